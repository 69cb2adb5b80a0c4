// The request of the cheapest-design search (POST /calc/cheapest and the browser's worker): the
// study input in its own units, the width limits in the same units, unit rates per SI unit and
// the take-off's overrides in the input's units.
import { mixed, number, object, type ObjectSchema } from 'yup';
import type { StudyInput } from '../range/types';
import type { TakeoffOverrides } from '../takeoff/assumptions';
import { TAKEOFF_ITEM_KINDS, type TakeoffItemKind } from '../takeoff/takeoff';
import { ENGINE_LIMITS, ESTIMATE_LIMITS, SEARCH_LIMITS } from './limits';
import { studyInputSchema } from './study';
import { takeoffOverridesSchema } from './takeoff';

export interface CheapestRequest {
  /** the study input, in the units it names */
  input: StudyInput;
  /** widths allowed, in the input's units (m or ft); `steps` widths evenly spaced, ends included */
  width: { min: number; max: number; steps?: number };
  /** unit rates per SI unit (m³, kg, m², m): by item kind, or by take-off line key */
  rates: { byKind?: Partial<Record<TakeoffItemKind, number>>; byKey?: Record<string, number> };
  /** the take-off's overrides, in the input's units */
  overrides?: TakeoffOverrides;
}

const isPlain = (v: unknown): v is Record<string, unknown> =>
  typeof v === 'object' && v !== null && !Array.isArray(v);

const unitsOf = (input: unknown): 'SI' | 'US' =>
  isPlain(input) && input.units === 'US' ? 'US' : 'SI';

const rate = (label: string) =>
  number()
    .typeError(`${label} must be a number.`)
    .min(0, `${label} must not be negative.`)
    .max(ESTIMATE_LIMITS.maxAmount, `${label} is too large.`);

const MAX_KEYS = 200;

export const cheapestRequestSchema: ObjectSchema<CheapestRequest> = object({
  input: studyInputSchema.required('Send the study input.'),
  width: object({
    min: number()
      .typeError('The smallest width must be a number.')
      .required('Give the smallest width to try.')
      .moreThan(0, 'The smallest width must be above zero.'),
    max: number()
      .typeError('The largest width must be a number.')
      .required('Give the largest width to try.')
      .moreThan(0, 'The largest width must be above zero.')
      .test('order', 'The largest width must not be below the smallest.', function (v) {
        const min = (this.parent as { min?: unknown }).min;
        return typeof v !== 'number' || typeof min !== 'number' || v >= min;
      }),
    steps: number()
      .typeError('The number of widths must be a number.')
      .integer('The number of widths must be a whole number.')
      .min(1, 'Try at least one width.')
      .max(SEARCH_LIMITS.maxWidthSteps, `Try at most ${SEARCH_LIMITS.maxWidthSteps} widths.`)
      .optional(),
  })
    .noUnknown(true, 'Unknown field in the width limits.')
    .required('Give the width limits.'),
  rates: object({
    byKind: object(
      Object.fromEntries(TAKEOFF_ITEM_KINDS.map((k) => [k, rate(`The rate for ${k}`).optional()])),
    )
      .noUnknown(true, (p) => `Unknown take-off item in the rates: ${String(p.unknown)}.`)
      .optional()
      .default(undefined),
    byKey: mixed<Record<string, number>>()
      .optional()
      .test('rates', 'Rates by key must map take-off keys to non-negative numbers.', (v) => {
        if (v === undefined) return true;
        if (!isPlain(v)) return false;
        const entries = Object.entries(v);
        return (
          entries.length <= MAX_KEYS &&
          entries.every(
            ([k, x]) =>
              k.length <= 100 &&
              typeof x === 'number' &&
              Number.isFinite(x) &&
              x >= 0 &&
              x <= ESTIMATE_LIMITS.maxAmount,
          )
        );
      }),
  })
    .noUnknown(true, 'Unknown field in the rates.')
    .required('Give the unit rates.'),
  overrides: mixed<TakeoffOverrides>()
    .optional()
    .test('overrides', function (v) {
      if (v === undefined || v === null) return true;
      if (!isPlain(v))
        return this.createError({ message: 'The take-off overrides must be an object.' });
      const units = unitsOf((this.parent as { input?: unknown }).input);
      try {
        takeoffOverridesSchema(units).validateSync(v);
        return true;
      } catch (e) {
        return this.createError({
          message: e instanceof Error ? e.message : 'The take-off overrides are not valid.',
        });
      }
    }),
})
  // The engine's width limit in the input's units (the width is typed in them).
  .test('width-limit', function (v) {
    const w = (v as { width?: { max?: unknown } } | undefined)?.width;
    const units = unitsOf((v as { input?: unknown } | undefined)?.input);
    const limit = ENGINE_LIMITS.maxBasinWidth[units];
    if (typeof w?.max === 'number' && w.max > limit)
      return this.createError({
        path: 'width.max',
        message: `The largest width must not exceed ${limit} ${units === 'US' ? 'ft' : 'm'}.`,
      });
    return true;
  }) as unknown as ObjectSchema<CheapestRequest>;

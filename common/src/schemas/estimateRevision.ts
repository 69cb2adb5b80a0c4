import { mixed, number, object, string, type InferType } from 'yup';
import { AACE_CLASSES, PRICE_UNITS, type AaceClass, type PriceUnit } from '../estimate';
import { ESTIMATE_LIMITS } from './limits';
import { trimString } from './text';

// The settings of an estimate revision and the requests that change it. Fractions throughout
// (0.05 = 5 %); the web shows percentages and converts at the form's edge.

const E = ESTIMATE_LIMITS;
const fraction = (label: string, min: number, max: number) =>
  number()
    .strict()
    .typeError(`${label} is a number.`)
    .min(min, `${label} is at least ${min * 100} %.`)
    .max(max, `${label} is at most ${max * 100} %.`);

export const estimateSettingsSchema = object({
  locationFactor: number()
    .strict()
    .typeError('The location factor is a number.')
    .min(E.locationFactor.min, `The location factor is at least ${E.locationFactor.min}.`)
    .max(E.locationFactor.max, `The location factor is at most ${E.locationFactor.max}.`)
    .required('Enter a location factor.'),
  percentages: object({
    mobilisation: fraction('Mobilisation', E.percentage.min, E.percentage.max).required(
      'Enter the mobilisation percentage.',
    ),
    careOfWater: fraction('Care of water', E.percentage.min, E.percentage.max).required(
      'Enter the care of water percentage.',
    ),
    contingency: fraction('Contingency', E.percentage.min, E.percentage.max).required(
      'Enter the contingency percentage.',
    ),
    overheadAndProfit: fraction('Overhead and profit', E.percentage.min, E.percentage.max).required(
      'Enter the overhead and profit percentage.',
    ),
  }).required(),
  escalation: object({
    annualRate: fraction(
      'The escalation rate',
      E.escalationRate.min,
      E.escalationRate.max,
    ).required('Enter the escalation rate.'),
    years: number()
      .strict()
      .typeError('The years to the construction mid-point are a number.')
      .min(E.escalationYears.min, 'The years cannot be negative.')
      .max(E.escalationYears.max, `At most ${E.escalationYears.max} years.`)
      .required('Enter the years to the construction mid-point.'),
  }).required(),
  accuracy: object({
    aaceClass: number<AaceClass>()
      .strict()
      .oneOf([...AACE_CLASSES], 'The class is 3, 4 or 5.')
      .required('Choose the estimate class.'),
    low: number().strict().min(-1).max(0).optional(),
    high: number().strict().min(0).max(2).optional(),
  }).required(),
});
export type EstimateSettings = InferType<typeof estimateSettingsSchema>;

/** A new revision's settings when there is none to start from: no additions, class 5. */
export const DEFAULT_ESTIMATE_SETTINGS: EstimateSettings = {
  locationFactor: 1,
  percentages: { mobilisation: 0, careOfWater: 0, contingency: 0, overheadAndProfit: 0 },
  escalation: { annualRate: 0, years: 0 },
  accuracy: { aaceClass: 5 },
};

const codeText = string()
  .transform(trimString)
  .max(40, 'A code has at most 40 characters.')
  .test('no-nul', 'A code cannot contain a NUL character.', (v) => !v?.includes('\u0000'));

export const estimateUpdateSchema = object({
  priceBookId: string()
    .nullable()
    .matches(/^[0-9a-f-]{36}$/i, 'Choose a price book.')
    .optional(),
  settings: estimateSettingsSchema.default(undefined).optional(),
  /** take-off line key → price-book item code ('' to leave the line unpriced) */
  // mixed, not object(): validation strips unknown keys, and every key of a mapping is "unknown"
  mapping: mixed<Record<string, string>>()
    .test('mapping-shape', 'The mapping pairs take-off lines with item codes.', (value) => {
      if (value === undefined) return true;
      if (typeof value !== 'object' || value === null || Array.isArray(value)) return false;
      const entries = Object.entries(value as Record<string, unknown>);
      return (
        entries.length <= 200 &&
        entries.every(
          ([k, v]) =>
            /^[a-zA-Z]+\.[a-zA-Z]+$/.test(k) && typeof v === 'string' && codeText.isValidSync(v),
        )
      );
    })
    .default(undefined)
    .optional(),
}).test('estimate-update-not-empty', 'Change at least one field.', (value) =>
  Object.values(value).some((field) => field !== undefined),
);
export type EstimateUpdateInput = {
  priceBookId?: string | null;
  settings?: EstimateSettings;
  mapping?: Record<string, string>;
};

const PRICE_UNIT_KEYS = Object.keys(PRICE_UNITS) as PriceUnit[];

export const estimateOverrideSchema = object({
  key: string()
    .matches(/^[a-zA-Z]+\.[a-zA-Z]+$/, 'Name a take-off line, such as concrete.floorSlab.')
    .required('Name a take-off line.'),
  /** the new quantity in `unit` (SI when absent); null puts the take-off's quantity back */
  quantity: number()
    .strict()
    .typeError('A quantity is a number.')
    .min(0, 'A quantity cannot be negative.')
    .max(E.maxAmount, 'That quantity is too large.')
    .nullable()
    .defined('Give the new quantity, or null to put back the take-off quantity.'),
  unit: string<PriceUnit>().oneOf(PRICE_UNIT_KEYS, 'Not a unit of quantity.').optional(),
  reason: string()
    .transform(trimString)
    .min(1, 'Say why the quantity changes.')
    .max(E.reasonMaxLength, `A reason has at most ${E.reasonMaxLength} characters.`)
    .test('no-nul', 'A reason cannot contain a NUL character.', (v) => !v?.includes('\u0000'))
    .required('Say why the quantity changes.'),
});
export type EstimateOverrideInput = InferType<typeof estimateOverrideSchema>;

export const estimateCreateSchema = object({
  priceBookId: string()
    .nullable()
    .matches(/^[0-9a-f-]{36}$/i, 'Choose a price book.')
    .optional(),
});
export type EstimateCreateInput = InferType<typeof estimateCreateSchema>;

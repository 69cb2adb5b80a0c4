// The engine's warnings as data: a stable code, a severity, the SI quantities the warning quotes
// with their kinds, and where it applies. The sentence is made at the edge by
// `studyWarningText(warning, units)` in common/src/messages — nothing here is English, and
// nothing reads a sentence back.
import { InputError, type InputErrorCode } from './errors';
import type { QuantityKind } from './units';
import type { DissipatorTypeId } from './basins/types';
import type { PublishedKey } from './basins/defaults';

/** Stable codes of the study's warnings (range, floor, rows, the runs that could not finish). */
export type StudyWarningCode =
  | 'design-discharge-added'
  | 'design-discharge-above-range'
  | 'tailwater-extended'
  | 'headwater-extended'
  | 'outlet-extended'
  | 'jet-flare'
  | 'known-toe-q-differs'
  | 'known-toe-velocity-held'
  | 'fixed-floor-above-required'
  | 'fixed-floor-unsolved'
  | 'sweep-out'
  | 'excess-submergence'
  | 'high-inflow-velocity'
  | 'oscillating-jump'
  | 'weak-jump'
  | 'froude-above-tested'
  | 'gate-submerged'
  | 'dissipators-not-run'
  // the sizing of one type at the design discharge (basins/jumpBasin.ts, types/usbr6.ts, usbr9.ts)
  | 'type-froude-outside'
  | 'type-oscillating'
  | 'piers-not-advised'
  | 'saf-blocks-not-advised'
  | 'blocks-cavitation'
  | 'type2-unit-discharge'
  | 'type3-unit-discharge'
  | 'plain-apron-long'
  | 'narrow-chute-blocks'
  | 'narrow-baffle-blocks'
  | 'narrow-sill-teeth'
  | 'type6-width-from-memory'
  | 'type6-narrower'
  | 'type6-discharge-above'
  | 'type6-velocity-above'
  | 'type6-baffle-overtopped'
  | 'type9-unit-discharge'
  // one type's design over the whole range, on its own floor (basins/design.ts)
  | 'basin-cavitation'
  | 'basin-oscillating'
  | 'basin-froude-outside'
  | 'basin-submergence'
  | 'basin-sweep-out'
  | 'basin-sweep-out-margin'
  | 'slab-thick'
  | 'uplift-below-floor'
  // the culvert outlet's riprap apron (basins/riprap.ts)
  | 'apron-tailwater-assumed'
  | 'apron-tailwater-held'
  | 'apron-stone-beyond-classes'
  // the choice of a type (basins/study.ts)
  | 'type-not-designed'
  | 'specialist-needed'
  | 'no-catalogue-type'
  | 'jet-also-indicated'
  | 'chosen-not-designed';

/** How much a warning matters: a fact to know, a point to check, a result not to rely on. */
export type WarningSeverity = 'info' | 'caution' | 'warning';

/** The refusal behind a warning (a solve or a sizing that could not run), as data. */
export interface WarningCause {
  field: string;
  code: InputErrorCode;
  values: Readonly<Record<string, number>>;
  /** an uncoded refusal's own sentence (SI), phrased at the edge by refusalText's rule */
  detail?: string;
}

/**
 * The quantities a coded message quotes: `values` SI; a value named in `kinds` is a quantity of
 * that kind (phrased in the project's units), any other is a pure number (a count, a Froude
 * number, a ratio); a value named in `published` is that published limit, kept at its default
 * (shown exactly as published when the project works in the system it was published in).
 */
export interface Quoted {
  values: Readonly<Record<string, number>>;
  kinds: Readonly<Record<string, QuantityKind>>;
  published?: Readonly<Record<string, PublishedKey>>;
}

/** A quantity to quote: its kind, its SI value and, for a published limit at its default, its key. */
export interface Quantity {
  kind: QuantityKind;
  si: number;
  published?: PublishedKey;
}

/** What a coded message quotes, by name: a pure number or a quantity. */
export type Quotes = Readonly<Record<string, number | Quantity | undefined>>;

/** A quantity of a kind. @example qty('length', 2.5) */
export const qty = (kind: QuantityKind, si: number): Quantity => ({ kind, si });

/**
 * The quotes as data (values, kinds, published); undefined entries are left out.
 * @example quote({ Q: qty('discharge', 40), fr1: 5.2 })
 */
export function quote(q: Quotes): Quoted {
  const values: Record<string, number> = {};
  const kinds: Record<string, QuantityKind> = {};
  let published: Record<string, PublishedKey> | undefined;
  for (const name in q) {
    const x = q[name];
    if (x === undefined) continue;
    if (typeof x === 'number') values[name] = x;
    else {
      values[name] = x.si;
      kinds[name] = x.kind;
      if (x.published) (published ??= {})[name] = x.published;
    }
  }
  return published ? { values, kinds, published } : { values, kinds };
}

/**
 * One warning of the study. `values` are SI; a value named in `kinds` is a quantity of that kind
 * (phrased in the project's units), any other is a pure number (a count, a Froude number, a
 * ratio). `at` says where it applies: the discharge (m³/s) and the dissipator type.
 */
export interface StudyWarning extends Quoted {
  code: StudyWarningCode;
  severity: WarningSeverity;
  at?: { Q?: number; type?: DissipatorTypeId };
  /** the refusal that stopped a step (fixed-floor-unsolved, dissipators-not-run, type-not-designed) */
  cause?: WarningCause;
  /** the types a choice note names (specialist-needed) */
  types?: DissipatorTypeId[];
}

/** The severity of every code (one place, so a code cannot be raised in one place and lowered in another). */
export const WARNING_SEVERITY: Readonly<Record<StudyWarningCode, WarningSeverity>> = {
  'design-discharge-added': 'info',
  'design-discharge-above-range': 'caution',
  'tailwater-extended': 'caution',
  'headwater-extended': 'caution',
  'outlet-extended': 'caution',
  'jet-flare': 'info',
  'known-toe-q-differs': 'caution',
  'known-toe-velocity-held': 'info',
  'fixed-floor-above-required': 'warning',
  'fixed-floor-unsolved': 'warning',
  'sweep-out': 'warning',
  'excess-submergence': 'caution',
  'high-inflow-velocity': 'warning',
  'oscillating-jump': 'caution',
  'weak-jump': 'caution',
  'froude-above-tested': 'caution',
  'gate-submerged': 'warning',
  'dissipators-not-run': 'warning',
  'type-froude-outside': 'warning',
  'type-oscillating': 'caution',
  'piers-not-advised': 'warning',
  'saf-blocks-not-advised': 'warning',
  'blocks-cavitation': 'caution',
  'type2-unit-discharge': 'caution',
  'type3-unit-discharge': 'warning',
  'plain-apron-long': 'info',
  'narrow-chute-blocks': 'caution',
  'narrow-baffle-blocks': 'caution',
  'narrow-sill-teeth': 'caution',
  'type6-width-from-memory': 'caution',
  'type6-narrower': 'caution',
  'type6-discharge-above': 'warning',
  'type6-velocity-above': 'warning',
  'type6-baffle-overtopped': 'caution',
  'type9-unit-discharge': 'warning',
  'basin-cavitation': 'caution',
  'basin-oscillating': 'caution',
  'basin-froude-outside': 'warning',
  'basin-submergence': 'caution',
  'basin-sweep-out': 'warning',
  'basin-sweep-out-margin': 'caution',
  'slab-thick': 'caution',
  'uplift-below-floor': 'info',
  'apron-tailwater-assumed': 'info',
  'apron-tailwater-held': 'caution',
  'apron-stone-beyond-classes': 'warning',
  'type-not-designed': 'info',
  'specialist-needed': 'warning',
  'no-catalogue-type': 'warning',
  'jet-also-indicated': 'info',
  'chosen-not-designed': 'warning',
};

/** Every code of StudyWarning (for tests and documentation). */
export const STUDY_WARNING_CODES = Object.keys(WARNING_SEVERITY) as StudyWarningCode[];

/**
 * A warning with its code's severity.
 * @example studyWarning('sweep-out', { count: 2, Q: 40 }, { Q: 'discharge' }, { Q: 40 })
 */
export function studyWarning(
  code: StudyWarningCode,
  values: Record<string, number> = {},
  kinds: Record<string, QuantityKind> = {},
  at?: StudyWarning['at'],
): StudyWarning {
  const w: StudyWarning = { code, severity: WARNING_SEVERITY[code], values, kinds };
  if (at) w.at = at;
  return w;
}

/**
 * A warning from quotes (numbers and quantities by name).
 * @example warn('type6-discharge-above', { Q: qty('discharge', 12) }, { type: 'usbr-6' })
 */
export function warn(
  code: StudyWarningCode,
  q: Quotes = {},
  at?: StudyWarning['at'],
): StudyWarning {
  const w: StudyWarning = { code, severity: WARNING_SEVERITY[code], ...quote(q) };
  if (at) w.at = at;
  return w;
}

/** One key per distinct warning (code, place and quantities), to say each once. */
export const warningKey = (w: StudyWarning): string =>
  JSON.stringify([w.code, w.at?.type, w.at?.Q, w.values]);

/** The warnings, each said once (the first kept), in order. */
export function distinctWarnings(list: readonly StudyWarning[]): StudyWarning[] {
  const seen = new Set<string>();
  return list.filter((w) => {
    const k = warningKey(w);
    if (seen.has(k)) return false;
    seen.add(k);
    return true;
  });
}

/** The cause of a caught refusal as data (a RangeError without a code counts as 'invalid'). */
export function warningCause(e: RangeError, field: string): WarningCause {
  return e instanceof InputError
    ? { field: e.field, code: e.code, values: { ...e.values } }
    : { field, code: 'invalid', values: {}, detail: e.message };
}

// The engine's warnings as data: a stable code, a severity, the SI quantities the warning quotes
// with their kinds, and where it applies. The sentence is made at the edge by
// `studyWarningText(warning, units)` in common/src/messages — nothing here is English, and
// nothing reads a sentence back.
import { InputError, type InputErrorCode } from './errors';
import type { QuantityKind } from './units';
import type { DissipatorTypeId } from './basins/types';

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
  | 'dissipators-not-run';

/** How much a warning matters: a fact to know, a point to check, a result not to rely on. */
export type WarningSeverity = 'info' | 'caution' | 'warning';

/** The refusal behind a warning (a solve or a sizing that could not run), as data. */
export interface WarningCause {
  field: string;
  code: InputErrorCode;
  values: Readonly<Record<string, number>>;
}

/**
 * One warning of the study. `values` are SI; a value named in `kinds` is a quantity of that kind
 * (phrased in the project's units), any other is a pure number (a count, a Froude number, a
 * ratio). `at` says where it applies: the discharge (m³/s) and the dissipator type.
 */
export interface StudyWarning {
  code: StudyWarningCode;
  severity: WarningSeverity;
  values: Readonly<Record<string, number>>;
  kinds: Readonly<Record<string, QuantityKind>>;
  at?: { Q?: number; type?: DissipatorTypeId };
  /** the refusal that stopped a step (fixed-floor-unsolved, dissipators-not-run) */
  cause?: WarningCause;
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

/** The cause of a caught refusal as data (a RangeError without a code counts as 'invalid'). */
export function warningCause(e: RangeError, field: string): WarningCause {
  return e instanceof InputError
    ? { field: e.field, code: e.code, values: { ...e.values } }
    : { field, code: 'invalid', values: {} };
}

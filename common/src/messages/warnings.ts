// Sentences for the study's coded warnings (common/src/warnings.ts) in SI or US customary. The
// quantities arrive SI with their kinds; each is converted and rounded by one rule here.
import { fromSIValue, UNIT_LABELS, type QuantityKind } from '../units';
import type { UnitSystem } from '../range/types';
import type { StudyWarning, StudyWarningCode } from '../warnings';
import { codedRefusalText } from './refusals';

/** Significant figures of a quantity in a sentence, no trailing zeros, never an exponent. */
function significant(x: number, figures: number): string {
  if (!Number.isFinite(x)) return '?';
  const a = Math.abs(x);
  if (a === 0) return '0';
  const decimals = Math.min(6, Math.max(0, figures - 1 - Math.floor(Math.log10(a))));
  const text = x.toFixed(decimals);
  return decimals > 0 ? text.replace(/\.?0+$/, '') : text;
}

/**
 * A quantity in a sentence, converted from SI and labelled: lengths and elevations to the
 * hundredth (m or ft, as drawings and levels are read), every other kind to three significant
 * figures (discharge, velocity, unit discharge).
 * @example formatQuantity(2.831684659, 'discharge', 'US') // '100 cfs'
 */
export function formatQuantity(si: number, kind: QuantityKind, units: UnitSystem): string {
  const v = fromSIValue(si, kind, units);
  const text = kind === 'length' ? v.toFixed(2) : significant(v, 3);
  return `${text} ${UNIT_LABELS[kind][units]}`;
}

/** "1 discharge", "3 discharges". */
const discharges = (count: number): string => `${count} discharge${count === 1 ? '' : 's'}`;

type Say = (name: string) => string;
type Sentence = (w: StudyWarning, say: Say, units: UnitSystem) => string;

/** The published round figure of the cavitation threshold in each system (hydraulics.md §7). */
const CAVITATION_LIMIT: Record<UnitSystem, string> = { SI: '15 m/s', US: '50 ft/s' };

const SENTENCES: Record<StudyWarningCode, Sentence> = {
  'design-discharge-added': (_w, say) =>
    `The discharges checked did not include the design discharge ${say('Q')}: it was added and analysed.`,
  'design-discharge-above-range': (_w, say) =>
    `The design discharge ${say('Q')} lies above the discharges checked: it was added and analysed.`,
  'tailwater-extended': (w, say) =>
    `${cap(discharges(w.values.count ?? 0))} lie outside the tailwater rating table (from ${say('Q')}); the tailwater there is extended in a straight line from the end of the table — extend the table.`,
  'headwater-extended': (w) =>
    `${cap(discharges(w.values.count ?? 0))} lie outside the headwater rating table; the headwater there is extended in a straight line.`,
  'outlet-extended': (w) =>
    `${cap(discharges(w.values.count ?? 0))} lie outside the outlet table; the outlet depth and velocity there are extended in a straight line.`,
  'jet-flare': (w, say) =>
    `Jet from the outlet: the walls should diverge no faster than tanθ = 1/(3·Fr) = ${say('tanTheta')} at the highest outlet Froude number ${say('fr')} (HEC-14).`,
  'known-toe-q-differs': (_w, say) =>
    `The toe conditions give a unit discharge of ${say('qToe')} but the design discharge over the basin width gives ${say('qBasin')}; the toe velocity ${say('v1')} is used with the basin's unit discharge.`,
  'known-toe-velocity-held': () =>
    'Known toe conditions: the toe velocity is held the same at every discharge (y1 = q/V1) — an approximation; enter each discharge separately to refine.',
  'fixed-floor-above-required': (_w, say) =>
    `The fixed floor at elevation ${say('floorElevation')} is above the highest floor that holds the jump at every discharge (${say('requiredElevation')}).`,
  'fixed-floor-unsolved': (w, say, units) =>
    `No floor elevation holds the jump at every discharge; the fixed floor at ${say('floorElevation')} is checked as given.${w.cause ? ` ${codedRefusalText(w.cause, units)}` : ''}`,
  'sweep-out': (w, say) =>
    `Sweep-out: the tailwater is short of the required depth at ${discharges(w.values.count ?? 0)}, from ${say('Q')}.`,
  'excess-submergence': (w, say) =>
    `Excess submergence at ${discharges(w.values.count ?? 0)}: up to ${Math.round((w.values.excess ?? 0) * 100)} % above the required depth (at ${say('Q')}); a drowned jump dissipates less energy.`,
  'high-inflow-velocity': (_w, say, units) =>
    `The inflow velocity reaches ${say('v1')} at ${say('Q')} (above ${CAVITATION_LIMIT[units]}): cavitation risk on blocks; a model study is advised.`,
  'oscillating-jump': (w) =>
    `Oscillating jump (Fr1 2.5–4.5) at ${discharges(w.values.count ?? 0)}: waves downstream; avoid, or use a wave-suppressing basin (USBR Type IV).`,
  'weak-jump': (w) =>
    `Undular or weak jump (Fr1 below 2.5) at ${discharges(w.values.count ?? 0)}: little energy is dissipated.`,
  'froude-above-tested': (w, say) =>
    `Fr1 above ${say('limit')} at ${discharges(w.values.count ?? 0)}: outside the range tested for standard basins.`,
  'gate-submerged': () =>
    'The gate runs submerged at some discharges: the free-flow gate equation used for the toe does not apply there.',
  'dissipators-not-run': (w, _say, units) =>
    `The dissipator types could not be screened and sized.${w.cause ? ` ${codedRefusalText(w.cause, units)}` : ''}`,
};

const cap = (s: string): string => s.charAt(0).toUpperCase() + s.slice(1);

/** A pure number in a sentence (Froude number, tanθ, a limit): three significant figures. */
const pure = (x: number | undefined): string => (x === undefined ? '?' : significant(x, 3));

/**
 * The sentence of a study warning in a unit system: its quantities converted and rounded by
 * formatQuantity, its pure numbers to three significant figures.
 * @example studyWarningText(result.warnings[0], 'US')
 */
export function studyWarningText(w: StudyWarning, units: UnitSystem = 'SI'): string {
  const u: UnitSystem = units === 'US' ? 'US' : 'SI';
  const say: Say = (name) => {
    const si = w.values[name];
    const kind = w.kinds[name];
    if (si === undefined) return '?';
    return kind ? formatQuantity(si, kind, u) : pure(si);
  };
  return SENTENCES[w.code](w, say, u);
}

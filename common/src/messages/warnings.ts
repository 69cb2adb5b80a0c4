// Sentences for the engine's coded warnings (common/src/warnings.ts) in SI or US customary: the
// study's own, each type's sizing and design cautions, and the notes on the choice of a type. The
// quantities arrive SI with their kinds; each is converted and rounded by one rule (quote.ts).
import { DISSIPATOR_NAMES } from '../basins/names';
import type { DissipatorTypeId } from '../basins/types';
import type { RowNoteCode, UnitSystem } from '../range/types';
import type { StudyWarning, StudyWarningCode } from '../warnings';
import { cap, discharges, sayer, type Say } from './quote';
import { codedRefusalText, INTERNAL_FAILURE_TEXT } from './refusals';

export { formatQuantity } from './quote';

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
  'fixed-floor-unsolved': (_w, say, units) =>
    `No floor elevation holds the jump at every discharge; the fixed floor at ${say('floorElevation')} is checked as given.${causeText(_w, units)}`,
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
    `The dissipator types could not be screened and sized.${causeText(w, units)}`,
  'type-froude-outside': (_w, say) =>
    `Fr1 ${say('fr1')} is outside the tested range ${say('lo')}–${say.has('hi') ? say('hi') : '∞'} of this type: model study.`,
  'type-oscillating': (_w, say) =>
    `Fr1 ${say('fr1')}: oscillating jump — waves may travel downstream; consider wave suppressors.`,
  'piers-not-advised': (_w, say) =>
    `V1 ${say.beyond('v1', 'limit', 'is above')}: baffle piers would cavitate and are not advised; use Type II.`,
  'saf-blocks-not-advised': (_w, say) =>
    `V1 ${say.beyond('v1', 'limit', 'is above')}: cavitation on the chute blocks; not advised for an SAF basin.`,
  'blocks-cavitation': (_w, say) =>
    `V1 ${say.beyond('v1', 'limit', 'is above')}: cavitation risk on the blocks; model study advised.`,
  'type2-unit-discharge': (_w, say) =>
    `q ${say.beyond('q', 'limit', 'is above the')} tested for Type II.`,
  'type3-unit-discharge': (_w, say) => `q ${say.beyond('q', 'limit', 'is above the')} of Type III.`,
  'plain-apron-long': (_w, say) =>
    `Fr1 ${say('fr1')} > 9: a plain apron is long (${say('length')}); a basin with blocks is shorter.`,
  'narrow-chute-blocks': () =>
    'The basin is too narrow for the chute or deflector blocks rule: one narrowed block is shown; widen the basin.',
  'narrow-baffle-blocks': () =>
    'The basin is too narrow for the baffle or floor blocks rule: one narrowed block is shown; widen the basin.',
  'narrow-sill-teeth': () =>
    'The basin is too narrow for the sill teeth rule: one narrowed block is shown; widen the basin.',
  'type6-width-from-memory': () =>
    'The Type VI width comes from a fit of the HEC-14 design curve recalled from memory: check W against the published curve.',
  'type6-narrower': (_w, say) =>
    `Width ${say('width')} is narrower than the ${say('curveWidth')} of the width curve.`,
  'type6-discharge-above': (_w, say) =>
    `Q ${say.beyond('Q', 'limit', 'exceeds the')} of the type [src: HEC-14 (2006) §9.4].`,
  'type6-velocity-above': (_w, say) =>
    `Entering velocity ${say.beyond('v', 'limit', 'exceeds')} [src: HEC-14 (2006) §9.4].`,
  'type6-baffle-overtopped': (_w, say) =>
    `Tailwater ${say('tw')} above the floor exceeds ${say('max')} (h3 + h2/2): flow overtops the baffle, dissipation falls [mem: HEC-14].`,
  'type9-unit-discharge': (_w, say) =>
    `q ${say.beyond('q', 'limit', 'exceeds the')} of the type [src: USBR, Design of Small Dams / EM-25 Basin IX].`,
  'basin-cavitation': (_w, say) =>
    `Cavitation risk: at ${say('Q')} the inflow velocity ${say.beyond('v1', 'limit', 'is above')}; model study advised.`,
  'basin-oscillating': (w, say) =>
    `Oscillating jump (Fr1 2.5–4.5) at ${discharges(w.values.count)} from ${say('Q')}: waves downstream; wave suppressors may be needed.`,
  'basin-froude-outside': (w, say) =>
    `Fr1 outside the tested range of the type at ${discharges(w.values.count)} (e.g. Fr1 ${say('fr1')} at ${say('Q')}): model study.`,
  'basin-submergence': (w, say) =>
    `Excess submergence at ${discharges(w.values.count)}: tailwater up to ${say('ratio')}× the required depth (at ${say('Q')}); the jump is drowned and dissipates less.`,
  'basin-sweep-out': (w, say) =>
    `Tailwater short of the required depth at ${discharges(w.values.count)} from ${say('Q')}: the jump sweeps out.`,
  'basin-sweep-out-margin': (w, say, units) =>
    `Sweep-out margin: at ${say('Q')} the tailwater ${say('margin') === sayer({ values: { z: 0 }, kinds: { z: 'length' } }, units)('z') ? 'just meets' : `exceeds by only ${say('margin')}`} the required ${say('required')} (C·y2), so a tailwater lower than rated sweeps the jump out; an extra floor depth (lowering the floor) gives a margin.`,
  'slab-thick': (_w, say) =>
    `Flotation needs a slab of ${say('need')} (${say('thickness')} used): consider underdrains (pressure relief) or anchors, which reduce the uplift.`,
  'uplift-below-floor': () =>
    'The uplift level is below the floor: no flotation beyond the slab depth.',
  'apron-tailwater-assumed': () =>
    'Tailwater not known: taken as 0.4·D, the low bound of the relation (conservative).',
  'apron-tailwater-held': (_w, say) =>
    `Tailwater ${say('tw')} is outside 0.4·D–1.0·D (${say('low')}–${say('rise')}): held at ${say('used')}.`,
  'apron-stone-beyond-classes': (_w, say) =>
    `Stone D50 ${say('d50')} exceeds the largest apron class (${say('max')}): use another dissipator.`,
  'type-not-designed': (w, _say, units) =>
    `${typeName(w.at?.type)}: not designed.${causeText(w, units)}`,
  'specialist-needed': (w) =>
    `No standard basin suits the whole range; ${(w.types ?? []).map(typeName).join(' or ')} is the likely answer: a specialist study is needed.`,
  'no-catalogue-type': () =>
    'No catalogue type suits the whole range: change the width, the floor or the range, or seek a specialist design.',
  'jet-also-indicated': () =>
    'A jet structure is also indicated (see the specialist types): compare with a specialist study.',
  'chosen-not-designed': (w) =>
    `${typeName(w.at?.type)}: cannot be designed from this study (not sized, or its inputs are missing).`,
};

/** The published name of a type (never its code id). */
export function typeName(id: DissipatorTypeId | undefined): string {
  return (id && DISSIPATOR_NAMES[id]) ?? 'The chosen type';
}

/** The refusal behind a warning, as a following sentence ('' when none). */
function causeText(w: StudyWarning, units: UnitSystem): string {
  if (!w.cause) return '';
  // An uncoded cause (an internal guard) is never shown raw.
  if (w.cause.detail !== undefined) return ` ${INTERNAL_FAILURE_TEXT}`;
  return ` ${codedRefusalText(w.cause, units)}`;
}

/**
 * The sentence of an engine warning in a unit system: its quantities converted and rounded by
 * formatQuantity, its pure numbers to three significant figures.
 * @example studyWarningText(result.warnings[0], 'US')
 */
export function studyWarningText(w: StudyWarning, units: UnitSystem = 'SI'): string {
  const u: UnitSystem = units === 'US' ? 'US' : 'SI';
  return SENTENCES[w.code](w, sayer(w, u), u);
}

/** The sentences of a study row's notes (StudyRow.noteCodes); they quote no quantity. */
export const ROW_NOTE_TEXT: Readonly<Record<RowNoteCode, string>> = {
  'swept-out': 'tailwater short of the sequent depth: the jump is pushed downstream of the toe',
  'leaves-basin':
    'tailwater below critical depth on the floor: the flow stays supercritical and leaves the basin',
  drowned: 'jump drowned: tailwater above the required depth by more than the tolerance',
  'tailwater-extended': 'tailwater extended beyond the rating table',
  'gate-submerged':
    'tailwater above the sequent depth of the vena contracta: the gate runs submerged and the free-flow gate equation does not apply',
};

/** The sentence of a study row's note. @example rowNoteText('drowned') */
export const rowNoteText = (code: RowNoteCode): string => ROW_NOTE_TEXT[code];

// Sentences for the engine's refusal codes, in either unit system: the one phraser of refusals (the web's
// messages and the API's 422s both come from here). Quantities arrive SI with their codes; nothing
// here parses a sentence.
import { InputError, type EngineFailure, type InputErrorCode } from '../errors';
import type { PhraseUnits } from '../units/phrase';
import { formatQuantity } from './quote';

/** Quantities in a refusal, by the one rounding rule (formatQuantity). */
interface Phraser {
  len(si: number): string;
  Q(si: number): string;
  q(si: number): string;
  unitWeight(si: number): string;
}
const phraserIn = (units: 'SI' | 'US'): Phraser => ({
  len: (x) => formatQuantity(x, 'length', units),
  Q: (x) => formatQuantity(x, 'discharge', units),
  q: (x) => formatQuantity(x, 'unitDischarge', units),
  unitWeight: (x) => formatQuantity(x, 'unitWeight', units),
});
const phrasers: Record<PhraseUnits, Phraser> = { SI: phraserIn('SI'), US: phraserIn('US') };

/** Plain words for the input fields the engine names (never the internal key). */
const FIELD_WORDS: Record<string, string> = {
  units: 'the unit system',
  body: 'the design',
  channelBedElevation: 'the channel bed elevation',
  basinWidth: 'the basin width',
  designDischarge: 'the design discharge',
  floorElevation: 'the floor elevation',
  floorSafetyDepth: 'the safety depth below the floor',
  tailwaterFactor: 'the tailwater factor',
  submergenceTolerance: 'the submergence tolerance',
  floorManningN: "the floor's Manning n",
  tailwater: 'the tailwater rating',
  'tailwater.slope': 'the downstream channel slope',
  'tailwater.manningN': "the downstream channel's Manning n",
  'discharges.min': 'the smallest discharge',
  'discharges.max': 'the largest discharge',
  'discharges.count': 'the number of discharges',
  'discharges.values': 'the discharges',
  'inflow.crestElevation': 'the crest elevation',
  'inflow.invertElevation': 'the outlet invert elevation',
  'inflow.upstreamElevation': 'the water level upstream of the gate',
  'inflow.upstreamDepth': 'the depth of the pool above the gate',
  'inflow.opening': 'the gate opening',
  'inflow.Cc': 'the contraction coefficient',
  'inflow.toe': 'the toe conditions',
  'inflow.headwater.C': 'the weir coefficient',
  'inflow.headwater.L': 'the crest length',
  'inflow.lossModel': 'the loss allowance',
  'inflow.outlet': 'the outlet flow',
  'inflow.chute': 'the chute',
  'dissipators.chosenType': 'the chosen basin type',
  'dissipators.alternatives': 'the basin types to compare',
  'dissipators.extraFloorDepth': 'the extra floor depth',
  'dissipators.flotation': 'the flotation case',
  // The jump-position tool's situation (hydraulics/profiles.ts), in the form's words.
  Q: 'the discharge',
  y1: 'the depth at the toe',
  fr1: "the inflow's Froude number",
  section: 'the channel section',
  'section.shape': 'the section shape',
  'section.width': 'the channel width',
  'section.bottomWidth': 'the bottom width',
  'section.sideSlope': 'the side slope',
  'section.diameter': 'the diameter',
  slope: 'the bed slope',
  manningN: "Manning's n",
  'upstream.slope': 'the upstream slope',
  'upstream.manningN': "the upstream reach's Manning n",
  'downstream.slope': 'the downstream slope',
  'downstream.manningN': "the downstream reach's Manning n",
  tailwaterDepth: 'the tailwater depth',
  opening: 'the gate opening',
  Cc: 'the contraction coefficient',
  upstreamDepth: 'the depth upstream of the gate',
  crestHeight: 'the crest height',
  lossFraction: 'the share of energy lost on the face',
  kind: 'the situation',
};

/** Plain words for a field path: known ones by name, others from their last part. */
export function fieldWords(field: string): string {
  const known = FIELD_WORDS[field];
  if (known) return known;
  const row = /^(.*)\.rows\[(\d+)\]\.(\w+)$/.exec(field);
  if (row) return `${words(row[3]!)} in row ${Number(row[2]) + 1} of ${fieldWords(row[1]!)}`;
  const last = field.split('.').pop() ?? field;
  return `the ${words(last.replace(/\[\d+\]$/, ''))}`;
}

const words = (key: string): string =>
  key
    .replace(/\s*\(.*\)$/, '')
    .replace(/([a-z])([A-Z])/g, '$1 $2')
    .toLowerCase();

const cap = (s: string): string => s.charAt(0).toUpperCase() + s.slice(1);
/** A dimensionless number in a sentence: three significant figures. */
const fig3 = (x: number): string => String(Number(x.toPrecision(3)));

type Values = Readonly<Record<string, number>>;

/** A count in a sentence, with thousands separated. */
const whole = (x: number | undefined): string =>
  x === undefined ? '?' : Math.round(x).toLocaleString('en-US');
/** The flow a gate refusal quotes: the discharge, or the unit discharge under the gate. */
const flow = (v: Values, P: Phraser): string =>
  v.Q !== undefined ? P.Q(v.Q) : `${P.q(v.q!)} under the gate`;

const SENTENCES: Record<InputErrorCode, (f: string, v: Values, P: Phraser) => string> = {
  'not-finite': (f) => `${cap(f)} must be a number.`,
  'not-positive': (f) => `${cap(f)} must be greater than zero.`,
  negative: (f) => `${cap(f)} must not be negative.`,
  'out-of-range': (f, v) =>
    v.min !== undefined && v.max !== undefined
      ? `${cap(f)} must lie between ${v.min} and ${v.max}.`
      : `${cap(f)} is out of range.`,
  invalid: (f) => `${cap(f)} is not valid.`,
  'units-not-si': () =>
    'The design is still in US customary units: it must be converted to SI before the study runs.',
  'below-bed': (f, v, P) =>
    `${cap(f)} (${P.len(v.elevation!)}) lies below the channel bed (${P.len(v.channelBedElevation!)}) it must drop to.`,
  'far-from-bed': (f, v, P) =>
    `${cap(f)} (${P.len(v.elevation!)}) lies more than ${P.len(v.span!)} from the channel bed (${P.len(v.channelBedElevation!)}): check the datum.`,
  'supercritical-tailwater': (_f, v, P) =>
    `The downstream channel runs supercritical at ${P.Q(v.Q!)} (Froude number ${fig3(v.fr!)} at normal depth): a steep channel cannot hold a jump. Give a tailwater rating table or a downstream control.`,
  'gate-opening-too-large': (_f, v, P) =>
    `The gate opening ${P.len(v.opening!)} is too large for ${flow(v, P)}: the water would not reach the gate. Give a smaller opening or a pool depth instead.`,
  'gate-pool-too-shallow': (_f, v, P) =>
    `The pool above the gate (${P.len(v.upstreamDepth!)} deep) cannot pass ${flow(v, P)}.`,
  'above-energy-line': (_f, v, P) =>
    v.Q !== undefined
      ? `The floor at ${P.len(v.floorElevation!)} lies above the energy line of the inflow at ${P.Q(v.Q)}.`
      : v.floorElevation !== undefined
        ? `The floor at ${P.len(v.floorElevation)} lies above the energy line of the inflow.`
        : 'The basin floor lies above the energy line of the inflow.',
  'not-supercritical': (f, v, P) =>
    v.Q !== undefined
      ? `At ${P.Q(v.Q)} the inflow is not supercritical (Froude number ${fig3(v.fr1!)}): no jump forms.`
      : `With ${f} as given the Froude number is ${fig3(v.fr1!)}: the flow is not supercritical and no jump forms.`,
  'unknown-option': (f) => `${cap(f)} is not one of the choices offered.`,
  missing: (f) => `${cap(f)} must be given.`,
  'too-small': (f) => `${cap(f)} is too small to compute.`,
  'not-above': (f, v) => `${cap(f)} must be greater than ${fig3(v.min ?? 0)}.`,
  'conduit-full': (f, v, P) =>
    v.depth !== undefined && v.diameter !== undefined
      ? `${cap(f)} (${P.len(v.depth)}) exceeds the conduit's diameter (${P.len(v.diameter)}): the conduit would run full.`
      : v.diameter !== undefined
        ? `The depth after the jump would exceed the conduit's diameter (${P.len(v.diameter)}): the conduit would run full, and flow under pressure is outside this open-channel method.`
        : 'The slow flow would fill the conduit: it would run full.',
  'conduit-too-small': (_f, v, P) =>
    `A discharge of ${P.Q(v.Q!)} is too much for a conduit ${P.len(v.diameter!)} across: its critical depth would reach the crown and the conduit would run full.`,
  'conduit-capacity': (_f, v, P) =>
    `A discharge of ${P.Q(v.Q!)} exceeds what the conduit carries flowing partly full (${P.Q(v.capacity!)} at normal depth).`,
  'energy-too-low': (_f, v, P) =>
    `The specific energy (${P.len(v.E!)}) is below the least the flow needs, at critical depth (${P.len(v.eMin!)}): the flow cannot pass.`,
  'head-too-small': (_f, v, P) =>
    `The head above the floor (${P.len(v.H0!)}) is too small to pass ${P.q(v.q!)} with the losses allowed.`,
  'gate-not-controlling': (_f, v, P) =>
    `The gate opening (${P.len(v.opening!)}) is not below the depth upstream of the gate (${P.len(v.upstreamDepth!)}): the gate does not control the flow.`,
  'needs-rectangular': (f) =>
    `${cap(f)} is needed: the gate relation used here holds for rectangular channels only.`,
  'table-too-short': (f) => `${cap(f)} needs at least two rows with both values.`,
  'table-not-increasing': (f, v) =>
    `The discharges of ${f} must increase from row to row (row ${v.row ?? '?'}).`,
  'not-steep': (f, v, P) =>
    v.yc !== undefined
      ? `${cap(f)} is not steep at this discharge: its normal depth${v.depth !== undefined ? ` (${P.len(v.depth)})` : ''} is not below critical depth (${P.len(v.yc)}).`
      : `${cap(f)} is not steep at this discharge: its normal depth is not below critical depth.`,
  'not-mild': (f, v, P) =>
    `${cap(f)} is not mild at this discharge: the depth downstream (${P.len(v.depth!)}) is not above critical depth (${P.len(v.yc!)}). Check the bed slope, or give the tailwater depth.`,
  'not-subcritical': (f, v, P) =>
    `${cap(f)} (${P.len(v.depth!)}) is not above critical depth (${P.len(v.yc!)}): no jump can form against it.`,
  'steep-no-jump': (_f, v, P) =>
    `The reach is steep (normal depth ${P.len(v.yn!)}, below critical depth ${P.len(v.yc!)}): the fast flow tends to normal depth and never deepens to ${P.len(v.yToe!)}, the depth a jump needs here, so no jump forms on this reach.`,
  'no-normal-depth': (f) =>
    `${cap(f)} is needed: the reach is level or adverse, so it has no normal depth.`,
  'uniform-flow': () =>
    'The profile reached normal depth (uniform flow) before the jump: no jump forms on this reach.',
  'not-backwater': () =>
    'The backwater profile does not run upstream from the control: check that the reach is steep.',
  'too-many-blocks': (f, v) =>
    `${cap(f)} would need ${whole(v.count)} blocks, more than the ${whole(v.max)} allowed: the basin is far wider than its flow needs.`,
  'too-many-rows': (_f, v) =>
    `The drop would need ${whole(v.rows)} rows of baffle piers, more than the ${whole(v.max)} one apron may hold: the unit discharge is too small for the drop.`,
  'slab-cannot-hold': (_f, v, P) =>
    `Concrete of ${P.unitWeight(v.unitWeight!)} cannot outweigh ${fig3(v.safetyFactor!)} times the uplift whatever the slab's thickness: reduce the uplift (drains) or anchor the slab.`,
  'no-floor': (_f, v, P) =>
    v.fr1 !== undefined && v.fr1 < 1.7
      ? `No floor elevation holds a jump at ${P.Q(v.Q!)}: the inflow stays too slow however low the floor.`
      : `No floor elevation holds the jump at ${P.Q(v.Q!)}: the tailwater stays short of the required depth however low the floor.`,
};

/** Every code of InputError (for tests and the API's documentation). */
export const INPUT_ERROR_CODES = Object.keys(SENTENCES) as InputErrorCode[];

/** What the user reads when the engine fails for a reason of its own (never its raw text). */
export const INTERNAL_FAILURE_TEXT =
  'The engine could not finish this calculation with these inputs. Check the values; if they are sound, the case needs a closer look by an engineer.';

/**
 * The sentence for an engine refusal in a unit system. A coded InputError is phrased from its
 * code, field and SI quantities; anything else (an internal guard, a bug) gets a plain sentence
 * and never its own text.
 * @example refusalText(new InputError('inflow.opening', 'gate-opening-too-large', '', { opening: 3, Q: 5 }), 'SI')
 */
export function refusalText(error: unknown, units: PhraseUnits = 'SI'): string {
  if (error instanceof InputError) return codedRefusalText(error, units);
  return INTERNAL_FAILURE_TEXT;
}

/** The sentence of a refusal given as data: its field, code and SI quantities. */
export function codedRefusalText(
  refusal: { field: string; code: InputErrorCode; values: Values },
  units: PhraseUnits = 'SI',
): string {
  const P = phrasers[units === 'US' ? 'US' : 'SI'];
  // A code this version does not know (data from elsewhere) is never guessed at.
  if (!Object.hasOwn(SENTENCES, refusal.code)) return INTERNAL_FAILURE_TEXT;
  return SENTENCES[refusal.code](fieldWords(refusal.field), refusal.values, P);
}

/** The sentence of an engine failure carried as data (across a Web Worker's boundary). */
export function engineFailureText(failure: EngineFailure, units: PhraseUnits = 'SI'): string {
  return failure.kind === 'refusal'
    ? codedRefusalText(failure.refusal, units)
    : INTERNAL_FAILURE_TEXT;
}

// Sentences for the engine's refusal codes, in either unit system: the one phraser of refusals (the web's
// messages and the API's 422s both come from here). Quantities arrive SI with their codes; nothing
// here parses a sentence.
import { InputError, type InputErrorCode } from '../errors';
import { phraseMessage, type PhraseUnits } from '../units/phrase';
import { formatQuantity } from './quote';

/** Quantities in a refusal, by the one rounding rule (formatQuantity). */
interface Phraser {
  len(si: number): string;
  Q(si: number): string;
}
const phrasers: Record<PhraseUnits, Phraser> = {
  SI: {
    len: (x) => formatQuantity(x, 'length', 'SI'),
    Q: (x) => formatQuantity(x, 'discharge', 'SI'),
  },
  US: {
    len: (x) => formatQuantity(x, 'length', 'US'),
    Q: (x) => formatQuantity(x, 'discharge', 'US'),
  },
};

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
    `The gate opening ${P.len(v.opening!)} is too large for ${P.Q(v.Q!)}: the water would not reach the gate. Give a smaller opening or a pool depth instead.`,
  'gate-pool-too-shallow': (_f, v, P) =>
    `The pool above the gate (${P.len(v.upstreamDepth!)} deep) cannot pass ${P.Q(v.Q!)}.`,
  'above-energy-line': (_f, v, P) =>
    v.Q !== undefined
      ? `The floor at ${P.len(v.floorElevation!)} lies above the energy line of the inflow at ${P.Q(v.Q)}.`
      : `The floor at ${P.len(v.floorElevation!)} lies above the energy line of the inflow.`,
  'not-supercritical': (f, v, P) =>
    v.Q !== undefined
      ? `At ${P.Q(v.Q)} the inflow is not supercritical (Froude number ${fig3(v.fr1!)}): no jump forms.`
      : `${cap(f)} give Froude number ${fig3(v.fr1!)}: the flow is not supercritical and no jump forms.`,
  'no-floor': (_f, v, P) =>
    v.fr1 !== undefined && v.fr1 < 1.7
      ? `No floor elevation holds a jump at ${P.Q(v.Q!)}: the inflow stays too slow however low the floor.`
      : `No floor elevation holds the jump at ${P.Q(v.Q!)}: the tailwater stays short of the required depth however low the floor.`,
};

/** Every code of InputError (for tests and the API's documentation). */
export const INPUT_ERROR_CODES = Object.keys(SENTENCES) as InputErrorCode[];

/**
 * The sentence for an engine refusal in a unit system. A coded InputError is phrased from its
 * code, field and SI quantities; any other RangeError keeps its sentence, its quantities put in
 * the unit system.
 * @example refusalText(new InputError('inflow.opening', 'gate-opening-too-large', '', { opening: 3, Q: 5 }), 'SI')
 */
export function refusalText(error: RangeError, units: PhraseUnits = 'SI'): string {
  if (error instanceof InputError) return codedRefusalText(error, units);
  return refusalDetailText(error.message, units);
}

/** The sentence of a refusal given as data: its field, code and SI quantities. */
export function codedRefusalText(
  refusal: { field: string; code: InputErrorCode; values: Values },
  units: PhraseUnits = 'SI',
): string {
  const P = phrasers[units === 'US' ? 'US' : 'SI'];
  return SENTENCES[refusal.code](fieldWords(refusal.field), refusal.values, P);
}

/** The sentence of an uncoded refusal (SI), its quantities put in the unit system. */
export function refusalDetailText(sentence: string, units: PhraseUnits = 'SI'): string {
  return phraseMessage(sentence, units);
}

// An uncoded engine sentence (SI) in the user's unit system: the quantities it quotes are put in
// US customary by the one display-rounding rule of formatQuantity (lengths to the hundredth,
// other quantities to three significant figures). Coded refusals and warnings never come here:
// common/src/messages phrases them from their codes.
import { formatQuantity } from '../messages/quote';
import type { QuantityKind } from './index';

/** The unit system a project works in. */
export type PhraseUnits = 'SI' | 'US';

// Longest unit first, so that "m³/s" is not read as "m³" followed by "/s".
const SI_IN_TEXT: ReadonlyArray<[string, QuantityKind]> = [
  ['m³/s', 'discharge'],
  ['m²/s', 'unitDischarge'],
  ['m/s', 'velocity'],
  ['m³', 'earthwork'],
  ['m', 'length'],
];
const QUANTITY_IN_TEXT =
  /(?<![\w.])(-?\d+(?:\.\d+)?(?:e[-+]?\d+)?)\s?(m³\/s|m²\/s|m\/s|m³|m)(?![\w²³/])/g;

/**
 * An engine message (SI) phrased for a unit system: every number followed by an SI unit of a
 * sentence quantity (m, m/s, m³/s, m²/s, m³) becomes the same quantity in US customary. Numbers
 * without a unit are left as they are. SI messages come back unchanged.
 * @example phraseMessage('the floor 30.48 m lies above the water', 'US') // 'the floor 100.00 ft lies above the water'
 */
export function phraseMessage(text: string, units: PhraseUnits): string {
  if (units !== 'US') return text;
  return text.replace(QUANTITY_IN_TEXT, (whole, num: string, label: string) => {
    const kind = SI_IN_TEXT.find(([l]) => l === label)?.[1];
    const si = Number(num);
    if (!kind || !Number.isFinite(si)) return whole;
    return formatQuantity(si, kind, 'US');
  });
}

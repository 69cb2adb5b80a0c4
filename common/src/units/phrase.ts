// Numbers inside sentences (screening reasons, warnings, notes) in the user's unit system.
// The engine computes in SI; only the words it hands back are phrased in US customary when the
// project works in it. Exact factors (NIST SP 811: 1 ft = 0.3048 m, 1 yd = 0.9144 m); kept
// here rather than through mathjs so the sizing code need not load the units instance.

/** The unit system a project works in. */
export type PhraseUnits = 'SI' | 'US';

/** Quantities that appear in sentences. */
export type PhraseKind = 'length' | 'velocity' | 'discharge' | 'unitDischarge' | 'volume';

import { FOOT as FT } from './constants';
import { n3, n3Pair } from './rounding';
const US_FACTOR: Record<PhraseKind, number> = {
  length: FT,
  velocity: FT,
  discharge: FT ** 3,
  unitDischarge: FT ** 2,
  volume: 0.9144 ** 3, // concrete and earthwork in cubic yards (US practice)
};
const LABEL: Record<PhraseKind, Record<PhraseUnits, string>> = {
  length: { SI: 'm', US: 'ft' },
  velocity: { SI: 'm/s', US: 'ft/s' },
  discharge: { SI: 'm³/s', US: 'cfs' },
  unitDischarge: { SI: 'm²/s', US: 'ft²/s' },
  volume: { SI: 'm³', US: 'yd³' },
};

// The rounding of numbers in sentences is the one display rule of units/rounding.ts.
export { n3, n3Pair } from './rounding';

/** Phrases SI quantities in one unit system. */
export interface Phraser {
  readonly units: PhraseUnits;
  /** the SI value converted to the user's units (a number) */
  value(si: number, kind: PhraseKind): number;
  /** the unit label, e.g. 'ft' */
  unit(kind: PhraseKind): string;
  /** the converted number, three figures, no unit */
  num(si: number, kind: PhraseKind): string;
  /** number and unit: '1.23 ft' */
  len(si: number): string;
  vel(si: number): string;
  Q(si: number): string;
  q(si: number): string;
  vol(si: number): string;
  /** two quantities compared, with enough digits to tell them apart, each with its unit */
  pair(kind: PhraseKind, si: number, siLimit: number): [string, string];
}

const cache: Partial<Record<PhraseUnits, Phraser>> = {};

/**
 * The phraser of a unit system (default SI).
 * @example phraser('US').vel(15) // '49.2 ft/s'
 */
export function phraser(units: PhraseUnits = 'SI'): Phraser {
  const u: PhraseUnits = units === 'US' ? 'US' : 'SI';
  const hit = cache[u];
  if (hit) return hit;
  const value = (si: number, kind: PhraseKind): number => (u === 'SI' ? si : si / US_FACTOR[kind]);
  const unit = (kind: PhraseKind): string => LABEL[kind][u];
  const num = (si: number, kind: PhraseKind): string => n3(value(si, kind));
  const withUnit =
    (kind: PhraseKind) =>
    (si: number): string =>
      `${num(si, kind)} ${unit(kind)}`;
  const p: Phraser = {
    units: u,
    value,
    unit,
    num,
    len: withUnit('length'),
    vel: withUnit('velocity'),
    Q: withUnit('discharge'),
    q: withUnit('unitDischarge'),
    vol: withUnit('volume'),
    pair(kind, si, siLimit) {
      const [a, b] = n3Pair(value(si, kind), value(siLimit, kind));
      return [`${a} ${unit(kind)}`, `${b} ${unit(kind)}`];
    },
  };
  cache[u] = p;
  return p;
}

/** A number in a message: four significant figures, or one decimal beyond the units for larger numbers; no trailing zeros. */
function messageNumber(x: number): string {
  const whole = x === 0 ? 1 : Math.floor(Math.log10(Math.abs(x))) + 1;
  return String(Number(x.toPrecision(Math.min(21, Math.max(4, whole + 1)))));
}

// Longest unit first, so that "m³/s" is not read as "m³" followed by "/s".
const SI_IN_TEXT: ReadonlyArray<[string, PhraseKind]> = [
  ['m³/s', 'discharge'],
  ['m²/s', 'unitDischarge'],
  ['m/s', 'velocity'],
  ['m³', 'volume'],
  ['m', 'length'],
];
const QUANTITY_IN_TEXT =
  /(?<![\w.])(-?\d+(?:\.\d+)?(?:e[-+]?\d+)?)\s?(m³\/s|m²\/s|m\/s|m³|m)(?![\w²³/])/g;

/**
 * An engine message (SI) phrased for a unit system: every number followed by an SI unit of a
 * sentence quantity (m, m/s, m³/s, m²/s, m³) becomes the same quantity in US customary. Numbers
 * without a unit are left as they are. SI messages come back unchanged.
 * @example phraseMessage('floorElevation 30.48 m lies above the water', 'US') // 'floorElevation 100 ft lies above the water'
 */
export function phraseMessage(text: string, units: PhraseUnits): string {
  if (units !== 'US') return text;
  const p = phraser('US');
  return text.replace(QUANTITY_IN_TEXT, (whole, num: string, label: string) => {
    const kind = SI_IN_TEXT.find(([l]) => l === label)?.[1];
    const si = Number(num);
    if (!kind || !Number.isFinite(si)) return whole;
    return `${messageNumber(p.value(si, kind))} ${p.unit(kind)}`;
  });
}

// How a coded message's quantities are said: each SI value converted to the project's units and
// rounded by the one rule of formatQuantity (units/rounding.ts); a published limit kept at its
// default is said exactly as published when the project works in the system it was published in
// (50 ft/s, never 49.2 ft/s); pure numbers to three significant figures.
import { PUBLISHED_FIGURES } from '../basins/defaults';
import { fromSIValue, UNIT_LABELS, type QuantityKind } from '../units';
import { significant } from '../units/rounding';
import type { UnitSystem } from '../range/types';
import type { Quoted } from '../warnings';

/**
 * A quantity in a sentence, converted from SI and labelled: lengths and elevations to the
 * hundredth (m or ft, as drawings and levels are read), every other kind to three significant
 * figures (discharge, velocity, unit discharge).
 * @example formatQuantity(2.831684659, 'discharge', 'US') // '100 cfs'
 */
export function formatQuantity(si: number, kind: QuantityKind, units: UnitSystem): string {
  return `${quantityNumber(si, kind, units)} ${UNIT_LABELS[kind][units]}`;
}

/** The number of formatQuantity without its unit. */
function quantityNumber(si: number, kind: QuantityKind, units: UnitSystem, figures = 3): string {
  const v = fromSIValue(si, kind, units);
  return kind === 'length' && figures === 3 ? v.toFixed(2) : significant(v, figures);
}

/** Says the quantities of one message. */
export interface Say {
  /** the value `name`: a quantity with its unit, or a pure number ('?' when absent) */
  (name: string): string;
  /** the value `name` with enough figures to differ from the value `limit` when they differ */
  pair(name: string, limit: string): string;
  /**
   * A value past a published limit, said against the limit as published: "16.1 m/s is above
   * 15 m/s" (`verb` "is above"), or "at the 15 m/s limit" when the value rounds to the limit —
   * never more figures than the limit has to make the two differ.
   */
  beyond(name: string, limit: string, verb: string): string;
  /** whether the message quotes `name` */
  has(name: string): boolean;
}

/**
 * The sayer of a message's quotes in a unit system.
 * @example sayer({ values: { v1: 16 }, kinds: { v1: 'velocity' } }, 'US')('v1') // '52.5 ft/s'
 */
export function sayer(q: Quoted, units: UnitSystem): Say {
  const text = (name: string, figures = 3, asPublished = true): string => {
    const si = q.values[name];
    if (si === undefined) return '?';
    const kind = q.kinds[name];
    if (!kind) return significant(si, figures);
    const key = asPublished ? q.published?.[name] : undefined;
    if (key) {
      const f = PUBLISHED_FIGURES[key];
      if (f.units === units) return `${f.value} ${UNIT_LABELS[kind][units]}`;
    }
    return figures === 3
      ? formatQuantity(si, kind, units)
      : `${quantityNumber(si, kind, units, figures)} ${UNIT_LABELS[kind][units]}`;
  };
  const say = ((name: string) => text(name)) as Say;
  // The value against its limit, both at the same figures, until they differ (up to seven).
  say.pair = (name, limit) => {
    const x = q.values[name];
    const y = q.values[limit];
    if (x === undefined || y === undefined || x === y) return text(name);
    for (let k = 3; k <= 7; k++) {
      const a = text(name, k, false);
      if (a !== text(limit, k, false)) return a;
    }
    return text(name);
  };
  say.beyond = (name, limit, verb) => {
    const [value, bound] = [text(name), text(limit)];
    return value === bound ? `at the ${bound} limit` : `${value} ${verb} ${bound}`;
  };
  say.has = (name) => q.values[name] !== undefined;
  return say;
}

/** "1 discharge", "3 discharges". */
export const discharges = (count: number | undefined): string =>
  `${count ?? 0} discharge${count === 1 ? '' : 's'}`;

/** The sentence with a capital first letter. */
export const cap = (s: string): string => s.charAt(0).toUpperCase() + s.slice(1);

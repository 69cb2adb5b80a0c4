// The units' mathjs instance is built from the unit factories only (mathjs's custom-bundle API,
// common/src/units/convert.ts) to keep the browser's download small, and the conversions by kind
// use its factors written out (common/src/units/factors.ts), loading no mathjs at all.
// Reference: the full mathjs build, create(all) with the same cfs definition — the instance the
// units used before. Both must give the same bits for every conversion the project makes, so no
// number the demo or a saved design shows moves.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { all, create } from 'mathjs';
import { PRICE_UNITS, UNITS, convert, fromSIValue, toSIValue } from '@basinwright/common';
import type { QuantityKind } from '@basinwright/common';
import { US_TO_SI } from '../../common/src/units/factors';

const full = create(all!, {});
full.createUnit('cfs', '1 ft^3/s');
const reference = (value: number, from: string, to: string): number =>
  full.unit(value, from).toNumber(to);

/** Every pair of unit strings the project converts between. */
const PAIRS: Array<[string, string]> = [
  ...Object.values(UNITS).map((u): [string, string] => [u.US, u.SI]),
  // takeoff/format.ts: assumption units
  ['kg/m^3', 'lb/ft^3'],
  ['kg/m^3', 'lb/yd^3'],
  // estimate.ts: each price unit from its SI unit
  ...Object.values(PRICE_UNITS).map((u): [string, string] => [
    { earthwork: 'm^3', mass: 'kg', area: 'm^2', length: 'm' }[u.kind],
    u.expr,
  ]),
];

describe('the trimmed mathjs instance', () => {
  it('converts exactly as the full mathjs build, both ways, for every unit the project uses', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-6, max: 1e6, noNaN: true }), (v) => {
        for (const [a, b] of PAIRS) {
          expect(convert(v, a, b)).toBe(reference(v, a, b));
          expect(convert(v, b, a)).toBe(reference(v, b, a));
        }
      }),
    );
  });
  it('the conversions by kind, written out as a table of factors, are the full build bit for bit', () => {
    // toSIValue/fromSIValue never load mathjs: their factors are its numbers, written out.
    for (const kind of Object.keys(UNITS) as QuantityKind[]) {
      const { US, SI } = UNITS[kind];
      expect(US_TO_SI[kind]).toBe(reference(1, US, SI));
      fc.assert(
        fc.property(fc.double({ min: 1e-6, max: 1e6, noNaN: true }), (v) => {
          expect(toSIValue(v, kind, 'US')).toBe(v * reference(1, US, SI));
          expect(fromSIValue(v, kind, 'US')).toBe(v / reference(1, US, SI));
        }),
        { numRuns: 50 },
      );
    }
    // NIST SP 811: 1 ft = 0.3048 m and 1 lb = 0.45359237 kg exactly
    expect(US_TO_SI.length).toBe(0.3048);
    expect(US_TO_SI.mass).toBe(0.45359237);
  });

  it('still refuses a conversion between different quantities', () => {
    expect(() => convert(1, 'ft', 'kg')).toThrow(/cannot convert/);
  });
});

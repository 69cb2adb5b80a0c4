// Estimate totals against a hand calculation, the AACE accuracy bands and the price units.
import { describe, expect, it } from 'vitest';
import { AACE_BANDS, estimate, quantityInUnit, type EstimateInput } from '@basinwright/common';
import { expectRel } from '../support/tolerance';

// Invented prices (test data only).
const input: EstimateInput = {
  lines: [
    { key: 'concrete.floorSlab', quantity: 100, unit: 'm3', unitPrice: 250 },
    { key: 'reinforcement.floorSlab', quantity: 5000, unit: 'kg', unitPrice: 2.1 },
    {
      key: 'formwork.sideWalls',
      quantity: 300,
      unit: 'm2',
      unitPrice: 45,
      override: { quantity: 320, reason: 'forms for the wall steps' },
    },
  ],
  locationFactor: 1.1,
  percentages: { mobilisation: 0.05, careOfWater: 0.03, contingency: 0.2, overheadAndProfit: 0.15 },
  escalation: { annualRate: 0.04, years: 2 },
  accuracy: { aaceClass: 4 },
};

describe('estimate totals (hand calculation)', () => {
  const e = estimate(input);
  it('builds the total step by step', () => {
    // lines: 100 × 250 = 25,000; 5,000 × 2.1 = 10,500; the override 320 × 45 = 14,400
    expectRel(e.lines[2]!.amount, 14400, 1e-12);
    expect(e.lines[2]!.quantityUsed).toBe(320);
    expectRel(e.direct, 49900, 1e-12);
    expectRel(e.located, 54890, 1e-12); // × 1.1
    expectRel(e.mobilisation, 2744.5, 1e-12); // 5 % of 54,890
    expectRel(e.careOfWater, 1646.7, 1e-12); // 3 % of 54,890
    expectRel(e.contingency, 11856.24, 1e-12); // 20 % of 59,281.2
    expectRel(e.overheadAndProfit, 10670.616, 1e-12); // 15 % of 71,137.44
    // escalation compounded: 81,808.056 × (1.04² − 1) = 81,808.056 × 0.0816
    expectRel(e.escalation, 6675.5373696, 1e-12);
    expectRel(e.total, 88483.5933696, 1e-12);
  });
  it('takes the class 4 band ends when none are chosen (AACE RP 18R-97: −15..−30 %, +20..+50 %)', () => {
    expect(e.accuracy.basis).toBe('band-ends');
    expect(e.accuracy.lowPct).toBe(-0.3);
    expect(e.accuracy.highPct).toBe(0.5);
    expectRel(e.accuracy.low, 88483.5933696 * 0.7, 1e-12);
    expectRel(e.accuracy.high, 88483.5933696 * 1.5, 1e-12);
    expect(e.accuracy.source).toMatch(/18R-97/);
  });
  it('accepts a low and high chosen within the band and refuses one outside it', () => {
    const c = estimate({ ...input, accuracy: { aaceClass: 5, low: -0.3, high: 0.5 } });
    expect(c.accuracy.basis).toBe('chosen');
    expectRel(c.accuracy.low, c.total * 0.7, 1e-12);
    // class 5 low end lies between −20 % and −50 % (AACE RP 18R-97)
    expect(() => estimate({ ...input, accuracy: { aaceClass: 5, low: -0.1 } })).toThrow(
      /accuracy.low/,
    );
    expect(() => estimate({ ...input, accuracy: { aaceClass: 3, high: 0.5 } })).toThrow(
      /accuracy.high/,
    );
    expect(AACE_BANDS[3]).toEqual({ low: [-0.1, -0.2], high: [0.1, 0.3] });
  });
  it('refuses an override without a reason and values out of bounds', () => {
    const noReason: EstimateInput = {
      ...input,
      lines: [{ ...input.lines[0]!, override: { quantity: 1, reason: '  ' } }],
    };
    expect(() => estimate(noReason)).toThrow(/reason/);
    expect(() => estimate({ ...input, locationFactor: 0 })).toThrow(/locationFactor/);
    expect(() =>
      estimate({ ...input, lines: [{ ...input.lines[0]!, unitPrice: Number.NaN }] }),
    ).toThrow(/unitPrice/);
  });
});

describe('price units', () => {
  it('converts a take-off quantity into the price unit', () => {
    // 1 yd³ = 0.764554857984 m³; 1 US short ton = 907.18474 kg; 1 ft = 0.3048 m (exact)
    expectRel(quantityInUnit(0.764554857984, 'earthwork', 'yd3'), 1, 1e-12);
    expectRel(quantityInUnit(907.18474, 'mass', 'ton'), 1, 1e-12);
    expectRel(quantityInUnit(1000, 'mass', 't'), 1, 1e-12);
    expectRel(quantityInUnit(0.3048, 'length', 'ft'), 1, 1e-12);
    expect(() => quantityInUnit(1, 'mass', 'm3')).toThrow(/cannot be priced/);
  });
});

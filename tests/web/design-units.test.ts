// Unit conversion at the form's edge: what a US user types reaches the engine as the same SI
// input as the SI demo, and a saved input shown in the other system converts back unchanged.
// Factors: 1 ft = 0.3048 m and 1 cfs = 0.028316846592 m³/s exactly [standard: NIST SP 811].
import { describe, expect, it } from 'vitest';
import { runStudy, type StudyInput } from '@basinwright/common';
import { inputForEngine, inputForForm, startingInput } from '../../web/src/composables/useDesign';
import { expectRel } from '../support/tolerance';
import { fenwickDesign } from '../../seed/designs';

const FT = 0.3048;
const CFS = 0.028316846592;

// The demo scenario of product.md, as an SI user types it.
// the demo design of product.md (invented scenario), as seeded
const demoSI: StudyInput = fenwickDesign;

// The same site typed by a US user (converted here by hand with the exact factors).
const demoUS: StudyInput = {
  units: 'US',
  channelBedElevation: 90 / FT,
  basinWidth: 12 / FT,
  designDischarge: 85 / CFS,
  discharges: { kind: 'range', min: 5 / CFS, max: 85 / CFS, count: 17 },
  tailwater: {
    kind: 'manning',
    section: { shape: 'trapezoidal', bottomWidth: 14 / FT, sideSlope: 2 },
    slope: 0.0015,
    manningN: 0.03,
  },
  // Q = C·L·H^1.5 → C scales with √length: C_US = C_SI / √0.3048 (ft^½/s).
  inflow: {
    kind: 'chute',
    crestElevation: 102 / FT,
    headwater: { kind: 'weir', C: 2.15 / Math.sqrt(FT), L: 12 / FT },
    lossModel: { kind: 'fraction', value: 0.1 },
  },
};

function numbers(node: unknown, path = ''): Array<[string, number]> {
  if (typeof node === 'number') return [[path, node]];
  if (node && typeof node === 'object')
    return Object.entries(node).flatMap(([k, v]) => numbers(v, path ? `${path}.${k}` : k));
  return [];
}

describe('design form units', () => {
  it('US values typed in ft and cfs reach the engine as the SI demo input', () => {
    const si = inputForEngine(demoUS);
    const expected = new Map(numbers(demoSI));
    const got = numbers(si);
    expect(got.map(([p]) => p).sort()).toEqual([...expected.keys()].sort());
    for (const [p, v] of got) expectRel(v, expected.get(p)!, 1e-12);
    // n, slopes and the loss fraction are the same number in both systems.
    expect(si.tailwater.kind === 'manning' && si.tailwater.manningN).toBe(0.03);
  });

  it('the same SI input gives the same floor whichever system it was typed in', () => {
    const a = runStudy(inputForEngine(demoSI));
    const b = runStudy(inputForEngine(demoUS));
    expectRel(b.floor.elevation, a.floor.elevation, 1e-9);
    expect(a.floor.elevation).toBeLessThan(90); // product.md: the floor sits well below the bed
  });

  it('a saved SI input shown to a project now in US units converts there and back unchanged', () => {
    const shown = inputForForm(demoSI, 'US');
    expect(shown.units).toBe('US');
    expectRel(shown.channelBedElevation, 90 / FT, 1e-9);
    expectRel(shown.designDischarge, 85 / CFS, 1e-9);
    const back = new Map(numbers(inputForEngine(shown)));
    for (const [p, v] of numbers(demoSI)) expectRel(back.get(p)!, v, 1e-9);
  });

  it('a saved input in the project units is shown as it was typed', () => {
    expect(inputForForm(demoSI, 'SI')).toEqual(demoSI);
    expect(inputForForm(demoUS, 'US').basinWidth).toBe(Number((12 / FT).toPrecision(10)));
  });

  it('the US starting input is the SI one converted, rounded to two significant figures', () => {
    const si = startingInput('SI');
    const us = startingInput('US');
    expect(us.units).toBe('US');
    // 100 m = 328.08 ft → 330 ft; 50 m³/s = 1765.7 cfs → 1800 cfs (NIST SP 811 factors above).
    expect(us.channelBedElevation).toBe(330);
    expect(us.designDischarge).toBe(1800);
    // Every number back in SI lies within the rounding of two figures (≤ 5 %) of its SI start.
    const back = new Map(numbers(inputForEngine(us)));
    const start = numbers(si);
    expect([...back.keys()].sort()).toEqual(start.map(([p]) => p).sort());
    for (const [p, v] of start) expectRel(back.get(p)!, v, 0.05);
    // Two calls give two copies: the form may change one without touching the next design's.
    expect(startingInput('SI')).not.toBe(si);
  });

  it.each(['SI', 'US'] as const)(
    'the starting input in %s runs through the engine with a floor below the bed',
    (units) => {
      const input = startingInput(units);
      expect(input.units).toBe(units);
      const r = runStudy(inputForEngine(input));
      const bedSI = units === 'US' ? input.channelBedElevation * FT : input.channelBedElevation;
      expect(r.floor.elevation).toBeLessThan(bedSI);
      expect(r.recommendedType).not.toBeNull();
    },
  );
});

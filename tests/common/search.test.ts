// The cheapest design that works: no grid point is cheaper than the answer, and every design
// the search says passes is checked again with an independent runStudy at its width and type.
import { describe, expect, it } from 'vitest';
import {
  cheapestDesign,
  compareAlternatives,
  costOf,
  runStudy,
  siRate,
  takeoff,
  toSI,
  type StudyInput,
  type UnitRates,
} from '@basinwright/common';
import { expectRel } from '../support/tolerance';
import { caldwellDesign, fenwickDesign } from '../../seed/designs';

// Invented unit rates per SI unit (test data only).
const rates: UnitRates = {
  byKind: {
    concrete: 300,
    reinforcement: 2,
    formwork: 50,
    excavation: 15,
    backfill: 10,
    riprap: 60,
    bedding: 40,
    geotextile: 4,
    waterstop: 30,
    joint: 10,
  },
};

function recheck(study: StudyInput, width: number, type: string): { cost: number; holds: boolean } {
  const r = runStudy({
    ...study,
    basinWidth: width,
    dissipators: { ...(study.dissipators ?? {}), chosenType: type as never },
  });
  const d = r.design!;
  expect(d.type).toBe(type);
  // whole-range check, from the study's own answer: no discharge on the type's floor sweeps out
  let holds = true;
  if (r.chosenFloor)
    holds = r.chosenFloor.positions.every((p) => p.position !== 'swept-out' && p.margin >= -1e-9);
  return { cost: costOf(takeoff(d), rates).cost, holds };
}

describe.each([
  ['Fenwick (chute, SI)', fenwickDesign],
  ['Caldwell (box outlet, US input)', toSI(caldwellDesign)],
])('cheapest design: %s', (_name, study) => {
  const res = cheapestDesign({ study, width: { min: 3, max: 30, steps: 5 }, rates });
  const passing = res.points.filter((p) => p.passes);

  it('finds a design no more expensive than any passing grid point', () => {
    expect(res.best).not.toBeNull();
    expect(passing.length).toBeGreaterThan(0);
    for (const p of passing) expect(res.best!.cost).toBeLessThanOrEqual(p.cost);
    expect(res.widths.length).toBe(5);
    for (const w of res.widths) {
      expect(w).toBeGreaterThanOrEqual(res.widthBounds.min - 1e-12);
      expect(w).toBeLessThanOrEqual(res.widthBounds.max + 1e-12);
    }
  });

  it('every passing design holds the jump over the whole range when run again with runStudy', () => {
    for (const p of passing) {
      const again = recheck(study, p.width, p.type);
      expect(again.holds).toBe(true);
      // the search's reuse of the prepared range gives the same design as a fresh study
      expectRel(p.cost, again.cost, 1e-9);
    }
  });

  it('gives one chart line per type, with the optimum on it', () => {
    const s = res.series.find((x) => x.type === res.best!.type)!;
    expect(s.points.map((p) => p.width)).toEqual(res.widths);
    expect(s.points.find((p) => p.width === res.best!.width)!.cost).toBe(res.best!.cost);
  });
});

describe('search inputs and the types side by side', () => {
  it('refuses width limits out of order or beyond the engine limit', () => {
    expect(() =>
      cheapestDesign({ study: fenwickDesign, width: { min: 20, max: 10 }, rates }),
    ).toThrow(/width.max/);
    expect(() =>
      cheapestDesign({ study: fenwickDesign, width: { min: 1, max: 400 }, rates }),
    ).toThrow(/width.max/);
    expect(() =>
      cheapestDesign({ study: fenwickDesign, width: { min: 1, max: 10, steps: 1000 }, rates }),
    ).toThrow(/width.steps/);
    expect(() =>
      cheapestDesign({
        study: fenwickDesign,
        width: { min: 1, max: 10 },
        rates: { byKind: { concrete: -1 } },
      }),
    ).toThrow(/rates.byKind.concrete/);
  });
  it('compares the sized types with the take-off and cost of each', () => {
    const r = runStudy(fenwickDesign);
    const rows = compareAlternatives(r, rates);
    expect(rows.map((x) => x.type)).toEqual([r.design!, ...r.alternatives].map((e) => e.type));
    for (const row of rows) {
      const t = takeoff([r.design!, ...r.alternatives].find((e) => e.type === row.type)!);
      expectRel(row.concrete, t.totals.concrete, 1e-12);
      expectRel(row.cost, costOf(t, rates).cost, 1e-12);
    }
  });
  it('converts a price per yd³ into a rate per m³', () => {
    // 100 per yd³ = 100 / 0.764554857984 per m³ (1 yd³ = 0.764554857984 m³)
    expectRel(siRate(100, 'concrete', 'yd3'), 100 / 0.764554857984, 1e-12);
  });
});

// How sure is the floor (issue 12): sensitivity of the required floor and the seeded risk of
// sweep-out. Expected values come from the deterministic study (runStudy, itself checked against
// published relations elsewhere), from an inverse mapping worked out here by hand, from published
// normal-table values, and from the physics stated beside each check.
import { describe, expect, it } from 'vitest';
import {
  InputError,
  defaultUncertainInputs,
  quantile,
  runStudy,
  runUncertainty,
  uncertaintyToSI,
  FOOT,
  type StudyInput,
  type UncertainInput,
  type UncertaintyRequest,
} from '@basinwright/common';
import { expectRel } from '../support/tolerance';
import { fenwickDesign } from '../../seed/designs';

// the demo project's design input (invented demo data, seed/designs.ts)
const demo: StudyInput = fenwickDesign;
const study = runStudy(demo);
const required = study.floor.requiredElevation!;

const req = (inputs: UncertainInput[], extra: Partial<UncertaintyRequest> = {}) => ({
  inputs,
  samples: 400,
  seed: 'fenwick',
  confidence: 0.9,
  ...extra,
});
const none = (key: UncertainInput['key'], at: number): UncertainInput => ({
  key,
  distribution: { kind: 'uniform', low: at, high: at },
  basis: 'test: no spread',
});

describe('distributions (inverse cumulative distribution)', () => {
  it('uniform and triangular quantiles: closed forms worked by hand', () => {
    expect(quantile({ kind: 'uniform', low: 2, high: 4 }, 0.25)).toBe(2.5);
    // triangular (0, 0, 1): F(x) = 1 − (1 − x)², so F⁻¹(0.75) = 0.5
    expectRel(quantile({ kind: 'triangular', low: 0, mode: 0, high: 1 }, 0.75), 0.5, 1e-12);
    // symmetric triangle: the median is the mode
    expectRel(quantile({ kind: 'triangular', low: 0.8, mode: 1, high: 1.2 }, 0.5), 1, 1e-12);
  });

  it('normal: z(0.975) = 1.95996 and z(0.95) = 1.64485 (standard normal tables, ±1e-5)', () => {
    const wide = { kind: 'normal', mean: 0, sd: 1, low: -40, high: 40 } as const;
    expectRel(quantile(wide, 0.975), 1.959964, 1e-5);
    expectRel(quantile(wide, 0.95), 1.644854, 1e-5);
    expectRel(quantile(wide, 0.01), -2.326348, 1e-5); // the tail branch
    expectRel(quantile(wide, 0.999), 3.090232, 1e-5);
    // truncated to [0, 40]: the median is z(0.75) of the whole normal = 0.67449 (tables)
    expectRel(quantile({ ...wide, low: 0 }, 0.5), 0.67449, 1e-5);
  });
});

describe('every spread at zero equals the deterministic study exactly', () => {
  const inputs = defaultUncertainInputs(demo).map((u) =>
    none(u.key, u.key === 'bedLowering' || u.key === 'ratingShift' ? 0 : 1),
  );
  const r = runUncertainty(demo, req(inputs, { samples: 50 }));

  it('the required floor and governing discharge, as designed, in every row and every sample', () => {
    expect(inputs.length).toBe(5); // downstream n, bed lowering, chute loss, weir C, design Q
    expect(r.asDesigned.requiredElevation).toBe(required);
    expect(r.asDesigned.governingQ).toBe(study.floor.governingQ);
    for (const row of r.sensitivity) {
      expect(row.floorAtLow).toBe(required);
      expect(row.floorAtHigh).toBe(required);
      expect(row.changeAtLow).toBe(0);
      expect(row.governingQAtHigh).toBe(study.floor.governingQ);
    }
    const mc = r.monteCarlo;
    expect(mc.requiredFloor!.min).toBe(required);
    expect(mc.requiredFloor!.max).toBe(required);
    expect(mc.requiredFloor!.histogram).toEqual([{ from: required, to: required, count: 50 }]);
    expect(mc.floorAtConfidence!.elevation).toBe(required);
    // at the floor it solved, the study holds the jump at every discharge: no sweep-out
    expect(study.floor.leastMargin.margin).toBeGreaterThanOrEqual(0);
    expect(mc.probability).toBe(0);
    expect(mc.standardError).toBe(0);
  });
});

describe('Monte Carlo against the inverse mapping', () => {
  it('bed lowering uniform on [0, 1] m at a fixed floor: P(sweep-out) = 1 − m0 within 3 standard errors', () => {
    // Lowering the bed by d lowers every tailwater level by d (normal depth of the degraded
    // channel is unchanged) and leaves the toe alone (the floor is fixed), so every margin
    // falls by d: the jump sweeps out exactly when d > m0, the least margin as designed.
    // For d uniform on [0, 1], P = 1 − m0.
    const fixed = { ...demo, floorElevation: required - 0.4 };
    const m0 = runStudy(fixed).floor.leastMargin.margin;
    expect(m0).toBeGreaterThan(0);
    expect(m0).toBeLessThan(1);
    const mc = runUncertainty(
      fixed,
      req(
        [{ key: 'bedLowering', distribution: { kind: 'uniform', low: 0, high: 1 }, basis: 'test' }],
        {
          samples: 4000,
        },
      ),
    ).monteCarlo;
    const p = 1 - m0;
    expect(Math.abs(mc.probability - p)).toBeLessThanOrEqual(3 * mc.standardError);
    expectRel(mc.standardError, Math.sqrt((mc.probability * (1 - mc.probability)) / 4000), 1e-12);
  });

  it('the floor at 90 % confidence sweeps out in about 10 % of the same samples (within 3 standard errors)', () => {
    const inputs = defaultUncertainInputs(demo);
    const first = runUncertainty(demo, req(inputs, { samples: 1000 })).monteCarlo;
    const z90 = first.floorAtConfidence!.elevation;
    expect(z90).toBeLessThan(required);
    const again = runUncertainty(
      { ...demo, floorElevation: z90 },
      req(inputs, { samples: 1000 }),
    ).monteCarlo;
    // the same seed draws the same samples; a sample sweeps out at z90 when its own required
    // floor lies below z90, which is 10 % of them by the definition of the 10 % point
    const se = Math.sqrt((0.1 * 0.9) / 1000);
    expect(Math.abs(again.probability - 0.1)).toBeLessThanOrEqual(3 * se);
  });
});

describe('reproducible', () => {
  const inputs = defaultUncertainInputs(demo);
  it('the same seed gives the same numbers; another seed other numbers', () => {
    const a = runUncertainty(demo, req(inputs, { samples: 200 }));
    const b = runUncertainty(demo, req(inputs, { samples: 200 }));
    expect(b).toEqual(a);
    const c = runUncertainty(demo, req(inputs, { samples: 200, seed: 'another' }));
    expect(c.monteCarlo.requiredFloor!.mean).not.toBe(a.monteCarlo.requiredFloor!.mean);
  });
});

describe('sensitivity signs (the physics)', () => {
  const r = runUncertainty(demo, req(defaultUncertainInputs(demo), { samples: 1 }));
  const row = (k: string) => r.sensitivity.find((s) => s.key === k)!;

  it('a larger downstream n raises the tailwater, so the floor may stand HIGHER; a smaller n lowers it', () => {
    // Manning: for the same Q a rougher channel runs deeper; more tailwater holds the same jump
    // on a higher floor.
    expect(row('downstreamN').changeAtHigh!).toBeGreaterThan(0);
    expect(row('downstreamN').changeAtLow!).toBeLessThan(0);
  });

  it('a larger chute loss slows the inflow, so the floor may stand higher', () => {
    // less energy at the toe → deeper y1, lower Fr1 → a smaller sequent depth to hold
    expect(row('chuteLoss').changeAtHigh!).toBeGreaterThan(0);
    expect(row('chuteLoss').changeAtLow!).toBeLessThan(0);
  });

  it('bed lowering lowers the floor; the rows come largest swing first', () => {
    expect(row('bedLowering').changeAtHigh!).toBeLessThan(0);
    const swings = r.sensitivity.map((s) => s.swing);
    expect([...swings].sort((a, b) => b - a)).toEqual(swings);
  });
});

describe('bed lowering and the required floor', () => {
  const lowering = (d: number): UncertainInput => none('bedLowering', d);

  it('one for one where the tailwater is normal depth of a uniformly lowered bed and the toe does not depend on the floor', () => {
    // A known toe (v1 held) does not change with the floor; lowering the bed by d lowers the
    // tailwater level by d at every discharge (normal depth of the same channel), so the
    // highest floor that holds falls by exactly d.
    const known: StudyInput = { ...demo, inflow: { kind: 'known', toe: { fr1: 6, y1: 0.4 } } };
    const base = runStudy(known).floor.requiredElevation!;
    for (const d of [0.25, 0.8]) {
      const r = runUncertainty(known, req([lowering(d)], { samples: 1 }));
      expectRel(r.sensitivity[0]!.floorAtHigh!, base - d, 1e-9);
    }
  });

  it('more than one for one below a chute: a lower floor also speeds up the inflow', () => {
    const r = runUncertainty(demo, req([lowering(0.5)], { samples: 1 }));
    expect(r.sensitivity[0]!.changeAtHigh!).toBeLessThan(-0.5);
  });
});

describe('refusals name the field', () => {
  const refusal = (f: () => unknown): InputError => {
    try {
      f();
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      return e as InputError;
    }
    throw new Error('expected a refusal');
  };
  it('an input that does not apply, a repeated key, a factor leaving the physical range, too many samples', () => {
    expect(refusal(() => runUncertainty(demo, req([none('ratingShift', 0)]))).field).toBe(
      'uncertainty.inputs[0].key',
    );
    expect(
      refusal(() => runUncertainty(demo, req([none('weirC', 1), none('weirC', 1)]))).field,
    ).toBe('uncertainty.inputs[1].key');
    // n = 0.03 × 4.5 = 0.135 is still a Manning's n, but 0.05 × 4.5 = 0.225 is not (ENGINE_LIMITS 0.2)
    const rough: StudyInput = {
      ...demo,
      tailwater: {
        ...(demo.tailwater as { kind: 'manning' } & StudyInput['tailwater']),
        manningN: 0.05,
      },
    } as StudyInput;
    const high = refusal(() =>
      runUncertainty(
        rough,
        req([
          { key: 'downstreamN', distribution: { kind: 'uniform', low: 1, high: 4.5 }, basis: '' },
        ]),
      ),
    );
    expect(high.field).toBe('uncertainty.inputs[0].distribution.high');
    expect(refusal(() => runUncertainty(demo, req([], { samples: 20_001 }))).field).toBe(
      'uncertainty.samples',
    );
  });
});

describe('units at the edge', () => {
  it('depths typed in feet become metres (1 ft = 0.3048 m exactly, NIST); factors stay', () => {
    const si = uncertaintyToSI(
      req([
        { key: 'bedLowering', distribution: { kind: 'uniform', low: 0, high: 2 }, basis: '' },
        none('designDischarge', 1.1),
      ]),
      'US',
    );
    expect(si.inputs[0]!.distribution).toEqual({ kind: 'uniform', low: 0, high: 2 * FOOT });
    expect(si.inputs[1]!.distribution).toEqual({ kind: 'uniform', low: 1.1, high: 1.1 });
  });
});

// The chute computed (issue 12, item 1): critical depth on the crest, the S2 drawdown down the
// chute by the engine's direct step method. Checked against an independent profile written
// differently here (x(y) by Simpson's rule on dx/dy = (1 − Fr²)/(S0 − Sf), Chow 1959 eq. 9-13
// turned over, and RK4 in x from tests/support/gvf-reference.ts) and against the fraction
// (loss allowance) method on the demo design.
import { describe, expect, it } from 'vitest';
import {
  G,
  InputError,
  chuteFoot,
  chuteProfile,
  runStudy,
  studyInputSchema,
  toSI,
  type StudyInput,
} from '@basinwright/common';
import { expectRel } from '../support/tolerance';
import { Fr2, Sf, critical, dydx, normal, type Chan } from '../support/gvf-reference';
import { fenwickDesign } from '../../seed/designs';

// A chute like the demo's (invented demo data): 12 m wide, 1V:2H, formed concrete n = 0.014.
const SLOPE = 0.5;
const N = 0.014;
const WIDTH = 12;
const Q = 85;
const sinT = SLOPE / Math.sqrt(1 + SLOPE * SLOPE);
const chan: Chan = { b: WIDTH, z: 0, n: N, S0: sinT, Q };

/** Distance along the bed from critical depth to depth y: Simpson's rule on dx/dy, 20,000 strips. */
function distanceTo(y: number): number {
  const yc = critical(chan);
  const f = (d: number): number => (1 - Fr2(chan, d)) / (chan.S0 - Sf(chan, d));
  const n = 20_000;
  const h = (y - yc) / n;
  let s = f(yc) + f(y);
  for (let k = 1; k < n; k++) s += (k % 2 === 1 ? 4 : 2) * f(yc + k * h);
  return (s * h) / 3;
}

/** RK4 in x on dy/dx from (0, y0) over a distance L in `steps` equal steps. */
function rk4Depth(y0: number, L: number, steps = 20_000): number {
  const h = L / steps;
  let y = y0;
  for (let i = 0; i < steps; i++) {
    const k1 = dydx(chan, y);
    const k2 = dydx(chan, y + (h / 2) * k1);
    const k3 = dydx(chan, y + (h / 2) * k2);
    const k4 = dydx(chan, y + h * k3);
    y += (h / 6) * (k1 + 2 * k2 + 2 * k3 + k4);
  }
  return y;
}

describe('chuteProfile: the S2 drawdown from critical depth on the crest', () => {
  const p = chuteProfile({ slope: SLOPE, manningN: N }, WIDTH, Q);

  it('starts at critical depth and tends to normal depth (bisection references, Chow 1959 §4-2, §5-6)', () => {
    expectRel(p.yc, critical(chan), 1e-9);
    expectRel(p.yn, normal(chan), 1e-6);
    expectRel(p.points[0]!.y, p.yc, 1e-12);
    expect(p.points.every((pt, i) => i === 0 || pt.x > p.points[i - 1]!.x)).toBe(true);
  });

  it('reaches each depth at the distance Simpson’s rule on dx/dy gives (±0.1 %)', () => {
    for (const frac of [0.8, 0.6, 0.4]) {
      const y = p.yn + frac * (p.yc - p.yn);
      // the engine's distance to y: inverse-interpolated from its tabulated points
      const k = p.points.findIndex((pt) => pt.y <= y);
      const a = p.points[k - 1]!;
      const b = p.points[k]!;
      const x = a.x + ((b.x - a.x) * (a.y - y)) / (a.y - b.y);
      expectRel(x, distanceTo(y), 1e-3);
    }
  });

  it('gives at the chute’s foot the depth RK4 in x gives (±0.1 %)', () => {
    const y0 = p.yn + 0.7 * (p.yc - p.yn);
    const x0 = distanceTo(y0); // independent start off the critical singularity of dy/dx
    for (const drop of [3, 6, 12]) {
      const L = drop / sinT;
      const foot = chuteFoot(p, drop)!;
      expectRel(foot.length, L, 1e-12);
      expectRel(foot.y, rk4Depth(y0, L - x0), 1e-3);
      const v = Q / (WIDTH * foot.y);
      expectRel(foot.energy, foot.y + (v * v) / (2 * G), 1e-12); // specific energy, definition
    }
  });

  it('refuses a chute that is not steep, naming its slope', () => {
    let err: unknown;
    try {
      chuteProfile({ slope: 0.002, manningN: 0.03 }, WIDTH, Q); // mild: yn > yc
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(InputError);
    expect((err as InputError).field).toBe('inflow.chute.slope');
    expect((err as InputError).code).toBe('not-supercritical');
  });
});

describe('the study with the chute computed', () => {
  const chuteInflow = (extra: object = {}): StudyInput => ({
    ...fenwickDesign,
    inflow: {
      ...fenwickDesign.inflow,
      chute: { slope: SLOPE, manningN: N, ...extra },
    } as StudyInput['inflow'],
  });

  it('agrees with the fraction method on the demo: a loss of 5–25 % of the head and y1 within 10 %', () => {
    // the demo types a 10 % loss (seed/designs.ts); chute losses of 5–25 % of the head are the
    // usual allowance on concrete chutes of this height (common practice, from memory)
    const byFraction = runStudy(fenwickDesign);
    const computed = runStudy({
      ...chuteInflow(),
      floorElevation: byFraction.floor.elevation,
    });
    const t = computed.designJump.toe;
    const share = t.headLoss / t.H0;
    expect(share).toBeGreaterThan(0.05);
    expect(share).toBeLessThan(0.25);
    expectRel(t.y1, byFraction.designJump.toe.y1, 0.1);
    // the toe is the profile's foot: the same depth chuteFoot gives, independent of the study path
    const p = chuteProfile({ slope: SLOPE, manningN: N }, WIDTH, 85);
    expectRel(t.y1, chuteFoot(p, 102 - byFraction.floor.elevation)!.y, 1e-12);
  });

  it('carries a narrower chute’s energy onto the wider floor (energy equation)', () => {
    const r = runStudy({ ...chuteInflow({ width: 10 }), floorElevation: 87 });
    const p = chuteProfile({ slope: SLOPE, manningN: N }, 10, 85);
    const foot = chuteFoot(p, 102 - 87)!;
    const t = r.designJump.toe;
    expectRel(t.y1 + (t.v1 * t.v1) / (2 * G), foot.energy, 1e-9);
    expect(t.y1).toBeLessThan(foot.y); // the same energy spread wider runs shallower
  });
});

describe('the chute field at the edges', () => {
  it('the shared schema keeps it and refuses a slope outside its range; toSI turns its width from feet', () => {
    const raw = {
      ...fenwickDesign,
      inflow: { ...fenwickDesign.inflow, chute: { slope: 0.5, manningN: 0.014, width: 10 } },
    };
    const cast = studyInputSchema.validateSync(raw, { stripUnknown: true });
    expect(cast.inflow.kind === 'chute' && cast.inflow.chute).toEqual({
      slope: 0.5,
      manningN: 0.014,
      width: 10,
    });
    expect(() =>
      studyInputSchema.validateSync({
        ...raw,
        inflow: { ...raw.inflow, chute: { slope: 20, manningN: 0.014 } },
      }),
    ).toThrow('The chute slope must not exceed 10.');
    // 1 ft = 0.3048 m exactly (NIST); slope and n have no unit
    const si = toSI({ ...(cast as StudyInput), units: 'US' });
    const c = si.inflow.kind === 'chute' ? si.inflow.chute : undefined;
    expect(c).toEqual({ slope: 0.5, manningN: 0.014, width: 10 * 0.3048 });
  });
});

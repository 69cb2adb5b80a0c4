// Where the jump forms: the four situations of a channel, checked against an independent
// solution written here — the profile equation dy/dx = (S0 − Sf)/(1 − Fr²) (Chow 1959,
// eq. 9-13) integrated in x by classical Runge–Kutta with 1 cm steps, the jump placed where
// the Bélanger sequent of the supercritical depth equals the subcritical depth. The engine
// steps in depth (direct step method) — a different discretisation of the same physics.
import { describe, expect, it } from 'vitest';
import { G, jumpNoteText, jumpToeDistance, locateJump, type Section } from '@basinwright/common';
import { expectRel } from '../support/tolerance';
import { M, bisect, conj, critical, normal, rk4Until, type Chan } from '../support/gvf-reference';

const rect3: Section = { shape: 'rectangular', width: 3 };
const chan = (S0: number, n = 0.014, Q = 6): Chan => ({ b: 3, z: 0, n, S0, Q });

describe('jump position in a channel (independent RK4 check, 1 cm steps)', () => {
  it('slope break, steep → mild, jump pushed onto the mild reach (M3 profile)', () => {
    const up = chan(0.08);
    const dn = chan(0.001);
    const yn1 = normal(up);
    const yn2 = normal(dn);
    expect(M(up, yn1)).toBeGreaterThan(M(dn, yn2)); // the supercritical flow is the stronger
    const target = M(dn, yn2);
    const xRef = rk4Until(dn, yn1, 0.01, (y) => target - M(dn, y));
    const r = locateJump({
      kind: 'slopeBreak',
      section: rect3,
      Q: 6,
      upstream: { slope: 0.08, manningN: 0.014 },
      downstream: { slope: 0.001, manningN: 0.014 },
    });
    expect(r.position).toBe('downstream');
    expectRel(r.distance, xRef, 5e-4);
    expectRel(r.ySequent, yn2, 1e-8);
    expectRel(r.supercriticalProfile[0]!.y, yn1, 1e-8);
    expectRel(r.supercriticalProfile.at(-1)!.x, r.distance, 1e-12);
  });

  it('slope break, steep → mild, jump on the steep reach (S1 backwater from the break)', () => {
    const up = chan(0.02);
    const dn = chan(0.0005);
    const yn1 = normal(up);
    const yn2 = normal(dn);
    const y2 = conj(up, yn1);
    expect(y2).toBeLessThan(yn2);
    const xRef = rk4Until(up, yn2, -0.01, (y) => y2 - y);
    const r = locateJump({
      kind: 'slopeBreak',
      section: rect3,
      Q: 6,
      upstream: { slope: 0.02, manningN: 0.014 },
      downstream: { slope: 0.0005, manningN: 0.014 },
    });
    expect(r.position).toBe('upstream');
    expectRel(r.distance, -xRef, 5e-4);
    expectRel(r.ySequent, y2, 1e-7);
    // profiles run from upstream to downstream for plotting
    expect(r.subcriticalProfile[0]!.x).toBeLessThan(r.subcriticalProfile.at(-1)!.x);
  });

  it('sluice gate on a mild slope: jump downstream of the vena contracta (M3)', () => {
    const c = chan(0.0005);
    const y1 = 0.61 * 0.3;
    const target = M(c, normal(c));
    const xRef = rk4Until(c, y1, 0.01, (y) => target - M(c, y));
    const r = locateJump({
      kind: 'gateMildSlope',
      section: rect3,
      Q: 6,
      opening: 0.3,
      Cc: 0.61,
      slope: 0.0005,
      manningN: 0.014,
    });
    expect(r.position).toBe('downstream');
    expectRel(r.distance, xRef, 5e-4);
    expectRel(jumpToeDistance(rect3, 6, 0.014, 0.0005, y1, normal(c)), xRef, 5e-4);
  });

  it('sluice gate on a mild slope drowned by the tailwater: distance 0, said so', () => {
    const r = locateJump({
      kind: 'gateMildSlope',
      section: rect3,
      Q: 6,
      opening: 0.6,
      Cc: 0.61,
      slope: 0.0005,
      manningN: 0.014,
    });
    expect(r.position).toBe('drowned');
    expect(r.distance).toBe(0);
    // the notes are data: the drowned jump and the submerged gate, phrased in messages/jump.ts
    expect(r.notes.map((n) => n.code)).toEqual([
      'from-vena-contracta',
      'drowned',
      'gate-submerged',
    ]);
    expect(r.notes.map((n) => jumpNoteText(n, 'US')).join(' ')).toMatch(/submerged/);
    // check: the vena contracta 0.366 m already has less momentum than the tailwater
    const c = chan(0.0005);
    expect(M(c, 0.366)).toBeLessThan(M(c, normal(c)));
  });

  it('gate on a steep slope: jump upstream of the gate (S1 from the gate pool)', () => {
    const c = chan(0.02);
    // upstream depth from the gate equation q = Cd·a·√(2g·y0), Cd = Cc/√(1 + Cc·a/y0) [Henderson 1966]
    const q = 2;
    const y0 = bisect(
      (y) => (0.61 / Math.sqrt(1 + (0.61 * 0.3) / y)) * 0.3 * Math.sqrt(2 * G * y) - q,
      0.31,
      50,
    );
    const y2 = conj(c, normal(c));
    const xRef = rk4Until(c, y0, -0.01, (y) => y2 - y);
    const r = locateJump({
      kind: 'gateSteepSlope',
      section: rect3,
      Q: 6,
      opening: 0.3,
      Cc: 0.61,
      slope: 0.02,
      manningN: 0.014,
    });
    expect(r.position).toBe('upstream');
    expectRel(r.distance, -xRef, 5e-4);
    expectRel(r.subcriticalProfile.at(-1)!.y, y0, 1e-8);
  });

  it('weir crest onto a mild slope: toe depth from E = P + 1.5·yc, then the M3 profile', () => {
    const c = chan(0.0005);
    const yc = critical(c);
    const E = 2 + 1.5 * yc; // rectangle: Ec = 1.5·yc [Chow 1959, §3-2]
    const y1 = bisect((y) => y + 4 / (2 * G * y * y) - E, 0.01, yc);
    const target = M(c, normal(c));
    const xRef = rk4Until(c, y1, 0.005, (y) => target - M(c, y));
    const r = locateJump({
      kind: 'weirToMildSlope',
      section: rect3,
      Q: 6,
      crestHeight: 2,
      slope: 0.0005,
      manningN: 0.014,
    });
    expect(r.position).toBe('downstream');
    expectRel(r.supercriticalProfile[0]!.y, y1, 1e-8);
    expectRel(r.distance, xRef, 5e-4);
  });

  it('jumpToeDistance on a horizontal trapezoidal floor (H3 profile)', () => {
    const c: Chan = { b: 4, z: 1.5, n: 0.016, S0: 0, Q: 20 };
    const yDown = 2.2;
    const target = M(c, yDown);
    const xRef = rk4Until(c, 0.3, 0.005, (y) => target - M(c, y));
    const d = jumpToeDistance(
      { shape: 'trapezoidal', bottomWidth: 4, sideSlope: 1.5 },
      20,
      0.016,
      0,
      0.3,
      yDown,
    );
    expectRel(d, xRef, 5e-4);
  });

  it('jumpToeDistance refuses what cannot be', () => {
    expect(() => jumpToeDistance(rect3, 6, 0.014, 0.0005, 1.0, 1.5)).toThrow(
      /yStart .* not supercritical/,
    );
    expect(() => jumpToeDistance(rect3, 6, 0.014, 0.0005, 0.2, 0.5)).toThrow(
      /yDownstream .* not subcritical/,
    );
    // steep reach: the S3 profile tends to normal depth 0.417 m; the sequent of 1.0 m is 0.53 m
    expect(() => jumpToeDistance(rect3, 6, 0.014, 0.02, 0.2, 1.0)).toThrow(/steep/);
    // on the same steep reach a toe depth below normal depth is reached along the S3 curve
    expect(jumpToeDistance(rect3, 6, 0.014, 0.02, 0.2, 1.5)).toBeGreaterThan(0);
    expect(() => jumpToeDistance(rect3, 6, 0.014, 0.0005, 0.2, 0.5)).toThrow(RangeError);
    // sequent of 0.5 m at q = 2 m²/s is 1.05 m: a tailwater of 1.2 m drowns the jump
    expect(jumpToeDistance(rect3, 6, 0.014, 0.0005, 0.5, 1.2)).toBe(0);
    expect(() =>
      locateJump({
        kind: 'gateSteepSlope',
        section: rect3,
        Q: 6,
        slope: 0.0005,
        manningN: 0.014,
        upstreamDepth: 2,
      }),
    ).toThrow(/not steep/);
  });
});

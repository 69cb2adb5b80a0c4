// POST /calc/jump-position: where the jump forms below a control. The engine's distances are
// checked against an independent RK4 integration in tests/common/hydraulics-profiles.test.ts;
// here the route is checked end to end against facts that do not depend on the engine:
// the depth after the jump is the mild channel's normal depth (Manning, Chow 1959 §5-6), the
// toe depth and that depth are conjugate (Bélanger, Chow 1959 eq. 3-20), and the toe depth
// lies between the vena contracta (Cc·a, Henderson 1966) and critical depth.
import { describe, expect, it } from 'vitest';
import { bearer, signUpFirm, apiForFile } from '../support/api-app';
import { expectRel } from '../support/tolerance';

const g = 9.80665; // the engine's g (standard gravity)
let token = '';
const h = apiForFile(async () => {
  token = (await signUpFirm(h, 'position')).token;
});

const post = (body: unknown, t: string | null = token) => {
  const req = h.http().post('/api/v1/calc/jump-position');
  return (t === null ? req : req.set(bearer(t))).send(body as object);
};

const b = 3;
const Q = 6;
const n = 0.014;
const manningQ = (y: number, S: number) => {
  const A = b * y;
  const R = A / (b + 2 * y);
  return (1 / n) * A * R ** (2 / 3) * Math.sqrt(S);
};
const belanger = (y1: number) => {
  const fr = Q / b / Math.sqrt(g * y1 ** 3);
  return (y1 / 2) * (Math.sqrt(1 + 8 * fr * fr) - 1);
};

/** A sluice gate with the given opening (m) on the 3 m channel at slope 0.0005 (Cc 0.61). */
const gateOnMildSlope = (opening: number) => ({
  kind: 'gateMildSlope',
  section: { shape: 'rectangular', width: b },
  Q,
  opening,
  Cc: 0.61,
  slope: 0.0005,
  manningN: n,
});

describe('POST /api/v1/calc/jump-position', () => {
  it('a gate on a mild slope: the jump stands downstream on the M3 profile', async () => {
    const res = await post(gateOnMildSlope(0.3));
    expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(200);
    const r = res.body;
    expect(r.position).toBe('downstream');
    expect(r.distance).toBeGreaterThan(0);
    expectRel(manningQ(r.ySequent, 0.0005), Q, 1e-6); // normal depth of the mild channel
    expectRel(belanger(r.yToe), r.ySequent, 1e-4); // conjugate depths
    expect(r.yToe).toBeGreaterThan(0.61 * 0.3); // the M3 profile rises from the vena contracta
    expect(r.yToe).toBeLessThan(r.criticalDepth);
    expectRel(r.criticalDepth, Math.cbrt((Q / b) ** 2 / g), 1e-9);
    // profiles for plotting: x increasing, depths positive
    for (const profile of [r.supercriticalProfile, r.subcriticalProfile]) {
      expect(profile.length).toBeGreaterThan(1);
      for (let i = 1; i < profile.length; i += 1)
        expect(profile[i].x).toBeGreaterThan(profile[i - 1].x);
    }
  });

  it('a slope break steep → mild: the depth after the jump is the mild normal depth', async () => {
    const res = await post({
      kind: 'slopeBreak',
      section: { shape: 'rectangular', width: b },
      Q,
      upstream: { slope: 0.08, manningN: n },
      downstream: { slope: 0.001, manningN: n },
    });
    expect(res.status).toBe(200);
    expectRel(manningQ(res.body.ySequent, 0.001), Q, 1e-6);
    expect(['downstream', 'upstream']).toContain(res.body.position);
  });

  it('a drowned gate answers drowned at distance 0', async () => {
    const res = await post(gateOnMildSlope(0.6));
    expect(res.status).toBe(200);
    expect(res.body.position).toBe('drowned');
    expect(res.body.distance).toBe(0);
    // the notes are data (code and the SI depth quoted), phrased by the client in its units
    expect(res.body.notes.map((n: { code: string }) => n.code)).toEqual([
      'from-vena-contracta',
      'drowned',
      'gate-submerged',
    ]);
  });

  it('needs a sign-in; bad or impossible input is a 422 with a message, never a 500', async () => {
    expect((await post({ kind: 'slopeBreak' }, null)).status).toBe(401);
    const unknown = await post({
      kind: 'waterfall',
      section: { shape: 'rectangular', width: 3 },
      Q,
    });
    expect(unknown.status).toBe(422);
    expect(unknown.body.details.kind).toMatch(/slopeBreak/);
    const missing = await post({
      kind: 'gateMildSlope',
      section: { shape: 'rectangular', width: 3 },
      Q: -1,
    });
    expect(missing.status).toBe(422);
    expect(Object.keys(missing.body.details)).toEqual(
      expect.arrayContaining(['Q', 'opening', 'slope']),
    );
    // both reaches mild: no supercritical flow to jump from — the engine's RangeError as a 422
    const impossible = await post({
      kind: 'slopeBreak',
      section: { shape: 'rectangular', width: b },
      Q,
      upstream: { slope: 0.0001, manningN: n },
      downstream: { slope: 0.001, manningN: n },
    });
    expect(impossible.status).toBe(422);
    expect(impossible.body.code).toBe('validation_error');
    // coded (not-steep), filed under the field it names, phrased from its code
    expect(impossible.body.details['upstream.slope']).toMatch(
      /^The upstream slope is not steep at this discharge/,
    );
  });
});

// Engine routes: signed-in members only; bad or impossible input is a 4xx with the message.
// Expected numbers come from hydraulics.md §6 (sources named there) and Bélanger's equation
// (Chow 1959, eq. 3-20).
import { describe, expect, it } from 'vitest';
import { addMember, bearer, signUpFirm, apiForFile } from '../support/api-app';
import { expectRel } from '../support/tolerance';
import { fenwickDesign } from '../../seed/designs';

let token: string;
const h = apiForFile(async () => {
  token = (await signUpFirm(h, 'calc')).token;
});

const jump = (body: unknown, t: string | null = token) => {
  const req = h.http().post('/api/v1/calc/jump');
  return (t === null ? req : req.set(bearer(t))).send(body as object);
};
const study = (body: unknown) =>
  h
    .http()
    .post('/api/v1/calc/study')
    .set(bearer(token))
    .send(body as object);

// the demo project's design input (invented demo data, seed/designs.ts), 9 discharges
const demo = {
  ...fenwickDesign,
  discharges: { kind: 'range', min: 5, max: 85, count: 9 },
} as const;

describe('POST /api/v1/calc/jump', () => {
  it('returns the JumpResult: y1 0.2, b 5, Q 4.43 → y2 0.8, Fr1 3.16 [src: textbook problem, ±0.5 %]', async () => {
    const res = await jump({ section: { shape: 'rectangular', width: 5 }, Q: 4.43, y1: 0.2 });
    expect(res.status).toBe(200);
    for (const k of [
      'y1',
      'y2',
      'v1',
      'v2',
      'fr1',
      'fr2',
      'headLoss',
      'relativeLoss',
      'efficiency',
      'length',
      'rollerLength',
      'jumpClass',
      'power',
    ]) {
      expect(res.body).toHaveProperty(k);
    }
    expectRel(res.body.y2, 0.8, 0.005);
    expectRel(res.body.fr1, 3.16, 0.005);
    expect(res.body.jumpClass).toBe('oscillating');
  });
  it('trapezoid by momentum: b 5, z 1, Q 20, y1 0.40 → 2.2731 m [calc with g = 9.81: 3e-4]', async () => {
    const res = await jump({
      section: { shape: 'trapezoidal', bottomWidth: 5, sideSlope: 1 },
      Q: 20,
      y1: 0.4,
    });
    expect(res.status).toBe(200);
    expectRel(res.body.y2, 2.2731, 3e-4);
  });
  it('signed-in members of any role may calculate; strangers may not', async () => {
    expect(
      (await jump({ section: { shape: 'rectangular', width: 5 }, Q: 4.43, y1: 0.2 }, null)).status,
    ).toBe(401);
    const firm = await signUpFirm(h, 'calc-viewer');
    const viewer = await addMember(h, firm.firm.id, 'viewer');
    const res = await jump(
      { section: { shape: 'rectangular', width: 5 }, Q: 4.43, y1: 0.2 },
      viewer.token,
    );
    expect(res.status).toBe(200);
  });
  it.each([
    ['missing fields', {}, 'Q'],
    [
      'negative width',
      { section: { shape: 'rectangular', width: -1 }, Q: 1, y1: 0.1 },
      'section.width',
    ],
    ['unknown shape', { section: { shape: 'oval' }, Q: 1, y1: 0.1 }, 'section.shape'],
    ['text for a number', { section: { shape: 'rectangular', width: 2 }, Q: 'lots', y1: 0.1 }, 'Q'],
  ])('invalid input → 422 (%s)', async (_n, body, field) => {
    const res = await jump(body);
    expect(res.status).toBe(422);
    expect(res.body.code).toBe('validation_error');
    expect(res.body.details).toHaveProperty(field);
  });
  it('impossible input → 422 with the engine message, never 500', async () => {
    const sub = await jump({ section: { shape: 'rectangular', width: 1 }, Q: 1, y1: 2 });
    expect(sub.status).toBe(422);
    expect(sub.body.message).toMatch(/not supercritical/);
    const full = await jump({ section: { shape: 'circular', diameter: 1 }, Q: 2, y1: 0.2 });
    expect(full.status).toBe(422);
    expect(full.body.message).toMatch(/run full/);
    const over = await jump({ section: { shape: 'circular', diameter: 1 }, Q: 1, y1: 1.5 });
    expect(over.status).toBe(422);
  });
});

describe('POST /api/v1/calc/study', () => {
  it('runs the study: floor, rows, cautions', async () => {
    const res = await study(demo);
    expect(res.status).toBe(200);
    expect(res.body.rows).toHaveLength(9);
    const gov = res.body.rows.find((r: { Q: number }) => r.Q === res.body.floor.governingQ);
    expectRel(gov.tailwaterDepth, gov.y2, 1e-6); // TW = 1.0·y2 where it binds
    expect(res.body.cautions.join(' ')).toMatch(/licensed professional engineer/);
  });
  it('the same study in US units gives the same floor (result in SI)', async () => {
    const FT = 0.3048;
    const CFS = FT ** 3;
    const us = {
      ...demo,
      units: 'US',
      channelBedElevation: 90 / FT,
      basinWidth: 12 / FT,
      designDischarge: 85 / CFS,
      discharges: { kind: 'range', min: 5 / CFS, max: 85 / CFS, count: 9 },
      tailwater: {
        ...demo.tailwater,
        section: { shape: 'trapezoidal', bottomWidth: 14 / FT, sideSlope: 2 },
      },
      inflow: {
        ...demo.inflow,
        crestElevation: 102 / FT,
        headwater: { kind: 'weir', C: 2.15 / Math.sqrt(FT), L: 12 / FT },
      },
    };
    const [a, b] = await Promise.all([study(demo), study(us)]);
    expect(b.status).toBe(200);
    expectRel(b.body.floor.elevation, a.body.floor.elevation, 1e-9);
  });
  it('bad study input → 422 naming the field; impossible → 422 with the engine message', async () => {
    const bad = await study({ ...demo, inflow: { kind: 'gate', Cc: 0.61 } });
    expect(bad.status).toBe(422);
    expect(bad.body.details).toHaveProperty('inflow');
    const none = await study({ ...demo, discharges: { kind: 'range', min: 5, max: 85, count: 0 } });
    expect(none.status).toBe(422);
    expect(none.body.details).toHaveProperty(['discharges.count']);
    const sub = await study({ ...demo, inflow: { kind: 'known', toe: { y1: 3, v1: 1 } } });
    expect(sub.status).toBe(422);
    expect(sub.body.message).toMatch(/not supercritical/);
  });
  it('passes the dissipator options through: chosen type and a default override reach the engine', async () => {
    const res = await study({
      ...demo,
      dissipators: { chosenType: 'usbr-2', defaults: { riprapLengthRatio: 6 } },
    });
    expect(res.status).toBe(200);
    expect(res.body.input.dissipators).toEqual({
      chosenType: 'usbr-2',
      defaults: { riprapLengthRatio: 6 },
    });
    expect(res.body.design.type).toBe('usbr-2');
    // riprap length = ratio × y2 [from memory: 4–6·y2 habit; here the override 6]
    expectRel(res.body.design.design.riprap.length, 6 * res.body.design.design.sizing.y2, 1e-12);
    const bad = await study({
      ...demo,
      dissipators: { chosenType: 'moat', defaults: { colour: 1 } },
    });
    expect(bad.status).toBe(422);
    expect(bad.body.details['dissipators.chosenType']).toMatch(/must be one of/);
    expect(bad.body.details['dissipators.defaults.colour']).toMatch(/not a setting/);
  });
  it('a pipe inflow needs no lossModel (optional, default none)', async () => {
    const res = await study({
      ...demo,
      inflow: {
        kind: 'pipe',
        invertElevation: 95,
        outlet: {
          kind: 'table',
          rows: [
            { Q: 1, depth: 0.5, velocity: 5 },
            { Q: 100, depth: 2, velocity: 9 },
          ],
        },
      },
    });
    expect(res.status).toBe(200);
    expect(res.body.rows.length).toBe(9);
  });
  it('is documented in the OpenAPI file', async () => {
    const res = await h.http().get('/api/v1/openapi.json');
    expect(res.status).toBe(200);
    expect(Object.keys(res.body.paths)).toEqual(
      expect.arrayContaining(['/calc/jump', '/calc/study']),
    );
    for (const s of ['JumpRequest', 'JumpResult', 'StudyInput', 'StudyResult'])
      expect(res.body.components.schemas).toHaveProperty(s);
  });
});

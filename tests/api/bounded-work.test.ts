// Bounded work (issue 8, item 1): every engine input has a limit checked before any work,
// engine calculations run in the compute pool off the event loop with a time budget, and an
// engine error from a worker reaches the client as the same 422 as before.
// Limits and their reasons: ENGINE_LIMITS in common/src/schemas/limits.ts.
import { describe, expect, it } from 'vitest';
import { ENGINE_LIMITS, type StudyInput } from '@basinwright/common';
import { caldwellDesign, fenwickDesign } from '../../seed/designs';
import { addMember, apiForFile, bearer, setPlan, signUpFirm } from '../support/api-app';
import type { ApiError } from '../../api/src/errors';

let owner = '';
let viewer = '';
let projectId = '';
const h = apiForFile(async () => {
  const firm = await signUpFirm(h, 'bounded');
  owner = firm.token;
  await setPlan(h, firm.firm.id, 'firm', 5);
  viewer = (await addMember(h, firm.firm.id, 'viewer')).token;
  const project = await h
    .http()
    .post('/api/v1/projects')
    .set(bearer(owner))
    .send({ name: 'Bounded work', units: 'SI' });
  projectId = project.body.id;
});

const study = (body: unknown, t = owner) =>
  h
    .http()
    .post('/api/v1/calc/study')
    .set(bearer(t))
    .send(body as object);
const health = () => h.http().get('/api/v1/health');

/** Polls until `ready()` holds (a condition, never a fixed wait). */
async function until(what: string, ready: () => boolean, timeoutMs = 60_000): Promise<void> {
  const end = Date.now() + timeoutMs;
  while (!ready()) {
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 5));
  }
}

// the demo design (invented demo data, seed/designs.ts) at the largest discharge count allowed
const longStudy: StudyInput = {
  ...fenwickDesign,
  discharges: { kind: 'range', min: 5, max: 85, count: ENGINE_LIMITS.maxDischarges },
};

describe('the request that stopped the API (issue 8): demo input with basinWidth 10,000', () => {
  it('a viewer gets a prompt 422 naming basinWidth, and the service keeps serving', async () => {
    const res = await study({ ...fenwickDesign, basinWidth: 10_000 }, viewer);
    expect(res.status).toBe(422);
    expect(res.body.details.basinWidth).toMatch(/must not exceed 300 m/);
    expect((await health()).status).toBe(200);
    const demo = await study(fenwickDesign, viewer);
    expect(demo.status).toBe(200);
    expect(demo.body.rows.length).toBeGreaterThan(0);
  });

  it('the design save refuses it the same way, under input.basinWidth, and saves nothing', async () => {
    const res = await h
      .http()
      .put(`/api/v1/projects/${projectId}/design`)
      .set(bearer(owner))
      .send({ input: { ...fenwickDesign, basinWidth: 10_000 } });
    expect(res.status).toBe(422);
    expect(res.body.details['input.basinWidth']).toMatch(/must not exceed 300 m/);
    const saved = await h.http().get(`/api/v1/projects/${projectId}/design`).set(bearer(owner));
    expect(saved.body.input).toBeNull();
  });
});

describe('limits checked before any work: a 422 naming the field', () => {
  const gate = {
    ...fenwickDesign,
    inflow: { kind: 'gate', Cc: 0.61, opening: 0.6 },
  };
  const rows = (n: number) =>
    Array.from({ length: n }, (_, i) => ({ Q: 1 + i, elevation: 90 + i / n }));
  it.each([
    [
      'discharges.count',
      { ...fenwickDesign, discharges: { kind: 'range', min: 5, max: 85, count: 5001 } },
      /At most 5000 discharges/,
    ],
    [
      'discharges.values',
      { ...fenwickDesign, discharges: { kind: 'list', values: rows(5001).map((r) => r.Q) } },
      /At most 5000 discharges/,
    ],
    [
      'tailwater.rows',
      { ...fenwickDesign, tailwater: { kind: 'table', rows: rows(5001) } },
      /at most 5000 rows/,
    ],
    ['basinWidth', { ...caldwellDesign, basinWidth: 1000 }, /must not exceed 980 ft/],
    [
      'inflow.headwater.C',
      {
        ...fenwickDesign,
        inflow: { ...fenwickDesign.inflow, headwater: { kind: 'weir', C: 3.9, L: 12 } },
      },
      /between 1.2 and 2.5 m\^0.5\/s/,
    ],
    ['inflow.Cc', { ...gate, inflow: { ...gate.inflow, Cc: 0.4 } }, /Cc must be at least 0.5/],
    [
      'tailwater.manningN',
      { ...fenwickDesign, tailwater: { ...fenwickDesign.tailwater, manningN: 0.5 } },
      /Manning's n must not exceed 0.2/,
    ],
  ])('%s', async (field, body, message) => {
    const res = await study(body);
    expect(res.status).toBe(422);
    expect(res.body.details[field]).toMatch(message);
  });

  it('a weir coefficient typed in US units is checked in ft^0.5/s (3.9 is an ogee crest there)', async () => {
    const us = {
      ...caldwellDesign,
      channelBedElevation: 290,
      inflow: {
        kind: 'chute',
        crestElevation: 330,
        headwater: { kind: 'weir', C: 3.9, L: 26 },
        lossModel: { kind: 'fraction', value: 0.1 },
      },
    };
    const res = await study(us);
    expect(res.body.details?.['inflow.headwater.C']).toBeUndefined();
  });
});

describe('the compute pool', () => {
  it('/health keeps answering while a 5,000-discharge study runs', async () => {
    const { computePool } = await import('../../api/src/modules/calc/calc.pool');
    const pool = computePool();
    let answered = false;
    const running = study(longStudy).then((res) => {
      answered = true;
      return res;
    });
    await until('the study to reach the pool', () => pool.pending > 0 || answered);
    const res = await health();
    expect(res.status).toBe(200);
    // The health check came back while the study was still being computed: the event loop
    // was free (on the main thread the health check would have waited for the study).
    expect(answered).toBe(false);
    expect(pool.pending).toBeGreaterThan(0);
    // It ends with its result, or with the over-budget 422 on a machine too busy to finish it.
    const done = await running;
    expect([200, 422]).toContain(done.status);
  }, 120_000); // the study itself may take its whole time budget on a busy machine

  it('over its time budget a calculation is stopped with a 422 naming the input that made it large; the pool serves on', async () => {
    const { computePool } = await import('../../api/src/modules/calc/calc.pool');
    const pool = computePool();
    const failure = await pool.run({ kind: 'study', input: longStudy }, 1).then(
      () => null,
      (e: unknown) => e as ApiError,
    );
    expect(failure?.status).toBe(422);
    expect(failure?.details?.['discharges.count']).toMatch(
      /took longer than 0\.001 s.*number of discharges \(discharges\.count = 5000\)/,
    );
    const next = await pool.run({ kind: 'study', input: fenwickDesign });
    expect(next.rows.length).toBeGreaterThan(0);
  });

  it('an engine RangeError thrown in a worker is the same 422 as before, under the field it names', async () => {
    // A known toe with Fr1 below 1 is subcritical: the engine refuses it (RangeError naming
    // inflow.toe); the schema lets it through (Fr1 is a physics check, not a bound).
    const res = await study({
      ...fenwickDesign,
      inflow: { kind: 'known', toe: { y1: 2, v1: 1 } },
    });
    expect(res.status).toBe(422);
    expect(res.body.code).toBe('validation_error');
    expect(res.body.details['inflow.toe']).toMatch(/not supercritical/);
  });

  it("an engine error keeps its name, message, field and code across the thread boundary (structured clone, as piscina's messages)", async () => {
    const { toErrorData } = await import('../../api/src/modules/calc/calc.worker');
    const { reviveEngineError } = await import('../../api/src/modules/calc/calc.pool');
    class StudyInputError extends RangeError {
      override name = 'StudyInputError';
      constructor(
        message: string,
        readonly field: string,
        readonly code: string,
      ) {
        super(message);
      }
    }
    const thrown = new StudyInputError(
      'discharges.count: too many',
      'discharges.count',
      'too_many',
    );
    const back = reviveEngineError(structuredClone(toErrorData(thrown)));
    expect(back).toBeInstanceOf(RangeError);
    expect(back.name).toBe('StudyInputError');
    expect(back.message).toBe('discharges.count: too many');
    expect(back).toMatchObject({ field: 'discharges.count', code: 'too_many' });
  });
});

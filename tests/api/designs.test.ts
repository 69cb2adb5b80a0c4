import { describe, expect, it } from 'vitest';
import { ENGINE_VERSION, runStudy, toSI } from '@basinwright/common';
import { caldwellDesign, fenwickDesign } from '../../seed/designs';
import { bearer, setPlan, signUpFirm, apiForFile } from '../support/api-app';

// A project's design: saved as typed (in the project's units), validated by the shared schema
// and by running the study on the server; bad input is a 4xx and saves nothing.

let token = '';
let firmId = '';
let siProject = '';
let usProject = '';

const h = apiForFile(async () => {
  const firm = await signUpFirm(h, 'designs');
  token = firm.token;
  firmId = firm.firm.id;
  await setPlan(h, firmId, 'firm', 5);
  const si = await h
    .http()
    .post('/api/v1/projects')
    .set(bearer(token))
    .send({ name: 'Design SI', units: 'SI' });
  const us = await h
    .http()
    .post('/api/v1/projects')
    .set(bearer(token))
    .send({ name: 'Design US', units: 'US' });
  siProject = si.body.id;
  usProject = us.body.id;
});

const get = (id: string, t = token) => h.http().get(`/api/v1/projects/${id}/design`).set(bearer(t));
/** A save based on the current copy: it sends the revision it read (optimistic concurrency). */
const put = async (id: string, body: object, t = token) => {
  const current = await get(id, t);
  const revision = (current.body as { revision?: number | null }).revision ?? null;
  return h
    .http()
    .put(`/api/v1/projects/${id}/design`)
    .set(bearer(t))
    .send({ ...body, revision });
};

describe('GET/PUT /projects/:id/design', () => {
  it('a project without a design answers with nulls', async () => {
    const res = await get(siProject);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({
      projectId: siProject,
      input: null,
      options: null,
      updatedAt: null,
      revision: null,
      updatedBy: null,
      result: null,
      engineVersion: null,
      computedAt: null,
    });
  });

  it('saves the input as typed and returns it unchanged, with who saved it', async () => {
    const res = await put(siProject, { input: fenwickDesign, options: { chosenType: 'usbr-2' } });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.input).toEqual(fenwickDesign);
    expect(res.body.options).toEqual({ chosenType: 'usbr-2' });
    expect(res.body.updatedBy.name).toBeTruthy();
    const again = await get(siProject);
    expect(again.body.input).toEqual(fenwickDesign);
    expect(await h.models.Design.count({ where: { projectId: siProject } })).toBe(1);
  });

  it('a second save replaces the first (one design a project)', async () => {
    const changed = { ...fenwickDesign, basinWidth: 14 };
    const res = await put(siProject, { input: changed });
    expect(res.status).toBe(200);
    expect(res.body.input.basinWidth).toBe(14);
    expect(res.body.options).toBeNull();
    expect(await h.models.Design.count({ where: { projectId: siProject } })).toBe(1);
  });

  it('keeps the result it computed on save, with the engine version and time, and returns it on read', async () => {
    const before = Date.now();
    const changed = { ...fenwickDesign, basinWidth: 13 };
    const res = await put(siProject, { input: changed });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    // the same engine run here on the same input gives the stored answer, every figure of it
    const expected = JSON.parse(JSON.stringify(runStudy(toSI(changed))));
    expect(res.body.result).toEqual(expected);
    expect(res.body.engineVersion).toBe(ENGINE_VERSION);
    const at = Date.parse(res.body.computedAt);
    expect(at).toBeGreaterThanOrEqual(before - 1000);
    expect(at).toBeLessThanOrEqual(Date.now() + 1000);
    const read = await get(siProject);
    expect(read.body.result).toEqual(expected);
    expect(read.body.engineVersion).toBe(ENGINE_VERSION);
    expect(read.body.computedAt).toBe(res.body.computedAt);
    // stored in the row, not recomputed on read
    const row = await h.models.Design.findOne({ where: { projectId: siProject } });
    expect(row?.result).toEqual(expected);
    // put back the width the tests below expect
    expect((await put(siProject, { input: { ...fenwickDesign, basinWidth: 14 } })).status).toBe(
      200,
    );
  });

  it('keeps a US-customary design in its own units (the study still runs in SI)', async () => {
    const res = await put(usProject, { input: caldwellDesign });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.input.designDischarge).toBe(420);
    // the server ran the same study the browser runs, on the input in SI, and kept it
    expect(res.body.result).toEqual(JSON.parse(JSON.stringify(runStudy(toSI(caldwellDesign)))));
    expect(res.body.result.rows).toHaveLength(20);
  });

  it('rejects a design in the wrong unit system for the project, saving nothing', async () => {
    const before = await get(usProject);
    const res = await put(usProject, { input: fenwickDesign });
    expect(res.status).toBe(422);
    expect(res.body.code).toBe('validation_error');
    expect(res.body.details['input.units']).toMatch(/US/);
    expect((await get(usProject)).body).toEqual(before.body);
  });

  it('input the engine cannot compute (a subcritical toe) is a 422 with its message; nothing saved', async () => {
    const before = await get(siProject);
    const bad = { ...fenwickDesign, inflow: { kind: 'known', toe: { y1: 3, v1: 1 } } };
    const res = await put(siProject, { input: bad });
    expect(res.status).toBe(422);
    expect(res.body.message).toMatch(/not supercritical/);
    // filed under the field the engine names, inside the request's `input`
    expect(res.body.details['input.inflow.toe']).toMatch(/not supercritical/);
    expect((await get(siProject)).body).toEqual(before.body);
  });

  it("on a US project the engine's message quotes its quantities in ft, not m", async () => {
    // a fixed floor at 400 ft lies above the outlet's energy line of the Caldwell demo (invented scenario)
    const res = await put(usProject, { input: { ...caldwellDesign, floorElevation: 400 } });
    expect(res.status).toBe(422);
    // 400 ft = 121.92 m exactly [NIST SP 811: 1 ft = 0.3048 m]; the engine computed it in m;
    // lengths are said to the hundredth (the one rounding rule, formatQuantity)
    expect(res.body.details['input.floorElevation']).toBe(
      'The floor at 400.00 ft lies above the energy line of the inflow.',
    );
    expect(res.body.message).not.toMatch(/\d m\b/);
  });

  it('schema errors come back per field', async () => {
    const res = await put(siProject, {
      input: { ...fenwickDesign, basinWidth: -3, designDischarge: 'lots' },
    });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.details)).toEqual(
      expect.arrayContaining(['input.basinWidth', 'input.designDischarge']),
    );
  });

  it('a missing input, non-object options and malformed JSON are 4xx, never 500', async () => {
    expect((await put(siProject, {})).status).toBe(422);
    expect((await put(siProject, { input: fenwickDesign, options: [1, 2] })).status).toBe(422);
    const raw = await h
      .http()
      .put(`/api/v1/projects/${siProject}/design`)
      .set(bearer(token))
      .set('Content-Type', 'application/json')
      .send('{"input": ');
    expect(raw.status).toBe(400);
    expect(raw.body.code).toBe('bad_json');
  });

  it("another firm's project answers 404 and gets no design", async () => {
    const other = await signUpFirm(h, 'designs-other');
    expect((await get(siProject, other.token)).status).toBe(404);
    const res = await put(siProject, { input: { ...fenwickDesign, basinWidth: 99 } }, other.token);
    expect(res.status).toBe(404);
    expect((await get(siProject)).body.input.basinWidth).toBe(14);
    expect((await get('not-a-uuid')).status).toBe(404);
  });

  it('deleting the project deletes its design', async () => {
    const p = await h
      .http()
      .post('/api/v1/projects')
      .set(bearer(token))
      .send({ name: 'Short-lived', units: 'SI' });
    expect((await put(p.body.id, { input: fenwickDesign })).status).toBe(200);
    expect((await h.http().delete(`/api/v1/projects/${p.body.id}`).set(bearer(token))).status).toBe(
      204,
    );
    expect(await h.models.Design.count({ where: { projectId: p.body.id } })).toBe(0);
  });

  it('saves the dissipator overrides and the chosen type in the input; a bad override is a 422 and saves nothing', async () => {
    // US project: the overrides are typed in ft; the server runs the study on toSI(input).
    const dissipators = {
      chosenType: 'usbr-2' as const,
      debris: 'light' as const,
      defaults: { freeboardCoefficient: 0.15, riprapMinThickness: 2 },
      flotation: { safetyFactor: 1.5, minThickness: 1.5 },
    };
    const res = await put(usProject, { input: { ...caldwellDesign, dissipators } });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.input.dissipators).toEqual(dissipators);
    expect((await get(usProject)).body.input.dissipators).toEqual(dissipators);
    // What the server computed: the chosen type, and 2 ft = 0.6096 m exactly (NIST SP 811).
    const study = runStudy(toSI(res.body.input));
    expect(study.dissipators?.chosen).toBe('usbr-2');
    expect(study.dissipators?.assumptions.find((a) => a.key === 'riprapMinThickness')?.value).toBe(
      2 * 0.3048,
    );

    const before = await get(usProject);
    const bad = await put(usProject, {
      input: {
        ...caldwellDesign,
        dissipators: {
          ...dissipators,
          defaults: { freeboardCoefficient: -1 },
          flotation: { safetyFactor: 0.5 },
        },
      },
    });
    expect(bad.status).toBe(422);
    expect(bad.body.details['input.dissipators.defaults.freeboardCoefficient']).toMatch(
      /must be a number not below zero/,
    );
    expect(bad.body.details['input.dissipators.flotation.safetyFactor']).toBe(
      'The flotation safety factor must be at least 1.',
    );
    const unknown = await put(usProject, {
      input: { ...caldwellDesign, dissipators: { defaults: { wallColour: 3 } } },
    });
    expect(unknown.status).toBe(422);
    expect((await get(usProject)).body).toEqual(before.body);
  });
});

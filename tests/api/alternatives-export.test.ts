// The alternatives export (issue 10's plan gate, issue 13's spreadsheets): the sized types of
// the saved design side by side, a Firm-plan feature enforced by the server.
import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { runStudy, toSI, type StudyInput } from '@basinwright/common';
import { caldwellDesign, fenwickDesign } from '../../seed/designs';
import { bearer, setPlan, signUpFirm, apiForFile } from '../support/api-app';
import { expectRel } from '../support/tolerance';

const h = apiForFile();
const FT = 0.3048; // international foot, exact by definition [src: NIST SP 811]

async function firmWithDesign(label: string, units: 'SI' | 'US', input: StudyInput) {
  const firm = await signUpFirm(h, label);
  const project = await h
    .http()
    .post('/api/v1/projects')
    .set(bearer(firm.token))
    .send({ name: `${label} — outlet`, units });
  expect(project.status).toBe(201);
  const saved = await h
    .http()
    .put(`/api/v1/projects/${project.body.id}/design`)
    .set(bearer(firm.token))
    .send({ input });
  expect(saved.status, JSON.stringify(saved.body)).toBe(200);
  return { firm, projectId: project.body.id as string };
}

const exportOf = (token: string, projectId: string, format: 'csv' | 'xlsx') =>
  h
    .http()
    .get(`/api/v1/projects/${projectId}/alternatives/export?format=${format}`)
    .set(bearer(token))
    .buffer(true)
    .parse((r, done) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => done(null, Buffer.concat(chunks)));
    });

describe('alternatives export: Firm plan only', () => {
  it.each(['concept', 'professional'] as const)(
    'on %s: 403 plan_limit naming the feature and the plan that lifts it, no file',
    async (plan) => {
      const { firm, projectId } = await firmWithDesign(`alt-${plan}`, 'SI', fenwickDesign);
      await setPlan(h, firm.firm.id, plan, plan === 'concept' ? 1 : 2);
      const res = await h
        .http()
        .get(`/api/v1/projects/${projectId}/alternatives/export?format=csv`)
        .set(bearer(firm.token));
      expect(res.status).toBe(403);
      expect(res.body.code).toBe('plan_limit');
      expect(res.body.details).toEqual({ limit: 'alternativesExport', liftedBy: 'firm' });
      expect(res.body.message).toMatch(/Firm/);
      expect(res.headers['content-disposition']).toBeUndefined();
    },
  );

  it('another firm’s project answers 404 before the plan is looked at', async () => {
    const { projectId } = await firmWithDesign('alt-owner', 'SI', fenwickDesign);
    const other = await signUpFirm(h, 'alt-other');
    const res = await h
      .http()
      .get(`/api/v1/projects/${projectId}/alternatives/export?format=csv`)
      .set(bearer(other.token));
    expect(res.status).toBe(404);
  });

  it('on Firm, SI: a CSV with the header, then the chosen type and every alternative', async () => {
    const { firm, projectId } = await firmWithDesign('alt-firm', 'SI', fenwickDesign);
    await setPlan(h, firm.firm.id, 'firm', 3);
    const res = await exportOf(firm.token, projectId, 'csv');
    expect(res.status).toBe(200);
    expect(res.headers['content-disposition']).toContain('alternatives-alt-firm-outlet.csv');
    const rows = Papa.parse<string[]>(
      (res.body as Buffer).toString('utf8').replace(/^\uFEFF/, ''),
    ).data;
    expect(rows[0]).toEqual(['Project', 'alt-firm — outlet']);
    expect(rows[2]).toEqual(['Units', 'SI (metric)']);
    const at = rows.findIndex((r) => r[0] === 'Type');
    expect(rows[at]).toEqual([
      'Type',
      'Chosen',
      'Screening',
      'Floor elevation (m)',
      'Floor below the bed (m)',
      'Length (m)',
      'Width (m)',
      'Excavation (m³)',
      'Concrete (m³)',
      'Reinforcement (kg)',
    ]);
    // the same study the server stored, computed here on the same input
    const study = runStudy(fenwickDesign);
    const entries = [study.design!, ...study.alternatives];
    const body = rows.slice(at + 1).filter((r) => r.length > 1);
    expect(body.map((r) => r[0])).toEqual(entries.map((e) => e.design.name));
    expect(body[0]![1]).toBe('yes');
    entries.forEach((e, i) =>
      expectRel(Number(body[i]![5]), e.design.length, 1e-3 / e.design.length),
    );
    // floor below the bed = bed − floor, signed (a floor above the bed is not shown as 0)
    entries.forEach((e, i) => {
      const d = e.design;
      if (d.family !== 'jump-basin' && d.family !== 'impact-basin') return;
      const below = fenwickDesign.channelBedElevation - d.floorElevation;
      expect(Math.abs(Number(body[i]![4]) - below)).toBeLessThanOrEqual(5e-4);
    });
  });

  it('on Firm, US: an XLSX in feet and cubic yards [1 ft = 0.3048 m, NIST SP 811]', async () => {
    const { firm, projectId } = await firmWithDesign('alt-us', 'US', caldwellDesign);
    await setPlan(h, firm.firm.id, 'firm', 3);
    const res = await exportOf(firm.token, projectId, 'xlsx');
    expect(res.status).toBe(200);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(res.body as ArrayBuffer);
    const sheet = wb.worksheets[0]!;
    const values: unknown[][] = [];
    sheet.eachRow({ includeEmpty: true }, (row) => values.push((row.values as unknown[]).slice(1)));
    expect(values[2]).toEqual(['Units', 'US customary']);
    const at = values.findIndex((r) => r[0] === 'Type');
    expect(values[at]![5]).toBe('Length (ft)');
    expect(values[at]![8]).toBe('Concrete (yd³)');
    expect(sheet.getRow(at + 1).font?.bold).toBe(true);
    const chosen = runStudy(toSI(caldwellDesign)).design!;
    expectRel(
      values[at + 1]![5] as number,
      chosen.design.length / FT,
      1e-3 / (chosen.design.length / FT),
    );
  });

  it('a project whose design is not saved yet: 409 saying so', async () => {
    const firm = await signUpFirm(h, 'alt-empty');
    await setPlan(h, firm.firm.id, 'firm', 3);
    const project = await h
      .http()
      .post('/api/v1/projects')
      .set(bearer(firm.token))
      .send({ name: 'Nothing saved', units: 'SI' });
    const res = await h
      .http()
      .get(`/api/v1/projects/${project.body.id}/alternatives/export?format=xlsx`)
      .set(bearer(firm.token));
    expect(res.status).toBe(409);
    expect(res.body.message).toMatch(/save it/);
  });
});

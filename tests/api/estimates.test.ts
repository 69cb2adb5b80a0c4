import ExcelJS from 'exceljs';
import { describe, expect, it } from 'vitest';
import { fenwickDesign } from '../../seed/designs';
import { addMember, bearer, setPlan, signUpFirm, apiForFile } from '../support/api-app';
import { expectRel } from '../support/tolerance';

// Estimates priced from the stored Fenwick design through a price book; totals against a hand
// calculation written out here; issued revisions never change.

/** 1 yd³ = 0.9144³ m³ exactly (the international yard, 1959): a fact of the trade. */
const M3_PER_YD3 = 0.9144 ** 3;

const h = apiForFile();

interface TakeoffLine {
  key: string;
  quantity: number;
}

async function setUpFirm(tag: string) {
  const firm = await signUpFirm(h, tag);
  await setPlan(h, firm.firm.id, 'firm', 10);
  const auth = bearer(firm.token);
  const project = await h
    .http()
    .post('/api/v1/projects')
    .set(auth)
    .send({ name: 'Fenwick estimate', units: 'SI' });
  const saved = await h
    .http()
    .put(`/api/v1/projects/${project.body.id}/design`)
    .set(auth)
    .send({ input: fenwickDesign });
  expect(saved.status, JSON.stringify(saved.body).slice(0, 300)).toBe(200);
  const book = await h
    .http()
    .post('/api/v1/price-books')
    .set(auth)
    .send({ name: 'Test rates', currency: 'USD' });
  await h
    .http()
    .put(`/api/v1/price-books/${book.body.id}/items`)
    .set(auth)
    .send({
      items: [
        { code: 'CON', description: 'Slab concrete', unit: 'm³', unitPrice: 400 },
        { code: 'EXC', description: 'Excavation', unit: 'CY', unitPrice: 15 },
        { code: 'RBR', description: 'Bar', unit: 'kg', unitPrice: 2 },
        { code: 'FORM', description: 'Forms', unit: 'SF', unitPrice: 9 },
      ],
    });
  const takeoff = await h.http().get(`/api/v1/projects/${project.body.id}/takeoff`).set(auth);
  expect(takeoff.status).toBe(200);
  const lines = takeoff.body.lines as TakeoffLine[];
  const q = (key: string) => lines.find((l) => l.key === key)!.quantity;
  return { firm, auth, projectId: project.body.id as string, bookId: book.body.id as string, q };
}

const SETTINGS = {
  locationFactor: 1.1,
  percentages: { mobilisation: 0.05, careOfWater: 0.03, contingency: 0.2, overheadAndProfit: 0.15 },
  escalation: { annualRate: 0.04, years: 2 },
  accuracy: { aaceClass: 4 },
};

/** The stated order of an estimate, written out by hand. */
function handTotal(direct: number) {
  const located = direct * 1.1;
  const mob = 0.05 * located;
  const cow = 0.03 * located;
  const cont = 0.2 * (located + mob + cow);
  const op = 0.15 * (located + mob + cow + cont);
  const before = located + mob + cow + cont + op;
  const esc = before * (1.04 ** 2 - 1);
  return before + esc;
}

describe('estimates', () => {
  it('prices the take-off through the mapping: totals against a hand calculation', async () => {
    const { auth, projectId, bookId, q } = await setUpFirm('est-hand');
    const made = await h
      .http()
      .post(`/api/v1/projects/${projectId}/estimates`)
      .set(auth)
      .send({ priceBookId: bookId });
    expect(made.status, JSON.stringify(made.body).slice(0, 300)).toBe(201);
    expect(made.body).toMatchObject({ revision: 1, status: 'draft' });
    // Nothing mapped yet: every take-off line is listed as unpriced.
    expect(made.body.lines).toEqual([]);
    expect(made.body.unpriced.length).toBe(made.body.takeoffLines.length);

    const res = await h
      .http()
      .patch(`/api/v1/estimates/${made.body.id}`)
      .set(auth)
      .send({
        settings: SETTINGS,
        mapping: {
          'concrete.floorSlab': 'CON',
          'excavation.structure': 'exc',
          'formwork.floorSlab': 'RBR', // kg cannot measure an area: refused line by line
        },
      });
    expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(200);
    const direct = q('concrete.floorSlab') * 400 + (q('excavation.structure') / M3_PER_YD3) * 15;
    expectRel(res.body.totals.direct, direct, 1e-12);
    expectRel(res.body.totals.total, handTotal(direct), 1e-12);
    // AACE 18R-97 class 4: −15 % to −30 % low, +20 % to +50 % high; with none chosen the wide ends.
    expectRel(res.body.totals.accuracy.low, handTotal(direct) * 0.7, 1e-12);
    expectRel(res.body.totals.accuracy.high, handTotal(direct) * 1.5, 1e-12);
    const exc = res.body.lines.find((l: { key: string }) => l.key === 'excavation.structure');
    expect(exc).toMatchObject({ code: 'EXC', unit: 'yd³' });
    expectRel(exc.quantity, q('excavation.structure') / M3_PER_YD3, 1e-12);
    expect(res.body.unpriced).toContainEqual({
      key: 'formwork.floorSlab',
      reason: 'Item RBR is priced per kg, which does not measure this line (m²).',
    });
    // The book remembers the mapping for the next estimate.
    const book = await h.models.PriceBook.findByPk(bookId);
    expect(book?.takeoffMapping['concrete.floorSlab']).toBe('CON');
  });

  it('overrides a quantity with a reason, keeps the audit entry, issues, then refuses every change', async () => {
    const { auth, firm, projectId, bookId, q } = await setUpFirm('est-issue');
    const made = await h
      .http()
      .post(`/api/v1/projects/${projectId}/estimates`)
      .set(auth)
      .send({ priceBookId: bookId });
    const url = `/api/v1/estimates/${made.body.id}`;
    await h
      .http()
      .patch(url)
      .set(auth)
      .send({ settings: SETTINGS, mapping: { 'concrete.floorSlab': 'CON' } });
    const noReason = await h
      .http()
      .post(`${url}/overrides`)
      .set(auth)
      .send({ key: 'concrete.floorSlab', quantity: 500, reason: ' ' });
    expect(noReason.status).toBe(422);
    // 500 yd³ typed by the estimator = 500 × 0.9144³ m³.
    const over = await h.http().post(`${url}/overrides`).set(auth).send({
      key: 'concrete.floorSlab',
      quantity: 500,
      unit: 'yd3',
      reason: 'Slab thickened at the chute',
    });
    expect(over.status, JSON.stringify(over.body).slice(0, 300)).toBe(200);
    const line = over.body.lines[0];
    expectRel(line.quantityUsed, 500 * M3_PER_YD3, 1e-12);
    expectRel(over.body.totals.direct, 500 * M3_PER_YD3 * 400, 1e-12);
    expect(over.body.audit).toHaveLength(1);
    expect(over.body.audit[0]).toMatchObject({
      by: firm.user.name,
      key: 'concrete.floorSlab',
      unit: 'm³',
      reason: 'Slab thickened at the chute',
    });
    expectRel(over.body.audit[0].oldQuantity, q('concrete.floorSlab'), 1e-12);
    expectRel(over.body.audit[0].newQuantity, 500 * M3_PER_YD3, 1e-12);

    const issued = await h.http().post(`${url}/issue`).set(auth);
    expect(issued.status, JSON.stringify(issued.body).slice(0, 300)).toBe(200);
    expect(issued.body.status).toBe('issued');
    const design = await h.models.Design.findOne({ where: { projectId } });
    expect(issued.body.pricedFrom).toEqual({
      designId: design!.id,
      engineVersion: design!.engineVersion,
      computedAt: design!.computedAt!.toISOString(),
      designUpdatedAt: design!.updatedAt.toISOString(),
    });

    for (const res of await Promise.all([
      h.http().patch(url).set(auth).send({ settings: SETTINGS }),
      h
        .http()
        .post(`${url}/overrides`)
        .set(auth)
        .send({ key: 'concrete.floorSlab', quantity: 1, reason: 'Later' }),
      h.http().post(`${url}/issue`).set(auth),
    ]))
      expect(res.status).toBe(409);

    // A later price change does not move the issued figures.
    await h.models.PriceBookItem.update({ unitPrice: 999 }, { where: { priceBookId: bookId } });
    const again = await h.http().get(url).set(auth);
    expect(again.body.totals).toEqual(issued.body.totals);

    // A new revision starts from the issued one (book, settings, override), priced now.
    const next = await h.http().post(`/api/v1/projects/${projectId}/estimates`).set(auth).send({});
    expect(next.status).toBe(201);
    expect(next.body).toMatchObject({ revision: 2, status: 'draft', settings: SETTINGS });
    expect(next.body.priceBook.id).toBe(bookId);
    expect(next.body.lines[0].override.reason).toBe('Slab thickened at the chute');
    expectRel(next.body.totals.direct, 500 * M3_PER_YD3 * 999, 1e-12);
    const second = await h
      .http()
      .post(`/api/v1/projects/${projectId}/estimates`)
      .set(auth)
      .send({});
    expect(second.status).toBe(409);
    const list = await h.http().get(`/api/v1/projects/${projectId}/estimates`).set(auth);
    expect(
      list.body.items.map((r: { revision: number; status: string }) => [r.revision, r.status]),
    ).toEqual([
      [2, 'draft'],
      [1, 'issued'],
    ]);
  });

  it('exports CSV and XLSX; refuses another firm (404) and a viewer changing it (403)', async () => {
    const { auth, firm, projectId, bookId } = await setUpFirm('est-export');
    const made = await h
      .http()
      .post(`/api/v1/projects/${projectId}/estimates`)
      .set(auth)
      .send({ priceBookId: bookId });
    const url = `/api/v1/estimates/${made.body.id}`;
    await h
      .http()
      .patch(url)
      .set(auth)
      .send({ mapping: { 'concrete.floorSlab': 'CON' } });
    const csv = await h.http().get(`${url}/export?format=csv`).set(auth);
    expect(csv.status).toBe(200);
    expect(csv.text).toMatch(/\r\nTotal,,,,,,,[0-9.]+,?\r\n/);
    // Every export starts by naming the project, the design and the units (issue 13, item 6).
    // (after the byte-order mark by which a spreadsheet reads the file as UTF-8)
    expect(csv.text.startsWith('\uFEFF')).toBe(true);
    const lines = csv.text.slice(1).split('\r\n');
    expect(lines.slice(0, 4)).toEqual([
      'Project,Fenwick estimate',
      expect.stringMatching(/^Design,USBR Type II basin \(draft revision \d+\)$/),
      'Units,SI (metric)',
      'Table,Estimate revision 1 (draft)',
    ]);
    expect(lines.some((l) => l.startsWith('Take-off line,Code,Description,Quantity'))).toBe(true);
    const xlsx = await h
      .http()
      .get(`${url}/export?format=xlsx`)
      .set(auth)
      .buffer(true)
      .parse((r, done) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(xlsx.status).toBe(200);
    expect(xlsx.headers['content-type']).toMatch(/spreadsheetml/);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(xlsx.body as ArrayBuffer);
    const values: unknown[][] = [];
    wb.worksheets[0]!.eachRow({ includeEmpty: true }, (row) =>
      values.push((row.values as unknown[]).slice(1)),
    );
    expect(values[0]).toEqual(['Project', 'Fenwick estimate']);
    expect(values[2]).toEqual(['Units', 'SI (metric)']);
    expect(values.some((r) => r[0] === 'Total' && typeof r[7] === 'number')).toBe(true);

    const other = await signUpFirm(h, 'est-other');
    const o = bearer(other.token);
    for (const res of await Promise.all([
      h.http().get(url).set(o),
      h.http().patch(url).set(o).send({ priceBookId: null }),
      h.http().post(`${url}/issue`).set(o),
      h.http().get(`${url}/export`).set(o),
      h.http().get(`/api/v1/projects/${projectId}/takeoff`).set(o),
      h.http().get(`/api/v1/projects/${projectId}/estimates`).set(o),
    ]))
      expect(res.status).toBe(404);
    // Another firm's book cannot be chosen either.
    const foreignBook = await h.http().post('/api/v1/price-books').set(o).send({ name: 'Theirs' });
    const choose = await h.http().patch(url).set(auth).send({ priceBookId: foreignBook.body.id });
    expect(choose.status).toBe(422);

    const viewer = await addMember(h, firm.firm.id, 'viewer');
    expect((await h.http().get(url).set(bearer(viewer.token))).status).toBe(200);
    const change = await h.http().post(`${url}/issue`).set(bearer(viewer.token));
    expect(change.status).toBe(403);
    expect((await h.models.Estimate.findByPk(made.body.id))?.status).toBe('draft');
  });

  it('take-off overrides are stored per design in SI and move the quantities', async () => {
    const { auth, projectId, q } = await setUpFirm('est-takeoff');
    const before = q('excavation.structure');
    const bad = await h
      .http()
      .put(`/api/v1/projects/${projectId}/takeoff/overrides`)
      .set(auth)
      .send({ overrides: { workingRoom: 'wide' } });
    expect(bad.status).toBe(422);
    // The project is in SI units: stored as typed.
    const res = await h
      .http()
      .put(`/api/v1/projects/${projectId}/takeoff/overrides`)
      .set(auth)
      .send({ overrides: { workingRoom: 0.9 } });
    expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(200);
    expect(res.body.overrides).toEqual({ workingRoom: 0.9 });
    const after = res.body.lines.find(
      (l: TakeoffLine) => l.key === 'excavation.structure',
    ).quantity;
    expect(after).not.toBe(before);
  });
});

// Plan gating of price books (issue 10). The caps are the product brief's plan table
// (../shared/design/product.md, "Plans"): Concept one book and no import; Professional one book
// with import; Firm several books.
import { describe, expect, it } from 'vitest';
import { bearer, setPlan, signUpFirm, apiForFile } from '../support/api-app';

const h = apiForFile();

const create = (token: string, name: string) =>
  h.http().post('/api/v1/price-books').set(bearer(token)).send({ name });

const MAPPING = { code: 'Code', description: 'Description', unit: 'Unit', unitPrice: 'Unit price' };
const FILE = Buffer.from('Code,Description,Unit,Unit price\nCON-1,Concrete,m3,410\n', 'utf8');

const importInto = (token: string, id: string) =>
  h
    .http()
    .post(`/api/v1/price-books/${id}/import`)
    .set(bearer(token))
    .field('mapping', JSON.stringify(MAPPING))
    .attach('file', FILE, 'rates.csv');

const previewFile = (token: string) =>
  h
    .http()
    .post('/api/v1/price-books/import/preview')
    .set(bearer(token))
    .attach('file', FILE, 'rates.csv');

const copyOf = (token: string, id: string) =>
  h.http().post(`/api/v1/price-books/${id}/copy`).set(bearer(token));

const books = (firmId: string) => h.models.PriceBook.count({ where: { firmId } });

/** A 403 plan_limit naming what bit, the plan that lifts it, and both plans in its sentence. */
function expectRefused(
  res: { status: number; body: { message: string } },
  limit: string,
  liftedBy: string,
  planNames: string[],
): void {
  expect(res.status).toBe(403);
  expect(res.body).toMatchObject({ code: 'plan_limit', details: { limit, liftedBy } });
  for (const name of planNames) expect(res.body.message).toContain(name);
}

describe('importing price books needs Professional', () => {
  it('Concept: preview and import are 403 plan_limit naming the feature and Professional; nothing written', async () => {
    const firm = await signUpFirm(h, 'pbp-concept');
    const made = await create(firm.token, 'Only book');
    expect(made.status).toBe(201);
    for (const res of [await previewFile(firm.token), await importInto(firm.token, made.body.id)])
      expectRefused(res, 'priceBookImport', 'professional', ['Concept', 'Professional']);
    expect(await h.models.PriceBookItem.count({ where: { priceBookId: made.body.id } })).toBe(0);
  });

  it('Professional: the same preview and import succeed', async () => {
    const firm = await signUpFirm(h, 'pbp-pro-import');
    await setPlan(h, firm.firm.id, 'professional', 1);
    const made = await create(firm.token, 'Only book');
    expect((await previewFile(firm.token)).status).toBe(200);
    const res = await importInto(firm.token, made.body.id);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.added).toBe(1);
  });
});

describe('the number of price books', () => {
  it('Concept: a second book (created or copied) is 403 plan_limit, lifted by Firm', async () => {
    const firm = await signUpFirm(h, 'pbp-concept-two');
    const first = await create(firm.token, 'First');
    expect(first.status).toBe(201);
    // Professional also holds one book, so Firm is the plan that lifts Concept's cap.
    for (const res of [await create(firm.token, 'Second'), await copyOf(firm.token, first.body.id)])
      expectRefused(res, 'priceBooks', 'firm', ['Concept', 'Firm']);
    expect(await books(firm.firm.id)).toBe(1);
  });

  it('Professional: a second book and a copy are 403 plan_limit lifted by Firm; archived books count', async () => {
    const firm = await signUpFirm(h, 'pbp-pro');
    await setPlan(h, firm.firm.id, 'professional', 1);
    const first = await create(firm.token, 'First');
    expect(first.status).toBe(201);
    const archived = await h
      .http()
      .patch(`/api/v1/price-books/${first.body.id}`)
      .set(bearer(firm.token))
      .send({ archived: true });
    expect(archived.status).toBe(200);
    for (const res of [await create(firm.token, 'Second'), await copyOf(firm.token, first.body.id)])
      expectRefused(res, 'priceBooks', 'firm', ['Professional', 'Firm']);
    expect(await books(firm.firm.id)).toBe(1);
  });

  it('Firm: several books, created and copied', async () => {
    const firm = await signUpFirm(h, 'pbp-firm');
    await setPlan(h, firm.firm.id, 'firm', 3);
    const first = await create(firm.token, 'First');
    expect(first.status).toBe(201);
    expect((await create(firm.token, 'Second')).status).toBe(201);
    expect((await copyOf(firm.token, first.body.id)).status).toBe(201);
    expect(await books(firm.firm.id)).toBe(3);
  });

  it('concurrent creates on Professional never make more than one book', async () => {
    const firm = await signUpFirm(h, 'pbp-race');
    await setPlan(h, firm.firm.id, 'professional', 1);
    const results = await Promise.all(
      Array.from({ length: 6 }, (_, i) => create(firm.token, `Racing ${i}`)),
    );
    const statuses = results.map((r) => r.status).sort();
    expect(statuses).toEqual([201, 403, 403, 403, 403, 403]);
    expect(await books(firm.firm.id)).toBe(1);
  });
});

import ExcelJS from 'exceljs';
import { describe, expect, it } from 'vitest';
import { addMember, bearer, setPlan, signUpFirm, apiForFile } from '../support/api-app';

const h = apiForFile();

const create = (token: string, body: object) =>
  h.http().post('/api/v1/price-books').set(bearer(token)).send(body);

const ITEMS = [
  { code: 'CON-1', description: 'Structural concrete', unit: 'm3', unitPrice: 410.5 },
  { code: 'RBR-1', description: 'Reinforcement', unit: 'kg', unitPrice: 2.35, source: 'Quote' },
];

async function bookWithItems(token: string, name = 'Unit rates 2026') {
  const made = await create(token, { name, currency: 'eur' });
  expect(made.status).toBe(201);
  const put = await h
    .http()
    .put(`/api/v1/price-books/${made.body.id}/items`)
    .set(bearer(token))
    .send({ items: ITEMS });
  expect(put.status, JSON.stringify(put.body)).toBe(200);
  return put.body as { id: string; items: typeof ITEMS };
}

describe('price books: create, edit, copy, archive', () => {
  it('creates a book, fills it, reads it back with numbers as numbers', async () => {
    const firm = await signUpFirm(h, 'pb-crud');
    const book = await bookWithItems(firm.token);
    const read = await h.http().get(`/api/v1/price-books/${book.id}`).set(bearer(firm.token));
    expect(read.status).toBe(200);
    expect(read.body).toMatchObject({
      name: 'Unit rates 2026',
      currency: 'EUR',
      archived: false,
      itemCount: 2,
    });
    // Items take the book's currency when they name none; unitPrice is a JSON number.
    expect(read.body.items).toEqual([
      { ...ITEMS[0], currency: 'EUR', source: '', dateNote: '' },
      { ...ITEMS[1], currency: 'EUR', dateNote: '' },
    ]);
    const list = await h.http().get('/api/v1/price-books').set(bearer(firm.token));
    expect(
      list.body.items.map((b: { id: string; itemCount: number }) => [b.id, b.itemCount]),
    ).toEqual([[book.id, 2]]);
  });

  it('refuses a duplicated code (any case) and a negative price, writing nothing', async () => {
    const firm = await signUpFirm(h, 'pb-dup');
    const book = await bookWithItems(firm.token);
    const res = await h
      .http()
      .put(`/api/v1/price-books/${book.id}/items`)
      .set(bearer(firm.token))
      .send({
        items: [...ITEMS, { code: 'con-1', description: 'Again', unit: 'm3', unitPrice: -1 }],
      });
    expect(res.status).toBe(422);
    expect(res.body.details['items[2].code']).toMatch(/more than once/);
    expect(res.body.details['items[2].unitPrice']).toMatch(/negative/);
    expect(await h.models.PriceBookItem.count({ where: { priceBookId: book.id } })).toBe(2);
  });

  it('copies a book with its items; archives, refuses changes while archived, restores', async () => {
    const firm = await signUpFirm(h, 'pb-copy');
    // A copy is a second book: the Firm plan allows several (price-books-plan.test.ts tests the caps).
    await setPlan(h, firm.firm.id, 'firm', 10);
    const book = await bookWithItems(firm.token);
    const copy = await h.http().post(`/api/v1/price-books/${book.id}/copy`).set(bearer(firm.token));
    expect(copy.status).toBe(201);
    expect(copy.body.name).toBe('Copy of Unit rates 2026');
    expect(copy.body.id).not.toBe(book.id);
    expect(copy.body.items.map((i: { code: string }) => i.code)).toEqual(['CON-1', 'RBR-1']);

    const url = `/api/v1/price-books/${book.id}`;
    const archived = await h.http().patch(url).set(bearer(firm.token)).send({ archived: true });
    expect(archived.status).toBe(200);
    expect(archived.body.archived).toBe(true);
    const edit = await h.http().put(`${url}/items`).set(bearer(firm.token)).send({ items: [] });
    expect(edit.status).toBe(409);
    const rename = await h.http().patch(url).set(bearer(firm.token)).send({ name: 'New name' });
    expect(rename.status).toBe(409);
    // Never deleted: still listed and readable.
    expect((await h.http().get(url).set(bearer(firm.token))).body.items).toHaveLength(2);
    const restored = await h.http().patch(url).set(bearer(firm.token)).send({ archived: false });
    expect(restored.body.archived).toBe(false);
  });

  it("answers another firm's book with 404 on every route", async () => {
    const a = await signUpFirm(h, 'pb-firm-a');
    const b = await signUpFirm(h, 'pb-firm-b');
    const book = await bookWithItems(a.token);
    const url = `/api/v1/price-books/${book.id}`;
    const probes = [
      h.http().get(url).set(bearer(b.token)),
      h.http().patch(url).set(bearer(b.token)).send({ name: 'Mine now' }),
      h.http().put(`${url}/items`).set(bearer(b.token)).send({ items: [] }),
      h.http().post(`${url}/copy`).set(bearer(b.token)),
      h.http().get(`${url}/export`).set(bearer(b.token)),
      h
        .http()
        .post(`${url}/import`)
        .set(bearer(b.token))
        .field(
          'mapping',
          JSON.stringify({ code: 'a', description: 'b', unit: 'c', unitPrice: 'd' }),
        )
        .attach('file', Buffer.from('a,b,c,d\nX,Y,m,1\n'), 'x.csv'),
    ];
    for (const res of await Promise.all(probes)) expect(res.status).toBe(404);
    expect(await h.models.PriceBookItem.count({ where: { priceBookId: book.id } })).toBe(2);
    const list = await h.http().get('/api/v1/price-books').set(bearer(b.token));
    expect(list.body.items).toEqual([]);
  });

  it('lets a viewer read and export but not change', async () => {
    const firm = await signUpFirm(h, 'pb-viewer');
    const book = await bookWithItems(firm.token);
    const viewer = await addMember(h, firm.firm.id, 'viewer');
    const url = `/api/v1/price-books/${book.id}`;
    expect((await h.http().get(url).set(bearer(viewer.token))).status).toBe(200);
    expect((await h.http().get(`${url}/export`).set(bearer(viewer.token))).status).toBe(200);
    const put = await h.http().put(`${url}/items`).set(bearer(viewer.token)).send({ items: [] });
    expect(put.status).toBe(403);
  });
});

describe('price books: export neutralises formula-looking cells', () => {
  const DANGEROUS = [
    { code: '=1+1', description: '+cmd', unit: '-m', unitPrice: 1 },
    { code: '@SUM', description: '-5 + 3', unit: 'm', unitPrice: 2 },
    { code: 'SAFE', description: 'Plain', unit: 'm', unitPrice: 3 },
  ];

  async function dangerousBook() {
    const firm = await signUpFirm(h, 'pb-export');
    const made = await create(firm.token, { name: 'Risky =names' });
    const put = await h
      .http()
      .put(`/api/v1/price-books/${made.body.id}/items`)
      .set(bearer(firm.token))
      .send({ items: DANGEROUS });
    expect(put.status, JSON.stringify(put.body)).toBe(200);
    return { token: firm.token, id: made.body.id as string };
  }

  it('CSV: each dangerous text cell starts with an apostrophe; numbers stay numbers', async () => {
    const { token, id } = await dangerousBook();
    const res = await h
      .http()
      .get(`/api/v1/price-books/${id}/export?format=csv`)
      .set(bearer(token));
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    const lines = res.text
      .replace(/^\uFEFF/, '')
      .trim()
      .split('\r\n');
    expect(lines[0]).toBe('Code,Description,Unit,Unit price,Currency,Source,Date note');
    expect(lines[1]).toBe(`'=1+1,'+cmd,'-m,1,USD,,`);
    expect(lines[2]).toBe(`'@SUM,'-5 + 3,m,2,USD,,`);
    expect(lines[3]).toBe('SAFE,Plain,m,3,USD,,');
  });

  it('XLSX: the same cells, read back with a spreadsheet library, start with an apostrophe', async () => {
    const { token, id } = await dangerousBook();
    const res = await h
      .http()
      .get(`/api/v1/price-books/${id}/export?format=xlsx`)
      .set(bearer(token))
      .buffer(true)
      .parse((r, done) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(res.status).toBe(200);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(res.body as ArrayBuffer);
    const sheet = wb.worksheets[0]!;
    expect(sheet.getRow(2).getCell(1).value).toBe("'=1+1");
    expect(sheet.getRow(2).getCell(2).value).toBe("'+cmd");
    expect(sheet.getRow(2).getCell(3).value).toBe("'-m");
    expect(sheet.getRow(2).getCell(4).value).toBe(1);
    expect(sheet.getRow(3).getCell(1).value).toBe("'@SUM");
    expect(sheet.getRow(4).getCell(1).value).toBe('SAFE');
    // No cell of the sheet is a formula.
    sheet.eachRow((row) =>
      row.eachCell((cell) => expect(cell.type).not.toBe(ExcelJS.ValueType.Formula)),
    );
  });

  it('a format other than csv or xlsx is a 422', async () => {
    const { token, id } = await dangerousBook();
    const res = await h
      .http()
      .get(`/api/v1/price-books/${id}/export?format=pdf`)
      .set(bearer(token));
    expect(res.status).toBe(422);
  });
});

import ExcelJS from 'exceljs';
import { describe, expect, it } from 'vitest';
import { neutralise, unneutralise } from '../../api/src/modules/price-books/price-books.files';
import { parsePrice } from '../../api/src/modules/price-books/price-books.mapping';
import { bearer, setPlan, signUpFirm, apiForFile } from '../support/api-app';

// The import's edge cases, each a clear 4xx or per-row error with nothing written.

let token = '';
let bookId = '';

const h = apiForFile(async () => {
  const firm = await signUpFirm(h, 'pb-import');
  // Importing needs a paid plan and these tests make many books: the Firm plan allows both
  // (price-books-plan.test.ts tests the refusals).
  await setPlan(h, firm.firm.id, 'firm', 10);
  token = firm.token;
});

const MAPPING = { code: 'Code', description: 'Description', unit: 'Unit', unitPrice: 'Unit price' };

async function freshBook(): Promise<string> {
  const res = await h
    .http()
    .post('/api/v1/price-books')
    .set(bearer(token))
    .send({ name: `Import ${Math.random()}` });
  expect(res.status).toBe(201);
  bookId = res.body.id;
  return bookId;
}

const itemCount = (id: string) => h.models.PriceBookItem.count({ where: { priceBookId: id } });

function preview(file: Buffer, name: string, mapping?: object) {
  let req = h.http().post('/api/v1/price-books/import/preview').set(bearer(token));
  if (mapping !== undefined) req = req.field('mapping', JSON.stringify(mapping));
  return req.attach('file', file, name);
}

function commit(id: string, file: Buffer, name: string, mapping: object = MAPPING, mode?: string) {
  let req = h
    .http()
    .post(`/api/v1/price-books/${id}/import`)
    .set(bearer(token))
    .field('mapping', JSON.stringify(mapping));
  if (mode !== undefined) req = req.field('mode', mode);
  return req.attach('file', file, name);
}

const csv = (text: string) => Buffer.from(text, 'utf8');

describe('CSV import', () => {
  it('reads a file with a byte-order mark: the first header is "Code", not "\\uFEFFCode"', async () => {
    const file = csv('\uFEFFCode,Description,Unit,Unit price\r\nC-1,Concrete,m3,410.50\r\n');
    const res = await preview(file, 'rates.csv');
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.headers).toEqual(['Code', 'Description', 'Unit', 'Unit price']);
    expect(res.body.mapping).toEqual(MAPPING);
    expect(res.body).toMatchObject({ format: 'csv', rowCount: 1, errorCount: 0, validCount: 1 });
    const id = await freshBook();
    const done = await commit(id, file, 'rates.csv');
    expect(done.status, JSON.stringify(done.body)).toBe(200);
    expect(done.body.items).toEqual([
      {
        code: 'C-1',
        description: 'Concrete',
        unit: 'm3',
        unitPrice: 410.5,
        currency: 'USD',
        source: '',
        dateNote: '',
      },
    ]);
  });

  it('reads a semicolon-separated file whose numbers use a decimal comma', async () => {
    const file = csv(
      'Code;Description;Unit;Unit price\nC-1;Béton, armé;m3;1.234,50\nC-2;Acier;kg;2,35\n',
    );
    const id = await freshBook();
    const res = await commit(id, file, 'tarifs.csv');
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    // 1.234,50 written with a decimal comma is one thousand two hundred and thirty-four and a half.
    expect(res.body.items.map((i: { unitPrice: number }) => i.unitPrice)).toEqual([1234.5, 2.35]);
    expect(res.body.items[0].description).toBe('Béton, armé');
  });

  it('a mapping naming a column the file lacks is a 422 naming the field; nothing written', async () => {
    const id = await freshBook();
    const file = csv('Code,Description,Unit\nC-1,Concrete,m3\n');
    const res = await commit(id, file, 'rates.csv', { ...MAPPING, unitPrice: 'Unit price' });
    expect(res.status).toBe(422);
    expect(res.body.details['mapping.unitPrice']).toBe(
      'The file has no column named "Unit price".',
    );
    expect(await itemCount(id)).toBe(0);
    // Without a column for the price at all, the mapping itself is refused.
    const res2 = await commit(id, file, 'rates.csv', {
      code: 'Code',
      description: 'Description',
      unit: 'Unit',
    });
    expect(res2.status).toBe(422);
    expect(res2.body.details['mapping.unitPrice']).toMatch(/unit price/);
    // The preview proposes no column for it and says every row lacks a price.
    const pre = await preview(file, 'rates.csv');
    expect(pre.status).toBe(200);
    expect(pre.body.mapping.unitPrice).toBeUndefined();
    expect(pre.body.errors).toEqual([
      { line: 2, field: 'unitPrice', message: 'Enter a unit price.' },
    ]);
  });

  it('text in the price column and a duplicated code are per-row errors; nothing written', async () => {
    const id = await freshBook();
    await commit(id, csv('Code,Description,Unit,Unit price\nKEEP,Kept,m,1\n'), 'a.csv');
    expect(await itemCount(id)).toBe(1);
    const file = csv(
      'Code,Description,Unit,Unit price\nA-1,Good,m3,10\nA-2,Bad price,m3,about ten\nA-1,Again,m3,12\n',
    );
    const res = await commit(id, file, 'rates.csv', MAPPING, 'replace');
    expect(res.status).toBe(422);
    expect(res.body.message).toBe('2 problems in 2 rows; nothing was imported.');
    expect(res.body.details).toEqual({
      'rows.3.unitPrice': '"about ten" is not a number.',
      'rows.4.code': 'The code A-1 is already on row 2.',
    });
    // The replace did not happen: the book still holds its one item.
    expect(await itemCount(id)).toBe(1);
  });

  it('an empty file and a header without rows are 422s', async () => {
    const id = await freshBook();
    const empty = await commit(id, Buffer.alloc(0), 'rates.csv');
    expect(empty.status).toBe(422);
    expect(empty.body.message).toBe('The file is empty.');
    const headerOnly = await commit(id, csv('Code,Description,Unit,Unit price\n'), 'rates.csv');
    expect(headerOnly.status).toBe(422);
    expect(headerOnly.body.details.file).toBe('The file has no data rows under its header row.');
    expect(await itemCount(id)).toBe(0);
  });

  it('takes 10,000 rows, the limit, and refuses 10,001 saying so', async () => {
    const rows = (n: number) =>
      'Code,Description,Unit,Unit price\n' +
      Array.from({ length: n }, (_, i) => `R-${i},Row ${i},m,${i % 97}.5`).join('\n');
    const id = await freshBook();
    const over = await commit(id, csv(rows(10_001)), 'big.csv');
    expect(over.status).toBe(422);
    expect(over.body.message).toBe(
      'The file has more than 10,000 data rows, the most one import takes. Split it into smaller files.',
    );
    expect(await itemCount(id)).toBe(0);
    const at = await commit(id, csv(rows(10_000)), 'big.csv');
    expect(at.status, JSON.stringify(at.body).slice(0, 300)).toBe(200);
    expect(at.body.added).toBe(10_000);
    expect(await itemCount(id)).toBe(10_000);
  });

  it('merge updates matching codes (case aside) and adds new ones; replace swaps the list', async () => {
    const id = await freshBook();
    await commit(id, csv('Code,Description,Unit,Unit price\nA,One,m,1\nB,Two,m,2\n'), 'a.csv');
    const merged = await commit(
      id,
      csv('Code,Description,Unit,Unit price\nb,Two new,m,20\nC,Three,m,3\n'),
      'b.csv',
    );
    expect(merged.status).toBe(200);
    expect(merged.body).toMatchObject({ added: 1, updated: 1 });
    expect(
      merged.body.items.map((i: { code: string; unitPrice: number }) => [i.code, i.unitPrice]),
    ).toEqual([
      ['A', 1],
      ['b', 20],
      ['C', 3],
    ]);
    const replaced = await commit(
      id,
      csv('Code,Description,Unit,Unit price\nZ,Only,m,9\n'),
      'c.csv',
      MAPPING,
      'replace',
    );
    expect(replaced.body.items.map((i: { code: string }) => i.code)).toEqual(['Z']);
  });

  it('an export comes back unchanged through an import (neutralised cells undone)', async () => {
    const id = await freshBook();
    const items = [
      {
        code: '=A1',
        description: '+plus first',
        unit: '@u',
        unitPrice: 1.25,
        source: '-minus',
        dateNote: 'Q1 2026',
      },
      {
        code: 'PLAIN',
        description: 'Plain, with a comma',
        unit: 'm2',
        unitPrice: 1234.5,
        source: '',
        dateNote: '',
      },
    ];
    const put = await h
      .http()
      .put(`/api/v1/price-books/${id}/items`)
      .set(bearer(token))
      .send({ items });
    expect(put.status).toBe(200);
    const exported = await h
      .http()
      .get(`/api/v1/price-books/${id}/export?format=csv`)
      .set(bearer(token));
    const other = await freshBook();
    const res = await commit(other, Buffer.from(exported.text, 'utf8'), 'back.csv', {
      ...MAPPING,
      currency: 'Currency',
      source: 'Source',
      dateNote: 'Date note',
    });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.items).toEqual(items.map((i) => ({ ...i, currency: 'USD' })));
  });
});

describe('XLSX import', () => {
  async function workbook(build: (sheet: ExcelJS.Worksheet) => void): Promise<Buffer> {
    const wb = new ExcelJS.Workbook();
    build(wb.addWorksheet('Rates'));
    return Buffer.from(await wb.xlsx.writeBuffer());
  }

  it('reads formulas by their result and merged cells without spilling into other fields', async () => {
    const file = await workbook((sheet) => {
      sheet.addRow(['Invented unit rates (illustrative)']);
      sheet.mergeCells('A1:E1');
      sheet.addRow(['Code', 'Description', 'Remark', 'Unit', 'Unit price']);
      sheet.addRow(['F-1', 'Formwork to walls', '', 'm2', { formula: '2*31.5', result: 63 }]);
      sheet.addRow(['F-2', 'Formwork to slabs', '', 'm2', 48]);
      // Description merged across Description and Remark: the Remark stays empty.
      sheet.mergeCells('B3:C3');
      // Unit merged down two rows: both rows are in m2.
      sheet.mergeCells('D3:D4');
    });
    const pre = await preview(file, 'rates.xlsx');
    expect(pre.status, JSON.stringify(pre.body)).toBe(200);
    expect(pre.body.headers).toEqual(['Code', 'Description', 'Remark', 'Unit', 'Unit price']);
    expect(pre.body.rows).toEqual([
      { line: 3, cells: ['F-1', 'Formwork to walls', '', 'm2', '63'] },
      { line: 4, cells: ['F-2', 'Formwork to slabs', '', 'm2', '48'] },
    ]);
    const id = await freshBook();
    const res = await commit(id, file, 'rates.xlsx');
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    // 2 × 31.5 = 63: the formula's cached result, not its text.
    expect(
      res.body.items.map((i: { code: string; unit: string; unitPrice: number }) => [
        i.code,
        i.unit,
        i.unitPrice,
      ]),
    ).toEqual([
      ['F-1', 'm2', 63],
      ['F-2', 'm2', 48],
    ]);
  });
});

describe('a file that is not what its name says', () => {
  const PNG = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]);
  const XLS = Buffer.from([0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1, 0, 0]);

  it.each([
    ['an image named .csv', PNG, 'rates.csv', /not a CSV text file or an XLSX workbook/],
    [
      'text named .xlsx',
      csv('Code,Description\nA,B\n'),
      'rates.xlsx',
      /holds text, not a workbook/,
    ],
    ['an old binary workbook named .xlsx', XLS, 'rates.xlsx', /older binary workbook/],
    ['a PDF named .csv', csv('%PDF-1.7\n...'), 'rates.csv', /is a PDF/],
    [
      'a ZIP that is no workbook',
      Buffer.from([0x50, 0x4b, 0x03, 0x04, 1, 2, 3, 4]),
      'rates.xlsx',
      /not a readable XLSX/,
    ],
  ])('%s: 415, nothing written', async (_what, file, name, message) => {
    const id = await freshBook();
    const res = await commit(id, file, name);
    expect(res.status).toBe(415);
    expect(res.body.code).toBe('unsupported_media_type');
    expect(res.body.message).toMatch(message);
    expect(await itemCount(id)).toBe(0);
  });

  it('a workbook named .csv is refused and told to be renamed', async () => {
    const wb = new ExcelJS.Workbook();
    wb.addWorksheet('x').addRow(['Code', 'Description']);
    const file = Buffer.from(await wb.xlsx.writeBuffer());
    const res = await preview(file, 'rates.csv');
    expect(res.status).toBe(415);
    expect(res.body.message).toMatch(/holds an XLSX workbook/);
  });

  it('a JSON body, no file, a second file and a file over 5 MB are 4xx', async () => {
    const id = await freshBook();
    const json = await h
      .http()
      .post(`/api/v1/price-books/${id}/import`)
      .set(bearer(token))
      .send({ mapping: MAPPING });
    expect(json.status).toBe(415);
    const noFile = await h
      .http()
      .post(`/api/v1/price-books/${id}/import`)
      .set(bearer(token))
      .field('mapping', JSON.stringify(MAPPING));
    expect(noFile.status).toBe(422);
    expect(noFile.body.details.file).toMatch(/Choose a CSV or XLSX file/);
    const big = await commit(id, Buffer.alloc(5 * 1024 * 1024 + 1, 0x41), 'big.csv');
    expect(big.status).toBe(413);
    expect(big.body.message).toBe('The file is larger than 5 MB, the most an import takes.');
    const badMapping = await h
      .http()
      .post(`/api/v1/price-books/${id}/import`)
      .set(bearer(token))
      .field('mapping', '{not json')
      .attach('file', csv('a,b\n1,2\n'), 'x.csv');
    expect(badMapping.status).toBe(422);
    expect(badMapping.body.details.mapping).toBe('The mapping is not valid JSON.');
    expect(await itemCount(id)).toBe(0);
  });
});

describe('cell rules (fact of the trade: spreadsheets run a cell starting = + - @ as a formula)', () => {
  it('neutralises the formula starters, tab and carriage return, and undoes exactly that', () => {
    for (const text of ['=1', '+1', '-1', '@A', '\tx', '\rx'])
      expect(unneutralise(neutralise(text))).toBe(text);
    expect(neutralise('\tx')).toBe("'\tx");
    expect(neutralise('\rx')).toBe("'\rx");
    expect(neutralise('plain')).toBe('plain');
    expect(unneutralise("'quoted")).toBe("'quoted");
  });

  it('reads prices written with thousands separators and a currency, refuses the rest', () => {
    expect(parsePrice('1,234.50', false)).toBe(1234.5);
    expect(parsePrice('$ 12', false)).toBe(12);
    expect(parsePrice('12 USD', false)).toBe(12);
    expect(parsePrice('1.234,50', true)).toBe(1234.5);
    expect(parsePrice('1 234,5', true)).toBe(1234.5);
    for (const bad of ['about ten', '1,2,3', '12..5', '-4', '1e5', ''])
      expect(parsePrice(bad, false)).toBeNull();
  });
});

import {
  PRICE_ITEM_FIELDS,
  priceItemSchema,
  type PriceImportMapping,
  type PriceItemField,
  type PriceItemInput,
} from '@basinwright/common';
import { ValidationError } from 'yup';
import { unneutralise, type SheetTable } from './price-books.files';

/** One problem of one row of an import: its line in the file, the field and what is wrong. */
export interface RowError {
  line: number;
  field: PriceItemField | 'row';
  message: string;
}

// Header words (letters and digits only, lower case) each field is recognised by.
const HEADER_WORDS: Record<PriceItemField, string[]> = {
  code: ['code', 'itemcode', 'item', 'ref', 'reference', 'itemno', 'no'],
  description: ['description', 'desc', 'itemdescription', 'name', 'item description'],
  unit: ['unit', 'units', 'uom', 'unitofmeasure'],
  unitPrice: ['unitprice', 'price', 'rate', 'unitrate', 'unitcost', 'cost'],
  currency: ['currency', 'cur', 'ccy'],
  source: ['source', 'basis', 'from'],
  dateNote: ['date', 'datenote', 'pricedate', 'asof', 'priced', 'dated'],
};

const squash = (header: string) => header.toLowerCase().replace(/[^a-z0-9]/g, '');

/** The mapping the preview proposes: each field to the first header that names it. */
export function suggestMapping(headers: string[]): PriceImportMapping {
  const mapping: PriceImportMapping = {};
  const used = new Set<string>();
  for (const field of PRICE_ITEM_FIELDS) {
    const words = HEADER_WORDS[field].map(squash);
    const header = headers.find((h) => h !== '' && !used.has(h) && words.includes(squash(h)));
    if (header !== undefined) {
      mapping[field] = header;
      used.add(header);
    }
  }
  return mapping;
}

/** Columns the mapping names that the file does not have, by field. */
export function missingColumns(
  headers: string[],
  mapping: PriceImportMapping,
): Partial<Record<PriceItemField, string>> {
  const missing: Partial<Record<PriceItemField, string>> = {};
  for (const field of PRICE_ITEM_FIELDS) {
    const column = mapping[field];
    if (column !== undefined && column !== '' && !headers.includes(column))
      missing[field] = `The file has no column named "${column}".`;
  }
  return missing;
}

/**
 * A unit price written in a file: digits with an optional decimal part; thousands separated
 * by commas (1,234.50), or, in a semicolon-separated file, the decimal mark is a comma and
 * thousands are separated by points or spaces (1.234,50). A currency sign or code around the
 * number is allowed. Anything else is not a number (null).
 */
export function parsePrice(text: string, decimalComma: boolean): number | null {
  let t = text
    .trim()
    .replace(/^[A-Z]{3}\s*|\s*[A-Z]{3}$/g, '')
    .replace(/^[$€£¥]\s*/, '');
  t = t.replace(/\u00a0/g, ' ');
  if (decimalComma) {
    if (!/^\d{1,3}([. ]\d{3})*(,\d+)?$|^\d+(,\d+)?$/.test(t)) return null;
    t = t.replace(/[. ]/g, '').replace(',', '.');
  } else {
    if (!/^\d{1,3}(,\d{3})*(\.\d+)?$|^\d+(\.\d+)?$/.test(t)) return null;
    t = t.replace(/,/g, '');
  }
  const value = Number(t);
  return Number.isFinite(value) ? value : null;
}

/**
 * Every data row of the table read through the mapping into an item, or the row's problems.
 * Nothing is written here: the caller writes only when `errors` is empty.
 */
export function mapRows(
  table: SheetTable,
  mapping: PriceImportMapping,
  defaultCurrency: string,
): { items: (PriceItemInput & { currency: string })[]; errors: RowError[] } {
  const index = Object.fromEntries(
    PRICE_ITEM_FIELDS.map((field) => {
      const column = mapping[field];
      return [field, column === undefined || column === '' ? -1 : table.headers.indexOf(column)];
    }),
  ) as Record<PriceItemField, number>;
  const items: (PriceItemInput & { currency: string })[] = [];
  const errors: RowError[] = [];
  const seen = new Map<string, number>();
  for (const { line, cells } of table.rows) {
    const read = (field: PriceItemField) => {
      const i = index[field];
      return i < 0 ? '' : unneutralise((cells[i] ?? '').trim());
    };
    const priceText = read('unitPrice');
    const price = priceText === '' ? undefined : parsePrice(priceText, table.decimalComma);
    if (price === null) {
      errors.push({
        line,
        field: 'unitPrice',
        message: `"${priceText.slice(0, 40)}" is not a number.`,
      });
    }
    const raw = {
      code: read('code'),
      description: read('description'),
      unit: read('unit'),
      unitPrice: price ?? undefined,
      currency: read('currency') === '' ? defaultCurrency : read('currency'),
      source: read('source'),
      dateNote: read('dateNote'),
    };
    try {
      const item = priceItemSchema.validateSync(raw, { abortEarly: false, stripUnknown: true });
      const key = item.code.toLowerCase();
      const first = seen.get(key);
      if (first !== undefined) {
        errors.push({
          line,
          field: 'code',
          message: `The code ${item.code} is already on row ${first}.`,
        });
      } else {
        seen.set(key, line);
        if (price !== null) items.push({ ...item, currency: item.currency ?? defaultCurrency });
      }
    } catch (error) {
      if (!(error instanceof ValidationError)) throw error;
      for (const inner of error.inner.length > 0 ? error.inner : [error]) {
        const field = (inner.path ?? 'row') as RowError['field'];
        // The "not a number" above already speaks for the price.
        if (field === 'unitPrice' && price === null) continue;
        errors.push({ line, field, message: inner.message });
      }
    }
  }
  return { items, errors };
}

export const MAX_REPORTED_ERRORS = 200;

/** Row errors as the one error shape's details: `rows.<line>.<field>` → message. */
export function rowErrorDetails(errors: RowError[]): Record<string, string> {
  const details: Record<string, string> = {};
  for (const e of errors.slice(0, MAX_REPORTED_ERRORS))
    details[`rows.${e.line}.${e.field}`] ??= e.message;
  return details;
}

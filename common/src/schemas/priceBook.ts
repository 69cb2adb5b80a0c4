import { array, boolean, mixed, number, object, string, type InferType } from 'yup';
import type { PriceUnit } from '../estimate';
import { trimString } from './text';

/** Bounds of a price book and of an import, each with its reason. */
export const PRICE_BOOK_LIMITS = {
  nameMaxLength: 120,
  notesMaxLength: 2000,
  codeMaxLength: 40,
  descriptionMaxLength: 300,
  unitMaxLength: 20,
  sourceMaxLength: 200,
  dateNoteMaxLength: 60,
  /** The most items a book holds, and the most data rows one import may bring (a firm's whole
   * unit-cost sheet fits many times over; a bigger file is almost surely the wrong file). */
  maxItems: 10_000,
  /** An upload larger than this is refused before it is read (10,000 rows of text fit in ~2 MB). */
  maxFileBytes: 5 * 1024 * 1024,
  /** Unit prices are non-negative and below this (a bound that no real unit rate reaches). */
  maxUnitPrice: 1e12,
  /** Rows the import preview shows. */
  previewRows: 20,
} as const;

/** The fields an import maps from the file's columns; the first four must be mapped. */
export const PRICE_ITEM_FIELDS = [
  'code',
  'description',
  'unit',
  'unitPrice',
  'currency',
  'source',
  'dateNote',
] as const;
export type PriceItemField = (typeof PRICE_ITEM_FIELDS)[number];
export const REQUIRED_PRICE_ITEM_FIELDS = ['code', 'description', 'unit', 'unitPrice'] as const;

export const EXPORT_FORMATS = ['csv', 'xlsx'] as const;
export type ExportFormat = (typeof EXPORT_FORMATS)[number];

const L = PRICE_BOOK_LIMITS;

const text = (max: number, label: string) =>
  string()
    .transform((value: unknown, original: unknown) => (original === null ? '' : value))
    .transform(trimString)
    .max(max, `${label} has at most ${max} characters.`)
    .test('no-nul', `${label} cannot contain a NUL character.`, (v) => !v?.includes('\u0000'));

const currency = string()
  .transform(trimString)
  .transform((v: unknown) => (typeof v === 'string' ? v.toUpperCase() : v))
  .matches(/^[A-Z]{3}$/, 'A currency is a three-letter code such as USD or EUR.');

const bookName = text(L.nameMaxLength, 'A price book name').min(1, 'Enter a price book name.');

export const priceBookCreateSchema = object({
  name: bookName.required('Enter a price book name.'),
  currency: currency.default('USD'),
  notes: text(L.notesMaxLength, 'Notes').default(''),
});
export type PriceBookCreateInput = InferType<typeof priceBookCreateSchema>;

export const priceBookUpdateSchema = object({
  name: bookName.optional(),
  currency: currency.optional(),
  notes: text(L.notesMaxLength, 'Notes').optional(),
  archived: boolean().strict().optional(),
}).test('price-book-update-not-empty', 'Change at least one field.', (value) =>
  Object.values(value).some((field) => field !== undefined),
);
export type PriceBookUpdateInput = InferType<typeof priceBookUpdateSchema>;

export const priceItemSchema = object({
  code: text(L.codeMaxLength, 'A code').min(1, 'Enter a code.').required('Enter a code.'),
  description: text(L.descriptionMaxLength, 'A description')
    .min(1, 'Enter a description.')
    .required('Enter a description.'),
  unit: text(L.unitMaxLength, 'A unit').min(1, 'Enter a unit.').required('Enter a unit.'),
  unitPrice: number()
    .strict()
    .typeError('A unit price is a number.')
    .min(0, 'A unit price cannot be negative.')
    .lessThan(L.maxUnitPrice, `A unit price is below ${L.maxUnitPrice.toExponential()}.`)
    .required('Enter a unit price.'),
  currency: currency.optional(),
  source: text(L.sourceMaxLength, 'A source').default(''),
  dateNote: text(L.dateNoteMaxLength, 'A date note').default(''),
});
export type PriceItemInput = InferType<typeof priceItemSchema>;

export const priceItemsSchema = object({
  items: array(priceItemSchema)
    .max(L.maxItems, `A price book holds at most ${L.maxItems.toLocaleString('en')} items.`)
    .required('Send the list of items.')
    .test('unique-codes', 'Each code appears once in a price book.', (items, ctx) => {
      const seen = new Set<string>();
      for (const [i, item] of (items ?? []).entries()) {
        const key = item.code.toLowerCase();
        if (seen.has(key))
          return ctx.createError({
            path: `items[${i}].code`,
            message: `The code ${item.code} appears more than once.`,
          });
        seen.add(key);
      }
      return true;
    }),
});
export type PriceItemsInput = InferType<typeof priceItemsSchema>;

/** Which column of the file feeds each field (the column's header text). */
export const priceImportMappingSchema = object(
  Object.fromEntries(
    PRICE_ITEM_FIELDS.map((field) => [
      field,
      string().transform(trimString).max(200, 'A column name has at most 200 characters.'),
    ]),
  ) as Record<PriceItemField, ReturnType<typeof string>>,
)
  .noUnknown('Map only these fields: ' + PRICE_ITEM_FIELDS.join(', ') + '.')
  .test('required-mapped', 'Choose a column for each required field.', (value, ctx) => {
    for (const field of REQUIRED_PRICE_ITEM_FIELDS) {
      const column = (value as Partial<Record<PriceItemField, string>> | undefined)?.[field];
      if (column === undefined || column === '')
        return ctx.createError({
          path: field,
          message: `Choose the column that holds the ${field === 'unitPrice' ? 'unit price' : field}.`,
        });
    }
    return true;
  });
export type PriceImportMapping = Partial<Record<PriceItemField, string>>;

export const priceExportQuerySchema = object({
  format: mixed<ExportFormat>()
    .oneOf([...EXPORT_FORMATS], 'The format is csv or xlsx.')
    .default('csv'),
});
export type PriceExportQuery = InferType<typeof priceExportQuerySchema>;

// How price books write units, squashed (lower case, ³ ² ^ . and spaces removed).
const UNIT_WORDS: Record<string, PriceUnit> = {
  m3: 'm3',
  cum: 'm3',
  cm: 'm3',
  yd3: 'yd3',
  cy: 'yd3',
  cuyd: 'yd3',
  ft3: 'ft3',
  cf: 'ft3',
  cuft: 'ft3',
  kg: 'kg',
  kgs: 'kg',
  t: 't',
  tonne: 't',
  tonnes: 't',
  lb: 'lb',
  lbs: 'lb',
  ton: 'ton',
  tons: 'ton',
  m2: 'm2',
  sqm: 'm2',
  ft2: 'ft2',
  sf: 'ft2',
  sqft: 'ft2',
  yd2: 'yd2',
  sy: 'yd2',
  sqyd: 'yd2',
  m: 'm',
  lm: 'm',
  ft: 'ft',
  lf: 'ft',
};

/** The price unit a price book's unit text names (m³, m3, CY, SF, LF, …), or null. */
export function priceUnitOf(text: string): PriceUnit | null {
  const squashed = text
    .toLowerCase()
    .replace(/³/g, '3')
    .replace(/²/g, '2')
    .replace(/[\s^.]/g, '');
  return UNIT_WORDS[squashed] ?? null;
}

import {
  PRICE_BOOK_LIMITS,
  type PriceBookCreateInput,
  type PriceBookUpdateInput,
  type PriceImportMapping,
  type PriceItemInput,
} from '@basinwright/common';
import { QueryTypes, type Transaction } from 'sequelize';
import { conflict, notFound, validationError } from '../../errors';
import { PriceBook, PriceBookItem, sequelize, type User } from '../../models';
import { isUuid } from '../../security';
import { lockFirm } from '../members/members.service';
import { requireAnotherPriceBook, requirePriceBookImport } from '../plans/plans.service';
import type { SheetTable } from './price-books.files';
import {
  mapRows,
  missingColumns,
  rowErrorDetails,
  suggestMapping,
  type RowError,
} from './price-books.mapping';

// Every way a price book comes to be or grows (create, copy, import) is in this file, and each
// passes the plan gate: a new book (create, copy) under the firm's row lock in the insert's
// transaction, so two requests cannot both take the last place; an import needs the feature.

const NOT_FOUND = 'No such price book.';
const L = PRICE_BOOK_LIMITS;

export interface PriceBookSummary {
  book: PriceBook;
  itemCount: number;
}

/** The firm's price books, newest first, with how many items each holds. */
export async function listPriceBooks(firmId: string): Promise<PriceBookSummary[]> {
  const books = await PriceBook.findAll({
    where: { firmId },
    order: [
      ['updatedAt', 'DESC'],
      ['id', 'ASC'],
    ],
  });
  const counts = await sequelize.query<{ id: string; n: number }>(
    `SELECT price_book_id AS id, count(*)::int AS n FROM price_book_items
      WHERE firm_id = $1 GROUP BY price_book_id`,
    { bind: [firmId], type: QueryTypes.SELECT },
  );
  const byId = new Map(counts.map((c) => [c.id, c.n]));
  return books.map((book) => ({ book, itemCount: byId.get(book.id) ?? 0 }));
}

/** The firm's book (another firm's id is answered like a missing one), items in order. */
export async function getPriceBook(
  firmId: string,
  id: string,
  transaction?: Transaction,
): Promise<PriceBook> {
  if (!isUuid(id)) throw notFound(NOT_FOUND);
  const book = await PriceBook.findOne({
    where: { id, firmId },
    include: [{ model: PriceBookItem, as: 'items' }],
    order: [
      [{ model: PriceBookItem, as: 'items' }, 'position', 'ASC'],
      [{ model: PriceBookItem, as: 'items' }, 'code', 'ASC'],
    ],
    transaction,
  });
  if (book === null) throw notFound(NOT_FOUND);
  return book;
}

/** The book's row, locked for the rest of the transaction; 409 when it is archived. */
async function lockOpenBook(
  firmId: string,
  id: string,
  transaction: Transaction,
): Promise<PriceBook> {
  if (!isUuid(id)) throw notFound(NOT_FOUND);
  const book = await PriceBook.findOne({ where: { id, firmId }, transaction, lock: true });
  if (book === null) throw notFound(NOT_FOUND);
  if (book.archivedAt !== null)
    throw conflict('This price book is archived. Restore it before changing it.');
  return book;
}

/**
 * Refuses (403 plan_limit) one more book when the plan's book cap is reached. Takes the firm's
 * row lock in `transaction`; the caller inserts the book in the same transaction. Archived books
 * count: archiving is not deleting, and a restore must not go over the cap.
 */
async function requireRoomForBook(firmId: string, transaction: Transaction): Promise<void> {
  const firm = await lockFirm(firmId, transaction);
  requireAnotherPriceBook(firm, await PriceBook.count({ where: { firmId }, transaction }));
}

export async function createPriceBook(
  actor: User,
  input: PriceBookCreateInput,
): Promise<PriceBook> {
  const id = await sequelize.transaction(async (transaction) => {
    await requireRoomForBook(actor.firmId, transaction);
    const book = await PriceBook.create(
      { ...input, firmId: actor.firmId, createdById: actor.id },
      { transaction },
    );
    return book.id;
  });
  return getPriceBook(actor.firmId, id);
}

/** Renames, changes the currency or notes, archives or restores (never deletes). */
export async function updatePriceBook(
  firmId: string,
  id: string,
  input: PriceBookUpdateInput,
): Promise<PriceBook> {
  await sequelize.transaction(async (transaction) => {
    if (!isUuid(id)) throw notFound(NOT_FOUND);
    const book = await PriceBook.findOne({ where: { id, firmId }, transaction, lock: true });
    if (book === null) throw notFound(NOT_FOUND);
    const { archived, ...fields } = input;
    const changes = Object.fromEntries(Object.entries(fields).filter(([, v]) => v !== undefined));
    if (book.archivedAt !== null && archived !== false && Object.keys(changes).length > 0)
      throw conflict('This price book is archived. Restore it before changing it.');
    if (archived === true && book.archivedAt === null)
      Object.assign(changes, { archivedAt: new Date() });
    if (archived === false) Object.assign(changes, { archivedAt: null });
    await book.update(changes, { transaction });
  });
  return getPriceBook(firmId, id);
}

type ItemRow = PriceItemInput & { currency?: string };

async function writeItems(
  book: PriceBook,
  items: ItemRow[],
  transaction: Transaction,
  startAt = 0,
): Promise<void> {
  if (items.length === 0) return;
  await PriceBookItem.bulkCreate(
    items.map((item, i) => ({
      firmId: book.firmId,
      priceBookId: book.id,
      code: item.code,
      description: item.description,
      unit: item.unit,
      unitPrice: item.unitPrice,
      currency: item.currency ?? book.currency,
      source: item.source,
      dateNote: item.dateNote,
      position: startAt + i,
    })),
    { transaction },
  );
}

/** Replaces the book's items with this list (the list was validated whole: unique codes). */
export async function replaceItems(
  firmId: string,
  id: string,
  items: ItemRow[],
): Promise<PriceBook> {
  await sequelize.transaction(async (transaction) => {
    const book = await lockOpenBook(firmId, id, transaction);
    await PriceBookItem.destroy({ where: { priceBookId: book.id, firmId }, transaction });
    await writeItems(book, items, transaction);
    book.changed('updatedAt', true);
    await book.save({ transaction });
  });
  return getPriceBook(firmId, id);
}

/** A new open book with the same name (prefixed "Copy of"), currency, notes and items. */
export async function copyPriceBook(actor: User, id: string): Promise<PriceBook> {
  const copyId = await sequelize.transaction(async (transaction) => {
    const source = await getPriceBook(actor.firmId, id, transaction);
    await requireRoomForBook(actor.firmId, transaction);
    const copy = await PriceBook.create(
      {
        firmId: actor.firmId,
        name: `Copy of ${source.name}`.slice(0, L.nameMaxLength),
        currency: source.currency,
        notes: source.notes,
        createdById: actor.id,
      },
      { transaction },
    );
    await writeItems(
      copy,
      (source.items ?? []).map((item) => ({ ...item.get(), unitPrice: Number(item.unitPrice) })),
      transaction,
    );
    return copy.id;
  });
  return getPriceBook(actor.firmId, copyId);
}

export interface ImportPreview {
  format: SheetTable['format'];
  headers: string[];
  rows: { line: number; cells: string[] }[];
  rowCount: number;
  mapping: PriceImportMapping;
  /** Problems of the rows read through the mapping (at most 200 listed), and how many in all. */
  errors: RowError[];
  errorCount: number;
  /** Rows that would be imported as they stand. */
  validCount: number;
}

/** What an import would do with this file and mapping (the suggested one when none is given). */
export function previewImport(
  table: SheetTable,
  mapping: PriceImportMapping | undefined,
  currency = 'USD',
): ImportPreview {
  const used = mapping ?? suggestMapping(table.headers);
  const missing = missingColumns(table.headers, used);
  if (Object.keys(missing).length > 0)
    throw validationError(
      Object.fromEntries(Object.entries(missing).map(([f, m]) => [`mapping.${f}`, m])),
      Object.values(missing)[0],
    );
  const { items, errors } = mapRows(table, used, currency);
  return {
    format: table.format,
    headers: table.headers,
    rows: table.rows.slice(0, L.previewRows),
    rowCount: table.rows.length,
    mapping: used,
    errors: errors.slice(0, 200),
    errorCount: errors.length,
    validCount: items.length,
  };
}

export const IMPORT_MODES = ['merge', 'replace'] as const;
export type ImportMode = (typeof IMPORT_MODES)[number];

/**
 * Imports the file's rows into the book in one transaction. `merge` updates the items whose
 * code matches (case aside) and adds the others; `replace` makes the file the whole book. While
 * any row has a problem nothing is written: a 422 lists the problems by row and field.
 */
export async function importPriceBookItems(
  firmId: string,
  id: string,
  table: SheetTable,
  mapping: PriceImportMapping,
  mode: ImportMode,
): Promise<{ book: PriceBook; added: number; updated: number }> {
  const missing = missingColumns(table.headers, mapping);
  if (Object.keys(missing).length > 0)
    throw validationError(
      Object.fromEntries(Object.entries(missing).map(([f, m]) => [`mapping.${f}`, m])),
      Object.values(missing)[0],
    );
  let added = 0;
  let updated = 0;
  await sequelize.transaction(async (transaction) => {
    // The plan as it is now (a downgrade may have come after the request was authenticated).
    requirePriceBookImport(await lockFirm(firmId, transaction));
    const book = await lockOpenBook(firmId, id, transaction);
    const { items, errors } = mapRows(table, mapping, book.currency);
    if (errors.length > 0) {
      const rows = new Set(errors.map((e) => e.line)).size;
      throw validationError(
        rowErrorDetails(errors),
        `${errors.length} problem${errors.length === 1 ? '' : 's'} in ${rows} row${rows === 1 ? '' : 's'}; nothing was imported.`,
      );
    }
    if (mode === 'replace') {
      await PriceBookItem.destroy({ where: { priceBookId: book.id, firmId }, transaction });
      await writeItems(book, items, transaction);
      added = items.length;
    } else {
      const existing = await PriceBookItem.findAll({
        where: { priceBookId: book.id, firmId },
        transaction,
      });
      // The final list, in the book's order with new codes after: written in two statements.
      const incoming = new Map(items.map((item) => [item.code.toLowerCase(), item]));
      const kept: ItemRow[] = existing
        .sort((a, b) => a.position - b.position)
        .map((old) => {
          const replacement = incoming.get(old.code.toLowerCase());
          if (replacement === undefined)
            return { ...old.get(), unitPrice: Number(old.unitPrice) } as ItemRow;
          incoming.delete(old.code.toLowerCase());
          updated += 1;
          return replacement;
        });
      const fresh = [...incoming.values()];
      if (kept.length + fresh.length > L.maxItems) {
        const message = `A price book holds at most ${L.maxItems.toLocaleString('en')} items; this import would make ${(kept.length + fresh.length).toLocaleString('en')}.`;
        throw validationError({ file: message }, message);
      }
      await PriceBookItem.destroy({ where: { priceBookId: book.id, firmId }, transaction });
      await writeItems(book, [...kept, ...fresh], transaction);
      added = fresh.length;
    }
    book.changed('updatedAt', true);
    await book.save({ transaction });
  });
  return { book: await getPriceBook(firmId, id), added, updated };
}

export const EXPORT_HEADER = [
  'Code',
  'Description',
  'Unit',
  'Unit price',
  'Currency',
  'Source',
  'Date note',
];

/** The book's items as export rows (numbers stay numbers; text is neutralised by the writer). */
export function exportRows(book: PriceBook): (string | number)[][] {
  return (book.items ?? []).map((item) => [
    item.code,
    item.description,
    item.unit,
    Number(item.unitPrice),
    item.currency,
    item.source,
    item.dateNote,
  ]);
}

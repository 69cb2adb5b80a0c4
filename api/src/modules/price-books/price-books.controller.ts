import type { Request, Response } from 'express';
import type {
  PriceBookCreateInput,
  PriceBookUpdateInput,
  PriceExportQuery,
  PriceItemsInput,
} from '@basinwright/common';
import { authOf } from '../../middlewares/auth';
import { requirePriceBookImport } from '../plans/plans.service';
import { readSheet, writeCsv, writeXlsx } from './price-books.files';
import { presentItem, presentPriceBook, presentPriceBookWithItems } from './price-books.presenter';
import * as books from './price-books.service';
import { mappingField, modeField } from './price-books.upload';

export async function list(req: Request, res: Response): Promise<void> {
  const summaries = await books.listPriceBooks(authOf(req).firm.id);
  res.json({ items: summaries.map(({ book, itemCount }) => presentPriceBook(book, itemCount)) });
}

export async function create(req: Request, res: Response): Promise<void> {
  const book = await books.createPriceBook(authOf(req).user, req.body as PriceBookCreateInput);
  res.status(201).json(presentPriceBookWithItems(book));
}

export async function read(req: Request<{ id: string }>, res: Response): Promise<void> {
  res.json(presentPriceBookWithItems(await books.getPriceBook(authOf(req).firm.id, req.params.id)));
}

export async function update(req: Request<{ id: string }>, res: Response): Promise<void> {
  const book = await books.updatePriceBook(
    authOf(req).firm.id,
    req.params.id,
    req.body as PriceBookUpdateInput,
  );
  res.json(presentPriceBookWithItems(book));
}

export async function replaceItems(req: Request<{ id: string }>, res: Response): Promise<void> {
  const { items } = req.body as PriceItemsInput;
  const book = await books.replaceItems(authOf(req).firm.id, req.params.id, items);
  res.json(presentPriceBookWithItems(book));
}

export async function copy(req: Request<{ id: string }>, res: Response): Promise<void> {
  const book = await books.copyPriceBook(authOf(req).user, req.params.id);
  res.status(201).json(presentPriceBookWithItems(book));
}

export async function preview(req: Request, res: Response): Promise<void> {
  // spreadsheetUpload() has checked the file is there.
  const file = req.file as Express.Multer.File;
  requirePriceBookImport(authOf(req).firm);
  const mapping = mappingField(req.body, false);
  const table = await readSheet(file.buffer, file.originalname);
  res.json(books.previewImport(table, mapping));
}

export async function importItems(req: Request<{ id: string }>, res: Response): Promise<void> {
  const file = req.file as Express.Multer.File;
  const mapping = mappingField(req.body, true) ?? {};
  const mode = modeField(req.body);
  // The book is looked up first so another firm's id is a 404 whatever the file holds.
  await books.getPriceBook(authOf(req).firm.id, req.params.id);
  // Checked again under the firm's lock when the rows are written.
  requirePriceBookImport(authOf(req).firm);
  const table = await readSheet(file.buffer, file.originalname);
  const result = await books.importPriceBookItems(
    authOf(req).firm.id,
    req.params.id,
    table,
    mapping,
    mode,
  );
  res.json({
    added: result.added,
    updated: result.updated,
    book: presentPriceBook(result.book),
    items: (result.book.items ?? []).map(presentItem),
  });
}

/** A file name from a book's name: letters, digits, spaces and - _ only. */
function fileStem(name: string): string {
  return (
    name
      .replace(/[^A-Za-z0-9 _-]+/g, '')
      .trim()
      .replace(/\s+/g, '-')
      .slice(0, 60) || 'price-book'
  );
}

export async function exportBook(req: Request<{ id: string }>, res: Response): Promise<void> {
  const { format } = res.locals.query as PriceExportQuery;
  const book = await books.getPriceBook(authOf(req).firm.id, req.params.id);
  const rows = books.exportRows(book);
  const stem = fileStem(book.name);
  if (format === 'xlsx') {
    const data = await writeXlsx(book.name, books.EXPORT_HEADER, rows);
    res.setHeader(
      'Content-Type',
      'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
    );
    res.setHeader('Content-Disposition', `attachment; filename="${stem}.xlsx"`);
    res.send(data);
    return;
  }
  res.setHeader('Content-Type', 'text/csv; charset=utf-8');
  res.setHeader('Content-Disposition', `attachment; filename="${stem}.csv"`);
  res.send(writeCsv(books.EXPORT_HEADER, rows));
}

import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import { PRICE_BOOK_LIMITS, neutralise, unneutralise, type SheetCell } from '@basinwright/common';
import { ApiError, badRequest, validationError } from '../../errors';

/** A spreadsheet read into text: the header row and the data rows with their line numbers. */
export interface SheetTable {
  format: 'csv' | 'xlsx';
  /** True for a semicolon-separated CSV: its numbers write the decimal mark as a comma. */
  decimalComma: boolean;
  headers: string[];
  /** `line` is the row's number in the file (1 = the first row), as a spreadsheet shows it. */
  rows: { line: number; cells: string[] }[];
}

const L = PRICE_BOOK_LIMITS;
const unsupported = (message: string) => new ApiError(415, 'unsupported_media_type', message);

// The first bytes of the formats a price list could arrive in (magic numbers of the formats).
const ZIP = [0x50, 0x4b, 0x03, 0x04]; // XLSX is a ZIP package
const OLE = [0xd0, 0xcf, 0x11, 0xe0]; // the older binary workbook (.xls)
const PDF = [0x25, 0x50, 0x44, 0x46]; // %PDF

const startsWith = (data: Buffer, magic: number[]) => magic.every((byte, i) => data[i] === byte);

/** What the content is, from its first bytes (never from the file's name). */
export function sniff(data: Buffer): 'xlsx' | 'xls' | 'pdf' | 'text' | 'binary' {
  if (startsWith(data, ZIP)) return 'xlsx';
  if (startsWith(data, OLE)) return 'xls';
  if (startsWith(data, PDF)) return 'pdf';
  // Text: no NUL in the first 8 KiB and valid UTF-8 throughout.
  if (data.subarray(0, 8192).includes(0)) return 'binary';
  try {
    new TextDecoder('utf-8', { fatal: true }).decode(data);
  } catch {
    return 'binary';
  }
  return 'text';
}

const extensionOf = (name: string) => /\.([a-z0-9]+)$/i.exec(name)?.[1]?.toLowerCase() ?? '';

/**
 * Reads an uploaded price list. The content decides the format; a name that says otherwise
 * (a .xlsx that is text, a .csv that is a workbook or a PDF) is refused with a 415 that says
 * what the file really is. Empty files, files without data rows and more than 10,000 rows are
 * refused as a whole.
 */
export async function readSheet(data: Buffer, fileName: string): Promise<SheetTable> {
  if (data.length === 0)
    throw validationError({ file: 'The file is empty.' }, 'The file is empty.');
  const kind = sniff(data);
  const ext = extensionOf(fileName);
  if (kind === 'xls')
    throw unsupported('This is an older binary workbook (.xls). Save it as .xlsx or .csv first.');
  if (kind === 'pdf') throw unsupported('This file is a PDF, not a spreadsheet. Send CSV or XLSX.');
  if (kind === 'binary') throw unsupported('This file is not a CSV text file or an XLSX workbook.');
  if (kind === 'xlsx' && ext !== 'xlsx')
    throw unsupported(
      `The file is named .${ext || '(none)'} but holds an XLSX workbook. Rename it to .xlsx.`,
    );
  if (kind === 'text' && ext === 'xlsx')
    throw unsupported('The file is named .xlsx but holds text, not a workbook. Send it as .csv.');
  if (kind === 'text' && !['csv', 'txt', 'tsv'].includes(ext))
    throw unsupported('Send a .csv or .xlsx file.');
  const table = kind === 'xlsx' ? await readXlsx(data) : readCsv(data);
  if (table.headers.length === 0 || table.rows.length === 0)
    throw validationError(
      { file: 'The file has no data rows under its header row.' },
      'The file has no data rows under its header row.',
    );
  return table;
}

function tooManyRows(): ApiError {
  const message = `The file has more than ${L.maxItems.toLocaleString('en')} data rows, the most one import takes. Split it into smaller files.`;
  return validationError({ file: message }, message);
}

const isBlank = (cells: string[]) => cells.every((cell) => cell.trim() === '');

/** CSV as UTF-8 with or without a byte-order mark; comma, semicolon or tab, as the file uses. */
export function readCsv(data: Buffer): SheetTable {
  let text = data.toString('utf8');
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  const parsed = Papa.parse<string[]>(text, {
    delimitersToGuess: [',', ';', '\t'],
    skipEmptyLines: false,
    preview: L.maxItems + 50,
  });
  const quoteError = parsed.errors.find((e) => e.type === 'Quotes');
  if (quoteError !== undefined)
    throw badRequest(
      `The CSV has an unclosed quote near row ${(quoteError.row ?? 0) + 1}; it cannot be read.`,
    );
  return toTable(
    'csv',
    parsed.meta.delimiter === ';',
    parsed.data.map((cells, i) => ({ line: i + 1, cells })),
  );
}

/** Cells to a table: a header row, then the data rows; blank rows are skipped. */
function toTable(
  format: 'csv' | 'xlsx',
  decimalComma: boolean,
  lines: { line: number; cells: string[] }[],
): SheetTable {
  const filled = lines.filter((row) => !isBlank(row.cells));
  // The header is the first row with two or more filled cells: a title above the table (one
  // cell, or one merged across the columns) is skipped.
  const at = filled.findIndex((row) => row.cells.filter((c) => c.trim() !== '').length >= 2);
  const header = filled[at];
  const rows = filled.slice(at + 1);
  if (at < 0 || header === undefined) return { format, decimalComma, headers: [], rows: [] };
  if (rows.length > L.maxItems) throw tooManyRows();
  const headers = header.cells.map((cell) => cell.trim());
  return { format, decimalComma, headers, rows };
}

/** The text a spreadsheet cell shows: a formula's cached result, rich text joined, dates ISO. */
export function cellText(cell: ExcelJS.Cell): string {
  // A merged region keeps its value in the top-left cell. Down a column (a unit merged over
  // several rows) the rows below take it; across columns the others stay empty, so one value
  // never fills two fields.
  if (cell.isMerged && cell.master !== cell) {
    return cell.master.col === cell.col ? cellText(cell.master) : '';
  }
  return valueText(cell.value);
}

function valueText(value: ExcelJS.CellValue): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'string') return value;
  if (typeof value === 'number') return String(value);
  if (typeof value === 'boolean') return value ? 'TRUE' : 'FALSE';
  if (value instanceof Date) return value.toISOString().slice(0, 10);
  if ('richText' in value) return value.richText.map((run) => run.text).join('');
  if ('formula' in value || 'sharedFormula' in value) {
    const result = (value as { result?: unknown }).result;
    if (result === undefined || result === null) return '';
    if (typeof result === 'object' && 'error' in (result as object)) return '#ERROR';
    return valueText(result as ExcelJS.CellValue);
  }
  if ('error' in value) return '#ERROR';
  if ('text' in value) return String((value as { text: unknown }).text);
  return '';
}

/** The first worksheet of an XLSX workbook. */
export async function readXlsx(data: Buffer): Promise<SheetTable> {
  const workbook = new ExcelJS.Workbook();
  try {
    await workbook.xlsx.load(data as unknown as ArrayBuffer);
  } catch {
    throw unsupported('This file is a ZIP archive but not a readable XLSX workbook.');
  }
  const sheet = workbook.worksheets[0];
  if (sheet === undefined) return { format: 'xlsx', decimalComma: false, headers: [], rows: [] };
  if (sheet.actualRowCount > L.maxItems + 50) throw tooManyRows();
  const width = Math.min(sheet.columnCount, 100);
  const lines: { line: number; cells: string[] }[] = [];
  sheet.eachRow({ includeEmpty: false }, (row, line) => {
    const cells: string[] = [];
    for (let col = 1; col <= width; col += 1) cells.push(cellText(row.getCell(col)));
    lines.push({ line, cells });
  });
  return toTable('xlsx', false, lines);
}

// Formula-looking text is neutralised by the one rule in common (exports/table.ts).
export { neutralise, unneutralise };

/** Rows of cells to CSV text (UTF-8 with a byte-order mark so spreadsheets read accents). */
export function writeCsv(header: string[], rows: (string | number)[][]): string {
  const safe = rows.map((row) =>
    row.map((cell) => (typeof cell === 'number' ? cell : neutralise(cell))),
  );
  return `\uFEFF${Papa.unparse({ fields: header.map(neutralise), data: safe }, { newline: '\r\n' })}\r\n`;
}

/** Rows of cells to an XLSX workbook of one sheet (text neutralised, numbers as numbers). */
export async function writeXlsx(
  sheetName: string,
  header: string[],
  rows: (string | number)[][],
): Promise<Buffer> {
  const workbook = new ExcelJS.Workbook();
  const sheet = workbook.addWorksheet(
    sheetName.replace(/[[\]*?:/\\]/g, ' ').slice(0, 31) || 'Sheet',
  );
  sheet.addRow(header.map(neutralise)).font = { bold: true };
  for (const row of rows)
    sheet.addRow(row.map((cell) => (typeof cell === 'number' ? cell : neutralise(cell))));
  const out = await workbook.xlsx.writeBuffer();
  return Buffer.from(out as ArrayBuffer);
}

/** Rows of cells (a header above the table) to CSV text with a byte-order mark; empty cells blank. */
export function writeSheetCsv(cells: SheetCell[][]): string {
  return `\uFEFF${Papa.unparse(
    cells.map((row) => row.map((cell) => cell ?? '')),
    { newline: '\r\n' },
  )}\r\n`;
}

/** Rows of cells to an XLSX workbook of one sheet; `headingRow` (0-based) set in bold. */
export async function writeSheetXlsx(
  sheetName: string,
  cells: SheetCell[][],
  headingRow: number,
): Promise<Buffer> {
  const workbook = new ExcelJS.Workbook();
  const sheet = workbook.addWorksheet(
    sheetName.replace(/[[\]*?:/\\]/g, ' ').slice(0, 31) || 'Sheet',
  );
  for (const row of cells) sheet.addRow(row.map((cell) => cell ?? undefined));
  sheet.getRow(headingRow + 1).font = { bold: true };
  const out = await workbook.xlsx.writeBuffer();
  return Buffer.from(out as ArrayBuffer);
}

// A results table as a file: the header (project, design, units) and the cells come from common
// (sheetRows); this file writes them: CSV with papaparse, XLSX with exceljs, which is loaded only
// when a workbook is asked for. Imported by downloadTable (useExports.ts) on the first download.
import Papa from 'papaparse';
import {
  exportFileName,
  sheetRows,
  type ExportContext,
  type ExportTable,
  type SheetCell,
} from '@basinwright/common';
import type { SheetFormat } from '@/composables/useExports';

/** Rows of cells as CSV text (comma, CRLF; papaparse quotes what needs quoting). */
export function cellsToCsv(rows: readonly SheetCell[][]): string {
  return Papa.unparse(
    rows.map((r) => r.map((c) => (c === null ? '' : c))),
    { newline: '\r\n' },
  );
}

/** Rows of cells as an XLSX workbook of one sheet; the column-heading row in bold. */
export async function cellsToXlsx(
  sheetName: string,
  rows: readonly SheetCell[][],
  headingRow: number,
): Promise<ArrayBuffer> {
  const { default: ExcelJS } = await import('exceljs');
  const book = new ExcelJS.Workbook();
  const sheet = book.addWorksheet(sheetName.replace(/[[\]*?:/\\]/g, ' ').slice(0, 31) || 'Sheet');
  for (const r of rows) sheet.addRow(r.map((c) => (c === null ? undefined : c)));
  sheet.getRow(headingRow + 1).font = { bold: true };
  sheet.getColumn(1).width = 28;
  return (await book.xlsx.writeBuffer()) as ArrayBuffer;
}

/** The table's file: CSV (UTF-8 with a byte-order mark so spreadsheets read ° and ³) or XLSX. */
export async function tableFile<Row>(
  table: ExportTable<Row>,
  ctx: ExportContext,
  format: SheetFormat,
): Promise<{ name: string; blob: Blob }> {
  const rows = sheetRows(table, ctx);
  const name = exportFileName([ctx.project, table.title], format);
  if (format === 'csv')
    return {
      name,
      blob: new Blob(['\uFEFF', cellsToCsv(rows)], { type: 'text/csv;charset=utf-8' }),
    };
  const headingRow = rows.length - table.rows.length - 1;
  const data = await cellsToXlsx(table.title, rows, headingRow);
  return {
    name,
    blob: new Blob([data], {
      type: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
    }),
  };
}

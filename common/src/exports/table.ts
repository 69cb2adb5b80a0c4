// A results table as rows of spreadsheet cells, shared by the web's downloads and the API's
// exports: a header naming the project, the design and the units, then the column headings
// with their units, then the rows in the project's units. Text that a spreadsheet would take
// for a formula is neutralised. Pure: the CSV and XLSX writers live at the edges.
import { fromSIValue, UNIT_LABELS, type QuantityKind } from '../units';
import type { UnitSystem } from '../range/types';

/** One cell: text, a number, or empty. */
export type SheetCell = string | number | null;

/** One column: its heading (without unit), its quantity (null: a pure number or text), decimals. */
export interface ExportColumn<Row> {
  title: string;
  kind: QuantityKind | null;
  /** decimals written (numbers are rounded to them); default 3 */
  digits?: number;
  /** the value in SI (converted to the project's units by `kind`), a text, or null for none */
  value: (row: Row) => number | string | null;
}

/** A table to export: its name, columns and rows, and lines said under the header. */
export interface ExportTable<Row> {
  title: string;
  columns: readonly ExportColumn<Row>[];
  rows: readonly Row[];
  notes?: readonly string[];
}

/** What every export names in its header. */
export interface ExportContext {
  project: string;
  design: string;
  units: UnitSystem;
}

/** The caution every exported result carries (product brief: concept level, review, codes). */
export const EXPORT_CAUTION =
  'Concept level only: to be verified by detailed design (model studies for large structures), reviewed and sealed by a licensed professional engineer, and to follow local codes.';

/** How the units are named in a header. */
export function unitSystemName(units: UnitSystem): string {
  return units === 'SI' ? 'SI (metric)' : 'US customary';
}

/**
 * A cell a spreadsheet would take for a formula (it starts with = + - @, a tab or a carriage
 * return) gets a leading apostrophe, so opening an export never runs anything [OWASP, CSV
 * injection]. Numbers are written as numbers and never need it.
 */
export function neutralise(text: string): string {
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}

/** Undoes neutralise() on import, so an exported file comes back unchanged. */
export function unneutralise(text: string): string {
  return /^'[=+\-@\t\r]/.test(text) ? text.slice(1) : text;
}

/** The header lines every export starts with (label, value), then a blank line. */
export function exportHeader(
  ctx: ExportContext,
  title: string,
  notes: readonly string[] = [],
): SheetCell[][] {
  return [
    ['Project', neutralise(ctx.project)],
    ['Design', neutralise(ctx.design)],
    ['Units', unitSystemName(ctx.units)],
    ['Table', neutralise(title)],
    ...notes.map((n): SheetCell[] => ['Note', neutralise(n)]),
    ['Caution', EXPORT_CAUTION],
    [],
  ];
}

/** A column's heading with its unit in the project's system: "Length (ft)". */
export function columnHeading(
  c: Pick<ExportColumn<unknown>, 'title' | 'kind'>,
  units: UnitSystem,
): string {
  return c.kind ? `${c.title} (${UNIT_LABELS[c.kind][units]})` : c.title;
}

/**
 * The whole sheet: header, column headings, rows. Numbers are converted from SI to the
 * project's units and rounded to the column's decimals; a non-finite number is left empty.
 */
export function sheetRows<Row>(table: ExportTable<Row>, ctx: ExportContext): SheetCell[][] {
  const heads = table.columns.map((c) => neutralise(columnHeading(c, ctx.units)));
  const body = table.rows.map((row) =>
    table.columns.map((c): SheetCell => {
      const v = c.value(row);
      if (v === null) return null;
      if (typeof v === 'string') return neutralise(v);
      const x = c.kind ? fromSIValue(v, c.kind, ctx.units) : v;
      return Number.isFinite(x) ? toDecimals(x, c.digits ?? 3) : null;
    }),
  );
  return [...exportHeader(ctx, table.title, table.notes), heads, ...body];
}

/** A number rounded to `digits` decimals as an export writes it (a number, not text). */
export function toDecimals(x: number, digits: number): number {
  return Number(x.toFixed(digits));
}

/** A file name from its parts: lower case, words joined by hyphens, nothing a file system minds. */
export function exportFileName(parts: readonly string[], extension: string): string {
  const stem = parts
    .join(' ')
    .normalize('NFKD')
    .replace(/[^\w\s-]/g, '')
    .trim()
    .toLowerCase()
    .replace(/[\s_-]+/g, '-')
    .slice(0, 80)
    .replace(/-+$/, '');
  return `${stem || 'export'}.${extension}`;
}

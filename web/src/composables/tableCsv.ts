// A results table as CSV for a spreadsheet: one header row with units, plain numbers (no
// thousands separators, a point for decimals) in the user's units. Papa.unparse quotes what
// needs quoting.
import Papa from 'papaparse';
import { fromSIValue, type QuantityKind, type UnitSystem, UNIT_LABELS } from '@basinwright/common';

/** One column: its heading (without unit), the quantity (null: a plain number or text), decimals. */
export interface CsvColumn<Row> {
  title: string;
  kind: QuantityKind | null;
  digits?: number;
  value: (row: Row) => number | string;
}

/** The CSV text of `rows`, headed "Title (unit)", numbers converted from SI to `units`. */
export function tableCsv<Row>(
  rows: readonly Row[],
  columns: readonly CsvColumn<Row>[],
  units: UnitSystem,
): string {
  const head = columns.map((c) =>
    c.kind ? `${c.title} (${UNIT_LABELS[c.kind][units]})` : c.title,
  );
  const body = rows.map((row) =>
    columns.map((c) => {
      const v = c.value(row);
      if (typeof v === 'string') return v;
      const x = c.kind ? fromSIValue(v, c.kind, units) : v;
      return Number.isFinite(x) ? x.toFixed(c.digits ?? 3) : '';
    }),
  );
  return Papa.unparse([head, ...body], { newline: '\r\n' });
}

/** Offers `text` to the browser as a file download. */
export function downloadText(
  fileName: string,
  text: string,
  type = 'text/csv;charset=utf-8',
): void {
  const url = URL.createObjectURL(new Blob(['\uFEFF', text], { type }));
  const a = document.createElement('a');
  a.href = url;
  a.download = fileName;
  document.body.append(a);
  a.click();
  a.remove();
  URL.revokeObjectURL(url);
}

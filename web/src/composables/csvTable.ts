// CSV tables typed in by file (tailwater rating, headwater rating, outlet table): parsed with
// papaparse, which loads with the steps that read such a file (DesignRatingTable), not with
// every page that uses the design (useDesign).
import Papa from 'papaparse';
import { UNIT_LABELS, type UnitSystem } from '@basinwright/common';

export interface CsvColumn {
  key: string;
  label: string;
  /** the value must be greater than zero */
  positive?: boolean;
}

export type CsvOutcome =
  { ok: true; rows: Array<Record<string, number>> } | { ok: false; errors: string[] };

/**
 * Parses a CSV table of numbers with the given columns in order (a header row is recognised
 * and skipped). Any bad row makes the whole table fail, with the row numbers as they appear in
 * the file; nothing partial is returned. `increasingKey` must rise from row to row.
 */
export function parseCsvTable(
  text: string,
  columns: readonly CsvColumn[],
  increasingKey?: string,
): CsvOutcome {
  const parsed = Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), {
    skipEmptyLines: 'greedy',
    comments: '#',
  });
  // A guessed delimiter is not an error of the file (a one-column row makes papaparse guess).
  const errors: string[] = parsed.errors
    .filter((e) => e.type !== 'Delimiter')
    .map((e) => `Row ${(e.row ?? 0) + 1}: ${e.message.replace(/\.$/, '')}.`);
  const lines = parsed.data;
  if (lines.length === 0) return { ok: false, errors: ['The file holds no rows.'] };
  const isNumber = (s: string | undefined) =>
    s !== undefined && s.trim() !== '' && Number.isFinite(Number(s.trim()));
  const first = lines[0]!;
  const hasHeader = !first.every((c) => isNumber(c));
  const rows: Array<Record<string, number>> = [];
  lines.forEach((cells, i) => {
    if (i === 0 && hasHeader) return;
    const rowNo = i + 1;
    const used = cells.map((c) => c.trim());
    while (used.length > columns.length && used[used.length - 1] === '') used.pop();
    if (used.length !== columns.length) {
      errors.push(
        `Row ${rowNo}: expected ${columns.length} values (${columns.map((c) => c.label).join(', ')}), found ${used.length}.`,
      );
      return;
    }
    const row: Record<string, number> = {};
    for (const [j, col] of columns.entries()) {
      const cell = used[j]!;
      if (!isNumber(cell)) {
        errors.push(`Row ${rowNo}: ${col.label} “${cell}” is not a number.`);
        return;
      }
      const v = Number(cell);
      if (col.positive && !(v > 0)) {
        errors.push(`Row ${rowNo}: ${col.label} must be greater than zero (got ${cell}).`);
        return;
      }
      row[col.key] = v;
    }
    if (increasingKey && rows.length > 0) {
      const prev = rows[rows.length - 1]![increasingKey]!;
      if (!(row[increasingKey]! > prev)) {
        const col = columns.find((c) => c.key === increasingKey)!;
        errors.push(
          `Row ${rowNo}: ${col.label} ${row[increasingKey]} does not increase from the row before (${prev}).`,
        );
      }
    }
    rows.push(row);
  });
  if (errors.length > 0) return { ok: false, errors };
  if (rows.length < 2)
    return { ok: false, errors: ['A rating table needs at least two rows of numbers.'] };
  return { ok: true, rows };
}

/** The tailwater rating as CSV: discharge, water-surface elevation (in the project's units). */
export function parseTailwaterCsv(text: string, units: UnitSystem): CsvOutcome {
  const q = UNIT_LABELS.discharge[units];
  const z = UNIT_LABELS.length[units];
  return parseCsvTable(
    text,
    [
      { key: 'Q', label: `Q (${q})`, positive: true },
      { key: 'elevation', label: `Tailwater elevation (${z})` },
    ],
    'Q',
  );
}

// Results out to a spreadsheet (issue 13 item 6): the rows every download writes.
import { describe, expect, it } from 'vitest';
import {
  exportFileName,
  neutralise,
  sheetRows,
  unneutralise,
  type ExportTable,
} from '@basinwright/common';
import { expectRel } from '../support/tolerance';

const FT = 0.3048; // international foot, exact by definition [src: NIST SP 811]
type Row = { Q: number; depth: number; note: string };
const table: ExportTable<Row> = {
  title: 'A check',
  notes: ['Floor at 87.38 m'],
  columns: [
    { title: 'Q', kind: 'discharge', digits: 3, value: (r) => r.Q },
    { title: 'Depth', kind: 'length', digits: 4, value: (r) => r.depth },
    { title: 'Note', kind: null, value: (r) => r.note },
  ],
  rows: [
    { Q: 85, depth: 4.75, note: '=HYPERLINK("x")' },
    { Q: 5, depth: NaN, note: 'plain' },
  ],
};

describe('sheetRows', () => {
  it('a header naming the project, design and units, a blank line, headings with units, the rows', () => {
    const rows = sheetRows(table, {
      project: 'Fenwick',
      design: 'USBR Type II basin',
      units: 'SI',
    });
    expect(rows.slice(0, 5)).toEqual([
      ['Project', 'Fenwick'],
      ['Design', 'USBR Type II basin'],
      ['Units', 'SI (metric)'],
      ['Table', 'A check'],
      ['Note', 'Floor at 87.38 m'],
    ]);
    expect(rows[5]![0]).toBe('Caution');
    expect(String(rows[5]![1])).toContain('licensed professional engineer');
    expect(rows[6]).toEqual([]);
    expect(rows[7]).toEqual(['Q (m³/s)', 'Depth (m)', 'Note']);
    // numbers stay numbers; a formula-looking text gets its apostrophe; NaN is left empty
    expect(rows[8]).toEqual([85, 4.75, '\'=HYPERLINK("x")']);
    expect(rows[9]).toEqual([5, null, 'plain']);
  });
  it('US customary: cfs and ft, converted from SI [1 ft = 0.3048 m exactly, NIST SP 811]', () => {
    const rows = sheetRows(table, { project: '+cmd', design: 'D', units: 'US' });
    expect(rows[0]).toEqual(['Project', "'+cmd"]);
    expect(rows[2]).toEqual(['Units', 'US customary']);
    expect(rows[7]!.slice(0, 2)).toEqual(['Q (cfs)', 'Depth (ft)']);
    expectRel(rows[8]![0] as number, 85 / FT ** 3, 1e-3 / (85 / FT ** 3));
    expectRel(rows[8]![1] as number, 4.75 / FT, 1e-4 / (4.75 / FT));
  });
});

describe('neutralise', () => {
  it('every formula starter, tab and carriage return, and nothing else; undone exactly', () => {
    for (const t of ['=1+1', '+1', '-1', '@SUM(A1)', '\tx', '\rx'])
      expect(neutralise(t)).toBe(`'${t}`);
    for (const t of ['1', 'a=b', "'=x", '']) expect(neutralise(t)).toBe(t);
    for (const t of ['=1+1', 'plain', '-x']) expect(unneutralise(neutralise(t))).toBe(t);
  });
  it('file names: lower case, hyphens, no punctuation', () => {
    expect(exportFileName(['Fenwick Mill Pond — outlet', 'Jump check'], 'csv')).toBe(
      'fenwick-mill-pond-outlet-jump-check.csv',
    );
    expect(exportFileName(['', '—'], 'xlsx')).toBe('export.xlsx');
  });
});

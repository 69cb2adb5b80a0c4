// The drawing out to CAD and the tables out to a workbook (issue 13 item 6). The DXF is read
// back by a DXF reader from the registry (dxf-parser), independent of the writer: its layers,
// its units ($INSUNITS 6 = metres, 2 = feet [AutoCAD DXF reference, header variables]) and
// entity counts equal to the SVG's, both being drawn from the same laid-out drawing. The XLSX
// is read back with exceljs.
import { describe, expect, it } from 'vitest';
import DxfParser from 'dxf-parser';
import ExcelJS from 'exceljs';
import { drawingToSvg, formatSI, runStudy, toSI, type DrawingFormatter } from '@basinwright/common';
import { DXF_LAYERS, drawingToDxf } from '../../web/src/composables/drawingFiles';
import { tableFile } from '../../web/src/composables/exportFiles';
import { caldwellDesign, fenwickDesign } from '../../seed/designs';
import { expectRel } from '../support/tolerance';

const FT = 0.3048; // international foot, exact by definition [src: NIST SP 811]
const feet: DrawingFormatter = (v, q) =>
  q === 'count'
    ? String(v)
    : q === 'discharge'
      ? `${(v / FT ** 3).toFixed(1)} cfs`
      : `${(v / FT).toFixed(2)} ft`;

interface Entity {
  type: string;
  layer: string;
  text?: string;
  vertices?: { x: number; y: number }[];
}

const cases = [
  {
    name: 'Fenwick (SI)',
    result: runStudy(fenwickDesign),
    units: 'SI' as const,
    format: formatSI,
    insunits: 6,
  },
  {
    name: 'Caldwell (US)',
    result: runStudy(toSI(caldwellDesign)),
    units: 'US' as const,
    format: feet,
    insunits: 2,
  },
];

describe.each(cases)('$name: the drawing as DXF', ({ result, units, format, insunits }) => {
  const drawing = result.design!.drawing;
  const opts = { format, width: 1100 };
  const dxf = new DxfParser().parseSync(drawingToDxf(drawing, units, opts))!;
  const entities = dxf.entities as unknown as Entity[];
  const svg = new DOMParser().parseFromString(drawingToSvg(drawing, opts), 'image/svg+xml');
  const views = [...svg.querySelectorAll('g[data-view]')];
  const on = (layer: string, type?: string) =>
    entities.filter((e) => e.layer === layer && (type === undefined || e.type === type));

  it('has the five layers and its units in the header', () => {
    const layers = Object.keys(dxf.tables.layer.layers);
    for (const l of Object.values(DXF_LAYERS)) expect(layers).toContain(l);
    expect(dxf.header.$INSUNITS).toBe(insunits);
    for (const l of Object.values(DXF_LAYERS)) expect(on(l).length, l).toBeGreaterThan(0);
  });

  it('holds as many outlines, dimensions and texts as the SVG', () => {
    const svgOutlines = views.flatMap((v) => [
      ...v.querySelectorAll('polygon[data-role], polyline[data-role]'),
    ]);
    const dxfOutlines = [DXF_LAYERS.outline, DXF_LAYERS.blocks, DXF_LAYERS.water].flatMap((l) =>
      on(l, 'LWPOLYLINE'),
    );
    expect(dxfOutlines).toHaveLength(svgOutlines.length);
    // blocks and water on their own layers, as many as the SVG's block and water outlines
    const roles = svgOutlines.map((e) => e.getAttribute('data-role'));
    expect(on(DXF_LAYERS.blocks, 'LWPOLYLINE')).toHaveLength(
      roles.filter((r) =>
        ['chute-block', 'baffle-pier', 'floor-block', 'sill-tooth', 'baffle'].includes(r!),
      ).length,
    );
    expect(on(DXF_LAYERS.water, 'LWPOLYLINE')).toHaveLength(
      roles.filter((r) => r!.startsWith('water')).length,
    );
    const svgDims = views.flatMap((v) => [...v.querySelectorAll('g[data-role^="dim-"]')]);
    expect(on(DXF_LAYERS.dimensions, 'TEXT')).toHaveLength(svgDims.length);
    expect(
      on(DXF_LAYERS.dimensions, 'TEXT')
        .map((e) => e.text)
        .sort(),
    ).toEqual(svgDims.map((g) => g.querySelector('text')!.textContent).sort());
    const svgTexts = views.flatMap((v) => [
      ...v.querySelectorAll('g[data-role^="label-"] text, g[data-role^="arrow-"] text'),
    ]);
    expect(
      on(DXF_LAYERS.text, 'TEXT')
        .map((e) => e.text)
        .sort(),
    ).toEqual(svgTexts.map((t) => t.textContent).sort());
  });

  it('is drawn to true scale: the slab outline of the section spans the basin length', () => {
    const d = result.design!.design;
    const slab = views
      .find((v) => v.getAttribute('data-view') === 'section')!
      .querySelector('polygon[data-role="slab"]');
    expect(slab).not.toBeNull();
    // the DXF outline with the same vertex count as the SVG's slab, on OUTLINE
    const n = slab!.getAttribute('points')!.trim().split(/\s+/).length;
    const candidates = on(DXF_LAYERS.outline, 'LWPOLYLINE').filter((e) => e.vertices!.length === n);
    const spans = candidates.map((e) => {
      const xs = e.vertices!.map((p) => p.x);
      return Math.max(...xs) - Math.min(...xs);
    });
    // the slab runs from the chute end drawn upstream to the end of the basin: at least L long
    const L = units === 'US' ? d.length / FT : d.length;
    expect(spans.some((s) => s >= L - 1e-6)).toBe(true);
    // and a dimension text carries the basin length in the project's units
    const lengthText =
      units === 'US' ? `${(d.length / FT).toFixed(2)} ft` : `${d.length.toFixed(2)} m`;
    expect(on(DXF_LAYERS.dimensions, 'TEXT').map((e) => e.text)).toContain(lengthText);
  });
});

describe('a table as XLSX', () => {
  it('reads back with the header, the headings with units and numbers as numbers', async () => {
    const file = await tableFile(
      {
        title: 'Check',
        columns: [
          { title: 'Q', kind: 'discharge', digits: 3, value: (r: { Q: number }) => r.Q },
          { title: 'Note', kind: null, value: () => '=1+1' },
        ],
        rows: [{ Q: 85 }],
      },
      { project: 'Caldwell', design: 'SAF basin', units: 'US' },
      'xlsx',
    );
    expect(file.name).toBe('caldwell-check.xlsx');
    const book = new ExcelJS.Workbook();
    await book.xlsx.load(await file.blob.arrayBuffer());
    const sheet = book.worksheets[0]!;
    expect(sheet.getRow(1).values).toEqual([undefined, 'Project', 'Caldwell']);
    expect(sheet.getRow(3).values).toEqual([undefined, 'Units', 'US customary']);
    const heads = sheet.getRow(7); // Project, Design, Units, Table, Caution, a blank row, then the headings
    expect(heads.values).toEqual([undefined, 'Q (cfs)', 'Note']);
    expect(heads.font?.bold).toBe(true);
    const q = sheet.getRow(8).getCell(1).value as number;
    expectRel(q, 85 / FT ** 3, 1e-3 / (85 / FT ** 3));
    expect(sheet.getRow(8).getCell(2).value).toBe("'=1+1");
  });
});

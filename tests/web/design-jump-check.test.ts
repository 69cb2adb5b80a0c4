// The Jump check's chart and table follow a switch: at the chosen basin's own design floor
// (its tailwater factor C) by default, or at the free-jump floor (C = 1.00) for reference. A type
// that holds no jump against the tailwater has no check of its own: the reference only, with a note.
import { describe, expect, it, vi } from 'vitest';
import { mount, type VueWrapper } from '@vue/test-utils';
import {
  runStudy,
  sheetRows,
  type ExportTable,
  type StudyResult,
  type UnitSystem,
} from '@basinwright/common';
import DesignJumpCheckStep from '../../web/src/components/DesignJumpCheckStep.vue';
import DesignRangeChart from '../../web/src/components/DesignRangeChart.vue';
import DesignDiagramChart from '../../web/src/components/DesignDiagramChart.vue';
import { unitFormat } from '../../web/src/composables/useStudy';
import { expectRel } from '../support/tolerance';
import { fenwickDesign } from '../../seed/designs';

const stubs = { DesignRangeChart: true, DesignDiagramChart: true };
// The SI demo study of product.md (invented scenario): a USBR Type II basin is chosen.
const result: StudyResult = runStudy(fenwickDesign);

function mountStep(res: StudyResult, units: UnitSystem = 'SI'): VueWrapper {
  return mount(DesignJumpCheckStep, { props: { result: res, units }, global: { stubs } });
}

/** Table cells by column title, one array per body row. */
function tableRows(w: VueWrapper): Array<Record<string, string>> {
  const table = w.find('[data-test="range-table"]');
  const heads = table.findAll('thead th').map((th) => th.text());
  return table.findAll('tbody tr.ant-table-row').map((tr) => {
    const cells = tr.findAll('td').map((td) => td.text());
    return Object.fromEntries(heads.map((h, i) => [h, cells[i] ?? '']));
  });
}

async function pick(w: VueWrapper, label: RegExp): Promise<void> {
  const item = w
    .findAll('[data-test="check-floor-switch"] .ant-segmented-item')
    .find((x) => label.test(x.text()));
  expect(item, `switch option ${label}`).toBeDefined();
  await item!.find('input').trigger('change');
}

describe('Jump check at the design floor', () => {
  const entry = result.design!;
  const d = entry.design;
  if (d.family !== 'jump-basin') throw new Error('the demo study should choose a jump basin');

  it('is the default and shows the chosen basin’s own rows, with C and the required depth C·y2', () => {
    const w = mountStep(result);
    expect(w.find('[data-test="range-table"]').attributes('data-floor')).toBe('design');
    expect(w.find('[data-test="check-floor-switch"]').text()).toContain(`Design floor — ${d.name}`);
    expect(w.find('[data-test="check-floor"]').text()).toBe(`${d.floorElevation.toFixed(2)} m`);
    // the design floor differs from the free-jump one here, so the two tables must differ too
    expect(Math.abs(d.floorElevation - result.floor.elevation)).toBeGreaterThan(0.005);
    const rows = tableRows(w);
    expect(rows).toHaveLength(d.rows.length);
    const f = unitFormat('SI');
    d.rows.forEach((row, i) => {
      const shown = rows[i]!;
      expect(shown['Q (m³/s)']).toBe(f.num(row.Q, 'discharge', 2));
      expect(shown['Tailwater depth (m)']).toBe(f.num(row.tailwaterDepth, 'length', 2));
      expect(shown['Required depth C·y2 (m)']).toBe(f.num(row.requiredDepth, 'length', 2));
      expect(shown['Margin TW − C·y2 (m)']).toBe(f.num(row.margin, 'length', 2));
      expect(shown['C']).toBe(f.num(d.sizing.tailwaterFactor, null, 2));
    });
    // the chart plots the same rows, and its legend names the C in force
    const chart = w.findComponent(DesignRangeChart);
    expect(chart.props('rows')).toHaveLength(d.rows.length);
    expect(chart.props('rows')[0]?.requiredDepth).toBe(d.rows[0]!.requiredDepth);
    expect(chart.props('requiredLabel')).toBe(
      `Required depth C·y2 (C = ${d.sizing.tailwaterFactor.toFixed(2)}, ${d.name})`,
    );
    w.unmount();
  });

  it('the rows obey Bélanger and C, and the margin is zero at the governing discharge', () => {
    // Sequent depth y2 = y1/2·(√(1 + 8·Fr1²) − 1) [Bélanger; Chow 1959, Open-Channel Hydraulics, §15-2]
    for (const row of d.rows) {
      expectRel(row.y2, 0.5 * row.y1 * (Math.sqrt(1 + 8 * row.fr1 * row.fr1) - 1), 1e-9);
      expectRel(row.requiredDepth, d.sizing.tailwaterFactor * row.y2, 1e-9);
    }
    // The floor is the highest with TW ≥ C·y2 at every discharge, so the least margin is zero and
    // falls at the governing discharge. The floor solve stops on a bracket of 1e-7·|z| (≈ 9e-6 m
    // here), so zero is met to that tolerance, from the safe side.
    const least = d.rows.reduce((a, x) => (x.margin < a.margin ? x : a));
    expect(least.Q).toBe(d.governingQ);
    expect(least.margin).toBeGreaterThanOrEqual(0);
    expect(least.margin).toBeLessThan(2e-7 * Math.abs(d.floorElevation));
    // the basin stands on the study's solved floor for its type
    expect(d.floorElevation).toBe(result.dissipators!.floors[entry.type as 'usbr-2']!.elevation);
  });

  it('names the jump position against C·y2 with the submergence tolerance', () => {
    const w = mountStep(result);
    const rows = tableRows(w);
    const tol = result.input.submergenceTolerance ?? 0.1;
    d.rows.forEach((row, i) => {
      const expected =
        row.margin < 0
          ? 'Swept out'
          : row.margin / row.requiredDepth > tol
            ? 'Drowned'
            : 'At the toe';
      expect(rows[i]!['Jump position']).toBe(expected);
    });
    // both ends occur in the demo: drowned at small flows, at the toe at the governing one
    expect(rows.at(-1)!['Jump position']).toBe('At the toe');
    expect(rows[0]!['Jump position']).toBe('Drowned');
    w.unmount();
  });

  it('a shortfall shows as swept out', () => {
    const short = d.rows.map((x, i) =>
      i === 0 ? { ...x, tailwaterDepth: x.requiredDepth - 0.2, margin: -0.2 } : x,
    );
    // the step formats what the engine says: the position comes with the result (chosenFloor)
    const own = result.chosenFloor!;
    const positions = own.positions.map((p, i) =>
      i === 0 ? { ...p, margin: -0.2, position: 'swept-out' as const } : p,
    );
    const res: StudyResult = {
      ...result,
      design: { ...entry, design: { ...d, rows: short } },
      chosenFloor: { ...own, positions },
    };
    const w = mountStep(res);
    const first = tableRows(w)[0]!;
    expect(first['Jump position']).toBe('Swept out');
    expect(first['Margin TW − C·y2 (m)']).toBe('-0.20');
    w.unmount();
  });
});

describe('Jump check at the free-jump floor (reference)', () => {
  it('switching shows StudyResult.rows with the free-jump columns', async () => {
    const w = mountStep(result);
    await pick(w, /Free-jump floor/);
    expect(w.find('[data-test="range-table"]').attributes('data-floor')).toBe('reference');
    expect(w.find('[data-test="check-floor"]').text()).toBe(
      `${result.floor.elevation.toFixed(2)} m`,
    );
    const rows = tableRows(w);
    expect(rows).toHaveLength(result.rows.length);
    const f = unitFormat('SI');
    result.rows.forEach((row, i) => {
      expect(rows[i]!['Tailwater depth (m)']).toBe(f.num(row.tailwaterDepth, 'length', 2));
      expect(rows[i]!['Margin TW − C·y2 (m)']).toBe(f.num(row.margin, 'length', 2));
      expect(rows[i]!['Head loss (%)']).toBe(f.num(row.relativeLoss * 100, null, 1));
    });
    expect(Object.keys(rows[0]!)).toEqual([
      'Q (m³/s)',
      'y1 (m)',
      'V1 (m/s)',
      'Fr1',
      'y2 (m)',
      'Tailwater depth (m)',
      'Margin TW − C·y2 (m)',
      'Jump position',
      'Jump class',
      'Head loss (%)',
      'Jump length (m)',
    ]);
    expect(w.findComponent(DesignRangeChart).props('rows')).toEqual(result.rows);
    expect(w.findComponent(DesignRangeChart).props('requiredLabel')).toBe(
      'Required depth C·y2 (C = 1.00, free jump)',
    );
    await pick(w, /Design floor/);
    expect(w.find('[data-test="range-table"]').attributes('data-floor')).toBe('design');
    w.unmount();
  });

  it('US units: headers and values in ft and cfs at either floor', async () => {
    const d = result.design!.design;
    if (d.family !== 'jump-basin') throw new Error('jump basin expected');
    const w = mountStep(result, 'US');
    const f = unitFormat('US');
    const first = tableRows(w)[0]!;
    expect(first['Q (cfs)']).toBe(f.num(d.rows[0]!.Q, 'discharge', 2));
    // 1 ft = 0.3048 m exactly (NIST SP 811)
    expect(first['Tailwater depth (ft)']).toBe(
      (d.rows[0]!.tailwaterDepth / 0.3048).toLocaleString('en-GB', {
        minimumFractionDigits: 2,
        maximumFractionDigits: 2,
      }),
    );
    await pick(w, /Free-jump floor/);
    expect(tableRows(w)[0]!['Tailwater depth (ft)']).toBe(
      f.num(result.rows[0]!.tailwaterDepth, 'length', 2),
    );
    w.unmount();
  });
});

describe('E–y and M–y diagrams follow the floor shown', () => {
  it('on the design floor: the chosen basin’s own jump at the design discharge; on the reference: the study’s', async () => {
    const d = result.design!.design;
    if (d.family !== 'jump-basin') throw new Error('jump basin expected');
    const w = mountStep(result);
    const charts = () =>
      w
        .findAllComponents(DesignDiagramChart)
        .map((c) => c.props('diagrams') as StudyResult['diagrams']);
    const [onDesign] = charts();
    const g = 9.80665; // standard gravity [CGPM 1901; NIST SP 330]
    const b = d.width;
    const y1 = onDesign!.y1;
    expectRel(y1, d.water.y1, 1e-9);
    const v1 = d.water.Q / (b * y1);
    // E1 = y1 + V1²/2g in a rectangle of the basin width [Chow 1959, §3-1]
    expectRel(onDesign!.specificEnergy.E1, y1 + (v1 * v1) / (2 * g), 1e-9);
    // y2 by Bélanger [Chow 1959, §15-2]
    const fr1 = v1 / Math.sqrt(g * y1);
    expectRel(onDesign!.y2, 0.5 * y1 * (Math.sqrt(1 + 8 * fr1 * fr1) - 1), 1e-9);
    // tailwater marked at its depth over this floor
    expectRel(onDesign!.tailwaterDepth!, d.water.tailwaterElevation - d.floorElevation, 1e-9);
    expect(w.find('[data-test="design-jump"]').text()).toContain(`Fr1 ${fr1.toFixed(2)}`);
    expect(w.find('[data-test="design-jump"]').text()).toContain('on the design floor');
    // the two floors differ here, and so do the two toe depths
    expect(Math.abs(y1 - result.diagrams.y1)).toBeGreaterThan(1e-4);
    // power dissipated P = ρ·g·Q·ΔE with ρ = 1000 kg/m³ (fresh water, common practice) [Chow 1959, §15-2]
    const power =
      1000 * g * d.water.Q * (onDesign!.specificEnergy.E1 - onDesign!.specificEnergy.E2);
    expect(w.find('[data-test="design-jump-power"]').text()).toBe(`${(power / 1e6).toFixed(2)} MW`);
    await pick(w, /Free-jump floor/);
    expect(charts()[0]).toEqual(result.diagrams);
    expect(w.find('[data-test="design-jump"]').text()).toContain('on the free-jump floor');
    w.unmount();
  });
});

describe('the table as CSV', () => {
  const d = result.design!.design;
  if (d.family !== 'jump-basin') throw new Error('jump basin expected');
  // the table as the download writes it (common's sheetRows): header lines, a blank line, the
  // column headings, the rows
  const read = (w: VueWrapper, units: 'SI' | 'US' = 'SI') => {
    const table = (w.vm as unknown as { checkTable: () => ExportTable<unknown> }).checkTable();
    const all = sheetRows(table, { project: 'Fenwick', design: 'Draft', units });
    const blank = all.findIndex((r) => r.length === 0);
    const note = all.find((r) => r[0] === 'Note');
    return { comment: String(note?.[1]), header: all.slice(0, blank), rows: all.slice(blank + 1) };
  };

  it('design floor: a header with units, then every row as plain numbers in SI', () => {
    const w = mountStep(result);
    const { comment, rows } = read(w);
    expect(comment).toContain(`design floor, ${d.name}`);
    expect(rows[0]).toEqual([
      'Q (m³/s)',
      'y1 (m)',
      'V1 (m/s)',
      'Fr1',
      'y2 (m)',
      'C',
      'Required depth C·y2 (m)',
      'Tailwater depth (m)',
      'Margin TW − C·y2 (m)',
      'Jump position',
      'Basin length (m)',
    ]);
    expect(rows).toHaveLength(d.rows.length + 1);
    d.rows.forEach((row, i) => {
      const cells = rows[i + 1]!;
      expect(Number(cells[0])).toBe(Number(row.Q.toFixed(3)));
      expect(Number(cells[7])).toBe(Number(row.tailwaterDepth.toFixed(4)));
      // no thousands separators: every number reads back as a number
      for (const c of [0, 1, 2, 3, 4, 5, 6, 7, 8, 10])
        expect(Number.isFinite(Number(cells[c]))).toBe(true);
    });
    w.unmount();
  });

  it('US units: the same rows in cfs and ft (1 ft = 0.3048 m exactly, NIST SP 811); the button offers a file', async () => {
    const w = mountStep(result, 'US');
    const { rows, header } = read(w, 'US');
    expect(header).toContainEqual(['Units', 'US customary']);
    expect(rows[0]![0]).toBe('Q (cfs)');
    expectRel(Number(rows[1]![0]), d.rows[0]!.Q / 0.3048 ** 3, 1e-3 / (d.rows[0]!.Q / 0.3048 ** 3));
    expectRel(
      Number(rows[1]![7]),
      d.rows[0]!.tailwaterDepth / 0.3048,
      1e-4 / (d.rows[0]!.tailwaterDepth / 0.3048),
    );
    const created = vi.fn(() => 'blob:csv');
    vi.stubGlobal(
      'URL',
      Object.assign(URL, { createObjectURL: created, revokeObjectURL: vi.fn() }),
    );
    await w.find('[data-test="download-csv"]').trigger('click');
    await vi.waitFor(() => expect(created).toHaveBeenCalledTimes(1));
    vi.unstubAllGlobals();
    w.unmount();
  });
});

describe('SAF basin: C varies with Fr1', () => {
  it('the C column follows Blaisdell’s relation and the legend gives the range', () => {
    const res = runStudy({ ...fenwickDesign, dissipators: { chosenType: 'saf' } });
    const d = res.design!.design;
    if (d.family !== 'jump-basin') throw new Error('SAF is a jump basin');
    // TW/y2 = 1.10 − Fr1²/120 (Fr1 1.7–5.5), 0.85 (5.5–11), 1.00 − Fr1²/800 (11–17), pieces joined
    // where they meet [from memory: Blaisdell 1948, SAF stilling basin]
    const blaisdell = (fr: number): number =>
      fr <= Math.sqrt(0.25 * 120)
        ? 1.1 - (fr * fr) / 120
        : fr <= Math.sqrt(0.15 * 800)
          ? 0.85
          : 1 - (fr * fr) / 800;
    const w = mountStep(res);
    const rows = tableRows(w);
    const f = unitFormat('SI');
    const cs = d.rows.map((row, i) => {
      const c = blaisdell(Math.min(17, Math.max(1.7, row.fr1)));
      expectRel(row.requiredDepth / row.y2, c, 1e-9);
      expect(rows[i]!['C']).toBe(f.num(c, null, 2));
      return c;
    });
    const lo = f.num(Math.min(...cs), null, 2);
    const hi = f.num(Math.max(...cs), null, 2);
    expect(lo).not.toBe(hi);
    expect(w.findComponent(DesignRangeChart).props('requiredLabel')).toBe(
      `Required depth C·y2 (C = ${lo}–${hi} with Fr1, ${d.name})`,
    );
    w.unmount();
  });
});

describe('a chosen type with no jump of its own', () => {
  it('USBR Type VI: the reference only, saying why', () => {
    const res = runStudy({ ...fenwickDesign, dissipators: { chosenType: 'usbr-6' } });
    expect(res.design?.design.family).toBe('impact-basin');
    const w = mountStep(res);
    expect(w.find('[data-test="check-floor-switch"]').exists()).toBe(false);
    expect(w.find('[data-test="check-floor-only"]').text()).toBe('Free-jump floor (reference)');
    expect(w.find('[data-test="check-floor-note"]').text()).toContain(
      `The ${res.design!.design.name} does not hold a hydraulic jump`,
    );
    expect(w.find('[data-test="range-table"]').attributes('data-floor')).toBe('reference');
    expect(tableRows(w)).toHaveLength(res.rows.length);
    expect(w.findComponent(DesignRangeChart).props('rows')).toEqual(res.rows);
    w.unmount();
  });

  it('no design at all: the reference only', () => {
    const w = mountStep({ ...result, design: null });
    expect(w.find('[data-test="check-floor-switch"]').exists()).toBe(false);
    expect(w.find('[data-test="check-floor-note"]').text()).toContain(
      'No basin type is designed yet',
    );
    expect(tableRows(w)).toHaveLength(result.rows.length);
    w.unmount();
  });
});

describe('a floor above the channel bed', () => {
  it('says it is above the bed, by how much, not "0.00 m below"', () => {
    // the demo with its floor fixed 0.30 m above the bed (invented demo data)
    const res = runStudy({ ...fenwickDesign, floorElevation: 90.3 });
    const w = mountStep(res);
    const item = w.find('[data-test="depth-below-bed"]');
    expect(item.text()).toBe('0.30 m');
    expect(w.text()).toContain('Floor above the channel bed');
    expect(w.text()).not.toContain('Floor below the channel bed');
  });
});

// Chart data in the user's units, shared by the web's charts and the proposal PDF: the web
// hands these series to its chart library, the PDF draws them with chartToSvg (svg.ts). Pure.
import type { JumpDiagrams } from '../hydraulics/diagrams';
import type { UnitSystem } from '../range/types';
import { unitFormat } from '../units';

/** One line of a chart: points [x, y] in the user's units. */
export interface ChartSeries {
  name: string;
  points: [number, number][];
  color: string;
  dash?: 'dashed' | 'dotted';
  width: number;
  /** draw a marker at each point */
  markers: boolean;
}

/** A horizontal (`y`) or vertical (`x`) reference line with its label. */
export interface ChartMark {
  axis: 'x' | 'y';
  at: number;
  label: string;
  color: string;
  dash?: 'dashed' | 'dotted';
  /** a horizontal line's label at the start (left) instead of the end, to keep clear of another */
  labelAtStart?: boolean;
}

export interface ChartSpec {
  title: string;
  xTitle: string;
  yTitle: string;
  /** y axis starts at 0 (depths) rather than fitting the data */
  yFromZero: boolean;
  series: ChartSeries[];
  marks: ChartMark[];
}

/** What the range chart needs of a row, SI (StudyRow and a jump basin's design row both fit). */
export interface RangeChartRow {
  Q: number;
  tailwaterDepth: number;
  requiredDepth: number;
  y2: number;
}

export const CHART_COLOURS = {
  water: '#1d6fb8',
  teal: '#0f6e6e',
  amber: '#b45309',
  red: '#b42318',
  slate: '#475569',
  slate700: '#334155',
} as const;

/**
 * Tailwater depth on the floor against the depth the jump needs (C·y2) and y2 itself, over
 * the discharges checked (SI rows → the user's units).
 */
export function rangeChartSpec(
  rows: readonly RangeChartRow[],
  units: UnitSystem,
  requiredLabel = 'Required depth C·y2',
): ChartSpec {
  const f = unitFormat(units);
  const pts = (get: (r: RangeChartRow) => number): [number, number][] =>
    rows.map((r) => [f.value(r.Q, 'discharge'), f.value(get(r), 'length')]);
  return {
    title: 'Tailwater against the depth the jump needs',
    xTitle: `Discharge Q (${f.label('discharge')})`,
    yTitle: `Depth above the basin floor (${f.label('length')})`,
    yFromZero: true,
    series: [
      {
        name: 'Tailwater depth on the floor',
        points: pts((r) => r.tailwaterDepth),
        color: CHART_COLOURS.water,
        width: 2.5,
        markers: true,
      },
      {
        name: requiredLabel,
        points: pts((r) => r.requiredDepth),
        color: CHART_COLOURS.teal,
        dash: 'dashed',
        width: 2.5,
        markers: true,
      },
      {
        name: 'Sequent depth y2',
        points: pts((r) => r.y2),
        color: CHART_COLOURS.amber,
        dash: 'dotted',
        width: 1,
        markers: false,
      },
    ],
    marks: [],
  };
}

/**
 * Specific energy E(y) at the design discharge, depth up the side, with y1, y2, yc and the
 * tailwater as horizontal lines and E1, E2 (their difference is the head loss ΔE) as vertical.
 */
export function energyChartSpec(d: JumpDiagrams, units: UnitSystem): ChartSpec {
  const f = unitFormat(units);
  const L = f.label('length');
  const len = (v: number): number => f.value(v, 'length');
  const mark = (
    label: string,
    y: number,
    color: string,
    dash?: 'dashed' | 'dotted',
  ): ChartMark => ({
    axis: 'y',
    at: len(y),
    label: `${label} = ${f.shown(len(y), 'length')}`,
    color,
    ...(dash ? { dash } : {}),
  });
  const marks: ChartMark[] = [
    mark('y1', d.y1, CHART_COLOURS.red),
    mark('y2', d.y2, CHART_COLOURS.water),
    mark('yc', d.criticalDepth, CHART_COLOURS.slate700, 'dashed'),
  ];
  if (d.tailwaterDepth !== null)
    marks.push({
      ...mark('Tailwater', d.tailwaterDepth, CHART_COLOURS.slate, 'dashed'),
      labelAtStart: true,
    });
  for (const [name, x] of [
    ['E1', d.specificEnergy.E1],
    ['E2', d.specificEnergy.E2],
  ] as const)
    marks.push({
      axis: 'x',
      at: len(x),
      label: `${name} = ${f.shown(len(x), 'length')}`,
      color: CHART_COLOURS.slate700,
      dash: 'dotted',
    });
  return {
    title: `Specific energy at the design discharge (ΔE = ${f.withUnit(d.specificEnergy.deltaE, 'length')})`,
    xTitle: `Specific energy E (${L})`,
    yTitle: `Depth y (${L})`,
    yFromZero: true,
    series: [
      {
        name: 'E(y)',
        points: d.specificEnergy.points.map((p) => [len(p.value), len(p.y)]),
        color: CHART_COLOURS.teal,
        width: 2,
        markers: false,
      },
    ],
    marks,
  };
}

/** Where a horizontal reference line's label sits: at which end, and on which side of the line. */
export interface MarkLabelPlace {
  end: 'start' | 'end';
  side: 'above' | 'below';
}

/**
 * Where to put the label of a horizontal reference line at y = `at` so that `points` (a series
 * drawn as straight segments, x ascending) do not run through it. The label spans `span` of
 * the x range from its end and `height` above or below the line (both in the axes' units).
 * Tried in order: end above, end below, start above, start below; the first the series stays
 * clear of is taken (end above when none is).
 */
export function markLabelPlace(
  points: readonly (readonly [number, number])[],
  at: number,
  span: number,
  height: number,
): MarkLabelPlace {
  const pts = points.filter(([x, y]) => Number.isFinite(x) && Number.isFinite(y));
  if (pts.length === 0) return { end: 'end', side: 'above' };
  const xs = pts.map((p) => p[0]);
  const lo = Math.min(...xs),
    hi = Math.max(...xs);
  /** y of the series at x (linear between points), or null outside it */
  const yAt = (x: number): number | null => {
    for (let i = 1; i < pts.length; i++) {
      const [x0, y0] = pts[i - 1]!,
        [x1, y1] = pts[i]!;
      if (x >= Math.min(x0, x1) && x <= Math.max(x0, x1))
        return x1 === x0 ? Math.max(y0, y1) : y0 + ((x - x0) / (x1 - x0)) * (y1 - y0);
    }
    return pts.length === 1 && x === pts[0]![0] ? pts[0]![1] : null;
  };
  const clear = (from: number, to: number, y0: number, y1: number): boolean => {
    // the series' vertices inside the span and its values at the span's ends
    const inside = [from, to, ...xs.filter((x) => x > from && x < to)];
    const ys = inside.map(yAt).filter((y): y is number => y !== null);
    // a segment crossing the band between two samples passes a sample on each side or inside
    const below = ys.some((y) => y < y0),
      above = ys.some((y) => y > y1),
      within = ys.some((y) => y >= y0 && y <= y1);
    return !within && !(below && above);
  };
  const w = (hi - lo) * span;
  const tries: [MarkLabelPlace, number, number][] = [
    [{ end: 'end', side: 'above' }, hi - w, hi],
    [{ end: 'end', side: 'below' }, hi - w, hi],
    [{ end: 'start', side: 'above' }, lo, lo + w],
    [{ end: 'start', side: 'below' }, lo, lo + w],
  ];
  for (const [place, from, to] of tries) {
    const [y0, y1] = place.side === 'above' ? [at, at + height] : [at - height, at];
    if (clear(from, to, y0, y1)) return place;
  }
  return { end: 'end', side: 'above' };
}

// The chart data shared by the web and the proposal PDF, and its SVG.
import { describe, expect, it } from 'vitest';
import {
  chartToSvg,
  energyChartSpec,
  jumpDiagrams,
  markLabelPlace,
  niceTicks,
  rangeChartSpec,
} from '@basinwright/common';
import { expectRel } from '../support/tolerance';

const G = 9.80665; // standard gravity, m/s² (CGPM 1901)

describe('niceTicks', () => {
  it('steps of 1, 2 or 5 × 10^k covering the range (the usual axis rule)', () => {
    expect(niceTicks(0, 85, 6)).toEqual([0, 20, 40, 60, 80, 100]);
    expect(niceTicks(0.2, 4.9, 6)).toEqual([0, 1, 2, 3, 4, 5]);
    expect(niceTicks(87.2, 88.9, 6)).toEqual([87, 87.5, 88, 88.5, 89]);
  });
  it('refuses ends that are not numbers', () => {
    expect(() => niceTicks(Number.NaN, 1)).toThrow(RangeError);
  });
});

describe('rangeChartSpec', () => {
  const rows = [
    { Q: 1, tailwaterDepth: 1, requiredDepth: 0.5, y2: 0.45 },
    { Q: 2, tailwaterDepth: 1.5, requiredDepth: 0.9, y2: 0.85 },
  ];
  it('gives the points in the user’s units: 1 m³/s = 35.3147 cfs, 1 m = 3.28084 ft', () => {
    // 1 ft = 0.3048 m exactly (international foot, 1959): 1/0.3048³ and 1/0.3048.
    const us = rangeChartSpec(rows, 'US');
    const [tw] = us.series;
    expectRel(tw!.points[0]![0], 1 / 0.3048 ** 3, 1e-9);
    expectRel(tw!.points[0]![1], 1 / 0.3048, 1e-9);
    expect(us.xTitle).toBe('Discharge Q (cfs)');
    expect(us.yTitle).toBe('Depth above the basin floor (ft)');
    const si = rangeChartSpec(rows, 'SI', 'Required depth C·y2 (C = 1.05)');
    expect(si.series.map((s) => s.name)).toEqual([
      'Tailwater depth on the floor',
      'Required depth C·y2 (C = 1.05)',
      'Sequent depth y2',
    ]);
    expect(si.series[1]!.points).toEqual([
      [1, 0.5],
      [2, 0.9],
    ]);
  });
});

describe('energyChartSpec', () => {
  it('marks E1 and E2 of the two depths, E = y + q²/(2g·y²) for a rectangle (Chow 1959, §3-1)', () => {
    const b = 2,
      Q = 3,
      y1 = 0.3,
      y2 = 1.1;
    const d = jumpDiagrams({ shape: 'rectangular', width: b }, Q, y1, y2, 1.2);
    const spec = energyChartSpec(d, 'SI');
    const q = Q / b;
    const E = (y: number) => y + (q * q) / (2 * G * y * y); // independent of the engine
    const xs = spec.marks.filter((m) => m.axis === 'x').map((m) => m.at);
    expectRel(xs[0]!, E(y1), 1e-9);
    expectRel(xs[1]!, E(y2), 1e-9);
    const ys = Object.fromEntries(
      spec.marks.filter((m) => m.axis === 'y').map((m) => [m.label.split(' ')[0], m.at]),
    );
    expectRel(ys.y1!, y1, 1e-12);
    expectRel(ys.y2!, y2, 1e-12);
    // critical depth of a rectangle yc = (q²/g)^(1/3) (Chow 1959)
    expectRel(ys.yc!, Math.cbrt((q * q) / G), 1e-6);
    expectRel(ys.Tailwater!, 1.2, 1e-12);
    expect(spec.title).toContain('ΔE = ');
    // every curve point lies on E(y)
    for (const [x, y] of spec.series[0]!.points) expectRel(x, E(y), 1e-9);
  });
});

describe('chartToSvg', () => {
  it('draws one path a series, the titles and legend, and no NaN', () => {
    const spec = rangeChartSpec(
      [
        { Q: 5, tailwaterDepth: 3, requiredDepth: 1.2, y2: 1.1 },
        { Q: 85, tailwaterDepth: 5, requiredDepth: 5, y2: 4.7 },
      ],
      'SI',
    );
    const svg = chartToSvg(spec, { fontFamily: 'Lato' });
    expect(svg.startsWith('<svg')).toBe(true);
    expect(svg.match(/<path /g)?.length).toBe(3);
    expect(svg).toContain('Discharge Q (m³/s)');
    expect(svg).toContain('Tailwater depth on the floor');
    expect(svg).toContain('font-family="Lato"');
    expect(svg).not.toMatch(/NaN|Infinity/);
  });
  it('refuses a chart with no points', () => {
    const spec = rangeChartSpec([], 'SI');
    expect(() => chartToSvg(spec)).toThrow(RangeError);
  });
});

// The label of a horizontal reference line (the V1 limit of the toe chart) never sits where
// its series runs: geometry of the points checked by hand beside each case.
describe('markLabelPlace', () => {
  it('a series rising to just under the line at the right: the label goes above at the end', () => {
    // V1 from 8 to 14.5 under a line at 15; the band above (15–16) is clear everywhere
    expect(
      markLabelPlace(
        [
          [0, 8],
          [50, 12],
          [100, 14.5],
        ],
        15,
        0.5,
        1,
      ),
    ).toEqual({ end: 'end', side: 'above' });
  });
  it('a series crossing the line near the right end: the label moves to the start, clear of it', () => {
    // from 8 to 17 across 15 at x ≈ 78: the right half holds values in both bands; the left
    // half (0–50) stays under 12.5, so above the line there is clear
    expect(
      markLabelPlace(
        [
          [0, 8],
          [50, 12.5],
          [100, 17],
        ],
        15,
        0.5,
        1,
      ),
    ).toEqual({ end: 'start', side: 'above' });
  });
  it('a series running just above the line at the right: the label goes below', () => {
    // 15.5 at the right end lies in the band above (15–16); below (14–15) is clear there
    expect(
      markLabelPlace(
        [
          [0, 10],
          [40, 14],
          [60, 15.5],
          [100, 15.5],
        ],
        15,
        0.3,
        1,
      ),
    ).toEqual({
      end: 'end',
      side: 'below',
    });
  });
});

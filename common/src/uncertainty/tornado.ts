// The tornado chart of the sensitivity (run.ts: each input at its 5 % and 95 % points, the
// others as designed) as SVG text in the user's units, for the proposal PDF. Inline attributes
// only and the round ticks of the range charts (charts/svg.ts), so the PDF's SVG reader draws it
// as a browser would. Pure.
import { CHART_COLOURS } from '../charts/spec';
import { niceTicks } from '../charts/svg';
import type { UnitSystem } from '../range/types';
import { unitFormat } from '../units';
import type { UncertainKey } from './inputs';
import type { SensitivityRow } from './run';

/** The short name of each uncertain input, as the tornado chart labels it (web and PDF). */
export const UNCERTAIN_INPUT_NAMES: Record<UncertainKey, string> = {
  downstreamN: 'Downstream n',
  ratingShift: 'Rating shift',
  bedLowering: 'Bed lowering',
  chuteLoss: 'Chute loss',
  weirC: 'Weir C',
  designDischarge: 'Design discharge',
};

/** The legend of the two bars of each input. */
export const TORNADO_LEGEND = {
  low: 'Input at its 5 % point',
  high: 'Input at its 95 % point',
} as const;

export interface TornadoSvgOptions {
  /** px (default 720); the height follows the number of inputs */
  width?: number;
  fontFamily?: string;
}

function esc(s: string): string {
  return s.replace(/[&<>"]/g, (c) => `&#${c.charCodeAt(0)};`);
}
const r2 = (v: number): string => (Math.round(v * 100) / 100).toString();

/**
 * The change in the required floor (user's units) when each input goes to its low and high
 * point, largest swing on top (the rows as runUncertainty orders them). An input at which no
 * floor holds the jump is said in words on its row.
 */
export function tornadoSvg(
  rows: readonly SensitivityRow[],
  units: UnitSystem,
  opts: TornadoSvgOptions = {},
): string {
  const f = unitFormat(units);
  const W = opts.width ?? 720;
  const font = esc(opts.fontFamily ?? 'Lato, Helvetica, Arial, sans-serif');
  const rowH = 34;
  const left = 150,
    right = 60,
    top = 58,
    bottom = 50;
  const H = top + Math.max(1, rows.length) * rowH + bottom;
  const changes = rows.flatMap((r) =>
    [r.changeAtLow, r.changeAtHigh].filter((c): c is number => c !== null),
  );
  const shown = changes.map((c) => f.value(c, 'length'));
  // a quarter more either side of zero: room for the value printed at the end of each bar
  const ticks = niceTicks(1.25 * Math.min(0, ...shown), 1.25 * Math.max(0, ...shown), 6);
  const x0 = ticks[0]!;
  const x1 = ticks[ticks.length - 1]!;
  const X = (v: number): number => left + ((v - x0) / (x1 - x0)) * (W - left - right);
  const step = ticks.length > 1 ? Math.abs(ticks[1]! - ticks[0]!) : 1;
  const decimals = Math.max(0, Math.min(4, -Math.floor(Math.log10(step) + 1e-9)));
  const T = (x: number, y: number, s: string, size: number, extra = '', fill = '#0f172a'): string =>
    `<text x="${r2(x)}" y="${r2(y)}" font-family="${font}" font-size="${size}" fill="${fill}"${extra}>${esc(s)}</text>`;
  const colours = { low: CHART_COLOURS.slate, high: CHART_COLOURS.teal };
  const out: string[] = [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}">`,
    `<rect x="0" y="0" width="${W}" height="${H}" fill="#ffffff"/>`,
    T(left, 16, 'Which input moves the floor most', 13, ' font-weight="bold"'),
  ];
  (['low', 'high'] as const).forEach((k, i) => {
    const lx = left + i * 200;
    out.push(
      `<rect x="${r2(lx)}" y="30" width="14" height="10" fill="${colours[k]}"/>`,
      T(lx + 20, 39, TORNADO_LEGEND[k], 11),
    );
  });
  for (const v of ticks)
    out.push(
      `<line x1="${r2(X(v))}" y1="${top}" x2="${r2(X(v))}" y2="${H - bottom}" stroke="#e2e8f0" stroke-width="0.8"/>`,
      T(X(v), H - bottom + 16, v.toFixed(decimals), 11, ' text-anchor="middle"', '#334155'),
    );
  rows.forEach((row, i) => {
    const y = top + i * rowH;
    out.push(
      T(left - 8, y + rowH / 2 + 4, UNCERTAIN_INPUT_NAMES[row.key], 11.5, ' text-anchor="end"'),
    );
    (['low', 'high'] as const).forEach((k, j) => {
      const change = k === 'low' ? row.changeAtLow : row.changeAtHigh;
      const by = y + 5 + j * 12;
      if (change === null) {
        out.push(T(X(0) + 4, by + 9, 'no floor holds the jump', 10, '', CHART_COLOURS.red));
        return;
      }
      const v = f.value(change, 'length');
      const a = Math.min(X(0), X(v));
      const w = Math.max(0.8, Math.abs(X(v) - X(0)));
      out.push(
        `<rect x="${r2(a)}" y="${r2(by)}" width="${r2(w)}" height="11" fill="${colours[k]}"/>`,
        T(
          v < 0 ? a - 3 : a + w + 3,
          by + 9,
          f.num(change, 'length'),
          9.5,
          v < 0 ? ' text-anchor="end"' : '',
          '#334155',
        ),
      );
    });
  });
  out.push(
    `<line x1="${r2(X(0))}" y1="${top}" x2="${r2(X(0))}" y2="${H - bottom}" stroke="#0f172a" stroke-width="1.2"/>`,
    `<rect x="${left}" y="${top}" width="${W - left - right}" height="${H - top - bottom}" fill="none" stroke="#64748b" stroke-width="1"/>`,
    T(
      (left + W - right) / 2,
      H - 12,
      `Change in the required floor elevation (${f.label('length')})`,
      12,
      ' text-anchor="middle"',
    ),
    '</svg>',
  );
  return out.join('');
}

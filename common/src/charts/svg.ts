// A chart spec (spec.ts) as SVG text: axes with round ticks and titles, the series, the
// reference lines and a legend. Inline attributes only, like the drawing (drawing/svg.ts), so
// the PDF's SVG reader draws it the same as a browser. Pure.
import type { ChartMark, ChartSpec } from './spec';
import { displayText } from '../units/rounding';

export interface ChartSvgOptions {
  /** px (default 720 × 380) */
  width?: number;
  height?: number;
  fontFamily?: string;
}

const DASH = { dashed: '7 4', dotted: '2 3' } as const;

function esc(s: string): string {
  return s.replace(/[&<>"]/g, (c) => `&#${c.charCodeAt(0)};`);
}
const f = (v: number): string => (Math.round(v * 100) / 100).toString();

/**
 * Round tick values covering [lo, hi]: steps of 1, 2 or 5 × 10^k, about `target` of them.
 * @example niceTicks(0, 85, 6) // [0, 20, 40, 60, 80, 100]
 */
export function niceTicks(lo: number, hi: number, target = 6): number[] {
  if (!(Number.isFinite(lo) && Number.isFinite(hi))) throw new RangeError('ticks need finite ends');
  if (hi <= lo) hi = lo + 1;
  const raw = (hi - lo) / target;
  const mag = 10 ** Math.floor(Math.log10(raw));
  const step = ([1, 2, 5, 10].map((m) => m * mag).find((s) => s >= raw) ?? 10 * mag) as number;
  const first = Math.floor(lo / step) * step;
  const ticks: number[] = [];
  // at most target·3 ticks: the step is at least a third of the span over target
  for (let v = first, i = 0; i <= target * 3 && v < hi + step * 0.999; i++, v = first + i * step)
    ticks.push(Number(v.toPrecision(12)));
  return ticks;
}

function tickText(v: number, ticks: number[]): string {
  const step = ticks.length > 1 ? Math.abs((ticks[1] ?? 0) - (ticks[0] ?? 0)) : 1;
  const decimals = Math.max(0, Math.min(4, -Math.floor(Math.log10(step) + 1e-9)));
  return displayText(v, null, 'SI', decimals);
}

/** The chart as one `<svg>` element. */
export function chartToSvg(spec: ChartSpec, opts: ChartSvgOptions = {}): string {
  const W = opts.width ?? 720;
  const H = opts.height ?? 380;
  const font = esc(opts.fontFamily ?? 'Lato, Helvetica, Arial, sans-serif');
  const left = 70,
    right = 24,
    top = 48 + 18 * Math.ceil(spec.series.length / 3),
    bottom = 56;
  const xs = spec.series.flatMap((s) => s.points.map((p) => p[0]));
  const ys = spec.series.flatMap((s) => s.points.map((p) => p[1]));
  for (const m of spec.marks) (m.axis === 'x' ? xs : ys).push(m.at);
  if (!xs.length || !ys.length) throw new RangeError('a chart needs at least one point');
  const xt = niceTicks(Math.min(...xs), Math.max(...xs));
  const yt = niceTicks(spec.yFromZero ? Math.min(0, ...ys) : Math.min(...ys), Math.max(...ys));
  const x0 = xt[0] as number,
    x1 = xt[xt.length - 1] as number,
    y0 = yt[0] as number,
    y1 = yt[yt.length - 1] as number;
  const X = (v: number): number => left + ((v - x0) / (x1 - x0)) * (W - left - right);
  const Y = (v: number): number => H - bottom - ((v - y0) / (y1 - y0)) * (H - top - bottom);
  const T = (x: number, y: number, s: string, size: number, extra = '', fill = '#0f172a'): string =>
    `<text x="${f(x)}" y="${f(y)}" font-family="${font}" font-size="${size}" fill="${fill}"${extra}>${esc(s)}</text>`;
  const out: string[] = [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}">`,
    `<rect x="0" y="0" width="${W}" height="${H}" fill="#ffffff"/>`,
  ];
  // grid and ticks
  for (const v of xt)
    out.push(
      `<line x1="${f(X(v))}" y1="${f(top)}" x2="${f(X(v))}" y2="${f(H - bottom)}" stroke="#e2e8f0" stroke-width="0.8"/>`,
      T(X(v), H - bottom + 16, tickText(v, xt), 11, ' text-anchor="middle"', '#334155'),
    );
  for (const v of yt)
    out.push(
      `<line x1="${f(left)}" y1="${f(Y(v))}" x2="${f(W - right)}" y2="${f(Y(v))}" stroke="#e2e8f0" stroke-width="0.8"/>`,
      T(left - 6, Y(v) + 4, tickText(v, yt), 11, ' text-anchor="end"', '#334155'),
    );
  out.push(
    `<rect x="${f(left)}" y="${f(top)}" width="${f(W - left - right)}" height="${f(H - top - bottom)}" fill="none" stroke="#64748b" stroke-width="1"/>`,
    T((left + W - right) / 2, H - 14, spec.xTitle, 12, ' text-anchor="middle"'),
    T(
      16,
      (top + H - bottom) / 2,
      spec.yTitle,
      12,
      ` text-anchor="middle" transform="rotate(-90 16 ${f((top + H - bottom) / 2)})"`,
    ),
  );
  // reference lines, labelled inside the plot at their far end
  const markLine = (m: ChartMark, i: number): string[] => {
    const dash = m.dash ? ` stroke-dasharray="${DASH[m.dash]}"` : '';
    if (m.axis === 'y') {
      const y = Y(m.at);
      return [
        `<line x1="${f(left)}" y1="${f(y)}" x2="${f(W - right)}" y2="${f(y)}" stroke="${m.color}" stroke-width="1.2"${dash}/>`,
        m.labelAtStart
          ? T(left + 4, y - 3, m.label, 10.5, '', m.color)
          : T(W - right - 4, y - 3, m.label, 10.5, ' text-anchor="end"', m.color),
      ];
    }
    const x = X(m.at);
    return [
      `<line x1="${f(x)}" y1="${f(top)}" x2="${f(x)}" y2="${f(H - bottom)}" stroke="${m.color}" stroke-width="1"${dash}/>`,
      T(x + 3, top + 12 + 12 * (i % 2), m.label, 10.5, '', m.color),
    ];
  };
  spec.marks.forEach((m, i) => out.push(...markLine(m, i)));
  // series
  for (const s of spec.series) {
    if (!s.points.length) continue;
    const d = s.points.map((p, i) => `${i ? 'L' : 'M'}${f(X(p[0]))} ${f(Y(p[1]))}`).join(' ');
    const dash = s.dash ? ` stroke-dasharray="${DASH[s.dash]}"` : '';
    out.push(`<path d="${d}" fill="none" stroke="${s.color}" stroke-width="${s.width}"${dash}/>`);
    if (s.markers)
      for (const p of s.points)
        out.push(`<circle cx="${f(X(p[0]))}" cy="${f(Y(p[1]))}" r="2.6" fill="${s.color}"/>`);
  }
  out.push(T(left, 16, spec.title, 13, ' font-weight="bold"'));
  // legend: up to three entries a line above the plot
  spec.series.forEach((s, i) => {
    const lx = left + (i % 3) * ((W - left - right) / 3);
    const ly = 38 + 18 * Math.floor(i / 3);
    const dash = s.dash ? ` stroke-dasharray="${DASH[s.dash]}"` : '';
    out.push(
      `<line x1="${f(lx)}" y1="${f(ly - 4)}" x2="${f(lx + 24)}" y2="${f(ly - 4)}" stroke="${s.color}" stroke-width="${Math.max(1.5, s.width)}"${dash}/>`,
      T(lx + 30, ly, s.name, 11),
    );
  });
  out.push('</svg>');
  return out.join('');
}

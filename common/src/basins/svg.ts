// One renderer for the web app and the proposal PDF: drawing data (metres) → SVG text. Pure;
// inline attributes only (no CSS) so PDF converters draw it the same.
import type { Drawing, DrawingItem, DrawingQuantity, DrawingView, LabelPart, LineStyle, FillStyle, Pt } from './drawing';

export type DrawingFormatter = (value: number, quantity: DrawingQuantity) => string;

export interface SvgOptions {
  /** numbers in labels and dimensions: e.g. metres with 2 decimals, or feet for US users */
  format?: DrawingFormatter;
  /** total width in px (default 960) */
  width?: number;
  fontFamily?: string;
  /** line colour of concrete (default the product's deep teal) */
  accent?: string;
}

/** Default formatter: SI, lengths and elevations to 2 decimals. */
export const formatSI: DrawingFormatter = (value, quantity) => {
  switch (quantity) {
    case 'count':
      return String(Math.round(value));
    case 'discharge':
      return `${value.toFixed(1)} m³/s`;
    case 'elevation':
      return `${value.toFixed(2)} m`;
    default:
      return `${value.toFixed(2)} m`;
  }
};

const STROKE: Record<LineStyle, { stroke: string; width: number; dash?: string }> = {
  concrete: { stroke: '#0f6e6e', width: 1.4 },
  hidden: { stroke: '#475569', width: 0.9, dash: '6 4' },
  water: { stroke: '#1d6fb8', width: 1.2 },
  ground: { stroke: '#6b4f2a', width: 1.2, dash: '10 3 2 3' },
  riprap: { stroke: '#6b7280', width: 0.9 },
  centre: { stroke: '#94a3b8', width: 0.7, dash: '14 4 3 4' },
  thin: { stroke: '#64748b', width: 0.6 },
};
const FILL: Record<FillStyle, string> = {
  concrete: '#d7e7e7',
  water: '#d6e8f7',
  riprap: '#e5e7eb',
  ground: '#efe6d8',
  none: 'none',
};

function esc(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}
const f = (x: number): string => (Math.round(x * 100) / 100).toString();

function text(parts: readonly LabelPart[], format: DrawingFormatter): string {
  return parts.map((p) => (typeof p === 'string' ? p : format(p.value, p.quantity))).join('');
}

/**
 * Renders a drawing as an SVG document: the views stacked, one scale for all (so plan and
 * section line up along the flow), a scale bar, dimension lines with arrowheads and values,
 * labels through the caller's formatter. Coordinates in the drawing are metres, y up.
 * @example drawingToSvg(buildBasinDrawing(design), { format: formatSI })
 */
export function drawingToSvg(drawing: Drawing, opts: SvgOptions = {}): string {
  if (!drawing || !Array.isArray(drawing.views) || drawing.views.length === 0) throw new RangeError('drawing must hold at least one view');
  const format = opts.format ?? formatSI;
  const width = opts.width ?? 960;
  if (!(Number.isFinite(width) && width > 100)) throw new RangeError(`width must be more than 100 px (got ${width})`);
  const font = opts.fontFamily ?? 'Lato, Helvetica, Arial, sans-serif';
  const margin = 24;
  const titleH = 22;
  const spanX = Math.max(...drawing.views.map((v) => v.bounds.maxX)) - Math.min(...drawing.views.map((v) => v.bounds.minX));
  const minX = Math.min(...drawing.views.map((v) => v.bounds.minX));
  const scale = (width - 2 * margin) / spanX; // px per metre, the same for every view
  let y = margin + 18;
  const out: string[] = [];
  out.push(`<text x="${margin}" y="${margin}" font-family="${esc(font)}" font-size="14" font-weight="bold" fill="#0f172a">${esc(drawing.title)}</text>`);
  for (const view of drawing.views) {
    const h = (view.bounds.maxY - view.bounds.minY) * scale;
    out.push(`<text x="${margin}" y="${f(y + 14)}" font-family="${esc(font)}" font-size="12" font-weight="bold" fill="#334155">${esc(view.title)}</text>`);
    const top = y + titleH;
    const X = (x: number): number => margin + (x - minX) * scale;
    const Y = (yy: number): number => top + (view.bounds.maxY - yy) * scale;
    out.push(`<g data-view="${view.id}">`);
    for (const it of order(view.items)) out.push(item(it, X, Y, format, font));
    out.push('</g>');
    y = top + h + 16;
  }
  // Scale bar: a round length near a fifth of the width.
  const target = spanX / 5;
  const pow = Math.pow(10, Math.floor(Math.log10(target)));
  const bar = [1, 2, 5, 10].map((k) => k * pow).reduce((a, b) => (Math.abs(b - target) < Math.abs(a - target) ? b : a));
  const bx = margin, by = y + 8, bw = bar * scale;
  out.push(`<g data-role="scale-bar"><rect x="${f(bx)}" y="${f(by)}" width="${f(bw / 2)}" height="5" fill="#0f172a"/><rect x="${f(bx + bw / 2)}" y="${f(by)}" width="${f(bw / 2)}" height="5" fill="none" stroke="#0f172a" stroke-width="0.8"/>`);
  out.push(`<text x="${f(bx)}" y="${f(by + 18)}" font-family="${esc(font)}" font-size="10" fill="#0f172a">0</text><text x="${f(bx + bw)}" y="${f(by + 18)}" font-family="${esc(font)}" font-size="10" text-anchor="middle" fill="#0f172a">${esc(format(bar, 'length'))}</text></g>`);
  let ny = by + 34;
  for (const n of drawing.notes) {
    out.push(`<text x="${margin}" y="${f(ny)}" font-family="${esc(font)}" font-size="10" fill="#475569">${esc(n)}</text>`);
    ny += 14;
  }
  const height = Math.ceil(ny + margin);
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${Math.round(width)}" height="${height}" viewBox="0 0 ${Math.round(width)} ${height}" data-scale-px-per-m="${f(scale)}"><rect x="0" y="0" width="${Math.round(width)}" height="${height}" fill="#ffffff"/>${out.join('')}</svg>`;
}

/** Fills first, then outlines, then dimensions and text on top. */
function order(items: readonly DrawingItem[]): DrawingItem[] {
  const rank = (it: DrawingItem): number => (it.kind === 'polyline' ? (it.style === 'riprap' ? 0 : it.style === 'concrete' ? 2 : 1) : it.kind === 'dimension' ? 3 : 4);
  return [...items].sort((a, b) => rank(a) - rank(b));
}

function head(tip: Pt, from: Pt, size: number): string {
  const dx = tip.x - from.x, dy = tip.y - from.y, len = Math.hypot(dx, dy) || 1;
  const ux = dx / len, uy = dy / len;
  const bx = tip.x - ux * size, by = tip.y - uy * size;
  return `${f(tip.x)},${f(tip.y)} ${f(bx - uy * size * 0.35)},${f(by + ux * size * 0.35)} ${f(bx + uy * size * 0.35)},${f(by - ux * size * 0.35)}`;
}

function item(it: DrawingItem, X: (x: number) => number, Y: (y: number) => number, format: DrawingFormatter, font: string): string {
  switch (it.kind) {
    case 'polyline': {
      const s = STROKE[it.style];
      const pts = it.points.map((p) => `${f(X(p.x))},${f(Y(p.y))}`).join(' ');
      const dash = s.dash ? ` stroke-dasharray="${s.dash}"` : '';
      const tag = it.closed ? 'polygon' : 'polyline';
      return `<${tag} data-role="${esc(it.role)}" points="${pts}" fill="${it.closed ? FILL[it.fill] : 'none'}" stroke="${s.stroke}" stroke-width="${s.width}"${dash} stroke-linejoin="round"/>`;
    }
    case 'dimension': {
      const a = { x: X(it.from.x), y: Y(it.from.y) }, b = { x: X(it.to.x), y: Y(it.to.y) };
      const dx = it.to.x - it.from.x, dy = it.to.y - it.from.y, len = Math.hypot(dx, dy) || 1;
      // offset to the left of from→to, in metres, converted through the same transform
      const ox = (-dy / len) * it.offset, oy = (dx / len) * it.offset;
      const a2 = { x: X(it.from.x + ox), y: Y(it.from.y + oy) }, b2 = { x: X(it.to.x + ox), y: Y(it.to.y + oy) };
      const mx = (a2.x + b2.x) / 2, my = (a2.y + b2.y) / 2;
      let ang = (Math.atan2(b2.y - a2.y, b2.x - a2.x) * 180) / Math.PI;
      if (ang > 90) ang -= 180;
      if (ang < -90) ang += 180;
      const label = esc(format(it.value, it.quantity));
      return (
        `<g data-role="dim-${esc(it.role)}" data-value="${it.value}">` +
        `<line x1="${f(a.x)}" y1="${f(a.y)}" x2="${f(a2.x)}" y2="${f(a2.y)}" stroke="#64748b" stroke-width="0.5"/>` +
        `<line x1="${f(b.x)}" y1="${f(b.y)}" x2="${f(b2.x)}" y2="${f(b2.y)}" stroke="#64748b" stroke-width="0.5"/>` +
        `<line x1="${f(a2.x)}" y1="${f(a2.y)}" x2="${f(b2.x)}" y2="${f(b2.y)}" stroke="#334155" stroke-width="0.7"/>` +
        `<polygon points="${head(a2, b2, 6)}" fill="#334155"/><polygon points="${head(b2, a2, 6)}" fill="#334155"/>` +
        `<text x="${f(mx)}" y="${f(my - 3)}" transform="rotate(${f(ang)} ${f(mx)} ${f(my)})" font-family="${esc(font)}" font-size="10" text-anchor="middle" fill="#0f172a">${label}</text></g>`
      );
    }
    case 'label': {
      const size = it.size === 'normal' ? 11 : 9.5;
      return `<text data-role="${esc(it.role)}" x="${f(X(it.at.x))}" y="${f(Y(it.at.y))}" font-family="${esc(font)}" font-size="${size}" text-anchor="${it.anchor}" fill="#0f172a">${esc(text(it.parts, format))}</text>`;
    }
    case 'arrow': {
      const a = { x: X(it.from.x), y: Y(it.from.y) }, b = { x: X(it.to.x), y: Y(it.to.y) };
      return (
        `<g data-role="arrow-${it.role}"><line x1="${f(a.x)}" y1="${f(a.y)}" x2="${f(b.x)}" y2="${f(b.y)}" stroke="#0f172a" stroke-width="1.2"/>` +
        `<polygon points="${head(b, a, 9)}" fill="#0f172a"/>` +
        `<text x="${f(it.role === 'north' ? b.x : (a.x + b.x) / 2)}" y="${f((it.role === 'north' ? b.y : (a.y + b.y) / 2) - 6)}" font-family="${esc(font)}" font-size="10" text-anchor="middle" fill="#0f172a">${esc(it.text)}</text></g>`
      );
    }
  }
}

/** For callers that need the view by id. */
export function drawingView(d: Drawing, id: DrawingView['id']): DrawingView {
  const v = d.views.find((x) => x.id === id);
  if (!v) throw new RangeError(`drawing has no ${id} view`);
  return v;
}

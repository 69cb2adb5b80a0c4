// One renderer for the web app and the proposal PDF: drawing data (metres) → SVG text. Pure;
// inline attributes only (no CSS) so PDF converters draw it the same.
// Text is laid out in pixels after the scale is known: a label's size does not shrink with the
// drawing, so placement that was fixed in metres collided on small basins. The layout below is
// greedy: dimensions first (stacked outwards until their values are clear), then labels, each
// moved to the nearest free spot and tied back to its feature by a leader when moved far.
import type {
  Drawing,
  DrawingItem,
  DrawingQuantity,
  DrawingView,
  DimensionItem,
  LabelItem,
  LabelPart,
  LineStyle,
  FillStyle,
  Pt,
} from './geometry';

export type DrawingFormatter = (value: number, quantity: DrawingQuantity) => string;

/** The unit the scale bar is drawn in: its name and its length in metres. */
export interface ScaleUnit {
  label: string;
  metres: number;
}

export interface SvgOptions {
  /** numbers in labels and dimensions: e.g. metres with 2 decimals, or feet for US users */
  format?: DrawingFormatter;
  /** total width in px (default 960); text sizes are in px at this width */
  width?: number;
  fontFamily?: string;
  /** line colour of concrete (default the product's deep teal) */
  accent?: string;
  /** unit of the scale bar (default metres); a US drawing passes { label: 'ft', metres: 0.3048 } */
  scaleUnit?: ScaleUnit;
  /**
   * how a label's white halo goes under its text: one element painted stroke first
   * (paint-order, as browsers draw it; the default), or the outline as an element of its own
   * under the text, for renderers that ignore paint-order (pdfmake's, in the proposal PDF)
   */
  halo?: 'paint-order' | 'underlay';
}

/** Default formatter: SI, lengths and elevations to 2 decimals. */
export const formatSI: DrawingFormatter = (value, quantity) => {
  switch (quantity) {
    case 'count':
      return String(Math.round(value));
    case 'discharge':
      return `${value.toFixed(1)} m³/s`;
    default: // lengths and elevations
      return `${value.toFixed(2)} m`;
  }
};

/** Font sizes in px at the rendered width. 11 px is the smallest text kept on the sheet. */
export const DRAWING_FONT = {
  title: 15,
  view: 12.5,
  label: 11,
  labelNormal: 12,
  dimension: 11,
  note: 10.5,
} as const;

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
  return s
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;');
}
const f = (x: number): string => (Math.round(x * 100) / 100).toString();

function text(parts: readonly LabelPart[], format: DrawingFormatter): string {
  return parts.map((p) => (typeof p === 'string' ? p : format(p.value, p.quantity))).join('');
}

/**
 * Width of a line of text in px, estimated from per-character widths of a humanist sans
 * (Lato, with Helvetica/Arial as fallbacks, which run slightly wider — the table follows them
 * so the estimate errs on the wide side). The layout and its tests use this one estimate.
 */
export function estimateTextWidth(s: string, fontSize: number): number {
  let em = 0;
  for (const ch of s) {
    if (" .,:;'!|ilIjft()[]1".includes(ch)) em += 0.3;
    else if ('mwMW—'.includes(ch)) em += 0.86;
    else if (ch >= 'A' && ch <= 'Z') em += 0.68;
    else if ((ch >= '0' && ch <= '9') || ch === '=' || ch === '+' || ch === '−' || ch === '-')
      em += 0.57;
    else if (ch === '³' || ch === '²') em += 0.36;
    else em += 0.54;
  }
  return em * fontSize;
}

/** An axis-aligned box in px, y down. */
export interface Box {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

/** Box of a line of text whose baseline starts (start), centres (middle) or ends (end) at x, y. */
export function textBox(
  s: string,
  size: number,
  x: number,
  y: number,
  anchor: 'start' | 'middle' | 'end',
): Box {
  const w = estimateTextWidth(s, size);
  const x0 = anchor === 'start' ? x : anchor === 'middle' ? x - w / 2 : x - w;
  return { x0, y0: y - 0.78 * size, x1: x0 + w, y1: y + 0.24 * size };
}

export function boxesOverlap(a: Box, b: Box, gap = 0): boolean {
  return a.x0 < b.x1 + gap && b.x0 < a.x1 + gap && a.y0 < b.y1 + gap && b.y0 < a.y1 + gap;
}

/** True when any part of the segment p→q lies inside the box. */
export function segmentHitsBox(p: Pt, q: Pt, b: Box): boolean {
  // Both ends on one outer side of the box: no part of it can be inside (the common case while
  // labels look for a place, so it is answered first, without the clipping below).
  if ((p.x < b.x0 && q.x < b.x0) || (p.x > b.x1 && q.x > b.x1)) return false;
  if ((p.y < b.y0 && q.y < b.y0) || (p.y > b.y1 && q.y > b.y1)) return false;
  // Liang–Barsky clipping: does any part of p→q lie inside b?
  const dx = q.x - p.x,
    dy = q.y - p.y;
  let t0 = 0,
    t1 = 1;
  const clip = (pp: number, qq: number): boolean => {
    if (pp === 0) return qq >= 0;
    const r = qq / pp;
    if (pp < 0) {
      if (r > t1) return false;
      if (r > t0) t0 = r;
    } else {
      if (r < t0) return false;
      if (r < t1) t1 = r;
    }
    return true;
  };
  return (
    clip(-dx, p.x - b.x0) && clip(dx, b.x1 - p.x) && clip(-dy, p.y - b.y0) && clip(dy, b.y1 - p.y)
  );
}

/** A label as placed: its text, baseline point, anchor, box and (when moved) leader. */
export interface PlacedLabel {
  role: string;
  text: string;
  size: number;
  x: number;
  y: number;
  anchor: 'start' | 'middle' | 'end';
  box: Box;
  leader?: { from: Pt; to: Pt };
}

/** A dimension as placed: witness ends, dimension line, its text and where the text sits. */
export interface PlacedDimension {
  role: string;
  value: number;
  text: string;
  a: Pt;
  b: Pt;
  a2: Pt;
  b2: Pt;
  textAt: Pt;
  angle: number;
  box: Box;
  /** the dimension line carried on to a value set beyond its end */
  tail?: { from: Pt; to: Pt };
}

/** Every line a placed dimension draws: its two witness lines, the dimension line, its tail. */
export function dimensionSegments(d: PlacedDimension): [Pt, Pt][] {
  const out: [Pt, Pt][] = [
    [d.a, d.a2],
    [d.b, d.b2],
    [d.a2, d.b2],
  ];
  if (d.tail) out.push([d.tail.from, d.tail.to]);
  return out;
}

export interface ViewLayout {
  view: DrawingView;
  labels: PlacedLabel[];
  dimensions: PlacedDimension[];
  /** text boxes of arrows (flow, north) */
  arrowBoxes: Box[];
  /** extent of everything drawn, px in the view's own frame */
  extent: Box;
}

type Seg = [Pt, Pt, boolean?];

function rotatedTextBox(s: string, size: number, at: Pt, angleDeg: number): Box {
  // Text centred on `at` horizontally, baseline at `at`, then rotated about `at`.
  const w = estimateTextWidth(s, size);
  const corners: Pt[] = [
    { x: -w / 2, y: -0.78 * size },
    { x: w / 2, y: -0.78 * size },
    { x: w / 2, y: 0.24 * size },
    { x: -w / 2, y: 0.24 * size },
  ];
  const a = (angleDeg * Math.PI) / 180,
    c = Math.cos(a),
    sn = Math.sin(a);
  const pts = corners.map((p) => ({ x: at.x + p.x * c - p.y * sn, y: at.y + p.x * sn + p.y * c }));
  return {
    x0: Math.min(...pts.map((p) => p.x)),
    y0: Math.min(...pts.map((p) => p.y)),
    x1: Math.max(...pts.map((p) => p.x)),
    y1: Math.max(...pts.map((p) => p.y)),
  };
}

function grow(e: Box, b: Box): void {
  e.x0 = Math.min(e.x0, b.x0);
  e.y0 = Math.min(e.y0, b.y0);
  e.x1 = Math.max(e.x1, b.x1);
  e.y1 = Math.max(e.y1, b.y1);
}

/**
 * Places the dimensions and labels of one view at `scale` px per metre, in the view's own
 * frame (x = (x − minX)·scale, y = (maxY − y)·scale). Greedy: each text takes the cheapest
 * free spot near its feature; no two text boxes overlap.
 */
export function layoutView(
  view: DrawingView,
  minX: number,
  scale: number,
  format: DrawingFormatter,
): ViewLayout {
  const X = (x: number): number => (x - minX) * scale;
  const Y = (y: number): number => (view.bounds.maxY - y) * scale;
  const PX = (p: Pt): Pt => ({ x: X(p.x), y: Y(p.y) });
  const taken: Box[] = [];
  const lines: Seg[] = []; // geometry a text should not sit on
  const dimLines: Seg[] = [];
  const extent: Box = { x0: Infinity, y0: Infinity, x1: -Infinity, y1: -Infinity };
  for (const it of view.items) {
    if (it.kind === 'polyline') {
      const pts = it.points.map(PX);
      pts.forEach((p) => grow(extent, { x0: p.x, y0: p.y, x1: p.x, y1: p.y }));
      const n = it.closed ? pts.length : pts.length - 1;
      for (let i = 0; i < n; i++)
        lines.push([pts[i]!, pts[(i + 1) % pts.length]!, it.style === 'concrete']);
    } else if (it.kind === 'arrow') {
      const a = PX(it.from),
        b = PX(it.to);
      lines.push([a, b]);
      grow(extent, {
        x0: Math.min(a.x, b.x),
        y0: Math.min(a.y, b.y),
        x1: Math.max(a.x, b.x),
        y1: Math.max(a.y, b.y),
      });
    }
  }
  const arrowBoxes: Box[] = [];
  for (const it of view.items) {
    if (it.kind !== 'arrow') continue;
    const a = PX(it.from),
      b = PX(it.to);
    const at = it.role === 'north' ? b : { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 };
    const bx = textBox(it.text, DRAWING_FONT.label, at.x, Math.min(a.y, b.y, at.y) - 6, 'middle');
    arrowBoxes.push(bx);
    taken.push(bx);
    grow(extent, bx);
  }

  // Dimensions: each placed clear of the others; one whose value a later dimension's lines
  // run through is placed again with every other one in view, until none conflicts.
  const dimItems = view.items.filter((it): it is DimensionItem => it.kind === 'dimension');
  const placed: (PlacedDimension | null)[] = dimItems.map(() => null);
  const conflicts = (i: number): boolean => {
    const d = placed[i];
    if (!d) return true;
    const mine = dimensionSegments(d);
    return placed.some(
      (o, j) =>
        j !== i &&
        o !== null &&
        (boxesOverlap(o.box, d.box, 1) ||
          dimensionSegments(o).some(([p, q]) => segmentHitsBox(p, q, d.box)) ||
          mine.some(([p, q]) => segmentHitsBox(p, q, o.box))),
    );
  };
  for (let pass = 0; pass < 4; pass++) {
    let moved = false;
    for (const [i, it] of dimItems.entries()) {
      if (pass > 0 && !conflicts(i)) continue;
      const others = placed.filter((o, j): o is PlacedDimension => j !== i && o !== null);
      placed[i] = placeDimension(
        it,
        PX,
        scale,
        format,
        [...taken, ...others.map((o) => o.box)],
        lines,
        others.flatMap(dimensionSegments),
      );
      moved = true;
    }
    if (!moved) break;
  }
  const dimensions = placed.filter((d): d is PlacedDimension => d !== null);
  for (const d of dimensions) {
    taken.push(d.box);
    dimLines.push(...dimensionSegments(d));
    grow(extent, d.box);
    for (const p of [d.a2, d.b2]) grow(extent, { x0: p.x, y0: p.y, x1: p.x, y1: p.y });
  }

  const labels: PlacedLabel[] = [];
  const labelItems = view.items.filter((it): it is LabelItem => it.kind === 'label');
  for (const [k, it] of labelItems.entries()) {
    // The points the labels still to come may need a leader to (their feature): text placed
    // on one would leave that label only a leader through it.
    const reserved = labelItems.slice(k + 1).map((o) => PX(o.target ?? o.at));
    const pl = placeLabel(it, PX, format, taken, lines, dimLines, reserved, {
      x0: X(view.bounds.minX),
      y0: 0,
      x1: X(view.bounds.maxX),
      y1: Y(view.bounds.minY),
    });
    labels.push(pl);
    taken.push(pl.box);
    if (pl.leader) dimLines.push([pl.leader.from, pl.leader.to]);
    grow(extent, pl.box);
  }
  return { view, labels, dimensions, arrowBoxes, extent };
}

/** The part of the dimension line carried on to a value set beyond its end (none when inside). */
function tailTo(a2: Pt, b2: Pt, box: Box): { from: Pt; to: Pt } | undefined {
  const lenPx = Math.hypot(b2.x - a2.x, b2.y - a2.y);
  const c = { x: (box.x0 + box.x1) / 2, y: (box.y0 + box.y1) / 2 };
  const mid = { x: (a2.x + b2.x) / 2, y: (a2.y + b2.y) / 2 };
  if (Math.hypot(c.x - mid.x, c.y - mid.y) <= lenPx / 2 + 2) return undefined;
  const near = Math.hypot(c.x - a2.x, c.y - a2.y) < Math.hypot(c.x - b2.x, c.y - b2.y) ? a2 : b2;
  const ux = (b2.x - a2.x) / (lenPx || 1),
    uy = (b2.y - a2.y) / (lenPx || 1);
  const t = (c.x - near.x) * ux + (c.y - near.y) * uy;
  // stop short of the text's own box so the line reaches it without running through it
  const stop =
    t - Math.sign(t) * ((box.x1 - box.x0) * Math.abs(ux) + (box.y1 - box.y0) * Math.abs(uy)) * 0.5;
  return { from: near, to: { x: near.x + ux * stop, y: near.y + uy * stop } };
}

/**
 * Places a dimension: its line offset from the feature (outwards in steps until clear) and its
 * value on the line or beyond an end. A spot is taken only when the value's box touches no
 * other text and no other dimension's line, and the dimension's own lines cross no text.
 */
function placeDimension(
  it: DimensionItem,
  PX: (p: Pt) => Pt,
  scale: number,
  format: DrawingFormatter,
  taken: Box[],
  lines: Seg[],
  dimLines: Seg[],
): PlacedDimension {
  const size = DRAWING_FONT.dimension;
  const a = PX(it.from),
    b = PX(it.to);
  const dx = it.to.x - it.from.x,
    dy = it.to.y - it.from.y,
    len = Math.hypot(dx, dy) || 1;
  // unit normal to the left of from→to in drawing axes (y up), turned into px (y down)
  const n = { x: -dy / len, y: -(dx / len) };
  const side = it.offset < 0 ? -1 : 1;
  const label = format(it.value, it.quantity);
  const w = estimateTextWidth(label, size);
  let best: PlacedDimension | null = null;
  let bestCost = Infinity;
  const clear = (d: PlacedDimension): boolean =>
    !taken.some((t) => boxesOverlap(t, d.box, 1)) &&
    !dimLines.some(([p, q]) => segmentHitsBox(p, q, d.box)) &&
    !dimensionSegments(d).some(([p, q]) => taken.some((t) => segmentHitsBox(p, q, t)));
  const build = (off: number, spot: (mid: Pt, ux: number, uy: number, lenPx: number) => Pt) => {
    const a2 = { x: a.x + n.x * off, y: a.y + n.y * off },
      b2 = { x: b.x + n.x * off, y: b.y + n.y * off };
    let ang = (Math.atan2(b2.y - a2.y, b2.x - a2.x) * 180) / Math.PI;
    if (ang > 90) ang -= 180;
    if (ang < -90) ang += 180;
    const lenPx = Math.hypot(b2.x - a2.x, b2.y - a2.y);
    const ux = (b2.x - a2.x) / (lenPx || 1),
      uy = (b2.y - a2.y) / (lenPx || 1);
    const mid = { x: (a2.x + b2.x) / 2, y: (a2.y + b2.y) / 2 };
    // text sits on the reading side of the line ("above" it once rotated upright)
    const r = (ang * Math.PI) / 180;
    const s = spot(mid, ux, uy, lenPx);
    const at = { x: s.x + Math.sin(r) * 3, y: s.y - Math.cos(r) * 3 };
    const box = rotatedTextBox(label, size, at, ang);
    const d: PlacedDimension = {
      role: it.role,
      value: it.value,
      text: label,
      a,
      b,
      a2,
      b2,
      textAt: at,
      angle: ang,
      box,
    };
    const tail = tailTo(a2, b2, box);
    if (tail) d.tail = tail;
    return d;
  };
  // The metre offset is kept when it is clear enough; never closer than the text needs.
  // An offset of 0 is a dimension drawn where it stands (e.g. a width across the open basin).
  const base = it.offset === 0 ? 0 : Math.max(Math.abs(it.offset) * scale, size + 10);
  // the side asked for first; the other side when every spot on it is crowded
  for (let k2 = 0; k2 < 28; k2++) {
    const step = k2 % 14;
    const flip = k2 >= 14 ? -1 : 1;
    if (flip < 0 && best) break;
    const off = flip * side * (base + step * (size + 4));
    const spots: ((mid: Pt, ux: number, uy: number, lenPx: number) => Pt)[] = [
      (mid, _ux, _uy, lenPx) => (w + 14 < lenPx ? mid : { x: NaN, y: NaN }),
      // too short for its value (or crowded): the value goes beyond either end, as drafters do
      (mid, ux, uy, lenPx) => {
        const along = lenPx / 2 + w / 2 + 10;
        return { x: mid.x + ux * along, y: mid.y + uy * along };
      },
      (mid, ux, uy, lenPx) => {
        const along = lenPx / 2 + w / 2 + 10;
        return { x: mid.x - ux * along, y: mid.y - uy * along };
      },
    ];
    for (const [k, spot] of spots.entries()) {
      const d = build(off, spot);
      if (!Number.isFinite(d.textAt.x) || !clear(d)) continue;
      const crossings = lines.filter(([p, q]) => segmentHitsBox(p, q, d.box)).length;
      const cost = step * 10 + k * 22 + crossings * 12 + (flip < 0 ? 60 : 0);
      if (cost < bestCost) {
        bestCost = cost;
        best = d;
      }
    }
    if (best && bestCost < (step + 1) * 10 + (flip < 0 ? 60 : 0)) break;
  }
  if (best) return best;
  // every spot tried is crowded: push the dimension out past everything already placed
  const along = (p: Pt): number => ((p.x - a.x) * n.x + (p.y - a.y) * n.y) * side;
  const corners = (t: Box): Pt[] => [
    { x: t.x0, y: t.y0 },
    { x: t.x1, y: t.y0 },
    { x: t.x0, y: t.y1 },
    { x: t.x1, y: t.y1 },
  ];
  let far = Math.max(
    0,
    ...taken.flatMap(corners).map(along),
    ...dimLines.flatMap(([p, q]) => [along(p), along(q)]),
  );
  let out = build(side * (far + 2 * size), (mid) => mid);
  for (let i = 0; i < 20 && !clear(out); i++) {
    far += size + 4;
    out = build(side * (far + 2 * size), (mid) => mid);
  }
  return out;
}

function placeLabel(
  it: LabelItem,
  PX: (p: Pt) => Pt,
  format: DrawingFormatter,
  taken: Box[],
  lines: Seg[],
  dimLines: Seg[],
  reserved: Pt[],
  frame: Box,
): PlacedLabel {
  const size = it.size === 'normal' ? DRAWING_FONT.labelNormal : DRAWING_FONT.label;
  const s = text(it.parts, format);
  const w = estimateTextWidth(s, size);
  const h = 1.02 * size;
  const A = PX(it.at);
  const gap = 4;
  const place = it.place ?? 'above';
  // natural box (top-left corner) on the preferred side of the feature point; a label with a
  // leader may also hang the other way from its point when that side is clearer
  const anchors: LabelItem['anchor'][] = it.target
    ? [it.anchor, ...(['start', 'end', 'middle'] as const).filter((a) => a !== it.anchor)]
    : [it.anchor];
  const natural = (anchor: LabelItem['anchor']): Pt => {
    const ax = anchor === 'start' ? A.x : anchor === 'middle' ? A.x - w / 2 : A.x - w;
    if (place === 'below') return { x: ax, y: A.y + gap };
    if (place === 'on') return { x: ax, y: A.y - h / 2 };
    if (place === 'left') return { x: A.x - gap - w, y: A.y - h / 2 };
    if (place === 'right') return { x: A.x + gap, y: A.y - h / 2 };
    return { x: ax, y: A.y - gap - h };
  };
  const dirY = place === 'below' ? 1 : place === 'above' ? -1 : 0;
  // The leader a box would need: to the named feature, or back to the point when moved far.
  const leaderFor = (box: Box, n: Pt): { from: Pt; to: Pt } | undefined => {
    const moved = Math.hypot(box.x0 - n.x, box.y0 - n.y);
    const target = it.target ? PX(it.target) : moved > h * 1.2 ? A : null;
    if (
      !target ||
      (target.x >= box.x0 - 2 &&
        target.x <= box.x1 + 2 &&
        target.y >= box.y0 - 2 &&
        target.y <= box.y1 + 2)
    )
      return undefined;
    const from = {
      x: Math.min(Math.max(target.x, box.x0), box.x1),
      y: target.y < box.y0 ? box.y0 : target.y > box.y1 ? box.y1 : (box.y0 + box.y1) / 2,
    };
    return { from, to: target };
  };
  type Pick = {
    box: Box;
    cost: number;
    anchor: LabelItem['anchor'];
    leader?: { from: Pt; to: Pt };
  };
  let best: Pick | null = null;
  // Rules, in order: no text on text, no text on a dimension's lines or a leader, no leader
  // through text (all three absolute); then the cheapest of: near its feature, on the side
  // asked for, off the outlines, within the geometry's width.
  for (let ring = 0; ring < 40 && !(best && best.cost < ring * h); ring++) {
    const cands: Pt[] = [];
    for (let i = -ring; i <= ring; i++) {
      for (const j of [-ring, ring]) {
        cands.push({ x: i, y: j });
        if (Math.abs(i) !== ring) cands.push({ x: j, y: i });
      }
    }
    if (ring === 0) cands.splice(0, cands.length, { x: 0, y: 0 });
    for (const [ai, anchor] of anchors.entries()) {
      const n = natural(anchor);
      for (const c of cands) {
        // steps: part of the text width sideways, one line height up or down
        const ox = c.x * Math.min(w / 2, 40),
          oy = c.y * (h + 2);
        const box = { x0: n.x + ox, y0: n.y + oy, x1: n.x + ox + w, y1: n.y + oy + h };
        if (taken.some((t) => boxesOverlap(t, box, 1.5))) continue;
        if (dimLines.some(([p, q]) => segmentHitsBox(p, q, box))) continue;
        const leader = leaderFor(box, n);
        // a leader through other text (or grazing it) is a last resort, taken only when
        // nothing else is free
        const leaderThrough = leader
          ? taken.filter((t) => segmentHitsBox(leader.from, leader.to, inflate(t, 0.5))).length
          : 0;
        // text on the point a later label's leader must reach may leave that label only a
        // leader through it: avoided when a place not far off is free
        const onReserved = reserved.filter((r) => inBox(r, inflate(box, 3))).length;
        const hits = lines.reduce(
          (k, [p, q, heavy]) => (segmentHitsBox(p, q, box) ? k + (heavy ? 1.4 : 1) : k),
          0,
        );
        const leaderCrossings = leader ? crossings(leader, dimLines) : 0;
        // moving away from the feature on the preferred side is cheaper than crossing it
        const against = dirY !== 0 && Math.sign(oy) === -dirY ? 1.6 : 1;
        // text past the ends of the geometry would shrink the whole drawing to fit the sheet
        const overflow = Math.max(0, frame.x0 - box.x0) + Math.max(0, box.x1 - frame.x1);
        const cost =
          ai * 12 +
          Math.abs(ox) * 0.4 +
          Math.abs(oy) * against +
          (place === 'on' ? 0.5 : 2.2) * hits * 28 +
          leaderCrossings * 90 +
          leaderThrough * 5000 +
          onReserved * RESERVED_COST +
          overflow * 3;
        if (!best || cost < best.cost) best = { box, cost, anchor, ...(leader ? { leader } : {}) };
      }
    }
  }
  const n0 = natural(it.anchor);
  const pick: Pick = best ?? {
    box: { x0: n0.x, y0: n0.y, x1: n0.x + w, y1: n0.y + h },
    cost: Infinity,
    anchor: it.anchor,
  };
  const { box, anchor } = pick;
  const x = anchor === 'start' ? box.x0 : anchor === 'middle' ? (box.x0 + box.x1) / 2 : box.x1;
  const y = box.y0 + 0.8 * size;
  const out: PlacedLabel = { role: it.role, text: s, size, x, y, anchor, box };
  if (pick.leader) out.leader = pick.leader;
  return out;
}

/** The cost of text over a later label's feature point (in the units of px moved). */
const RESERVED_COST = 300;

function inflate(b: Box, by: number): Box {
  return { x0: b.x0 - by, y0: b.y0 - by, x1: b.x1 + by, y1: b.y1 + by };
}

function inBox(p: Pt, b: Box): boolean {
  return p.x >= b.x0 && p.x <= b.x1 && p.y >= b.y0 && p.y <= b.y1;
}

/** How many of `segs` the segment crosses (proper crossings; touching ends do not count). */
function crossings(l: { from: Pt; to: Pt }, segs: readonly Seg[]): number {
  const cross = (o: Pt, a: Pt, b: Pt): number =>
    (a.x - o.x) * (b.y - o.y) - (a.y - o.y) * (b.x - o.x);
  return segs.filter(([p, q]) => {
    const d1 = cross(p, q, l.from),
      d2 = cross(p, q, l.to),
      d3 = cross(l.from, l.to, p),
      d4 = cross(l.from, l.to, q);
    return d1 * d2 < 0 && d3 * d4 < 0;
  }).length;
}

/** Length of the scale bar: a 1, 2 or 5 × 10ⁿ value near a fifth of `span` (same unit). */
export function scaleBarLength(span: number): number {
  if (!(Number.isFinite(span) && span > 0))
    throw new RangeError(`span must be a positive length (got ${span})`);
  const target = span / 5;
  const pow = Math.pow(10, Math.floor(Math.log10(target)));
  return [1, 2, 5, 10]
    .map((k) => k * pow)
    .reduce((a, b) => (Math.abs(b - target) < Math.abs(a - target) ? b : a));
}

/** Words of `s` broken into lines no wider than `maxWidth` px. */
function wrap(s: string, size: number, maxWidth: number): string[] {
  const out: string[] = [];
  let line = '';
  for (const word of s.split(/\s+/)) {
    const next = line ? `${line} ${word}` : word;
    if (line && estimateTextWidth(next, size) > maxWidth) {
      out.push(line);
      line = word;
    } else line = next;
  }
  if (line) out.push(line);
  return out;
}

/** The whole sheet laid out: scale, each view's layout and where its frame sits on the sheet. */
export interface DrawingLayout {
  scale: number;
  width: number;
  minX: number;
  views: { layout: ViewLayout; dx: number; dy: number; titleY: number }[];
  bottom: number;
}

const MARGIN = 24;

/**
 * Lays out the sheet: one scale for every view (so plan and section line up along the flow),
 * chosen so that the geometry and the text around it fit the width.
 */
export function layoutDrawing(drawing: Drawing, opts: SvgOptions = {}): DrawingLayout {
  if (!drawing || !Array.isArray(drawing.views) || drawing.views.length === 0)
    throw new RangeError('drawing must hold at least one view');
  const format = opts.format ?? formatSI;
  const width = opts.width ?? 960;
  if (!(Number.isFinite(width) && width > 100))
    throw new RangeError(`width must be more than 100 px (got ${width})`);
  const minX = Math.min(...drawing.views.map((v) => v.bounds.minX));
  const spanX = Math.max(...drawing.views.map((v) => v.bounds.maxX)) - minX;
  if (!(spanX > 0)) throw new RangeError('drawing views must have a positive extent');
  const avail = width - 2 * MARGIN;
  let scale = avail / spanX;
  let layouts: ViewLayout[] = [];
  // Text is in px, so what sticks out past the geometry depends on the scale: settle in a few passes.
  for (let pass = 0; pass < 4; pass++) {
    layouts = drawing.views.map((v) => layoutView(v, minX, scale, format));
    const left = Math.min(0, ...layouts.map((l) => l.extent.x0));
    const right = Math.max(spanX * scale, ...layouts.map((l) => l.extent.x1));
    const used = right - left;
    if (used <= avail + 0.5) break;
    scale = Math.max(1e-6, (avail - (used - spanX * scale)) / spanX);
    if (scale * spanX < avail * 0.3) scale = (avail * 0.3) / spanX;
  }
  const left = Math.min(0, ...layouts.map((l) => l.extent.x0));
  let y = MARGIN + 28;
  const views: DrawingLayout['views'] = [];
  for (const l of layouts) {
    const titleY = y + 14;
    const dy = titleY + 12 - Math.min(l.extent.y0, 0);
    views.push({ layout: l, dx: MARGIN - left, dy, titleY });
    y = dy + l.extent.y1 + 18;
  }
  return { scale, width, minX, views, bottom: y };
}

/**
 * Renders a drawing as an SVG document: the views stacked, one scale for all (so plan and
 * section line up along the flow), a scale bar in round units of the user's system, dimension
 * lines with arrowheads and values, labels through the caller's formatter, and a title block
 * with the cautions. Coordinates in the drawing are metres, y up.
 * @example drawingToSvg(buildBasinDrawing(design), { format: formatSI })
 */
export function drawingToSvg(drawing: Drawing, opts: SvgOptions = {}): string {
  const lay = layoutDrawing(drawing, opts);
  const width = lay.width;
  const font = esc(opts.fontFamily ?? 'Lato, Helvetica, Arial, sans-serif');
  const unit = opts.scaleUnit ?? { label: 'm', metres: 1 };
  if (!(Number.isFinite(unit.metres) && unit.metres > 0))
    throw new RangeError(`scaleUnit.metres must be positive (got ${unit.metres})`);
  const out: string[] = [];
  // One fill per text: an attribute written twice makes the file unreadable as XML (PDF, files).
  const T = (x: number, y: number, size: number, s: string, extra = '', fill = '#0f172a'): string =>
    `<text x="${f(x)}" y="${f(y)}" font-family="${font}" font-size="${size}" fill="${fill}"${extra}>${esc(s)}</text>`;
  out.push(T(MARGIN, MARGIN + 8, DRAWING_FONT.title, drawing.title, ' font-weight="bold"'));
  for (const v of lay.views) {
    const l = v.layout;
    const X = (x: number): number => (x - lay.minX) * lay.scale;
    const Y = (yy: number): number => (l.view.bounds.maxY - yy) * lay.scale;
    out.push(
      T(MARGIN, v.titleY, DRAWING_FONT.view, l.view.title, ' font-weight="bold"', '#334155'),
    );
    out.push(`<g data-view="${l.view.id}" transform="translate(${f(v.dx)} ${f(v.dy)})">`);
    for (const it of order(l.view.items)) {
      if (it.kind === 'polyline') out.push(polyline(it, X, Y, opts.accent));
      else if (it.kind === 'arrow') out.push(arrow(it, X, Y, font));
    }
    for (const d of l.dimensions) out.push(dimension(d, font));
    for (const p of l.labels) out.push(labelSvg(p, font, opts.halo ?? 'paint-order'));
    out.push('</g>');
  }
  // Scale bar: a round length in the user's unit, near a fifth of the width.
  const spanUnits = (width - 2 * MARGIN) / lay.scale / unit.metres;
  const bar = scaleBarLength(spanUnits);
  const bw = bar * unit.metres * lay.scale;
  const bx = MARGIN,
    by = lay.bottom + 4;
  const barText = `${Number.isInteger(bar) ? bar : bar.toPrecision(1)} ${unit.label}`;
  out.push(
    `<g data-role="scale-bar" data-length="${bar}" data-unit="${esc(unit.label)}" data-length-px="${f(bw)}">`,
  );
  for (let i = 0; i < 4; i++)
    out.push(
      `<rect x="${f(bx + (i * bw) / 4)}" y="${f(by)}" width="${f(bw / 4)}" height="5" fill="${i % 2 === 0 ? '#0f172a' : '#ffffff'}" stroke="#0f172a" stroke-width="0.8"/>`,
    );
  out.push(
    T(bx, by + 18, DRAWING_FONT.note, '0', ' text-anchor="middle"'),
    T(bx + bw, by + 18, DRAWING_FONT.note, barText, ' text-anchor="middle"'),
    '</g>',
  );
  // Title block: what the sheet is, its units and the cautions, in a frame along the bottom.
  const tbTop = by + 32;
  const innerW = width - 2 * MARGIN - 16;
  const lines: { s: string; size: number; bold?: boolean; colour?: string }[] = [
    { s: drawing.title, size: DRAWING_FONT.labelNormal, bold: true },
    {
      s: `Dimensions and elevations in ${unit.label === 'm' ? 'metres' : unit.label === 'ft' ? 'feet' : unit.label}. Drawn to the scale of the bar; do not scale from a print.`,
      size: DRAWING_FONT.note,
      colour: '#334155',
    },
  ];
  for (const n of drawing.notes)
    for (const s of wrap(n, DRAWING_FONT.note, innerW))
      lines.push({ s, size: DRAWING_FONT.note, colour: '#475569' });
  const caution =
    drawing.caution ??
    'Concept level only; to be reviewed and sealed by a licensed professional engineer and to follow local codes.';
  for (const s of wrap(caution, DRAWING_FONT.note, innerW))
    lines.push({ s, size: DRAWING_FONT.note, bold: true, colour: '#7c2d12' });
  let ty = tbTop + 18;
  const tb: string[] = [];
  for (const ln of lines) {
    tb.push(T(MARGIN + 8, ty, ln.size, ln.s, ln.bold ? ' font-weight="bold"' : '', ln.colour));
    ty += ln.size + 5;
  }
  const tbH = ty - tbTop;
  out.push(
    `<g data-role="title-block"><rect x="${MARGIN}" y="${f(tbTop)}" width="${f(width - 2 * MARGIN)}" height="${f(tbH)}" fill="#f8fafc" stroke="#334155" stroke-width="0.8"/>${tb.join('')}</g>`,
  );
  const height = Math.ceil(tbTop + tbH + MARGIN);
  const W = Math.round(width);
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${height}" viewBox="0 0 ${W} ${height}" data-scale-px-per-m="${f(lay.scale)}"><rect x="0" y="0" width="${W}" height="${height}" fill="#ffffff"/><rect x="6" y="6" width="${W - 12}" height="${height - 12}" fill="none" stroke="#94a3b8" stroke-width="0.8"/>${out.join('')}</svg>`;
}

/** Fills first, then outlines, then dimensions and text on top. */
function order(items: readonly DrawingItem[]): DrawingItem[] {
  const rank = (it: DrawingItem): number =>
    it.kind === 'polyline'
      ? it.style === 'riprap'
        ? 0
        : it.style === 'concrete'
          ? 2
          : 1
      : it.kind === 'dimension'
        ? 3
        : 4;
  return [...items].sort((a, b) => rank(a) - rank(b));
}

function head(tip: Pt, from: Pt, size: number): string {
  const dx = tip.x - from.x,
    dy = tip.y - from.y,
    len = Math.hypot(dx, dy) || 1;
  const ux = dx / len,
    uy = dy / len;
  const bx = tip.x - ux * size,
    by = tip.y - uy * size;
  return `${f(tip.x)},${f(tip.y)} ${f(bx - uy * size * 0.35)},${f(by + ux * size * 0.35)} ${f(bx + uy * size * 0.35)},${f(by - ux * size * 0.35)}`;
}

function polyline(
  it: Extract<DrawingItem, { kind: 'polyline' }>,
  X: (x: number) => number,
  Y: (y: number) => number,
  accent?: string,
): string {
  const s = STROKE[it.style];
  const stroke = it.style === 'concrete' && accent ? accent : s.stroke;
  const pts = it.points.map((p) => `${f(X(p.x))},${f(Y(p.y))}`).join(' ');
  const dash = s.dash ? ` stroke-dasharray="${s.dash}"` : '';
  const tag = it.closed ? 'polygon' : 'polyline';
  return `<${tag} data-role="${esc(it.role)}" points="${pts}" fill="${it.closed ? FILL[it.fill] : 'none'}" stroke="${esc(stroke)}" stroke-width="${s.width}"${dash} stroke-linejoin="round"/>`;
}

function dimension(d: PlacedDimension, font: string): string {
  const lenPx = Math.hypot(d.b2.x - d.a2.x, d.b2.y - d.a2.y);
  // witness lines start a little off the object and run just past the dimension line
  const ext = (p: Pt, q: Pt): string => {
    const L = Math.hypot(q.x - p.x, q.y - p.y) || 1,
      ux = (q.x - p.x) / L,
      uy = (q.y - p.y) / L;
    return `<line x1="${f(p.x + ux * 2)}" y1="${f(p.y + uy * 2)}" x2="${f(q.x + ux * 3)}" y2="${f(q.y + uy * 3)}" stroke="#64748b" stroke-width="0.5"/>`;
  };
  const arrows =
    lenPx > 14
      ? `<polygon points="${head(d.a2, d.b2, 6)}" fill="#334155"/><polygon points="${head(d.b2, d.a2, 6)}" fill="#334155"/>`
      : `<circle cx="${f(d.a2.x)}" cy="${f(d.a2.y)}" r="1.4" fill="#334155"/><circle cx="${f(d.b2.x)}" cy="${f(d.b2.y)}" r="1.4" fill="#334155"/>`;
  // a value set beyond the end gets the dimension line carried on to it
  const tail = d.tail
    ? `<line x1="${f(d.tail.from.x)}" y1="${f(d.tail.from.y)}" x2="${f(d.tail.to.x)}" y2="${f(d.tail.to.y)}" stroke="#334155" stroke-width="0.5"/>`
    : '';
  return (
    `<g data-role="dim-${esc(d.role)}" data-value="${d.value}">` +
    ext(d.a, d.a2) +
    ext(d.b, d.b2) +
    `<line x1="${f(d.a2.x)}" y1="${f(d.a2.y)}" x2="${f(d.b2.x)}" y2="${f(d.b2.y)}" stroke="#334155" stroke-width="0.7"/>` +
    arrows +
    tail +
    `<text x="${f(d.textAt.x)}" y="${f(d.textAt.y)}" transform="rotate(${f(d.angle)} ${f(d.textAt.x)} ${f(d.textAt.y)})" font-family="${font}" font-size="${DRAWING_FONT.dimension}" text-anchor="middle" fill="#0f172a">${esc(d.text)}</text></g>`
  );
}

function labelSvg(p: PlacedLabel, font: string, halo: 'paint-order' | 'underlay'): string {
  const leader = p.leader
    ? `<line x1="${f(p.leader.from.x)}" y1="${f(p.leader.from.y)}" x2="${f(p.leader.to.x)}" y2="${f(p.leader.to.y)}" stroke="#475569" stroke-width="0.6"/><circle cx="${f(p.leader.to.x)}" cy="${f(p.leader.to.y)}" r="1.6" fill="#475569"/>`
    : '';
  // a white halo keeps text readable where it has to sit on a line
  const at = `x="${f(p.x)}" y="${f(p.y)}" font-family="${font}" font-size="${p.size}" text-anchor="${p.anchor}"`;
  const outline = `stroke="#ffffff" stroke-width="3" stroke-linejoin="round"`;
  const body = esc(p.text);
  const text =
    halo === 'underlay'
      ? `<text ${at} fill="none" ${outline}>${body}</text><text data-role="${esc(p.role)}" ${at} fill="#0f172a">${body}</text>`
      : `<text data-role="${esc(p.role)}" ${at} fill="#0f172a" ${outline} paint-order="stroke">${body}</text>`;
  return `<g data-role="label-${esc(p.role)}">${leader}${text}</g>`;
}

function arrow(
  it: Extract<DrawingItem, { kind: 'arrow' }>,
  X: (x: number) => number,
  Y: (y: number) => number,
  font: string,
): string {
  const a = { x: X(it.from.x), y: Y(it.from.y) },
    b = { x: X(it.to.x), y: Y(it.to.y) };
  const at = it.role === 'north' ? b : { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 };
  return (
    `<g data-role="arrow-${it.role}"><line x1="${f(a.x)}" y1="${f(a.y)}" x2="${f(b.x)}" y2="${f(b.y)}" stroke="#0f172a" stroke-width="1.2"/>` +
    `<polygon points="${head(b, a, 9)}" fill="#0f172a"/>` +
    `<text x="${f(at.x)}" y="${f(Math.min(a.y, b.y, at.y) - 6)}" font-family="${font}" font-size="${DRAWING_FONT.label}" text-anchor="middle" fill="#0f172a">${esc(it.text)}</text></g>`
  );
}

/** For callers that need the view by id. */
export function drawingView(d: Drawing, id: DrawingView['id']): DrawingView {
  const v = d.views.find((x) => x.id === id);
  if (!v) throw new RangeError(`drawing has no ${id} view`);
  return v;
}

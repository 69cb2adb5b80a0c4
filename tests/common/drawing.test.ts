// Drawing geometry invariants and the shared SVG renderer.
import { describe, expect, it } from 'vitest';
import { buildBasinDrawing, designDissipators, designJumpBasin, drawingToSvg, drawingView, freeboard, type DesignRow, type Drawing, type JumpBasinDesign, type PolylineItem } from '../../common/src/basins';
import type { StudyInput } from '../../common/src/study';

// The demo project of product.md (invented scenario).
const DEMO: StudyInput = {
  units: 'SI',
  channelBedElevation: 90,
  basinWidth: 12,
  designDischarge: 85,
  discharges: { kind: 'range', min: 5, max: 85, count: 17 },
  tailwater: { kind: 'manning', section: { shape: 'trapezoidal', bottomWidth: 14, sideSlope: 2 }, slope: 0.0015, manningN: 0.03 },
  inflow: { kind: 'chute', crestElevation: 102, headwater: { kind: 'weir', C: 2.15, L: 12 }, lossModel: { kind: 'fraction', value: 0.1 } },
};

const g = 9.80665;
/** Rows for a rectangular basin with tailwater 1.05·y2 [calc: Bélanger]. */
function rows(W: number, fr: number, v: number, floor: number): DesignRow[] {
  return [0.4, 0.7, 1].map((k) => {
    const v1 = v * (0.9 + 0.1 * k);
    const fr1 = fr * (1.2 - 0.2 * k);
    const y1 = (v1 * v1) / (g * fr1 * fr1);
    const y2 = (y1 * (Math.sqrt(1 + 8 * fr1 * fr1) - 1)) / 2;
    return { Q: v1 * y1 * W, q: v1 * y1, y1, v1, fr1, y2, tailwaterDepth: 1.05 * y2, tailwaterElevation: floor + 1.05 * y2 };
  });
}

function polys(d: Drawing, view: 'plan' | 'section', role: string): PolylineItem[] {
  return drawingView(d, view).items.filter((i): i is PolylineItem => i.kind === 'polyline' && i.role === role);
}
function xs(p: PolylineItem): [number, number] {
  return [Math.min(...p.points.map((q) => q.x)), Math.max(...p.points.map((q) => q.x))];
}

function numbersOf(o: unknown, path = ''): Array<[string, number]> {
  if (typeof o === 'number') return [[path, o]];
  if (Array.isArray(o)) return o.flatMap((x, i) => numbersOf(x, `${path}[${i}]`));
  if (o && typeof o === 'object') return Object.entries(o).flatMap(([k, x]) => numbersOf(x, path ? `${path}.${k}` : k));
  return [];
}

describe.each(['usbr-2', 'usbr-3', 'saf', 'usbr-4', 'usbr-1'] as const)('%s design and drawing invariants', (type) => {
  const fr = type === 'usbr-4' ? 3.5 : 7;
  const d = designJumpBasin({ type, width: 10, floorElevation: 50, channelBedElevation: 52, designQ: 1e9, rows: rows(10, fr, 12, 50), governingQ: null });
  const dr = buildBasinDrawing(d);

  it('all dimensions finite; the geometric ones positive', () => {
    for (const [k, v] of numbersOf({ ...d, assumptions: [] })) expect(Number.isFinite(v), k).toBe(true);
    for (const v of [d.length, d.width, d.walls.height, d.walls.thickness, d.slab.thickness, d.riprap.d50, d.riprap.length, d.riprap.thickness, d.wingwalls.length, d.cutoffs.downstream.depth]) expect(v).toBeGreaterThan(0);
  });
  it('blocks fit inside the width (plan) and counts are whole numbers', () => {
    for (const role of ['chute-block', 'baffle-pier', 'floor-block', 'sill-tooth']) {
      for (const p of polys(dr, 'plan', role)) for (const q of p.points) expect(Math.abs(q.y)).toBeLessThanOrEqual(d.width / 2 + 1e-9);
    }
    for (const b of [d.chuteBlocks, d.baffleBlocks]) if (b) expect(Number.isInteger(b.count)).toBe(true);
    if (d.chuteBlocks) expect(polys(dr, 'plan', 'chute-block')).toHaveLength(d.chuteBlocks.count);
  });
  it('piers and floor blocks lie downstream of the chute blocks and upstream of the sill', () => {
    const chute = polys(dr, 'section', 'chute-block')[0];
    const sill = polys(dr, 'section', 'end-sill')[0];
    for (const role of ['baffle-pier', 'floor-block']) {
      for (const p of polys(dr, 'section', role)) {
        if (chute) expect(xs(p)[0]).toBeGreaterThan(xs(chute)[1]);
        if (sill) expect(xs(p)[1]).toBeLessThan(xs(sill)[0]);
      }
    }
  });
  it('wall top ≥ tailwater + freeboard at every discharge [freeboard from memory: DSD; SAF y2/3 from memory: Blaisdell]', () => {
    for (const r of d.rows) {
      const fb = type === 'saf' ? r.y2 / 3 : freeboard(r.v1, r.y2);
      expect(d.walls.topElevation).toBeGreaterThanOrEqual(d.floorElevation + Math.max(r.tailwaterDepth, type === 'saf' ? 0 : r.y2) + fb - 1e-9);
    }
  });
  it('dimension lines carry the true distances; the section length equals the basin length', () => {
    for (const v of dr.views) {
      for (const it of v.items) if (it.kind === 'dimension') expect(it.value).toBeCloseTo(Math.hypot(it.to.x - it.from.x, it.to.y - it.from.y), 9);
    }
    const len = drawingView(dr, 'section').items.find((i) => i.kind === 'dimension' && i.role === 'basin-length');
    expect(len && len.kind === 'dimension' && len.value).toBeCloseTo(d.length, 9);
    const wid = drawingView(dr, 'plan').items.find((i) => i.kind === 'dimension' && i.role === 'basin-width');
    expect(wid && wid.kind === 'dimension' && wid.value).toBeCloseTo(10, 9);
  });
  it('the section shows the design water surface from y1 at the toe to the tailwater', () => {
    const w = polys(dr, 'section', 'water-design')[0]!;
    const atToe = w.points.find((p) => p.x === 0)!;
    expect(atToe.y).toBeCloseTo(50 + d.water.y1, 9);
    expect(w.points[w.points.length - 1]!.y).toBeCloseTo(d.water.tailwaterElevation, 9);
  });
});

describe('flare limited by the jet spread tanθ = 1/(3·Fr) [src: HEC-14]', () => {
  it('a 4 m outlet into a 10 m basin at Fr up to 8.4 needs (10 − 4)/2 · 3·Fr of flare', () => {
    const r = rows(10, 7, 12, 50);
    const d = designJumpBasin({ type: 'usbr-2', width: 10, floorElevation: 50, channelBedElevation: 50, designQ: 1e9, rows: r, inflowWidth: 4 });
    const frMax = Math.max(...r.map((x) => x.fr1));
    expect(d.flare!.tanTheta).toBeCloseTo(1 / (3 * frMax), 12);
    expect(d.flare!.length).toBeCloseTo(3 * 3 * frMax, 9);
    expect(polys(buildBasinDrawing(d), 'plan', 'wall')[0]!.points.some((p) => Math.abs(p.x + d.flare!.length) < 1e-9)).toBe(true);
  });
});

describe('drawingToSvg', () => {
  const demo = designDissipators(DEMO);
  const drawing = demo.design!.drawing;
  it('renders plan and section, dimensioned, to one scale', () => {
    const svg = drawingToSvg(drawing);
    expect(svg.startsWith('<svg')).toBe(true);
    expect(svg).toContain('data-view="plan"');
    expect(svg).toContain('data-view="section"');
    expect(svg).toMatch(/data-role="dim-basin-length"/);
    expect(svg).toContain('Flow');
    expect(svg).not.toMatch(/NaN|undefined|Infinity/);
    const len = (demo.design!.design as JumpBasinDesign).length;
    expect(svg).toContain(`${len.toFixed(2)} m`);
  });
  it('labels go through the caller’s formatter (US users see feet)', () => {
    const ft = drawingToSvg(drawing, { format: (v, q) => (q === 'count' ? String(v) : q === 'discharge' ? `${(v / 0.028316846592).toFixed(0)} cfs` : `${(v / 0.3048).toFixed(1)} ft`) });
    const len = (demo.design!.design as JumpBasinDesign).length;
    expect(ft).toContain(`${(len / 0.3048).toFixed(1)} ft`);
    expect(ft).toContain('cfs');
    expect(ft).not.toMatch(/\d m</);
  });
  it('escapes text and refuses an empty drawing', () => {
    const odd: Drawing = { ...drawing, title: 'A <b> & "c"' };
    expect(drawingToSvg(odd)).toContain('A &lt;b&gt; &amp; &quot;c&quot;');
    expect(() => drawingToSvg({ ...drawing, views: [] })).toThrow(RangeError);
  });
  it('draws a north arrow when a bearing is given', () => {
    const d = buildBasinDrawing(demo.design!.design, { flowBearingDeg: 90 });
    expect(drawingView(d, 'plan').items.some((i) => i.kind === 'arrow' && i.role === 'north')).toBe(true);
    expect(drawingToSvg(d)).toContain('arrow-north');
  });
});

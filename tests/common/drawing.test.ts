// Drawing geometry invariants and the shared SVG renderer.
import { describe, expect, it } from 'vitest';
import {
  designDissipators,
  designJumpBasin,
  freeboard,
  type DesignRow,
  type JumpBasinDesign,
} from '../../common/src/basins';
import {
  buildBasinDrawing,
  drawingToSvg,
  drawingView,
  formatSI,
  type Drawing,
  type PolylineItem,
} from '../../common/src/drawing';
import {
  boxesOverlap,
  dimensionSegments,
  layoutDrawing,
  segmentHitsBox,
  scaleBarLength,
  textBox,
  type Box,
  type DrawingFormatter,
} from '../../common/src/drawing/svg';
import type { DrawingQuantity, Pt } from '../../common/src/drawing/geometry';
import { runStudy } from '../../common/src/study';
import type { StudyInput } from '../../common/src/range';
import { toSI } from '../../common/src/units';
import { caldwellDesign, fenwickDesign } from '../../seed/designs';
import { expectRel } from '../support/tolerance';

// The demo project of product.md (invented scenario).
// the demo design of product.md (invented scenario), as seeded
const DEMO: StudyInput = fenwickDesign;

const g = 9.80665;
/** Rows for a rectangular basin with tailwater 1.05·y2 [calc: Bélanger]. */
function rows(W: number, fr: number, v: number, floor: number): DesignRow[] {
  return [0.4, 0.7, 1].map((k) => {
    const v1 = v * (0.9 + 0.1 * k);
    const fr1 = fr * (1.2 - 0.2 * k);
    const y1 = (v1 * v1) / (g * fr1 * fr1);
    const y2 = (y1 * (Math.sqrt(1 + 8 * fr1 * fr1) - 1)) / 2;
    return {
      Q: v1 * y1 * W,
      q: v1 * y1,
      y1,
      v1,
      fr1,
      y2,
      tailwaterDepth: 1.05 * y2,
      tailwaterElevation: floor + 1.05 * y2,
    };
  });
}

function polys(d: Drawing, view: 'plan' | 'section', role: string): PolylineItem[] {
  return drawingView(d, view).items.filter(
    (i): i is PolylineItem => i.kind === 'polyline' && i.role === role,
  );
}
function xs(p: PolylineItem): [number, number] {
  return [Math.min(...p.points.map((q) => q.x)), Math.max(...p.points.map((q) => q.x))];
}

function numbersOf(o: unknown, path = ''): Array<[string, number]> {
  if (typeof o === 'number') return [[path, o]];
  if (Array.isArray(o)) return o.flatMap((x, i) => numbersOf(x, `${path}[${i}]`));
  if (o && typeof o === 'object')
    return Object.entries(o).flatMap(([k, x]) => numbersOf(x, path ? `${path}.${k}` : k));
  return [];
}

describe.each(['usbr-2', 'usbr-3', 'saf', 'usbr-4', 'usbr-1'] as const)(
  '%s design and drawing invariants',
  (type) => {
    const fr = type === 'usbr-4' ? 3.5 : 7;
    const d = designJumpBasin({
      type,
      width: 10,
      floorElevation: 50,
      channelBedElevation: 52,
      designQ: 1e9,
      rows: rows(10, fr, 12, 50),
      governingQ: null,
    });
    const dr = buildBasinDrawing(d);

    it('all dimensions finite; the geometric ones positive', () => {
      for (const [k, v] of numbersOf({ ...d, assumptions: [] }))
        expect(Number.isFinite(v), k).toBe(true);
      for (const v of [
        d.length,
        d.width,
        d.walls.height,
        d.walls.thickness,
        d.slab.thickness,
        d.riprap.d50,
        d.riprap.length,
        d.riprap.thickness,
        d.wingwalls.length,
        d.cutoffs.downstream.depth,
      ])
        expect(v).toBeGreaterThan(0);
    });
    it('blocks fit inside the width (plan) and counts are whole numbers', () => {
      for (const role of ['chute-block', 'baffle-pier', 'floor-block', 'sill-tooth']) {
        for (const p of polys(dr, 'plan', role))
          for (const q of p.points) expect(Math.abs(q.y)).toBeLessThanOrEqual(d.width / 2 + 1e-9);
      }
      for (const b of [d.chuteBlocks, d.baffleBlocks])
        if (b) expect(Number.isInteger(b.count)).toBe(true);
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
        expect(d.walls.topElevation).toBeGreaterThanOrEqual(
          d.floorElevation + Math.max(r.tailwaterDepth, type === 'saf' ? 0 : r.y2) + fb - 1e-9,
        );
      }
    });
    it('dimension lines carry the true distances; the section length equals the basin length', () => {
      for (const v of dr.views) {
        for (const it of v.items)
          if (it.kind === 'dimension')
            expectRel(it.value, Math.hypot(it.to.x - it.from.x, it.to.y - it.from.y), 1e-9);
      }
      const len = drawingView(dr, 'section').items.find(
        (i) => i.kind === 'dimension' && i.role === 'basin-length',
      );
      if (len?.kind !== 'dimension') throw new Error('no basin-length dimension');
      expectRel(len.value, d.length, 1e-9);
      const wid = drawingView(dr, 'plan').items.find(
        (i) => i.kind === 'dimension' && i.role === 'basin-width',
      );
      if (wid?.kind !== 'dimension') throw new Error('no basin-width dimension');
      expectRel(wid.value, 10, 1e-9);
    });
    it('the section shows the design water surface from y1 at the toe to the tailwater', () => {
      const w = polys(dr, 'section', 'water-design')[0]!;
      const atToe = w.points.find((p) => p.x === 0)!;
      expectRel(atToe.y, 50 + d.water.y1, 1e-9);
      expectRel(w.points[w.points.length - 1]!.y, d.water.tailwaterElevation, 1e-9);
    });
  },
);

describe('flare limited by the jet spread tanθ = 1/(3·Fr) [src: HEC-14]', () => {
  it('a 4 m outlet into a 10 m basin at Fr up to 8.4 needs (10 − 4)/2 · 3·Fr of flare', () => {
    const r = rows(10, 7, 12, 50);
    const d = designJumpBasin({
      type: 'usbr-2',
      width: 10,
      floorElevation: 50,
      channelBedElevation: 50,
      designQ: 1e9,
      rows: r,
      inflowWidth: 4,
    });
    const frMax = Math.max(...r.map((x) => x.fr1));
    expectRel(d.flare!.tanTheta, 1 / (3 * frMax), 1e-12);
    expectRel(d.flare!.length, 3 * 3 * frMax, 1e-9);
    expect(
      polys(buildBasinDrawing(d), 'plan', 'wall')[0]!.points.some(
        (p) => Math.abs(p.x + d.flare!.length) < 1e-9,
      ),
    ).toBe(true);
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
    const ft = drawingToSvg(drawing, {
      format: (v, q) =>
        q === 'count'
          ? String(v)
          : q === 'discharge'
            ? `${(v / 0.028316846592).toFixed(0)} cfs`
            : `${(v / 0.3048).toFixed(1)} ft`,
      scaleUnit: { label: 'ft', metres: 0.3048 },
    });
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
    expect(drawingView(d, 'plan').items.some((i) => i.kind === 'arrow' && i.role === 'north')).toBe(
      true,
    );
    expect(drawingToSvg(d)).toContain('arrow-north');
  });
});

// Label layout, scale bar and dimension values of the two demo drawings (invented scenario,
// seed/designs.ts) as the web app draws them: SI in metres, US in feet.
describe('drawing layout at the rendered size', () => {
  const FT = 0.3048; // international foot, exact by definition [src: NIST SP 811]
  const feet: DrawingFormatter = (v, q) =>
    q === 'count'
      ? String(Math.round(v))
      : q === 'discharge'
        ? `${(v / FT ** 3).toFixed(1)} cfs`
        : `${(v / FT).toFixed(2)} ft`;
  const demos = [
    {
      name: 'Fenwick (SI)',
      input: fenwickDesign,
      format: formatSI,
      unit: { label: 'm', metres: 1 },
    },
    {
      name: 'Caldwell (US)',
      input: toSI(caldwellDesign),
      format: feet,
      unit: { label: 'ft', metres: FT },
    },
  ];
  const jumpTypes = (['usbr-2', 'usbr-3', 'saf', 'usbr-4', 'usbr-1'] as const).map((type) => {
    const fr = type === 'usbr-4' ? 3.5 : 7;
    return {
      name: type,
      drawing: buildBasinDrawing(
        designJumpBasin({
          type,
          width: 4,
          floorElevation: 50,
          channelBedElevation: 52,
          designQ: 1e9,
          rows: rows(4, fr, 9, 50),
          governingQ: null,
        }),
      ),
    };
  });
  const sheets = [
    ...demos.map((d) => ({
      name: d.name,
      drawing: runStudy(d.input).design!.drawing,
      format: d.format,
      unit: d.unit,
    })),
    ...jumpTypes.map((j) => ({ ...j, format: formatSI, unit: { label: 'm', metres: 1 } })),
  ];

  describe.each(sheets)('$name', ({ drawing, format, unit }) => {
    it.each([760, 1100])(
      'no two text boxes overlap at %i px (boxes from the layout’s own text-width estimate)',
      (width) => {
        const lay = layoutDrawing(drawing, { format, width });
        for (const { layout } of lay.views) {
          // each label's box recomputed from its text, size, baseline and anchor
          const boxes: Array<[string, Box]> = layout.labels.map((l) => [
            `label ${l.role}`,
            textBox(l.text, l.size, l.x, l.y, l.anchor),
          ]);
          for (const d of layout.dimensions) boxes.push([`dimension ${d.role}`, d.box]);
          layout.arrowBoxes.forEach((b, i) => boxes.push([`arrow ${i}`, b]));
          expect(layout.labels.length + layout.dimensions.length).toBeGreaterThan(0);
          for (let i = 0; i < boxes.length; i++) {
            for (let j = i + 1; j < boxes.length; j++) {
              const [na, a] = boxes[i]!,
                [nb, b] = boxes[j]!;
              expect(boxesOverlap(a, b), `${layout.view.id}: ${na} overlaps ${nb}`).toBe(false);
            }
          }
        }
      },
    );
    it('the scale bar is a round length (1, 2 or 5 × 10ⁿ) in the chosen unit [common practice]', () => {
      const svg = drawingToSvg(drawing, { format, width: 1100, scaleUnit: unit });
      const m =
        /data-role="scale-bar" data-length="([\d.e-]+)" data-unit="([^"]+)" data-length-px="([\d.]+)"/.exec(
          svg,
        );
      expect(m).not.toBeNull();
      const len = Number(m![1]);
      expect(m![2]).toBe(unit.label);
      const mant = len / Math.pow(10, Math.floor(Math.log10(len) + 1e-9));
      expect(
        [1, 2, 5].some((k) => Math.abs(mant - k) < 1e-9),
        `scale bar ${len} ${unit.label}`,
      ).toBe(true);
      // the bar is drawn to the sheet's scale: its px length is its true length times px per metre
      const scale = Number(/data-scale-px-per-m="([\d.]+)"/.exec(svg)![1]);
      expectRel(Number(m![3]), len * unit.metres * scale, 0.01);
      expect(svg).toContain(`>${len} ${unit.label}<`);
      expect(svg).not.toMatch(/\d\.\d+ (ft|m)<\/text><\/g><g data-role="title-block"/);
    });
    it('carries the flow arrow and a title block with the cautions', () => {
      const svg = drawingToSvg(drawing, { format, width: 1100, scaleUnit: unit });
      expect(svg).toContain('arrow-flow');
      expect(svg).toContain('data-role="title-block"');
      expect(svg).toContain('licensed professional engineer');
    });
  });

  it('scaleBarLength picks the nearest of 1-2-5 steps to a fifth of the span [common practice]', () => {
    expect(scaleBarLength(82)).toBe(20); // 16.4 → 20
    expect(scaleBarLength(49)).toBe(10); // 9.8 → 10
    expect(scaleBarLength(23)).toBe(5); // 4.6 → 5
    expect(() => scaleBarLength(0)).toThrow(RangeError);
  });

  it.each(demos)(
    '$name: every dimension is positive and equals the design value it names',
    ({ input }) => {
      const out = runStudy(input).design!;
      const d = out.design as JumpBasinDesign;
      expect(d.family).toBe('jump-basin');
      const want: Record<string, number> = {
        'basin-length': d.length,
        'basin-width': d.width,
        'wall-height': d.walls.height,
        'riprap-length': d.riprap.length,
        ...(d.endSill.height > 0 ? { 'sill-height': d.endSill.height } : {}),
        ...(d.flare ? { 'flare-length': d.flare.length } : {}),
        ...(d.baffleBlocks ? { 'baffle-distance': d.baffleBlocks.distanceFromUpstream } : {}),
      };
      const seen = new Set<string>();
      for (const v of out.drawing.views) {
        for (const it of v.items) {
          if (it.kind !== 'dimension') continue;
          expect(it.value, it.role).toBeGreaterThan(0);
          const w = want[it.role];
          expect(w, `dimension ${it.role} names a design value`).toBeDefined();
          expectRel(it.value, w!, 1e-9);
          seen.add(it.role);
        }
      }
      for (const role of ['basin-length', 'basin-width', 'wall-height', 'riprap-length'])
        expect(seen.has(role), role).toBe(true);
      if (d.endSill.height > 0) expect(seen.has('sill-height')).toBe(true);
      // elevations and block call-outs carry the design's own numbers
      const section = drawingView(out.drawing, 'section').items.filter((i) => i.kind === 'label');
      const plan = drawingView(out.drawing, 'plan').items.filter((i) => i.kind === 'label');
      const valueOf = (items: typeof section, role: string, k = 0): number => {
        const l = items.find((i) => i.role === role);
        const parts =
          l && l.kind === 'label'
            ? l.parts.filter(
                (p): p is { value: number; quantity: DrawingQuantity } => typeof p !== 'string',
              )
            : [];
        return parts[k]!.value;
      };
      expectRel(valueOf(section, 'floor-elevation'), d.floorElevation, 1e-12);
      expectRel(valueOf(section, 'wall-top-elevation'), d.walls.topElevation, 1e-12);
      if (d.chuteBlocks) {
        expect(valueOf(plan, 'chute-blocks', 0)).toBe(d.chuteBlocks.count);
        expectRel(valueOf(plan, 'chute-blocks', 1), d.chuteBlocks.height, 1e-12);
      }
      if (d.baffleBlocks) expect(valueOf(plan, 'baffle-blocks', 0)).toBe(d.baffleBlocks.count);
    },
  );
});

// Issue 13 item 4: no label on a label and none on a dimension's lines, for every type the two
// demo studies design (the chosen one and the alternatives) and for wide basins (the SI demo
// at 60 m and the US demo at 30, 40 and 80 ft, where the plan is far wider than the basin is
// long and the section is drawn small). The boxes are each text's box
// recomputed from its own text, size and anchor (label) or as laid out (dimension values and
// arrows); the lines are every dimension's witness lines, dimension line and tail, and every
// leader. Each box is checked against every other box and every line but its own.
describe('labels clear of each other and of the dimension lines', () => {
  const FT = 0.3048; // international foot, exact by definition [src: NIST SP 811]
  const feet: DrawingFormatter = (v, q) =>
    q === 'count'
      ? String(Math.round(v))
      : q === 'discharge'
        ? `${(v / FT ** 3).toFixed(1)} cfs`
        : `${(v / FT).toFixed(2)} ft`;
  const studies = [
    { name: 'Fenwick (SI)', input: fenwickDesign, format: formatSI },
    { name: 'Caldwell (US)', input: toSI(caldwellDesign), format: feet },
    { name: 'Fenwick at 60 m wide', input: { ...fenwickDesign, basinWidth: 60 }, format: formatSI },
    {
      name: 'Caldwell at 30 ft wide',
      input: toSI({ ...caldwellDesign, basinWidth: 30 }),
      format: feet,
    },
    {
      name: 'Caldwell at 40 ft wide',
      input: toSI({ ...caldwellDesign, basinWidth: 40 }),
      format: feet,
    },
    {
      name: 'Caldwell at 80 ft wide',
      input: toSI({ ...caldwellDesign, basinWidth: 80 }),
      format: feet,
    },
  ];
  const cases = studies.flatMap((s) => {
    const r = runStudy(s.input);
    const entries = [r.design, ...r.alternatives].filter((e) => e !== null);
    return entries.map((e) => ({
      name: `${s.name} ${e.type}`,
      drawing: e.drawing,
      format: s.format,
    }));
  });
  it('covers several types in each study, the wide basin included', () => {
    expect(cases.length).toBeGreaterThanOrEqual(6);
    expect(cases.filter((c) => c.name.startsWith('Fenwick at 60 m')).length).toBeGreaterThan(0);
  });
  describe.each(cases)('$name', ({ drawing, format }) => {
    it.each([760, 960, 1100])('at %i px', (width) => {
      const lay = layoutDrawing(drawing, { format, width });
      for (const { layout } of lay.views) {
        const boxes: Array<[string, Box]> = [
          ...layout.labels.map((l): [string, Box] => [
            `label ${l.role}`,
            textBox(l.text, l.size, l.x, l.y, l.anchor),
          ]),
          ...layout.dimensions.map((d): [string, Box] => [`dimension ${d.role}`, d.box]),
          ...layout.arrowBoxes.map((b, i): [string, Box] => [`arrow ${i}`, b]),
        ];
        const lines: Array<[string, Pt, Pt]> = [
          ...layout.dimensions.flatMap((d) =>
            dimensionSegments(d).map(([p, q]): [string, Pt, Pt] => [`dimension ${d.role}`, p, q]),
          ),
          ...layout.labels.flatMap((l): Array<[string, Pt, Pt]> =>
            l.leader ? [[`label ${l.role}`, l.leader.from, l.leader.to]] : [],
          ),
        ];
        expect(layout.dimensions.length).toBeGreaterThan(0);
        for (const [i, [na, a]] of boxes.entries()) {
          for (const [nb, b] of boxes.slice(i + 1))
            expect(boxesOverlap(a, b), `${layout.view.id}: ${na} on ${nb}`).toBe(false);
          for (const [nl, p, q] of lines)
            if (nl !== na)
              expect(segmentHitsBox(p, q, a), `${layout.view.id}: ${na} on a line of ${nl}`).toBe(
                false,
              );
        }
      }
    });
  });
});

// Riprap below a basin is set into the channel bed (its top at the ground, thickness below),
// never laid on top of it [common practice: riprap is keyed in flush with the bed].
describe('riprap set into the bed', () => {
  const r = runStudy(fenwickDesign);
  const u = runStudy(toSI(caldwellDesign));
  const entries = [r.design!, ...r.alternatives, u.design!, ...u.alternatives].filter(
    (e) => e.design.family === 'jump-basin' || e.design.family === 'impact-basin',
  );
  it.each(entries.map((e) => [e.type, e] as const))('%s', (_t, e) => {
    const d = e.design as JumpBasinDesign;
    const rip = polys(e.drawing, 'section', 'riprap')[0]!;
    const top = Math.max(...rip.points.map((p) => p.y));
    const bottom = Math.min(...rip.points.map((p) => p.y));
    expectRel(top, d.channelBedElevation, 1e-9);
    // at its downstream end the layer runs from the bed down by its thickness
    const xEnd = Math.max(...rip.points.map((p) => p.x));
    const atEnd = rip.points.filter((p) => Math.abs(p.x - xEnd) < 1e-9).map((p) => p.y);
    expectRel(Math.max(...atEnd) - Math.min(...atEnd), d.riprap.thickness, 1e-9);
    expect(bottom).toBeLessThan(d.channelBedElevation);
  });
});

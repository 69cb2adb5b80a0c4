// Drawing geometry of a sized basin: plan and longitudinal section as neutral vector data in
// metres, to scale. The web app and the proposal PDF render the same data (drawingToSvg).
import type {
  BaffledApronDesign,
  DissipatorDesign,
  ImpactBasinDesign,
  JumpBasinDesign,
  RiprapApronDesign,
} from '../basins/design';
import type { DissipatorTypeId } from '../basins/types';

export interface Pt {
  x: number;
  y: number;
}

/** What a number in a label or dimension is, so the caller's formatter can pick the unit. */
export type DrawingQuantity = 'length' | 'elevation' | 'discharge' | 'count';

export type LineStyle = 'concrete' | 'hidden' | 'water' | 'ground' | 'riprap' | 'centre' | 'thin';
export type FillStyle = 'concrete' | 'water' | 'riprap' | 'ground' | 'none';

export interface PolylineItem {
  kind: 'polyline';
  style: LineStyle;
  fill: FillStyle;
  closed: boolean;
  points: Pt[];
  /** what the outline is (for tests and hit-testing): 'slab', 'wall', 'chute-block', … */
  role: string;
}

export interface DimensionItem {
  kind: 'dimension';
  from: Pt;
  to: Pt;
  /** the dimension line is drawn this far (m) to the left of from→to */
  offset: number;
  /** the measured value, m (equals the distance from→to) */
  value: number;
  quantity: 'length';
  role: string;
}

/** A label: text parts and numbers that the caller's formatter turns into text. */
export type LabelPart = string | { value: number; quantity: DrawingQuantity };

export interface LabelItem {
  kind: 'label';
  at: Pt;
  parts: LabelPart[];
  anchor: 'start' | 'middle' | 'end';
  size: 'small' | 'normal';
  /** which side of `at` the text goes (the renderer keeps a px gap and moves it if crowded) */
  place?: 'above' | 'below' | 'left' | 'right' | 'on';
  /** the feature the label names, when `at` is not on it: a leader is drawn to it */
  target?: Pt;
  role: string;
}

export interface ArrowItem {
  kind: 'arrow';
  from: Pt;
  to: Pt;
  text: string;
  role: 'flow' | 'north';
}

export type DrawingItem = PolylineItem | DimensionItem | LabelItem | ArrowItem;

export interface DrawingView {
  id: 'plan' | 'section';
  title: string;
  /** plan: x along the flow, y across (0 on the centre line); section: x along the flow, y elevation */
  bounds: { minX: number; minY: number; maxX: number; maxY: number };
  items: DrawingItem[];
}

export interface Drawing {
  units: 'm';
  type: DissipatorTypeId;
  title: string;
  views: DrawingView[];
  notes: string[];
  /** the cautions, in one line for the title block */
  caution?: string;
}

/** The cautions of product.md, short enough for a drawing's title block. */
export const DRAWING_CAUTION =
  'Concept level only: verify by detailed design (model studies for large or high-hazard structures); check cavitation, sweep-out, uplift and scour; to be reviewed and sealed by a licensed professional engineer and to follow local codes and dam-safety regulations.';

const P = (x: number, y: number): Pt => ({ x, y });
const rect = (x0: number, y0: number, x1: number, y1: number): Pt[] => [
  P(x0, y0),
  P(x1, y0),
  P(x1, y1),
  P(x0, y1),
];
const poly = (
  role: string,
  points: Pt[],
  style: LineStyle = 'concrete',
  fill: FillStyle = 'concrete',
  closed = true,
): PolylineItem => ({ kind: 'polyline', role, style, fill, closed, points });
const dim = (role: string, from: Pt, to: Pt, offset: number): DimensionItem => ({
  kind: 'dimension',
  role,
  from,
  to,
  offset,
  value: Math.hypot(to.x - from.x, to.y - from.y),
  quantity: 'length',
});
interface LabelOpts {
  anchor?: LabelItem['anchor'];
  place?: LabelItem['place'];
  target?: Pt;
  size?: LabelItem['size'];
}
const label = (role: string, at: Pt, parts: LabelPart[], o: LabelOpts = {}): LabelItem => ({
  kind: 'label',
  role,
  at,
  parts,
  anchor: o.anchor ?? 'middle',
  size: o.size ?? 'small',
  place: o.place ?? 'above',
  ...(o.target ? { target: o.target } : {}),
});
const v = (value: number, quantity: DrawingQuantity = 'length'): LabelPart => ({ value, quantity });

function boundsOf(items: DrawingItem[], pad: number): DrawingView['bounds'] {
  let minX = Infinity,
    minY = Infinity,
    maxX = -Infinity,
    maxY = -Infinity;
  const see = (p: Pt): void => {
    minX = Math.min(minX, p.x);
    maxX = Math.max(maxX, p.x);
    minY = Math.min(minY, p.y);
    maxY = Math.max(maxY, p.y);
  };
  for (const it of items) {
    if (it.kind === 'polyline') it.points.forEach(see);
    else if (it.kind === 'dimension') {
      const dx = it.to.x - it.from.x,
        dy = it.to.y - it.from.y,
        len = Math.hypot(dx, dy) || 1;
      const nx = -dy / len,
        ny = dx / len;
      [it.from, it.to].forEach((p) => see(P(p.x + nx * it.offset, p.y + ny * it.offset)));
      see(it.from);
      see(it.to);
    } else if (it.kind === 'label') see(it.at);
    else {
      see(it.from);
      see(it.to);
    }
  }
  return { minX: minX - pad, minY: minY - pad, maxX: maxX + pad, maxY: maxY + pad };
}

/** Options of the drawing. */
export interface DrawingOptions {
  /** bearing of the flow direction from north, degrees clockwise; when given a north arrow is drawn */
  flowBearingDeg?: number;
  /** slope of the chute end drawn upstream of the toe, horizontal per 1 vertical (indicative) */
  chuteSlope?: number;
}

/**
 * Plan and longitudinal section of a designed basin, to scale, in metres: outlines (slab,
 * walls, blocks, sill, cutoffs, wingwalls, riprap), water surfaces at the design discharge,
 * dimension lines with their values, labels (numbers kept as values for the caller's
 * formatter), flow arrow and, when a bearing is given, a north arrow.
 */
export function buildBasinDrawing(design: DissipatorDesign, opts: DrawingOptions = {}): Drawing {
  switch (design.family) {
    case 'jump-basin':
      return jumpBasinDrawing(design, opts);
    case 'impact-basin':
      return impactBasinDrawing(design, opts);
    case 'baffled-apron':
      return baffledApronDrawing(design, opts);
    case 'riprap-apron':
      return riprapApronDrawing(design, opts);
  }
}

function northArrow(items: DrawingItem[], at: Pt, size: number, bearing: number | undefined): void {
  if (bearing === undefined || !Number.isFinite(bearing)) return;
  // x along the flow: north lies at −bearing from the flow direction.
  const a = (-bearing * Math.PI) / 180;
  items.push({
    kind: 'arrow',
    role: 'north',
    from: at,
    to: P(at.x + size * Math.cos(a), at.y + size * Math.sin(a)),
    text: 'N',
  });
}

function jumpBasinDrawing(d: JumpBasinDesign, opts: DrawingOptions): Drawing {
  const L = d.length;
  const W = d.width;
  const zf = d.floorElevation;
  const t = d.slab.thickness;
  const tw = d.walls.thickness;
  const H = d.walls.height;
  const zt = d.walls.topElevation;
  const sill = d.endSill;
  const slope = opts.chuteSlope ?? 2;
  const rise = Math.min(H, Math.max(1, 0.6 * H));
  const xc = -(d.flare ? d.flare.length : 0) - rise * slope; // upstream end of what is drawn
  const zChute = (x: number): number => (x >= 0 ? zf : zf + -x / slope); // chute bed above the toe
  const sec: DrawingItem[] = [];
  const plan: DrawingItem[] = [];
  const cu = d.cutoffs.upstream;
  const cd = d.cutoffs.downstream;
  const xUp = -rise * slope;

  // Section: slab with cutoffs, chute end, blocks, sill, exit, riprap, walls, water.
  sec.push(
    poly('slab', [
      P(xUp, zChute(xUp)),
      P(0, zf),
      P(L, zf),
      P(L, zf - t - cd.depth),
      P(L - cd.thickness, zf - t - cd.depth),
      P(L - cd.thickness, zf - t),
      P(cu.thickness, zf - t),
      P(cu.thickness, zf - t - cu.depth),
      P(0, zf - t - cu.depth),
      P(0, zf - t),
      P(xUp, zChute(xUp) - t),
    ]),
  );
  const cb = d.chuteBlocks;
  if (cb) sec.push(poly('chute-block', rect(0, zf, cb.length, zf + cb.height)));
  const bb = d.baffleBlocks;
  if (bb) {
    const x0 = bb.distanceFromUpstream;
    sec.push(
      bb.kind === 'baffle-piers'
        ? poly('baffle-pier', [
            P(x0, zf),
            P(x0, zf + bb.height),
            P(x0 + (bb.topLength ?? 0), zf + bb.height),
            P(x0 + bb.length, zf),
          ])
        : poly('floor-block', rect(x0, zf, x0 + bb.length, zf + bb.height)),
    );
  }
  if (sill.height > 0) {
    const x0 = L - sill.length;
    sec.push(
      poly('end-sill', [
        P(x0, zf),
        P(Math.min(L, x0 + sill.upstreamSlope * sill.height), zf + sill.height),
        P(L, zf + sill.height),
        P(L, zf),
      ]),
    );
  }
  const ramp = d.exit.length;
  const xr = L + d.riprap.length;
  const xEnd = Math.max(L + ramp, xr) + Math.max(2, 0.1 * L);
  const zs = sill.topElevation;
  const zb = d.channelBedElevation;
  // The exit rises from the sill top to the channel bed; past it the ground is the bed, and the
  // riprap is set into it: its top at the ground line, its thickness below.
  const ground = (x: number): number =>
    x <= L ? zs : x <= L + ramp && ramp > 0 ? zs + ((x - L) / ramp) * d.exit.rise : zb;
  const gpts = [
    P(L, zs),
    ...(ramp > 0 ? [P(L + ramp, ground(L + ramp))] : zb !== zs ? [P(L, zb)] : []),
    P(xEnd, zb),
  ];
  sec.push(poly('ground', gpts, 'ground', 'none', false));
  const rTop = [
    P(L, ramp > 0 ? zs : zb),
    ...(ramp > 0 && L + ramp < xr ? [P(L + ramp, ground(L + ramp))] : []),
    P(xr, ground(xr)),
  ];
  sec.push(
    poly(
      'riprap',
      [
        ...rTop,
        ...rTop
          .slice()
          .reverse()
          .map((p) => P(p.x, p.y - d.riprap.thickness)),
      ],
      'riprap',
      'riprap',
    ),
  );
  sec.push(poly('wall-top', [P(xUp, zt), P(L, zt), P(L, zf)], 'hidden', 'none', false));
  // Water surfaces at the design discharge.
  const w = d.water;
  const ytw = Math.max(w.y1, w.tailwaterElevation - zf);
  const Lj = Math.max(w.jumpLength, 1e-3);
  const wpts: Pt[] = [P(xUp, zChute(xUp) + w.y1)];
  for (let i = 0; i <= 10; i++) {
    const x = (Lj * i) / 10;
    const s = 1 - Math.pow(1 - i / 10, 2);
    wpts.push(P(x, zf + w.y1 + (ytw - w.y1) * s));
  }
  wpts.push(P(xEnd, w.tailwaterElevation));
  sec.push(poly('water-design', wpts, 'water', 'none', false));
  // Section dimensions and labels.
  const below = zf - t - Math.max(cu.depth, cd.depth);
  sec.push(dim('basin-length', P(0, below), P(L, below), -0.8));
  if (bb)
    sec.push(
      dim('baffle-distance', P(0, zf + H * 0.15), P(bb.distanceFromUpstream, zf + H * 0.15), 0.3),
    );
  sec.push(dim('wall-height', P(L + 0.3, zf), P(L + 0.3, zt), -0.6));
  if (sill.height > 0)
    sec.push(dim('sill-height', P(L - sill.length - 0.4, zf), P(L - sill.length - 0.4, zs), 0.6));
  const rBottom = Math.min(ground(L), ground(xr)) - d.riprap.thickness - 0.3;
  sec.push(dim('riprap-length', P(L, rBottom), P(xr, rBottom), -0.6));
  // Labels sit on their feature; the renderer keeps them apart at the rendered scale.
  sec.push(
    label('floor-elevation', P(L * 0.55, zf), ['Floor El. ', v(zf, 'elevation')], {
      place: 'above',
    }),
  );
  sec.push(
    label('wall-top-elevation', P(L * 0.5, zt), ['Top of wall El. ', v(zt, 'elevation')], {
      place: 'above',
    }),
  );
  sec.push(
    label(
      'tailwater-elevation',
      P(xEnd, w.tailwaterElevation),
      ['Tailwater El. ', v(w.tailwaterElevation, 'elevation'), ' at Q = ', v(w.Q, 'discharge')],
      { anchor: 'end', place: 'above' },
    ),
  );
  sec.push(
    label(
      'bed-elevation',
      P(xEnd, d.channelBedElevation),
      ['Channel bed El. ', v(d.channelBedElevation, 'elevation')],
      { anchor: 'end', place: 'below' },
    ),
  );
  sec.push(
    label('y1', P(Math.min(0.1 * L, 0.5), zf + w.y1), ['y1 = ', v(w.y1)], {
      anchor: 'start',
      place: 'above',
    }),
  );
  sec.push(label('y2', P(Lj, zf + ytw), ['y2 = ', v(w.y2)], { place: 'above' }));
  sec.push(label('slab', P(L * 0.3, zf - t / 2), ['Slab ', v(t), ' thick'], { place: 'on' }));
  sec.push(
    label(
      'riprap',
      P((L + xr) / 2, ground((L + xr) / 2) - d.riprap.thickness),
      ['Riprap D50 ', v(d.riprap.d50), ', ', v(d.riprap.thickness), ' thick'],
      { place: 'below' },
    ),
  );
  sec.push(
    label(
      'sill',
      P(L - sill.length / 2, sill.height > 0 ? zs : zf),
      [
        sill.height > 0
          ? `${sill.kind === 'dentated' ? 'Dentated' : 'Solid'} end sill`
          : 'No end sill',
      ],
      { place: 'above' },
    ),
  );
  sec.push({
    kind: 'arrow',
    role: 'flow',
    from: P(xUp + 0.5, zChute(xUp) + w.y1 + 1.2),
    to: P(
      xUp + 0.5 + Math.max(2, 0.1 * L),
      zChute(xUp) + w.y1 + 1.2 - Math.max(2, 0.1 * L) / slope,
    ),
    text: 'Flow',
  });

  // Plan.
  const half = W / 2;
  const inner = (x: number): number => {
    if (!d.flare || x >= 0) return half;
    const f = d.flare;
    const xs = -f.length;
    return x <= xs
      ? f.fromWidth / 2
      : f.fromWidth / 2 + ((x - xs) / f.length) * (half - f.fromWidth / 2);
  };
  const xPlanUp = xc;
  for (const sgn of [1, -1]) {
    const pts: Pt[] = [];
    const xsList = d.flare ? [xPlanUp, -d.flare.length, 0, L] : [xPlanUp, 0, L];
    for (const x of xsList) pts.push(P(x, sgn * inner(x)));
    for (const x of xsList.slice().reverse()) pts.push(P(x, sgn * (inner(x) + tw)));
    plan.push(poly('wall', pts));
    const a = (d.wingwalls.angleDeg * Math.PI) / 180;
    const wl = d.wingwalls.length;
    plan.push(
      poly('wingwall', [
        P(L, sgn * half),
        P(L + wl * Math.cos(a), sgn * (half + wl * Math.sin(a))),
        P(
          L + wl * Math.cos(a) - tw * Math.sin(a),
          sgn * (half + wl * Math.sin(a) + tw * Math.cos(a)),
        ),
        P(L, sgn * (half + tw)),
      ]),
    );
  }
  plan.push(poly('slab-outline', rect(0, -half, L, half), 'thin', 'none'));
  if (cb)
    for (const c of cb.centres)
      plan.push(poly('chute-block', rect(0, c - cb.width / 2, cb.length, c + cb.width / 2)));
  if (bb)
    for (const c of bb.centres)
      plan.push(
        poly(
          bb.kind === 'baffle-piers' ? 'baffle-pier' : 'floor-block',
          rect(
            bb.distanceFromUpstream,
            c - bb.width / 2,
            bb.distanceFromUpstream + bb.length,
            c + bb.width / 2,
          ),
        ),
      );
  if (sill.height > 0) {
    plan.push(
      poly(
        'end-sill',
        rect(L - sill.length, -half, L, half),
        'concrete',
        sill.kind === 'dentated' ? 'none' : 'concrete',
      ),
    );
    if (sill.teeth)
      for (const c of sill.teeth.centres)
        plan.push(
          poly(
            'sill-tooth',
            rect(L - sill.length, c - sill.teeth.width / 2, L, c + sill.teeth.width / 2),
          ),
        );
  }
  const rh = d.riprap.width / 2;
  plan.push(poly('riprap', rect(L, -rh, xr, rh), 'riprap', 'riprap'));
  plan.push(poly('centre-line', [P(xPlanUp, 0), P(xEnd, 0)], 'centre', 'none', false));
  // The width goes across open floor: between the last row of blocks and the end sill.
  const xOpenUp = Math.max(cb ? cb.length : 0, bb ? bb.distanceFromUpstream + bb.length : 0);
  const xOpenDn = sill.height > 0 ? L - sill.length : L;
  plan.push(
    dim('basin-width', P((xOpenUp + xOpenDn) / 2, -half), P((xOpenUp + xOpenDn) / 2, half), 0),
  );
  plan.push(dim('basin-length', P(0, half + tw), P(L, half + tw), 0.8));
  plan.push(dim('riprap-length', P(L, -rh), P(xr, -rh), -0.8));
  if (d.flare)
    plan.push(dim('flare-length', P(-d.flare.length, -(half + tw)), P(0, -(half + tw)), -0.8));
  // Block call-outs below the lower wall, each with a leader to the outermost block.
  const lowest = (cs: readonly number[]): number => Math.min(...cs);
  if (cb)
    plan.push(
      label(
        'chute-blocks',
        P(cb.length / 2, -half - tw),
        [
          v(cb.count, 'count'),
          ` ${d.type === 'usbr-4' ? 'deflector' : 'chute'} blocks, `,
          v(cb.height),
          ' high, ',
          v(cb.width),
          ' wide at ',
          v(cb.spacing),
          ' spacing',
        ],
        { anchor: 'start', place: 'below', target: P(cb.length / 2, lowest(cb.centres)) },
      ),
    );
  if (bb)
    plan.push(
      label(
        'baffle-blocks',
        P(bb.distanceFromUpstream + bb.length / 2, -half - tw),
        [
          v(bb.count, 'count'),
          bb.kind === 'baffle-piers' ? ' baffle piers, ' : ' floor blocks, ',
          v(bb.height),
          ' high, ',
          v(bb.width),
          ' wide at ',
          v(bb.spacing),
          ' spacing',
        ],
        {
          anchor: 'start',
          place: 'below',
          target: P(bb.distanceFromUpstream + bb.length / 2, lowest(bb.centres)),
        },
      ),
    );
  if (sill.height > 0 && sill.teeth)
    plan.push(
      label(
        'sill-teeth',
        P(L - sill.length / 2, -half - tw),
        [v(sill.teeth.centres.length, 'count'), ' sill teeth ', v(sill.teeth.width), ' wide'],
        {
          anchor: 'start',
          place: 'below',
          target: P(L - sill.length / 2, lowest(sill.teeth.centres)),
        },
      ),
    );
  plan.push({
    kind: 'arrow',
    role: 'flow',
    from: P(xPlanUp + 0.3, 0),
    to: P(xPlanUp + 0.3 + Math.max(2, 0.1 * L), 0),
    text: 'Flow',
  });
  northArrow(plan, P(xEnd - 1.5, half + tw + 2), 1.5, opts.flowBearingDeg);

  const sectionItems = sec;
  return {
    units: 'm',
    type: d.type,
    title: `${d.name} — plan and section at the design discharge`,
    views: [
      { id: 'plan', title: 'Plan', bounds: boundsOf(plan, 1), items: plan },
      {
        id: 'section',
        title: 'Longitudinal section on the centre line',
        bounds: boundsOf(sectionItems, 1),
        items: sectionItems,
      },
    ],
    notes: [`Chute end drawn at ${slope}H:1V (indicative).`],
    caution: DRAWING_CAUTION,
  };
}

function impactBasinDrawing(d: ImpactBasinDesign, opts: DrawingOptions): Drawing {
  const s = d.sizing;
  const L = s.length,
    W = s.width,
    zf = d.floorElevation,
    t = d.walls.thickness,
    zt = d.walls.topElevation;
  const sec: DrawingItem[] = [];
  const plan: DrawingItem[] = [];
  sec.push(poly('slab', rect(-t, zf - t, L + t, zf)));
  sec.push(poly('wall-upstream', rect(-t, zf, 0, zt)));
  sec.push(
    poly(
      'baffle',
      rect(
        s.baffleDistance,
        zf + s.baffleClearance,
        s.baffleDistance + t,
        zf + s.baffleClearance + s.baffleHeight,
      ),
    ),
  );
  sec.push(poly('end-sill', rect(L - s.endSill.length, zf, L, zf + s.endSill.height)));
  sec.push(poly('wall-top', [P(0, zt), P(L, zt)], 'hidden', 'none', false));
  const xr = L + d.riprap.length;
  // riprap set into the channel bed past the end sill: its top at bed level, thickness below
  const zb = d.channelBedElevation;
  sec.push(poly('riprap', rect(L, zb - d.riprap.thickness, xr, zb), 'riprap', 'riprap'));
  sec.push(poly('ground', [P(L, zb), P(xr + 1, zb)], 'ground', 'none', false));
  sec.push(
    poly(
      'water-design',
      [P(L, d.water.tailwaterElevation), P(xr + 1, d.water.tailwaterElevation)],
      'water',
      'none',
      false,
    ),
  );
  sec.push(dim('basin-length', P(0, zf - t - 0.3), P(L, zf - t - 0.3), -0.6));
  sec.push(dim('wall-height', P(L + 0.2, zf), P(L + 0.2, zt), -0.5));
  sec.push(dim('baffle-distance', P(0, zt + 0.2), P(s.baffleDistance, zt + 0.2), 0.4));
  sec.push(
    label('floor-elevation', P(L * 0.7, zf), ['Floor El. ', v(zf, 'elevation')], {
      place: 'above',
    }),
  );
  sec.push(
    label(
      'baffle',
      P(s.baffleDistance, zf + s.baffleClearance + s.baffleHeight),
      ['Hanging baffle'],
      { place: 'above' },
    ),
  );
  sec.push({
    kind: 'arrow',
    role: 'flow',
    from: P(-2.5, zf + 0.3 * s.wallHeight),
    to: P(-0.5, zf + 0.3 * s.wallHeight),
    text: 'Flow',
  });
  plan.push(poly('wall', rect(-t, W / 2, L, W / 2 + t)));
  plan.push(poly('wall', rect(-t, -W / 2 - t, L, -W / 2)));
  plan.push(poly('wall-upstream', rect(-t, -W / 2, 0, W / 2)));
  plan.push(poly('baffle', rect(s.baffleDistance, -W / 2, s.baffleDistance + t, W / 2)));
  plan.push(poly('end-sill', rect(L - s.endSill.length, -W / 2, L, W / 2)));
  plan.push(poly('riprap', rect(L, -W / 2 - t, xr, W / 2 + t), 'riprap', 'riprap'));
  plan.push(dim('basin-width', P(L * 0.8, -W / 2), P(L * 0.8, W / 2), 0.4));
  plan.push(dim('basin-length', P(0, W / 2 + t), P(L, W / 2 + t), 0.6));
  plan.push({ kind: 'arrow', role: 'flow', from: P(-2.5, 0), to: P(-0.5, 0), text: 'Flow' });
  northArrow(plan, P(xr, W / 2 + 2), 1.2, opts.flowBearingDeg);
  return {
    units: 'm',
    type: 'usbr-6',
    title: `${d.name} — plan and section`,
    views: [
      { id: 'plan', title: 'Plan', bounds: boundsOf(plan, 1), items: plan },
      {
        id: 'section',
        title: 'Longitudinal section on the centre line',
        bounds: boundsOf(sec, 1),
        items: sec,
      },
    ],
    notes: ['The pipe enters through the upstream wall.'],
    caution: DRAWING_CAUTION,
  };
}

function baffledApronDrawing(d: BaffledApronDesign, opts: DrawingOptions): Drawing {
  const s = d.sizing;
  const cosA = s.slope / Math.sqrt(1 + s.slope * s.slope);
  const sinA = 1 / Math.sqrt(1 + s.slope * s.slope);
  const z0 = d.crestElevation;
  const sec: DrawingItem[] = [];
  const plan: DrawingItem[] = [];
  const Lh = s.length;
  const t = 0.3;
  sec.push(
    poly('slab', [P(0, z0), P(Lh, z0 - Lh / s.slope), P(Lh, z0 - Lh / s.slope - t), P(0, z0 - t)]),
  );
  for (let i = 0; i < s.rows; i++) {
    const along = s.rowSpacing / 2 + i * s.rowSpacing;
    const x = along * cosA,
      z = z0 - along * sinA;
    sec.push(
      poly('baffle', [
        P(x, z),
        P(x - s.baffleHeight * sinA, z + s.baffleHeight * cosA),
        P(x - s.baffleHeight * sinA + 0.2 * cosA, z + s.baffleHeight * cosA - 0.2 * sinA),
        P(x + 0.2 * cosA, z - 0.2 * sinA),
      ]),
    );
  }
  sec.push(
    poly(
      'ground',
      [P(Lh * 0.5, d.channelBedElevation), P(Lh + 3, d.channelBedElevation)],
      'ground',
      'none',
      false,
    ),
  );
  sec.push(dim('apron-length', P(0, z0 - Lh / s.slope - 1), P(Lh, z0 - Lh / s.slope - 1), -0.5));
  sec.push(
    label('crest-elevation', P(0, z0), ['Crest El. ', v(z0, 'elevation')], {
      anchor: 'start',
      place: 'above',
    }),
  );
  sec.push(
    label(
      'bed-elevation',
      P(Lh + 3, d.channelBedElevation),
      ['Channel bed El. ', v(d.channelBedElevation, 'elevation')],
      { anchor: 'end', place: 'above' },
    ),
  );
  sec.push({ kind: 'arrow', role: 'flow', from: P(-3, z0 + 1), to: P(-1, z0 + 1), text: 'Flow' });
  const W = d.width;
  plan.push(poly('wall', rect(0, W / 2, Lh, W / 2 + t)));
  plan.push(poly('wall', rect(0, -W / 2 - t, Lh, -W / 2)));
  for (let i = 0; i < s.rows; i++) {
    const x = (s.rowSpacing / 2 + i * s.rowSpacing) * cosA;
    const row = i % 2 === 0 ? s.rowA : s.rowB;
    for (const c of row.centres)
      plan.push(poly('baffle', rect(x, c - row.width / 2, x + 0.2, c + row.width / 2)));
  }
  plan.push(dim('basin-width', P(Lh * 0.5, -W / 2), P(Lh * 0.5, W / 2), 0.4));
  plan.push(dim('apron-length', P(0, W / 2 + t), P(Lh, W / 2 + t), 0.6));
  plan.push({ kind: 'arrow', role: 'flow', from: P(-3, 0), to: P(-1, 0), text: 'Flow' });
  northArrow(plan, P(Lh + 1, W / 2 + 2), 1.2, opts.flowBearingDeg);
  return {
    units: 'm',
    type: 'usbr-9',
    title: `${d.name} — plan and section`,
    views: [
      { id: 'plan', title: 'Plan', bounds: boundsOf(plan, 1), items: plan },
      { id: 'section', title: 'Section on the centre line', bounds: boundsOf(sec, 1), items: sec },
    ],
    notes: [`${s.rows} rows of baffles on a ${s.slope}H:1V apron; alternate rows staggered.`],
    caution: DRAWING_CAUTION,
  };
}

function riprapApronDrawing(d: RiprapApronDesign, opts: DrawingOptions): Drawing {
  const a = d.apron;
  const z = d.invertElevation;
  const sec: DrawingItem[] = [];
  const plan: DrawingItem[] = [];
  sec.push(poly('riprap', rect(0, z - a.thickness, a.length, z), 'riprap', 'riprap'));
  sec.push(poly('culvert', rect(-2, z, 0, z + 1), 'concrete', 'none', false));
  sec.push(
    dim('apron-length', P(0, z - a.thickness - 0.3), P(a.length, z - a.thickness - 0.3), -0.5),
  );
  sec.push(
    label('riprap', P(a.length / 2, z), ['Riprap D50 ', v(a.d50), ', ', v(a.thickness), ' thick'], {
      place: 'above',
    }),
  );
  sec.push({
    kind: 'arrow',
    role: 'flow',
    from: P(-1.8, z + 0.5),
    to: P(-0.2, z + 0.5),
    text: 'Flow',
  });
  plan.push(
    poly(
      'riprap',
      [
        P(0, -a.widthAtOutlet / 2),
        P(a.length, -a.widthAtEnd / 2),
        P(a.length, a.widthAtEnd / 2),
        P(0, a.widthAtOutlet / 2),
      ],
      'riprap',
      'riprap',
    ),
  );
  plan.push(dim('apron-length', P(0, a.widthAtEnd / 2), P(a.length, a.widthAtEnd / 2), 0.6));
  plan.push(
    dim('apron-width-end', P(a.length, -a.widthAtEnd / 2), P(a.length, a.widthAtEnd / 2), -0.6),
  );
  plan.push({ kind: 'arrow', role: 'flow', from: P(-2, 0), to: P(-0.3, 0), text: 'Flow' });
  northArrow(plan, P(a.length + 1, a.widthAtEnd / 2), 1, opts.flowBearingDeg);
  return {
    units: 'm',
    type: 'riprap-apron',
    title: `${d.name} — plan and section`,
    views: [
      { id: 'plan', title: 'Plan', bounds: boundsOf(plan, 1), items: plan },
      { id: 'section', title: 'Section on the centre line', bounds: boundsOf(sec, 1), items: sec },
    ],
    notes: ['Place on a filter (granular or geotextile).'],
    caution: DRAWING_CAUTION,
  };
}

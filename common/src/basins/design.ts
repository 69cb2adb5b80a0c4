// The full design of a basin over the whole discharge range: floor, length, width and flare,
// blocks, sill, walls, wingwalls, cutoffs, slab, riprap, quantities of concrete, warnings.
import { InputError } from '../errors';
import { getDissipator } from './catalogue';
import { listAssumptions, resolveDefaults, type Assumption, type BasinDefaults } from './defaults';
import { slabFlotation, type FlotationResult } from './flotation';
import { freeboard as usbrFreeboard } from './freeboard';
import { reqFinite, reqPositive, roundUp } from './guards';
import {
  jumpBasinHydraulics,
  jumpRules,
  jumpWarningItems,
  sizeJumpBasin,
  type JumpWarning,
} from './jumpBasin';
import {
  designCulvertApron,
  riprapBelowSill,
  type CulvertApron,
  type RiprapProtection,
} from './riprap';
import type {
  BaffleSet,
  BlockSet,
  DischargeRow,
  EndSill,
  JumpBasinSizing,
  JumpBasinType,
} from './types';
import { distinctWarnings, warn, type StudyWarning } from '../warnings';
import { dis, len, lim, vel } from './types/shared';
import { sizeImpactBasin, type ImpactBasinSizing } from './types/usbr6';
import { sizeBaffledApron, type BaffledApronSizing } from './types/usbr9';
import { designRow } from './types/shared';
import { jumpPosition } from '../range/position';

/** A discharge row of the study with its tailwater elevation (SI). */
export interface DesignRow extends DischargeRow {
  tailwaterElevation: number;
}

/** Options of the in-study design the user may set. */
export interface DesignOptions {
  defaults?: Partial<BasinDefaults>;
  /** flotation case: uplift level (default: tailwater at the smallest discharge), water on slab, factor */
  flotation?: {
    upliftElevation?: number;
    waterOnSlabDepth?: number;
    safetyFactor?: number;
    minThickness?: number;
    monolithic?: boolean;
  };
  /** extra depth to set the floor below the solved one, m (a margin against sweep-out) */
  extraFloorDepth?: number;
  /** tailwater above C·y2 by more than this fraction drowns the jump (range/position.ts; default 0.10) */
  submergenceTolerance?: number;
}

export interface ConcreteQuantities {
  slab: number;
  walls: number;
  blocks: number;
  sill: number;
  cutoffs: number;
  wingwalls: number;
  total: number;
  /** how the volumes were found */
  basis: string;
}

/** One discharge of a jump basin's own check, on its floor (SI). */
export interface JumpBasinDesignRow {
  Q: number;
  fr1: number;
  v1: number;
  y1: number;
  y2: number;
  /** tailwater depth above the basin's floor, m */
  tailwaterDepth: number;
  /** C·y2, m */
  requiredDepth: number;
  /** tailwater depth − C·y2, m */
  margin: number;
  /** the basin's length at this discharge, m */
  length: number;
}

export interface JumpBasinDesign {
  family: 'jump-basin';
  type: JumpBasinType;
  name: string;
  source: string;
  /** basin floor (top of slab) elevation, m */
  floorElevation: number;
  channelBedElevation: number;
  /** discharge that governs the floor, m³/s */
  governingQ: number | null;
  designQ: number;
  width: number;
  /** longest basin over the range, m, and where it occurs */
  length: number;
  lengthGoverningQ: number;
  /** sizing at the design discharge (appurtenances) */
  sizing: JumpBasinSizing;
  chuteBlocks?: BlockSet;
  baffleBlocks?: BaffleSet;
  endSill: EndSill & { topElevation: number };
  flare: {
    fromWidth: number;
    toWidth: number;
    tanTheta: number;
    angleDeg: number;
    length: number;
  } | null;
  walls: {
    height: number;
    topElevation: number;
    thickness: number;
    freeboard: number;
    maxTailwaterElevation: number;
  };
  wingwalls: { angleDeg: number; length: number; height: number };
  cutoffs: {
    upstream: { depth: number; thickness: number };
    downstream: { depth: number; thickness: number };
  };
  /** exit slope from the sill top up to the channel bed (0 when the sill reaches the bed) */
  exit: { rise: number; length: number };
  slab: FlotationResult;
  riprap: RiprapProtection;
  /** water surfaces at the design discharge (for the drawing) */
  water: {
    Q: number;
    y1: number;
    y2: number;
    v1: number;
    fr1: number;
    tailwaterElevation: number;
    jumpLength: number;
  };
  /** per discharge: required and available tailwater, margin, basin length */
  rows: JumpBasinDesignRow[];
  concrete: ConcreteQuantities;
  /** as data; phrase with studyWarningText(w, units) */
  warnings: StudyWarning[];
  sources: string[];
  assumptions: Assumption[];
}

export interface JumpDesignInput {
  type: JumpBasinType;
  width: number;
  floorElevation: number;
  channelBedElevation: number;
  designQ: number;
  governingQ?: number | null;
  rows: readonly DesignRow[];
  /** width of the inflow (outlet) when narrower than the basin: the walls flare */
  inflowWidth?: number;
}

function pickDesignRow<T extends DischargeRow>(rows: readonly T[], Q: number): T {
  const row = designRow(rows, Q);
  if (!row) throw new InputError('rows', 'missing', 'rows must hold at least one discharge', {});
  return row;
}

/**
 * Designs a jump basin over the whole range (hydraulics.md §3–4): appurtenances at the design
 * discharge, length the longest over the range, walls above the largest tailwater plus
 * freeboard, flare by the jet spread tanθ = 1/(3·Fr) [src: HEC-14], slab by flotation, riprap
 * below the sill, cutoffs and wingwalls (common practice), concrete by element, warnings.
 */
export function designJumpBasin(
  input: JumpDesignInput,
  options: DesignOptions = {},
): JumpBasinDesign {
  const d = resolveDefaults(options.defaults);
  const W = reqPositive('width', input.width);
  const zf = reqFinite('floorElevation', input.floorElevation);
  const zb = reqFinite('channelBedElevation', input.channelBedElevation);
  if (!Array.isArray(input.rows) || input.rows.length === 0)
    throw new InputError('rows', 'missing', 'rows must hold at least one discharge', {});
  const m = getDissipator(input.type);
  const rules = jumpRules(input.type);
  const dr = pickDesignRow(input.rows, input.designQ);
  // Every discharge needs only the type's hydraulics (the appurtenances are sized once, below).
  const rows: JumpBasinDesignRow[] = input.rows.map((r) => {
    const s = jumpBasinHydraulics(rules, W, reqPositive('Q', r.Q), reqPositive('y1', r.y1), d);
    const tw = r.tailwaterElevation - zf;
    const req = s.requiredTailwaterDepth;
    return {
      Q: r.Q,
      fr1: s.fr1,
      v1: s.v1,
      y1: r.y1,
      y2: s.y2,
      tailwaterDepth: tw,
      requiredDepth: req,
      margin: tw - req,
      length: s.length,
    };
  });
  const maxTw = Math.max(...rows.map((r) => r.tailwaterDepth));
  const sizing = sizeJumpBasin(
    input.type,
    { width: W, Q: dr.Q, y1: dr.y1 },
    { defaults: d, maxTailwaterDepth: Math.max(0, maxTw) },
  );
  const longest = rows.reduce((a, r) => (r.length > a.length ? r : a));
  const length = Math.max(longest.length, sizing.length);
  const app = rules.appurtenances({
    fr1: sizing.fr1,
    y1: sizing.y1,
    y2: sizing.y2,
    width: W,
    length,
    d,
  });

  // Walls: above the largest tailwater (and the jump) plus freeboard at every discharge.
  let wallHeight = sizing.wallHeight;
  let fbMax = sizing.freeboard;
  for (const r of rows) {
    const fb =
      rules.freeboardRule === 'saf' ? r.y2 / 3 : usbrFreeboard(r.v1, r.y2, d.freeboardCoefficient);
    fbMax = Math.max(fbMax, fb);
    const top =
      rules.freeboardRule === 'saf'
        ? Math.max(0, r.tailwaterDepth) + fb
        : Math.max(r.y2, r.tailwaterDepth) + fb;
    wallHeight = Math.max(wallHeight, top);
  }
  wallHeight = roundUp(wallHeight, 0.05);
  const wallT = roundUp(Math.max(d.minWallThickness, d.wallThicknessRatio * wallHeight), 0.05);

  // Flare from a narrower outlet, limited by the natural spread of the jet.
  let flare: JumpBasinDesign['flare'] = null;
  if (input.inflowWidth !== undefined && reqPositive('inflowWidth', input.inflowWidth) < W) {
    const frMax = Math.max(...rows.map((r) => r.fr1));
    const tan = 1 / (3 * frMax);
    flare = {
      fromWidth: input.inflowWidth,
      toWidth: W,
      tanTheta: tan,
      angleDeg: (Math.atan(tan) * 180) / Math.PI,
      length: (W - input.inflowWidth) / 2 / tan,
    };
  }

  // Slab by flotation.
  const low = rows.reduce((a, r) => (r.Q < a.Q ? r : a));
  const lowRow = input.rows.find((r) => r.Q === low.Q)!;
  const fl = options.flotation ?? {};
  const slab = slabFlotation({
    floorElevation: zf,
    upliftElevation: fl.upliftElevation ?? lowRow.tailwaterElevation,
    waterOnSlabDepth: fl.waterOnSlabDepth ?? 0,
    width: W,
    monolithic: fl.monolithic ?? true,
    wallThickness: wallT,
    wallHeight,
    safetyFactor: fl.safetyFactor ?? d.flotationSafetyFactor,
    minThickness: fl.minThickness ?? d.minSlabThickness,
    concreteUnitWeight: d.concreteUnitWeight,
    waterUnitWeight: d.waterUnitWeight,
    upliftFactor: d.upliftFactor,
  });

  // Exit: from the sill top up to the bed, and the velocity the riprap must resist.
  const sillTop = zf + app.endSill.height;
  const rise = Math.max(0, zb - sillTop);
  let vExit = 0;
  for (const r of rows) {
    const overSill = r.tailwaterDepth - app.endSill.height;
    const overBed = r.tailwaterDepth - Math.max(0, zb - zf);
    const depth = Math.min(overSill, zb > zf ? overBed : overSill);
    if (depth > 0) vExit = Math.max(vExit, r.Q / (W * depth));
  }
  const riprap = riprapBelowSill({
    velocity: vExit > 0 ? vExit : 0.5,
    y2: sizing.y2,
    width: W + 2 * wallT,
    lengthRatio: d.riprapLengthRatio,
    minThickness: d.riprapMinThickness,
    specificGravity: d.stoneSpecificGravity,
    coefficient: d.isbashCoefficient,
  });

  const wingLen = d.wingwallLengthRatio * wallHeight;
  // Cutoffs below the slab (common practice): the downstream one reaches below the riprap.
  const cutUp = { depth: d.upstreamCutoffDepth, thickness: wallT };
  const cutDown = {
    depth: Math.max(d.downstreamCutoffDepth, riprap.thickness + 0.5),
    thickness: wallT,
  };

  // Concrete by element (m³).
  const blockVol = (b: BlockSet | undefined, shape: number): number =>
    b ? b.count * b.height * b.width * b.length * shape : 0;
  const sillVol =
    app.endSill.height > 0
      ? (app.endSill.kind === 'dentated' ? 0.6 : 1) *
        0.5 *
        (app.endSill.height *
          (app.endSill.length +
            Math.max(0, app.endSill.length - app.endSill.upstreamSlope * app.endSill.height))) *
        W
      : 0;
  const slabVol = length * (W + 2 * wallT) * slab.thickness;
  const wallsVol =
    2 * length * wallHeight * wallT + (flare ? 2 * flare.length * wallHeight * wallT : 0);
  const wingVol = 2 * wingLen * (wallHeight / 2) * wallT;
  const cutVol =
    (cutUp.depth * cutUp.thickness + cutDown.depth * cutDown.thickness) * (W + 2 * wallT);
  const blocks =
    blockVol(app.chuteBlocks, 1) +
    blockVol(app.baffleBlocks, app.baffleBlocks?.kind === 'baffle-piers' ? 0.6 : 1);
  const concrete: ConcreteQuantities = {
    slab: slabVol,
    walls: wallsVol,
    blocks,
    sill: sillVol,
    cutoffs: cutVol,
    wingwalls: wingVol,
    total: slabVol + wallsVol + blocks + sillVol + cutVol + wingVol,
    basis:
      'neat-line volumes of the concept geometry (slab under the walls, walls full height over the basin length, wingwalls tapering to half height, blocks as prisms, sill by its section)',
  };

  const items = jumpWarningItems(
    input.type,
    { fr1: sizing.fr1, v1: sizing.v1, q: sizing.q, y2: sizing.y2, length: sizing.length },
    rules,
    d,
  );
  const own = new Set(items.map((w) => w.warning.code));
  for (const warning of sizing.warnings)
    if (!own.has(warning.code)) items.push({ topic: 'narrow', warning });
  const warnings = designWarnings(
    input.type,
    rows,
    items,
    d,
    rules.froudeRange,
    options.submergenceTolerance,
  );
  warnings.push(...slab.notes.map((n) => ({ ...n, at: { type: input.type } })));
  if (input.governingQ !== undefined && input.governingQ !== null) {
    const g = rows.reduce((a, r) => (r.margin < a.margin ? r : a));
    if (g.margin < 0.05 * g.y2) {
      warnings.push(
        warn(
          'basin-sweep-out-margin',
          { Q: dis(g.Q), margin: len(Math.max(0, g.margin)), required: len(g.requiredDepth) },
          { type: input.type, Q: g.Q },
        ),
      );
    }
  }
  const jumpLength = Math.min(length, rules.length(sizing.fr1, sizing.y1, sizing.y2, d));
  const design: JumpBasinDesign = {
    family: 'jump-basin',
    type: input.type,
    name: m.name,
    source: m.source,
    floorElevation: zf,
    channelBedElevation: zb,
    governingQ: input.governingQ ?? null,
    designQ: dr.Q,
    width: W,
    length,
    lengthGoverningQ: longest.length >= sizing.length ? longest.Q : dr.Q,
    sizing,
    endSill: { ...app.endSill, topElevation: sillTop },
    flare,
    walls: {
      height: wallHeight,
      topElevation: zf + wallHeight,
      thickness: wallT,
      freeboard: fbMax,
      maxTailwaterElevation: zf + maxTw,
    },
    wingwalls: { angleDeg: d.wingwallAngleDeg, length: wingLen, height: wallHeight },
    cutoffs: { upstream: cutUp, downstream: cutDown },
    exit: { rise, length: rise * d.exitSlopeHorizontal },
    slab,
    riprap,
    water: {
      Q: dr.Q,
      y1: sizing.y1,
      y2: sizing.y2,
      v1: sizing.v1,
      fr1: sizing.fr1,
      tailwaterElevation: dr.tailwaterElevation,
      jumpLength,
    },
    rows,
    concrete,
    warnings,
    sources: [
      ...sizing.sources,
      'flare tanθ = 1/(3·Fr) [src: HEC-14]',
      'slab by flotation, safety factor 1.3 usual loading [mem: USACE]',
      ...riprap.sources,
    ],
    assumptions: listAssumptions(d),
  };
  if (app.chuteBlocks) design.chuteBlocks = app.chuteBlocks;
  if (app.baffleBlocks) design.baffleBlocks = app.baffleBlocks;
  return design;
}

/**
 * The design's warnings: the sizing's (at the design discharge) and the range-wide ones, each
 * topic said once — a range-wide caution replaces the design-discharge one on the same topic
 * (cavitation, oscillating jump, Froude range), so one V1 never yields two cavitation lines.
 */
function designWarnings(
  type: JumpBasinType,
  rows: ReadonlyArray<{
    Q: number;
    fr1: number;
    v1: number;
    y2: number;
    tailwaterDepth: number;
    requiredDepth: number;
  }>,
  sizing: readonly JumpWarning[],
  d: BasinDefaults,
  range: readonly [number, number],
  tolerance: number | undefined,
): StudyWarning[] {
  const ranged: Array<{
    topic: JumpWarning['topic'] | 'submergence' | 'sweepOut';
    w: StudyWarning;
  }> = [];
  const at = { type };
  const vMax = rows.reduce((a, r) => (r.v1 > a.v1 ? r : a));
  const strongVelocity = sizing.some((w) => w.topic === 'velocity');
  if (type !== 'usbr-1' && vMax.v1 > d.cavitationVelocity && !strongVelocity) {
    ranged.push({
      topic: 'cavitation',
      w: warn(
        'basin-cavitation',
        { v1: vel(vMax.v1), Q: dis(vMax.Q), limit: lim(d, 'cavitationVelocity') },
        at,
      ),
    });
  }
  const osc = rows.filter((r) => r.fr1 >= 2.5 && r.fr1 < 4.5);
  if (osc.length > 0)
    ranged.push({
      topic: 'oscillating',
      w: warn('basin-oscillating', { count: osc.length, Q: dis(osc[0]!.Q) }, at),
    });
  const out = rows.filter((r) => r.fr1 < range[0] || r.fr1 > range[1]);
  if (out.length > 0)
    ranged.push({
      topic: 'froude',
      w: warn(
        'basin-froude-outside',
        { count: out.length, fr1: out[0]!.fr1, Q: dis(out[0]!.Q) },
        at,
      ),
    });
  const excess = rows.filter(
    (r) => jumpPosition(r.tailwaterDepth, r.requiredDepth, tolerance) === 'drowned',
  );
  if (excess.length > 0) {
    const worst = excess.reduce((a, r) =>
      r.tailwaterDepth / r.requiredDepth > a.tailwaterDepth / a.requiredDepth ? r : a,
    );
    ranged.push({
      topic: 'submergence',
      w: warn(
        'basin-submergence',
        {
          count: excess.length,
          ratio: worst.tailwaterDepth / worst.requiredDepth,
          Q: dis(worst.Q),
        },
        at,
      ),
    });
  }
  const short = rows.filter((r) => r.tailwaterDepth < r.requiredDepth - 1e-6);
  if (short.length > 0)
    ranged.push({
      topic: 'sweepOut',
      w: warn('basin-sweep-out', { count: short.length, Q: dis(short[0]!.Q) }, at),
    });
  const covered = new Set(ranged.map((r) => r.topic));
  // A velocity "not advised" at the design discharge also covers a cavitation caution there.
  const keep = sizing.filter(
    (w) => !covered.has(w.topic) && !(w.topic === 'cavitation' && strongVelocity),
  );
  return distinctWarnings([...keep.map((w) => w.warning), ...ranged.map((r) => r.w)]);
}

export interface ImpactBasinDesign {
  family: 'impact-basin';
  type: 'usbr-6';
  name: string;
  source: string;
  floorElevation: number;
  channelBedElevation: number;
  designQ: number;
  sizing: ImpactBasinSizing;
  width: number;
  length: number;
  walls: { height: number; topElevation: number; thickness: number };
  riprap: RiprapProtection;
  water: { Q: number; tailwaterElevation: number };
  concrete: ConcreteQuantities;
  /** as data; phrase with studyWarningText(w, units) */
  warnings: StudyWarning[];
  sources: string[];
  assumptions: Assumption[];
}

/** Type VI in a study: sized at the design discharge with its own rules; floor at the outlet invert. */
export function designImpactBasin(
  c: {
    floorElevation: number;
    channelBedElevation: number;
    designQ: number;
    rows: readonly DesignRow[];
  },
  options: DesignOptions = {},
): ImpactBasinDesign {
  const d = resolveDefaults(options.defaults);
  const zf = reqFinite('floorElevation', c.floorElevation);
  const dr = pickDesignRow(c.rows, c.designQ);
  const maxTw = Math.max(...c.rows.map((r) => r.tailwaterElevation - zf));
  const s = sizeImpactBasin({ Q: dr.Q, velocity: dr.v1, tailwaterDepth: Math.max(0, maxTw) }, d);
  const t = roundUp(Math.max(d.minWallThickness, s.width / 12), 0.05);
  const vExit =
    dr.Q /
    (s.width * Math.max(s.endSill.height, dr.tailwaterElevation - zf - s.endSill.height, 0.1));
  const riprap = riprapBelowSill({
    velocity: vExit,
    y2: s.wallHeight,
    width: s.width,
    lengthRatio: d.riprapLengthRatio,
    minThickness: d.riprapMinThickness,
  });
  const slab = s.length * (s.width + 2 * t) * t;
  const walls = 2 * s.length * s.wallHeight * t + s.width * s.wallHeight * t;
  const baffle = s.width * s.baffleHeight * t;
  const sill = s.width * s.endSill.height * s.endSill.length;
  return {
    family: 'impact-basin',
    type: 'usbr-6',
    name: getDissipator('usbr-6').name,
    source: getDissipator('usbr-6').source,
    floorElevation: zf,
    channelBedElevation: c.channelBedElevation,
    designQ: dr.Q,
    sizing: s,
    width: s.width,
    length: s.length,
    walls: { height: s.wallHeight, topElevation: zf + s.wallHeight, thickness: t },
    riprap,
    water: { Q: dr.Q, tailwaterElevation: dr.tailwaterElevation },
    concrete: {
      slab,
      walls,
      blocks: baffle,
      sill,
      cutoffs: 0,
      wingwalls: 0,
      total: slab + walls + baffle + sill,
      basis:
        'neat-line volumes; wall, floor and baffle thickness W/12 (at least the minimum wall thickness)',
    },
    warnings: [...s.warnings],
    sources: s.sources,
    assumptions: listAssumptions(d),
  };
}

export interface BaffledApronDesign {
  family: 'baffled-apron';
  type: 'usbr-9';
  name: string;
  source: string;
  crestElevation: number;
  channelBedElevation: number;
  designQ: number;
  sizing: BaffledApronSizing;
  width: number;
  length: number;
  concrete: ConcreteQuantities;
  /** as data; phrase with studyWarningText(w, units) */
  warnings: StudyWarning[];
  sources: string[];
  assumptions: Assumption[];
}

/** Type IX in a study: the drop from the crest to the channel bed, sized at the design discharge. */
export function designBaffledApron(
  c: { crestElevation: number; channelBedElevation: number; width: number; designQ: number },
  options: DesignOptions = {},
): BaffledApronDesign {
  const d = resolveDefaults(options.defaults);
  const drop =
    reqFinite('crestElevation', c.crestElevation) -
    reqFinite('channelBedElevation', c.channelBedElevation);
  const s = sizeBaffledApron({ Q: c.designQ, width: c.width, drop: Math.max(drop, 0.1) }, d);
  const t = options.flotation?.minThickness ?? d.minSlabThickness;
  const slab = s.slopeLength * (c.width + 2 * d.minWallThickness) * t;
  const walls = 2 * s.slopeLength * s.wallHeight * d.minWallThickness;
  const baffles =
    s.rows * ((s.rowA.count + s.rowB.count) / 2) * s.baffleHeight * s.baffleWidth * s.baffleHeight;
  return {
    family: 'baffled-apron',
    type: 'usbr-9',
    name: getDissipator('usbr-9').name,
    source: getDissipator('usbr-9').source,
    crestElevation: c.crestElevation,
    channelBedElevation: c.channelBedElevation,
    designQ: c.designQ,
    sizing: s,
    width: c.width,
    length: s.length,
    concrete: {
      slab,
      walls,
      blocks: baffles,
      sill: 0,
      cutoffs: 0,
      wingwalls: 0,
      total: slab + walls + baffles,
      basis: 'neat-line volumes; slab and walls at the minimum thickness',
    },
    warnings: [...s.warnings],
    sources: s.sources,
    assumptions: listAssumptions(d),
  };
}

export interface RiprapApronDesign {
  family: 'riprap-apron';
  type: 'riprap-apron';
  name: string;
  source: string;
  invertElevation: number;
  designQ: number;
  apron: CulvertApron;
  width: number;
  length: number;
  concrete: ConcreteQuantities;
  /** as data; phrase with studyWarningText(w, units) */
  warnings: StudyWarning[];
  sources: string[];
  assumptions: Assumption[];
}

export function designRiprapApron(
  c: {
    invertElevation: number;
    designQ: number;
    culvert: { shape: 'circular' | 'box'; rise: number; span?: number };
    tailwaterElevation?: number;
  },
  options: DesignOptions = {},
): RiprapApronDesign {
  const d = resolveDefaults(options.defaults);
  const tw =
    c.tailwaterElevation !== undefined
      ? Math.max(0, c.tailwaterElevation - c.invertElevation)
      : undefined;
  const a = designCulvertApron({
    Q: c.designQ,
    rise: c.culvert.rise,
    shape: c.culvert.shape,
    ...(c.culvert.span !== undefined ? { span: c.culvert.span } : {}),
    ...(tw !== undefined ? { tailwater: tw } : {}),
  });
  return {
    family: 'riprap-apron',
    type: 'riprap-apron',
    name: getDissipator('riprap-apron').name,
    source: getDissipator('riprap-apron').source,
    invertElevation: c.invertElevation,
    designQ: c.designQ,
    apron: a,
    width: a.widthAtEnd,
    length: a.length,
    concrete: {
      slab: 0,
      walls: 0,
      blocks: 0,
      sill: 0,
      cutoffs: 0,
      wingwalls: 0,
      total: 0,
      basis: 'no concrete: riprap only',
    },
    warnings: [...a.warnings],
    sources: a.sources,
    assumptions: listAssumptions(d, ['apronMaxRise', 'apronMaxFroude']),
  };
}

export type DissipatorDesign =
  JumpBasinDesign | ImpactBasinDesign | BaffledApronDesign | RiprapApronDesign;

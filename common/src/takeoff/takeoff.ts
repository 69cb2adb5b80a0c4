// The take-off of a sized design: concrete, reinforcement and formwork by element, structural
// excavation and backfill, riprap, bedding and geotextile, waterstop and joints. Pure; SI in
// and out (m, m², m³, kg). Neat-line quantities of the concept geometry; every figure they rest
// on is an assumption listed with the take-off (assumptions.ts) and can be overridden.
import type { DesignEntry } from '../basins/study';
import type { DissipatorDesign, JumpBasinDesign } from '../basins/design';
import type { DissipatorTypeId } from '../basins/types';
import { InputError } from '../errors';
import {
  DEFAULT_SOIL,
  SOIL_KINDS,
  SOIL_SIDE_SLOPES,
  TAKEOFF_ASSUMPTIONS,
  TAKEOFF_ASSUMPTION_KEYS,
  type SoilKind,
  type TakeoffAssumption,
  type TakeoffAssumptionKey,
  type TakeoffOverrides,
} from './assumptions';

/** What is bought: one kind per priceable quantity. */
export const TAKEOFF_ITEM_KINDS = [
  'concrete',
  'reinforcement',
  'formwork',
  'excavation',
  'backfill',
  'riprap',
  'riprapMass',
  'bedding',
  'geotextile',
  'waterstop',
  'joint',
] as const;
export type TakeoffItemKind = (typeof TAKEOFF_ITEM_KINDS)[number];

/** The part of the structure a quantity belongs to. */
export const TAKEOFF_ELEMENTS = [
  'floorSlab',
  'sideWalls',
  'chuteBlocks',
  'bafflePiers',
  'floorBlocks',
  'impactBaffle',
  'endSill',
  'cutoffWalls',
  'wingwalls',
  'transition',
  'structure',
  'exitProtection',
] as const;
export type TakeoffElement = (typeof TAKEOFF_ELEMENTS)[number];

/** The unit kind of each item kind (units/ QuantityKind): m³ ⇄ yd³, kg ⇄ lb, m² ⇄ ft², m ⇄ ft. */
export const TAKEOFF_QUANTITY_KINDS = {
  concrete: 'earthwork',
  reinforcement: 'mass',
  formwork: 'area',
  excavation: 'earthwork',
  backfill: 'earthwork',
  riprap: 'earthwork',
  riprapMass: 'mass',
  bedding: 'earthwork',
  geotextile: 'area',
  waterstop: 'length',
  joint: 'length',
} as const satisfies Record<TakeoffItemKind, 'earthwork' | 'mass' | 'area' | 'length'>;
export type TakeoffQuantityKind = (typeof TAKEOFF_QUANTITY_KINDS)[TakeoffItemKind];

/** One quantity of the take-off (SI). */
export interface TakeoffLine {
  /** stable key `${kind}.${element}`, e.g. 'concrete.floorSlab' (what price mappings remember) */
  key: string;
  kind: TakeoffItemKind;
  element: TakeoffElement;
  quantityKind: TakeoffQuantityKind;
  /** m³, kg, m² or m; waste and laps applied where an assumption says so */
  quantity: number;
  /** how it was found, in plain words (SI) */
  basis: string;
}

export interface Takeoff {
  type: DissipatorTypeId;
  /** lines in a fixed order (kind, then element); lines of zero quantity are left out */
  lines: TakeoffLine[];
  /** sum of the lines of each kind, SI */
  totals: Record<TakeoffItemKind, number>;
  assumptions: TakeoffAssumption[];
  soil: SoilKind;
  notes: string[];
}

type Values = Record<TakeoffAssumptionKey, number>;

function isEntry(x: DesignEntry | DissipatorDesign): x is DesignEntry {
  return 'design' in x && typeof (x as DesignEntry).design === 'object';
}

function requireOverride(key: string, v: unknown): number {
  if (typeof v !== 'number' || !Number.isFinite(v) || v < 0)
    throw new InputError(
      `overrides.${key}`,
      'invalid',
      `overrides.${key} must be a non-negative number`,
    );
  return v;
}

/** The thickness figures the design itself sized (the defaults of slab and wall thickness). */
function designThicknesses(d: DissipatorDesign): { slab: number; wall: number } {
  const fromAssumptions = (key: string, fallback: number): number =>
    d.assumptions.find((a) => a.key === key)?.value ?? fallback;
  switch (d.family) {
    case 'jump-basin':
      return { slab: d.slab.thickness, wall: d.walls.thickness };
    case 'impact-basin':
      return { slab: d.walls.thickness, wall: d.walls.thickness };
    case 'baffled-apron':
      return {
        slab: fromAssumptions('minSlabThickness', 0.3),
        wall: fromAssumptions('minWallThickness', 0.3),
      };
    case 'riprap-apron':
      return { slab: 0, wall: 0 };
  }
}

/** The assumptions in force for a design: defaults, the design's own figures, the overrides. */
export function takeoffAssumptions(
  design: DissipatorDesign,
  overrides: TakeoffOverrides = {},
): { assumptions: TakeoffAssumption[]; values: Values; soil: SoilKind } {
  if (overrides === null || typeof overrides !== 'object')
    throw new InputError('overrides', 'invalid', 'overrides must be an object');
  const soil = overrides.soil ?? DEFAULT_SOIL;
  if (!SOIL_KINDS.includes(soil))
    throw new InputError(
      'overrides.soil',
      'invalid',
      `overrides.soil must be one of ${SOIL_KINDS.join(', ')}`,
    );
  const th = designThicknesses(design);
  const designDefault: Partial<Record<TakeoffAssumptionKey, number>> = {
    slabThickness: th.slab,
    wallThickness: th.wall,
    sideSlope: SOIL_SIDE_SLOPES[soil],
  };
  const values = {} as Values;
  const assumptions: TakeoffAssumption[] = TAKEOFF_ASSUMPTION_KEYS.map((key) => {
    const spec = TAKEOFF_ASSUMPTIONS[key];
    const defaultValue = spec.value ?? designDefault[key] ?? 0;
    const o = overrides[key];
    const value = o === undefined ? defaultValue : requireOverride(key, o);
    values[key] = value;
    return { ...spec, key, value, defaultValue, overridden: value !== defaultValue };
  });
  return { assumptions, values, soil };
}

/** A piece of concrete: its neat volume, formed area and the reinforcement ratio it takes. */
interface Piece {
  element: TakeoffElement;
  volume: number;
  formwork: number;
  rebar: TakeoffAssumptionKey;
  basis: string;
}

/** The shell the earthwork is taken around. */
interface Shell {
  /** outside width of the structure (slab under the walls), m */
  outerWidth: number;
  /** length of the structure along the flow (transition included), m */
  length: number;
  /** top of the floor slab, m */
  floorElevation: number;
  /** original ground at the structure: the channel bed, m */
  groundElevation: number;
  /** wall height above the floor, for the joints, m */
  wallHeight: number;
  /** cutoff trenches below the slab: depth × thickness across the outer width */
  trenches: Array<{ depth: number; thickness: number }>;
}

interface Protection {
  thickness: number;
  length: number;
  /** mean width, m */
  width: number;
  what: string;
}

const f3 = (x: number): string => String(Number(x.toPrecision(4)));

function jumpBasinPieces(d: JumpBasinDesign, v: Values): { pieces: Piece[]; shell: Shell } {
  const W = d.width;
  const L = d.length;
  const ts = v.slabThickness;
  const tw = v.wallThickness;
  const H = d.walls.height;
  const B = W + 2 * tw;
  const pieces: Piece[] = [
    {
      element: 'floorSlab',
      volume: L * B * ts,
      formwork: 2 * (L + B) * ts,
      rebar: 'rebarSlab',
      basis: `basin length ${f3(L)} m × outside width ${f3(B)} m × slab ${f3(ts)} m; forms on the slab's edges`,
    },
    {
      element: 'sideWalls',
      volume: 2 * L * H * tw,
      formwork: 4 * L * H,
      rebar: 'rebarWalls',
      basis: `2 walls × length ${f3(L)} m × height ${f3(H)} m × thickness ${f3(tw)} m; forms on both faces`,
    },
  ];
  const blockPiece = (
    element: TakeoffElement,
    b: { count: number; height: number; width: number; length: number },
    shape: number,
    what: string,
  ): Piece => ({
    element,
    volume: b.count * b.height * b.width * b.length * shape,
    formwork: b.count * (2 * b.width * b.height + 2 * b.length * b.height * shape),
    rebar: 'rebarAppurtenances',
    basis: `${b.count} ${what} ${f3(b.width)} m wide × ${f3(b.length)} m long × ${f3(b.height)} m high${shape !== 1 ? ` × section factor ${shape}` : ''}; forms on their faces`,
  });
  if (d.chuteBlocks && d.chuteBlocks.count > 0)
    pieces.push(blockPiece('chuteBlocks', d.chuteBlocks, 1, 'chute blocks'));
  if (d.baffleBlocks && d.baffleBlocks.count > 0) {
    const piers = d.baffleBlocks.kind === 'baffle-piers';
    pieces.push(
      blockPiece(
        piers ? 'bafflePiers' : 'floorBlocks',
        d.baffleBlocks,
        piers ? 0.6 : 1,
        piers ? 'baffle piers' : 'floor blocks',
      ),
    );
  }
  const s = d.endSill;
  if (s.height > 0) {
    const factor = s.kind === 'dentated' ? 0.6 : 1;
    const top = Math.max(0, s.length - s.upstreamSlope * s.height);
    pieces.push({
      element: 'endSill',
      volume: factor * 0.5 * s.height * (s.length + top) * W,
      formwork: factor * s.height * (1 + Math.hypot(1, s.upstreamSlope)) * W,
      rebar: 'rebarAppurtenances',
      basis: `${s.kind} sill ${f3(s.height)} m high, ${f3(s.length)} m at the base, across ${f3(W)} m${factor !== 1 ? ' × 0.6 for the teeth' : ''}; forms on its upstream and downstream faces`,
    });
  }
  const cu = d.cutoffs.upstream;
  const cd = d.cutoffs.downstream;
  pieces.push({
    element: 'cutoffWalls',
    volume: (cu.depth * tw + cd.depth * tw) * B,
    formwork: 0,
    rebar: 'rebarCutoffs',
    basis: `upstream ${f3(cu.depth)} m and downstream ${f3(cd.depth)} m deep × ${f3(tw)} m × outside width ${f3(B)} m; cast against the trench (no forms)`,
  });
  const wl = d.wingwalls.length;
  pieces.push({
    element: 'wingwalls',
    volume: 2 * wl * (H / 2) * tw,
    formwork: 2 * 2 * wl * (H / 2),
    rebar: 'rebarWalls',
    basis: `2 wingwalls ${f3(wl)} m long tapering from ${f3(H)} m to nothing (mean ${f3(H / 2)} m) × ${f3(tw)} m; forms on both faces`,
  });
  let length = L;
  if (d.flare) {
    const fl = d.flare;
    const wallLen = fl.length * Math.hypot(1, fl.tanTheta);
    const floorW = (fl.fromWidth + fl.toWidth) / 2 + 2 * tw;
    const slabVol = fl.length * floorW * ts;
    const wallVol = 2 * wallLen * H * tw;
    pieces.push({
      element: 'transition',
      volume: slabVol + wallVol,
      formwork: 4 * wallLen * H + 2 * fl.length * ts,
      rebar: 'rebarWalls',
      basis: `floor ${f3(fl.length)} m × mean outside width ${f3(floorW)} m × ${f3(ts)} m, and 2 flared walls ${f3(wallLen)} m × ${f3(H)} m × ${f3(tw)} m`,
    });
    length += fl.length;
  }
  return {
    pieces,
    shell: {
      outerWidth: B,
      length,
      floorElevation: d.floorElevation,
      groundElevation: d.channelBedElevation,
      wallHeight: H,
      trenches: [
        { depth: cu.depth, thickness: tw },
        { depth: cd.depth, thickness: tw },
      ],
    },
  };
}

function piecesOf(
  d: DissipatorDesign,
  v: Values,
): { pieces: Piece[]; shell: Shell | null; protection: Protection | null; notes: string[] } {
  const notes: string[] = [];
  switch (d.family) {
    case 'jump-basin': {
      const { pieces, shell } = jumpBasinPieces(d, v);
      const r = d.riprap;
      // The transition's rebar is split: its floor takes the slab ratio (see below).
      return {
        pieces,
        shell,
        protection: {
          thickness: r.thickness,
          length: r.length,
          width: r.width,
          what: 'riprap below the end sill',
        },
        notes,
      };
    }
    case 'impact-basin': {
      const W = d.width;
      const L = d.length;
      const t = v.wallThickness;
      const ts = v.slabThickness;
      const H = d.walls.height;
      const B = W + 2 * t;
      const s = d.sizing;
      const pieces: Piece[] = [
        {
          element: 'floorSlab',
          volume: L * B * ts,
          formwork: 2 * (L + B) * ts,
          rebar: 'rebarSlab',
          basis: `length ${f3(L)} m × outside width ${f3(B)} m × ${f3(ts)} m`,
        },
        {
          element: 'sideWalls',
          volume: 2 * L * H * t + W * H * t,
          formwork: 4 * L * H + 2 * W * H,
          rebar: 'rebarWalls',
          basis: `2 side walls ${f3(L)} m and the back wall ${f3(W)} m, ${f3(H)} m high × ${f3(t)} m`,
        },
        {
          element: 'impactBaffle',
          volume: W * s.baffleHeight * t,
          formwork: 2 * W * s.baffleHeight,
          rebar: 'rebarAppurtenances',
          basis: `hanging baffle ${f3(W)} m × ${f3(s.baffleHeight)} m × ${f3(t)} m`,
        },
        {
          element: 'endSill',
          volume: W * s.endSill.height * s.endSill.length,
          formwork: 2 * W * s.endSill.height,
          rebar: 'rebarAppurtenances',
          basis: `sill ${f3(s.endSill.height)} m × ${f3(s.endSill.length)} m across ${f3(W)} m`,
        },
      ];
      return {
        pieces,
        shell: {
          outerWidth: B,
          length: L,
          floorElevation: d.floorElevation,
          groundElevation: d.channelBedElevation,
          wallHeight: H,
          trenches: [],
        },
        protection: {
          thickness: d.riprap.thickness,
          length: d.riprap.length,
          width: d.riprap.width,
          what: 'riprap below the end sill',
        },
        notes,
      };
    }
    case 'baffled-apron': {
      const s = d.sizing;
      const t = v.wallThickness;
      const ts = v.slabThickness;
      const B = d.width + 2 * t;
      const baffles = s.rows * ((s.rowA.count + s.rowB.count) / 2);
      notes.push(
        'The earthwork of a sloping apron (cut and fill along the slope) is not taken off at concept level: price it from the grading plan.',
      );
      return {
        pieces: [
          {
            element: 'floorSlab',
            volume: s.slopeLength * B * ts,
            formwork: 2 * (s.slopeLength + B) * ts,
            rebar: 'rebarSlab',
            basis: `sloping apron ${f3(s.slopeLength)} m along the slope × ${f3(B)} m × ${f3(ts)} m`,
          },
          {
            element: 'sideWalls',
            volume: 2 * s.slopeLength * s.wallHeight * t,
            formwork: 4 * s.slopeLength * s.wallHeight,
            rebar: 'rebarWalls',
            basis: `2 walls ${f3(s.slopeLength)} m × ${f3(s.wallHeight)} m × ${f3(t)} m`,
          },
          {
            element: 'bafflePiers',
            volume: baffles * s.baffleHeight * s.baffleWidth * s.baffleHeight,
            formwork: baffles * 4 * s.baffleWidth * s.baffleHeight,
            rebar: 'rebarAppurtenances',
            basis: `${f3(baffles)} baffle piers ${f3(s.baffleWidth)} m wide, ${f3(s.baffleHeight)} m high and long`,
          },
        ],
        shell: null,
        protection: null,
        notes,
      };
    }
    case 'riprap-apron': {
      const a = d.apron;
      return {
        pieces: [],
        shell: null,
        protection: {
          thickness: a.thickness,
          length: a.length,
          width: (a.widthAtOutlet + a.widthAtEnd) / 2,
          what: 'riprap apron at the outlet',
        },
        notes,
      };
    }
  }
}

/**
 * Volume of a pit with a rectangular base a × b, depth D and side slopes z (H:V) on all four
 * sides: the prismoid V = a·b·D + z·D²·(a + b) + (4/3)·z²·D³ [relation: solid geometry, exact
 * for plane slopes].
 */
export function pitVolume(a: number, b: number, D: number, z: number): number {
  return a * b * D + z * D * D * (a + b) + (4 / 3) * z * z * D * D * D;
}

/**
 * The take-off of one sized design (a study's `design` or `alternatives` entry, or the design
 * itself), with the assumptions in force and `overrides` applied. Pure; SI.
 */
export function takeoff(
  entry: DesignEntry | DissipatorDesign,
  overrides: TakeoffOverrides = {},
): Takeoff {
  const design = isEntry(entry) ? entry.design : entry;
  if (!design || typeof design !== 'object' || !('family' in design))
    throw new InputError('design', 'invalid', 'the take-off needs a sized design');
  const { assumptions, values: v, soil } = takeoffAssumptions(design, overrides);
  const { pieces, shell, protection, notes } = piecesOf(design, v);
  const lines: TakeoffLine[] = [];
  const add = (kind: TakeoffItemKind, element: TakeoffElement, quantity: number, basis: string) => {
    if (!(quantity > 0)) return;
    lines.push({
      key: `${kind}.${element}`,
      kind,
      element,
      quantityKind: TAKEOFF_QUANTITY_KINDS[kind],
      quantity,
      basis,
    });
  };
  const waste = v.concreteWaste;
  for (const p of pieces)
    add(
      'concrete',
      p.element,
      p.volume * (1 + waste),
      `${p.basis}; neat ${f3(p.volume)} m³ + ${f3(waste * 100)} % waste`,
    );
  for (const p of pieces) {
    // A transition carries a floor and walls: its floor takes the slab ratio.
    if (p.element === 'transition' && design.family === 'jump-basin' && design.flare) {
      const fl = design.flare;
      const floor =
        fl.length * ((fl.fromWidth + fl.toWidth) / 2 + 2 * v.wallThickness) * v.slabThickness;
      const mass = floor * v.rebarSlab + (p.volume - floor) * v.rebarWalls;
      add(
        'reinforcement',
        p.element,
        mass,
        `floor ${f3(floor)} m³ × ${f3(v.rebarSlab)} kg/m³ + walls ${f3(p.volume - floor)} m³ × ${f3(v.rebarWalls)} kg/m³ (neat volumes)`,
      );
      continue;
    }
    add(
      'reinforcement',
      p.element,
      p.volume * v[p.rebar],
      `neat ${f3(p.volume)} m³ × ${f3(v[p.rebar])} kg/m³`,
    );
  }
  for (const p of pieces) add('formwork', p.element, p.formwork, p.basis);

  if (shell) {
    const bottom = shell.floorElevation - v.slabThickness;
    const D = Math.max(0, shell.groundElevation - bottom);
    const a = shell.length + 2 * v.workingRoom;
    const b = shell.outerWidth + 2 * v.workingRoom;
    const z = v.sideSlope;
    const pit = pitVolume(a, b, D, z);
    const trenches =
      shell.trenches.reduce((s, t) => s + t.depth * t.thickness, 0) * shell.outerWidth;
    add(
      'excavation',
      'structure',
      pit + trenches,
      `pit to the slab underside ${f3(D)} m below the channel bed, base ${f3(a)} m × ${f3(b)} m (structure plus ${f3(v.workingRoom)} m working room each side), side slopes ${f3(z)}:1 (${soil}); plus cutoff trenches ${f3(trenches)} m³`,
    );
    add(
      'backfill',
      'structure',
      Math.max(0, pit - shell.length * shell.outerWidth * D),
      `the pit less the structure's outline below the channel bed (${f3(shell.length)} m × ${f3(shell.outerWidth)} m × ${f3(D)} m)`,
    );
    if (D === 0)
      notes.push(
        'The slab underside stands at or above the channel bed: no structural excavation; any fill under the structure is not taken off.',
      );
    const n = Math.max(0, Math.ceil(shell.length / v.jointSpacing - 1e-9) - 1);
    const across = shell.outerWidth + 2 * shell.wallHeight;
    add(
      'joint',
      'structure',
      n * across,
      `${n} transverse joints (every ${f3(v.jointSpacing)} m over ${f3(shell.length)} m), each across the slab ${f3(shell.outerWidth)} m and up both walls ${f3(shell.wallHeight)} m`,
    );
    add(
      'waterstop',
      'structure',
      n * across + 2 * shell.length,
      `in the ${n} transverse joints and along both wall-to-slab construction joints (2 × ${f3(shell.length)} m)`,
    );
  }
  if (protection) {
    const area = protection.length * protection.width;
    const vol = protection.thickness * area;
    add(
      'riprap',
      'exitProtection',
      vol,
      `${protection.what}: ${f3(protection.length)} m × ${f3(protection.width)} m × ${f3(protection.thickness)} m layer`,
    );
    add(
      'riprapMass',
      'exitProtection',
      vol * v.riprapDensity,
      `${f3(vol)} m³ × ${f3(v.riprapDensity)} kg/m³ placed`,
    );
    add(
      'bedding',
      'exitProtection',
      v.beddingThickness * area,
      `${f3(area)} m² × ${f3(v.beddingThickness)} m under the riprap`,
    );
    add(
      'geotextile',
      'exitProtection',
      area * (1 + v.geotextileLap),
      `${f3(area)} m² under the bedding + ${f3(v.geotextileLap * 100)} % laps and waste`,
    );
    add(
      'excavation',
      'exitProtection',
      (protection.thickness + v.beddingThickness) * area,
      `to set the riprap and bedding flush with the channel bed: ${f3(area)} m² × ${f3(protection.thickness + v.beddingThickness)} m`,
    );
  }
  const kindOrder = new Map(TAKEOFF_ITEM_KINDS.map((k, i) => [k, i]));
  const elOrder = new Map(TAKEOFF_ELEMENTS.map((k, i) => [k, i]));
  lines.sort(
    (x, y) =>
      kindOrder.get(x.kind)! - kindOrder.get(y.kind)! ||
      elOrder.get(x.element)! - elOrder.get(y.element)!,
  );
  const totals = Object.fromEntries(TAKEOFF_ITEM_KINDS.map((k) => [k, 0])) as Record<
    TakeoffItemKind,
    number
  >;
  for (const l of lines) totals[l.kind] += l.quantity;
  return { type: design.type, lines, totals, assumptions, soil, notes };
}

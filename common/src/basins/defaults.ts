// Every number the dissipator engine assumes, with where it comes from. Values marked 'mem'
// were recalled from the named publication and not re-read: they are defaults the user can
// override, and every result lists them (listAssumptions) so they are never hidden.

/** How sure we are of a value: seen in the source, recalled from it, computed, or trade habit. */
export type Confidence = 'src' | 'mem' | 'calc' | 'practice';

export interface Provenance {
  /** the publication (or "common practice") */
  source: string;
  confidence: Confidence;
  /** what the value is, in plain words (shown with the result) */
  label: string;
  /** unit of the value, SI */
  unit: string;
}

import { InputError } from '../errors';
import { FOOT } from '../units/constants';
import type { Quantity } from '../warnings';

/** A figure as it was published: its number, the unit system it was printed in, and its kind. */
export interface PublishedFigure {
  value: number;
  units: 'SI' | 'US';
  kind: 'velocity' | 'discharge' | 'unitDischarge' | 'unitWeight' | 'length';
}

// SI per US unit of each kind, from the exact foot and pound (NIST SP 811: 1 ft = 0.3048 m,
// 1 lb = 0.45359237 kg; standard gravity 9.80665 m/s², so 1 lbf = 4.4482216152605 N).
const LBF_N = 0.45359237 * 9.80665;
const SI_PER_US: Record<PublishedFigure['kind'], number> = {
  length: FOOT,
  velocity: FOOT,
  discharge: FOOT ** 3,
  unitDischarge: FOOT ** 2,
  unitWeight: LBF_N / FOOT ** 3 / 1000, // lbf/ft³ → kN/m³
};

/** The SI value the engine computes with: the published figure, converted exactly if it is US. */
export function publishedSI(f: PublishedFigure): number {
  return f.units === 'SI' ? f.value : f.value * SI_PER_US[f.kind];
}

/**
 * Limits and defaults published in US customary units, kept in that unit (hydraulics.md §4;
 * the confidence of each is in BASIN_DEFAULT_PROVENANCE). The engine uses their exact SI
 * conversion; a US project shows them exactly as published (50 ft/s, never 49.2126 ft/s).
 */
export const PUBLISHED_FIGURES = {
  // EM-25: Type II basins were tested to about 500 cfs/ft [mem].
  type2MaxUnitDischarge: { value: 500, units: 'US', kind: 'unitDischarge' },
  // EM-25: Type III to about 200 cfs/ft [mem].
  type3MaxUnitDischarge: { value: 200, units: 'US', kind: 'unitDischarge' },
  // EM-25: baffle piers need care above 50 ft/s [src], are not used above 60 ft/s [mem].
  type3VelocityWarn: { value: 50, units: 'US', kind: 'velocity' },
  type3VelocityFail: { value: 60, units: 'US', kind: 'velocity' },
  // SAF: chute blocks not advised above 60 ft/s [src].
  safVelocityFail: { value: 60, units: 'US', kind: 'velocity' },
  // Type VI (impact basin): up to 400 cfs and 50 ft/s [src].
  type6MaxDischarge: { value: 400, units: 'US', kind: 'discharge' },
  type6MaxVelocity: { value: 50, units: 'US', kind: 'velocity' },
  // Type IX (baffled apron): up to 60 cfs/ft [src].
  type9MaxUnitDischarge: { value: 60, units: 'US', kind: 'unitDischarge' },
  // EM-25: blocks risk cavitation above 50 ft/s [src]; jet structures beyond 60 ft/s [mem].
  cavitationVelocity: { value: 50, units: 'US', kind: 'velocity' },
  specialistVelocity: { value: 60, units: 'US', kind: 'velocity' },
} as const satisfies Record<string, PublishedFigure>;

const P = PUBLISHED_FIGURES;

/** A default kept in the unit it was published in. */
export type PublishedKey = keyof typeof PUBLISHED_FIGURES;

/**
 * A limit in force as a quantity to quote: its kind and SI value, and its key when the engineer
 * kept the published default (then a project in the published system shows it exactly as
 * published: '50 ft/s', never '49.2 ft/s'; common/src/messages phrases it).
 * @example limitQuantity(resolveDefaults(), 'type3VelocityWarn') // { kind: 'velocity', si: 15.24, published: 'type3VelocityWarn' }
 */
export function limitQuantity(d: BasinDefaults, key: PublishedKey): Quantity {
  const q: Quantity = { kind: PUBLISHED_FIGURES[key].kind, si: d[key] };
  if (d[key] === BASIN_DEFAULTS[key]) q.published = key;
  return q;
}

const DSD = 'USBR, Design of Small Dams';
const EM25 =
  'USBR EM-25 (Peterka 1958), Hydraulic Design of Stilling Basins and Energy Dissipators';
const SAF = 'Blaisdell 1948, SAF stilling basin (via USBR / USDA)';
const HEC14 =
  'FHWA HEC-14 (2006), Hydraulic Design of Energy Dissipators for Culverts and Channels';

/** Overridable defaults of the dissipator engine (SI: m, s, m³/s, kN/m³). */
export const BASIN_DEFAULTS = {
  // Tailwater factors C in TW ≥ C·y2 (SAF uses its own Froude-dependent relation).
  tailwaterFactorType1: 1.0,
  tailwaterFactorType2: 1.05,
  tailwaterFactorType3: 1.0,
  tailwaterFactorType4: 1.1,
  // Basin lengths.
  type2LengthRatioAtFr4_5: 4.0,
  type2LengthRatioAtFr14: 4.4,
  type3LengthRatioAtFr4_5: 2.3,
  type3LengthRatioAtFr10: 2.8,
  safTailwaterLowIntercept: 1.1,
  safTailwaterLowDivisor: 120,
  safTailwaterMid: 0.85,
  safTailwaterHighIntercept: 1.0,
  safTailwaterHighDivisor: 800,
  safLengthCoefficient: 4.5,
  safLengthExponent: 0.76,
  // Screening limits.
  type2MaxUnitDischarge: publishedSI(P.type2MaxUnitDischarge),
  type3MaxUnitDischarge: publishedSI(P.type3MaxUnitDischarge),
  type3VelocityWarn: publishedSI(P.type3VelocityWarn),
  type3VelocityFail: publishedSI(P.type3VelocityFail),
  safVelocityFail: publishedSI(P.safVelocityFail),
  type6MaxDischarge: publishedSI(P.type6MaxDischarge),
  type6MaxVelocity: publishedSI(P.type6MaxVelocity),
  type9MaxUnitDischarge: publishedSI(P.type9MaxUnitDischarge),
  type9MaxApproachFroude: 1.5,
  apronMaxRise: 1.5,
  apronMaxFroude: 2.5,
  cavitationVelocity: publishedSI(P.cavitationVelocity),
  specialistVelocity: publishedSI(P.specialistVelocity),
  specialistHead: 50,
  slottedBucketTailwaterRatio: 1.1,
  // Appurtenance proportions.
  type2SillHeightRatio: 0.2,
  type2ToothRatio: 0.15,
  type3PierDistanceRatio: 0.8,
  type4DeflectorHeightRatio: 2,
  type4DeflectorSpacingRatio: 2.5,
  type4SillHeightRatio: 1.25,
  safBlockRatio: 0.75,
  safSillRatio: 0.07,
  safFloorBlockPosition: 1 / 3,
  chuteBlockLengthRatio: 2,
  // Type VI (impact basin) width curve W/ye = a·Fr^b.
  type6WidthCoefficient: 2.88,
  type6WidthExponent: 0.566,
  // Type IX (baffled apron).
  type9BaffleHeightRatio: 0.8,
  type9BaffleWidthRatio: 1.5,
  type9RowSpacingRatio: 2,
  type9WallHeightRatio: 3,
  type9MinRows: 4,
  type9ChuteSlope: 2,
  // Freeboard 0.1·(V1 + y2), ft and ft/s.
  freeboardCoefficient: 0.1,
  // Riprap below the basin.
  stoneSpecificGravity: 2.65,
  isbashCoefficient: 0.86,
  riprapLengthRatio: 5,
  riprapMinThickness: 0.3,
  // Structure.
  flotationSafetyFactor: 1.3,
  minSlabThickness: 0.3,
  minWallThickness: 0.3,
  wallThicknessRatio: 0.1,
  upliftFactor: 1.0,
  concreteUnitWeight: 23.5,
  waterUnitWeight: 9.81,
  wingwallAngleDeg: 45,
  wingwallLengthRatio: 1.0,
  upstreamCutoffDepth: 1.0,
  downstreamCutoffDepth: 1.5,
  exitSlopeHorizontal: 3,
} as const;

export type BasinDefaults = { -readonly [K in keyof typeof BASIN_DEFAULTS]: number };
export type BasinDefaultKey = keyof BasinDefaults;

/** Where each default comes from; a test checks every key has one. */
export const BASIN_DEFAULT_PROVENANCE: Record<BasinDefaultKey, Provenance> = {
  tailwaterFactorType1: {
    source: EM25,
    confidence: 'src',
    label: 'Type I tailwater factor C (TW ≥ C·y2)',
    unit: '-',
  },
  tailwaterFactorType2: {
    source: EM25,
    confidence: 'mem',
    label: 'Type II tailwater factor C',
    unit: '-',
  },
  tailwaterFactorType3: {
    source: EM25,
    confidence: 'mem',
    label: 'Type III tailwater factor C',
    unit: '-',
  },
  tailwaterFactorType4: {
    source: EM25,
    confidence: 'mem',
    label: 'Type IV tailwater factor C',
    unit: '-',
  },
  type2LengthRatioAtFr4_5: {
    source: EM25,
    confidence: 'mem',
    label: 'Type II basin length / y2 at Fr1 = 4.5',
    unit: '-',
  },
  type2LengthRatioAtFr14: {
    source: EM25,
    confidence: 'mem',
    label: 'Type II basin length / y2 at Fr1 ≥ 14',
    unit: '-',
  },
  type3LengthRatioAtFr4_5: {
    source: EM25,
    confidence: 'mem',
    label: 'Type III basin length / y2 at Fr1 = 4.5',
    unit: '-',
  },
  type3LengthRatioAtFr10: {
    source: EM25,
    confidence: 'mem',
    label: 'Type III basin length / y2 at Fr1 ≥ 10',
    unit: '-',
  },
  safTailwaterLowIntercept: {
    source: SAF,
    confidence: 'mem',
    label: 'SAF tailwater factor C = a − Fr1²/b for Fr1 1.7–5.5: a',
    unit: '-',
  },
  safTailwaterLowDivisor: {
    source: SAF,
    confidence: 'mem',
    label: 'SAF tailwater factor C = a − Fr1²/b for Fr1 1.7–5.5: b',
    unit: '-',
  },
  safTailwaterMid: {
    source: SAF,
    confidence: 'mem',
    label: 'SAF tailwater factor C for Fr1 5.5–11',
    unit: '-',
  },
  safTailwaterHighIntercept: {
    source: SAF,
    confidence: 'mem',
    label: 'SAF tailwater factor C = a − Fr1²/b for Fr1 11–17: a',
    unit: '-',
  },
  safTailwaterHighDivisor: {
    source: SAF,
    confidence: 'mem',
    label: 'SAF tailwater factor C = a − Fr1²/b for Fr1 11–17: b',
    unit: '-',
  },
  safLengthCoefficient: {
    source: SAF,
    confidence: 'mem',
    label: 'SAF length L = a·y2/Fr1^b: a',
    unit: '-',
  },
  safLengthExponent: {
    source: SAF,
    confidence: 'mem',
    label: 'SAF length L = a·y2/Fr1^b: b',
    unit: '-',
  },
  type2MaxUnitDischarge: {
    source: EM25,
    confidence: 'mem',
    label: 'Type II largest tested unit discharge',
    unit: 'm²/s',
  },
  type3MaxUnitDischarge: {
    source: EM25,
    confidence: 'mem',
    label: 'Type III largest unit discharge',
    unit: 'm²/s',
  },
  type3VelocityWarn: {
    source: EM25,
    confidence: 'src',
    label: 'Type III inflow velocity above which to take care (cavitation on piers)',
    unit: 'm/s',
  },
  type3VelocityFail: {
    source: EM25,
    confidence: 'mem',
    label: 'Type III inflow velocity above which baffle piers are not used',
    unit: 'm/s',
  },
  safVelocityFail: {
    source: SAF,
    confidence: 'src',
    label: 'SAF inflow velocity above which chute blocks are not advised',
    unit: 'm/s',
  },
  type6MaxDischarge: {
    source: HEC14,
    confidence: 'src',
    label: 'Type VI largest discharge',
    unit: 'm³/s',
  },
  type6MaxVelocity: {
    source: HEC14,
    confidence: 'src',
    label: 'Type VI largest entering velocity',
    unit: 'm/s',
  },
  type9MaxUnitDischarge: {
    source: DSD,
    confidence: 'src',
    label: 'Type IX largest unit discharge',
    unit: 'm²/s',
  },
  type9MaxApproachFroude: {
    source: 'common practice',
    confidence: 'practice',
    label: 'Type IX: largest Froude number still "near critical" at entry',
    unit: '-',
  },
  apronMaxRise: {
    source: HEC14,
    confidence: 'src',
    label: 'Riprap apron: largest culvert rise',
    unit: 'm',
  },
  apronMaxFroude: {
    source: HEC14,
    confidence: 'mem',
    label: 'Riprap apron: largest outlet Froude number',
    unit: '-',
  },
  cavitationVelocity: {
    source: EM25,
    confidence: 'src',
    label: 'Inflow velocity above which blocks risk cavitation (model study advised)',
    unit: 'm/s',
  },
  specialistVelocity: {
    source: EM25,
    confidence: 'mem',
    label: 'Inflow velocity beyond which a jet structure is the likely answer',
    unit: 'm/s',
  },
  specialistHead: {
    source: 'common practice',
    confidence: 'practice',
    label: 'Head above the floor beyond which a jet structure is the likely answer',
    unit: 'm',
  },
  slottedBucketTailwaterRatio: {
    source: EM25,
    confidence: 'mem',
    label: 'Tailwater / sequent depth at bed level above which a submerged bucket is indicated',
    unit: '-',
  },
  type2SillHeightRatio: {
    source: EM25,
    confidence: 'mem',
    label: 'Type II dentated sill height / y2',
    unit: '-',
  },
  type2ToothRatio: {
    source: EM25,
    confidence: 'mem',
    label: 'Type II sill tooth width and gap / y2',
    unit: '-',
  },
  type3PierDistanceRatio: {
    source: EM25,
    confidence: 'mem',
    label: 'Type III distance from the chute blocks to the baffle piers / y2',
    unit: '-',
  },
  type4DeflectorHeightRatio: {
    source: EM25,
    confidence: 'mem',
    label: 'Type IV deflector block height / y1',
    unit: '-',
  },
  type4DeflectorSpacingRatio: {
    source: EM25,
    confidence: 'mem',
    label: 'Type IV space between deflector blocks / block width',
    unit: '-',
  },
  safBlockRatio: {
    source: SAF,
    confidence: 'mem',
    label: 'SAF chute and floor block width and spacing / y1',
    unit: '-',
  },
  safSillRatio: { source: SAF, confidence: 'mem', label: 'SAF end sill height / y2', unit: '-' },
  safFloorBlockPosition: {
    source: SAF,
    confidence: 'mem',
    label: 'SAF floor blocks: distance from the chute blocks / basin length',
    unit: '-',
  },
  type4SillHeightRatio: {
    source: EM25,
    confidence: 'mem',
    label: 'Type IV optional solid sill height / y1',
    unit: '-',
  },
  chuteBlockLengthRatio: {
    source: 'common practice',
    confidence: 'practice',
    label: 'Chute or deflector block length along the flow / height (drawing and quantities)',
    unit: '-',
  },
  type6WidthCoefficient: {
    source: HEC14,
    confidence: 'mem',
    label: 'Type VI width curve W/ye = a·Fr^b: a',
    unit: '-',
  },
  type6WidthExponent: {
    source: HEC14,
    confidence: 'mem',
    label: 'Type VI width curve W/ye = a·Fr^b: b',
    unit: '-',
  },
  type9BaffleHeightRatio: {
    source: DSD,
    confidence: 'mem',
    label: 'Type IX baffle height / critical depth',
    unit: '-',
  },
  type9BaffleWidthRatio: {
    source: DSD,
    confidence: 'mem',
    label: 'Type IX baffle width and space / baffle height',
    unit: '-',
  },
  type9RowSpacingRatio: {
    source: DSD,
    confidence: 'mem',
    label: 'Type IX row spacing along the slope / baffle height',
    unit: '-',
  },
  type9WallHeightRatio: {
    source: DSD,
    confidence: 'mem',
    label: 'Type IX wall height (normal to the slope) / baffle height',
    unit: '-',
  },
  type9MinRows: {
    source: DSD,
    confidence: 'mem',
    label: 'Type IX least number of baffle rows',
    unit: '-',
  },
  type9ChuteSlope: {
    source: DSD,
    confidence: 'mem',
    label: 'Type IX apron slope, horizontal per 1 vertical',
    unit: '-',
  },
  freeboardCoefficient: {
    source: DSD,
    confidence: 'mem',
    label: 'Freeboard = k·(V1 + y2) in ft and ft/s: k',
    unit: '-',
  },
  stoneSpecificGravity: {
    source: 'common practice',
    confidence: 'practice',
    label: 'Specific gravity of riprap stone',
    unit: '-',
  },
  isbashCoefficient: {
    source: 'Isbash (via HEC-14 / USACE)',
    confidence: 'src',
    label: 'Isbash coefficient C (0.86 turbulent, 1.20 low turbulence)',
    unit: '-',
  },
  riprapLengthRatio: {
    source: EM25,
    confidence: 'mem',
    label: 'Length of riprap below the end sill / y2',
    unit: '-',
  },
  riprapMinThickness: {
    source: 'common practice',
    confidence: 'practice',
    label: 'Least riprap layer thickness',
    unit: 'm',
  },
  flotationSafetyFactor: {
    source: 'USACE (usual loading)',
    confidence: 'mem',
    label: 'Safety factor against flotation, usual loading',
    unit: '-',
  },
  minSlabThickness: {
    source: 'common practice',
    confidence: 'practice',
    label: 'Least floor slab thickness',
    unit: 'm',
  },
  minWallThickness: {
    source: 'common practice',
    confidence: 'practice',
    label: 'Least wall thickness',
    unit: 'm',
  },
  wallThicknessRatio: {
    source: 'common practice',
    confidence: 'practice',
    label: 'Wall thickness / wall height (concept cantilever walls)',
    unit: '-',
  },
  upliftFactor: {
    source: 'common practice',
    confidence: 'practice',
    label: 'Share of the full uplift head acting under the slab (1 = no drains)',
    unit: '-',
  },
  concreteUnitWeight: {
    source: 'common practice',
    confidence: 'practice',
    label: 'Unit weight of reinforced concrete',
    unit: 'kN/m³',
  },
  waterUnitWeight: {
    source: 'standard (ρ·g)',
    confidence: 'calc',
    label: 'Unit weight of water',
    unit: 'kN/m³',
  },
  wingwallAngleDeg: {
    source: SAF,
    confidence: 'mem',
    label: 'Wingwall angle to the basin axis',
    unit: '°',
  },
  wingwallLengthRatio: {
    source: 'common practice',
    confidence: 'practice',
    label: 'Wingwall length / wall height',
    unit: '-',
  },
  upstreamCutoffDepth: {
    source: 'common practice',
    confidence: 'practice',
    label: 'Upstream cutoff depth below the slab',
    unit: 'm',
  },
  downstreamCutoffDepth: {
    source: 'common practice',
    confidence: 'practice',
    label: 'Downstream cutoff depth below the slab',
    unit: 'm',
  },
  exitSlopeHorizontal: {
    source: 'common practice',
    confidence: 'practice',
    label: 'Exit slope from the end sill up to the channel bed, horizontal per 1 vertical',
    unit: '-',
  },
};

/** The defaults with the user's overrides applied; rejects unknown keys and bad numbers. */
// Sizing calls this once per discharge with the same object: resolved once per object.
const RESOLVED = new WeakMap<Partial<BasinDefaults>, Readonly<BasinDefaults>>();

export function resolveDefaults(overrides: Partial<BasinDefaults> = {}): BasinDefaults {
  const known = RESOLVED.get(overrides);
  if (known) return { ...known };
  const out = resolveOnce(overrides);
  RESOLVED.set(overrides, { ...out });
  return out;
}

function resolveOnce(overrides: Partial<BasinDefaults>): BasinDefaults {
  const out: BasinDefaults = { ...BASIN_DEFAULTS };
  for (const [key, value] of Object.entries(overrides)) {
    if (!(key in BASIN_DEFAULTS))
      throw new InputError(
        `defaults.${key}`,
        'unknown-option',
        `defaults.${key} is not a known dissipator default`,
        {},
      );
    if (value === undefined) continue;
    if (typeof value !== 'number' || !Number.isFinite(value) || value < 0) {
      throw new InputError(
        `defaults.${key}`,
        'negative',
        `defaults.${key} must be a non-negative finite number (got ${String(value)})`,
        {},
      );
    }
    out[key as BasinDefaultKey] = value;
  }
  return out;
}

/** One assumption as shown with a result. */
export interface Assumption extends Provenance {
  key: BasinDefaultKey;
  value: number;
  /** the published (or habitual) default */
  defaultValue: number;
  overridden: boolean;
}

/** Every default in force, with its source and whether the user changed it. */
export function listAssumptions(
  defaults: BasinDefaults,
  keys?: readonly BasinDefaultKey[],
): Assumption[] {
  const all = keys ?? (Object.keys(BASIN_DEFAULTS) as BasinDefaultKey[]);
  return all.map((key) => ({
    key,
    value: defaults[key],
    defaultValue: BASIN_DEFAULTS[key],
    overridden: defaults[key] !== BASIN_DEFAULTS[key],
    ...BASIN_DEFAULT_PROVENANCE[key],
  }));
}

// The one map of which quantity each field holds (issue 7 item 3): toSI/fromSI (units/index.ts)
// and the web's converters read it. Fields not listed are dimensionless (Fr, n, slopes, ratios).
import type { JumpLocation, JumpSituation } from '../hydraulics/profiles';
import type { StudyInput } from '../range/types';
import type { QuantityKind } from './index';

/** The keys of T whose values are numbers (optional ones included). */
export type NumericKeys<T> = {
  [K in keyof T]-?: NonNullable<T[K]> extends number ? K : never;
}[keyof T];

/** A kind for every numeric key of T: null says the number is dimensionless. */
export type KindsOf<T> = { readonly [K in NumericKeys<T>]: QuantityKind | null };

/**
 * The keys of every number anywhere in T (nested objects, array items, each member of a union),
 * for a flat kind map of a small tree such as the jump-position tool's situation.
 */
export type DeepNumericKeys<T> = T extends readonly (infer E)[]
  ? DeepNumericKeys<E>
  : T extends object
    ? {
        [K in keyof T]-?: NonNullable<T[K]> extends number
          ? K
          : NonNullable<T[K]> extends object
            ? DeepNumericKeys<NonNullable<T[K]>>
            : never;
      }[keyof T]
    : never;

/** A kind for every number anywhere in T, by key: null says the number is dimensionless. */
export type DeepKindsOf<T> = { readonly [K in DeepNumericKeys<T> & string]: QuantityKind | null };

/**
 * The quantity of every number of a jump-position situation (hydraulics/profiles.ts), at any
 * depth (section, upstream and downstream reaches). Typed with `satisfies`: a numeric field added
 * to JumpSituation without an entry here fails the type-check.
 */
export const JUMP_SITUATION_KINDS = {
  Q: 'discharge',
  width: 'length',
  bottomWidth: 'length',
  sideSlope: null,
  diameter: 'length',
  slope: null,
  manningN: null,
  tailwaterDepth: 'length',
  opening: 'length',
  Cc: null,
  upstreamDepth: 'length',
  crestHeight: 'length',
  lossFraction: null,
} as const satisfies DeepKindsOf<JumpSituation>;

/** The quantity of every number of a jump-position answer (profiles' x and y, the notes' y1). */
export const JUMP_LOCATION_KINDS = {
  distance: 'length',
  yToe: 'length',
  ySequent: 'length',
  criticalDepth: 'length',
  x: 'length',
  y: 'length',
  y1: 'length',
} as const satisfies DeepKindsOf<JumpLocation>;

/**
 * The quantity of every number at the top of a StudyInput. Typed with `satisfies`: a numeric
 * field added to StudyInput without an entry here fails the type-check.
 */
export const STUDY_INPUT_KINDS = {
  channelBedElevation: 'length',
  basinWidth: 'length',
  designDischarge: 'discharge',
  tailwaterFactor: null,
  floorElevation: 'length',
  floorSafetyDepth: 'length',
  submergenceTolerance: null,
  floorManningN: null,
} as const satisfies KindsOf<StudyInput>;

/** Lengths and elevations, by key, wherever they appear (inputs, results, designs, the jump tool). */
const LENGTH_KEYS = [
  'y',
  'y1',
  'y2',
  'yc',
  'x',
  'depth',
  'elevation',
  'crestElevation',
  'invertElevation',
  'upstreamElevation',
  'upstreamDepth',
  'opening',
  'width',
  'bottomWidth',
  'diameter',
  'crestHeight',
  'L',
  'H0',
  'headLoss',
  'height',
  'length',
  'rollerLength',
  'requiredDepth',
  'margin',
  'tailwaterElevation',
  'tailwaterDepth',
  'approachVelocityHead',
  'E1',
  'E2',
  'deltaE',
  'criticalDepth',
  'requiredElevation',
  'depthBelowBed',
  'heightAboveBed',
  'safetyDepth',
  'sweepOutDistance',
  'distance',
  'yToe',
  'ySequent',
  'head',
  // Dissipator options and designs (basins/): blocks, sill, walls, slab, riprap, aprons.
  'requiredTailwaterDepth',
  'spacing',
  'nominalSpacing',
  'wallSpace',
  'wallSpaces',
  'topLength',
  'centres',
  'distanceFromUpstream',
  'topElevation',
  'freeboard',
  'wallHeight',
  'fromWidth',
  'toWidth',
  'maxTailwaterElevation',
  'maxTailwaterDepth',
  'thickness',
  'requiredThickness',
  'minThickness',
  'upliftHead',
  'upliftElevation',
  'waterOnSlabDepth',
  'extraFloorDepth',
  'rise',
  'span',
  'd50',
  'd50Isbash',
  'd50Velocity',
  'jumpLength',
  'equivalentDepth',
  'curveWidth',
  'baffleHeight',
  'baffleWidth',
  'baffleClearance',
  'baffleDistance',
  'endWallHeight',
  'rowSpacing',
  'slopeLength',
  'widthAtOutlet',
  'widthAtEnd',
  'tailwaterUsed',
] as const;

/** Every other keyed quantity of inputs and results. */
const OTHER_KEYS = {
  Q: 'discharge',
  governingQ: 'discharge',
  designQ: 'discharge',
  lengthGoverningQ: 'discharge',
  atQ: 'discharge',
  q: 'unitDischarge',
  criticalVelocity: 'velocity',
  concreteVolume: 'earthwork',
  v1: 'velocity',
  v2: 'velocity',
  velocity: 'velocity',
  power: 'power',
  volume: 'earthwork',
  M1: 'volume',
  M2: 'volume',
} as const satisfies Record<string, QuantityKind>;

/**
 * The one map: a field's key → its quantity (null: dimensionless). Context-dependent keys
 * (`value`, `min`/`max` of a discharge range, the slab's loads, …) are resolved by the walker
 * in units/index.ts, which reads this map for every other key.
 */
export const FIELD_KINDS: Readonly<Record<string, QuantityKind | null>> = {
  ...Object.fromEntries(LENGTH_KEYS.map((k) => [k, 'length' as const])),
  ...OTHER_KEYS,
  ...STUDY_INPUT_KINDS,
};

/** The quantity a field holds, by its key (null when dimensionless or unknown). */
export function fieldKind(key: string): QuantityKind | null {
  return Object.prototype.hasOwnProperty.call(FIELD_KINDS, key) ? (FIELD_KINDS[key] ?? null) : null;
}

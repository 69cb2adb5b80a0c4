// The assumptions of a take-off: every ratio, slope, working room, unit weight and waste the
// quantities rest on, with its default, the kind of its unit and its source. All SI. The
// figures are concept-level habits, not a structural design: the ones hydraulics.md §5 calls
// illustrative say so, and each can be overridden per design (TakeoffOverrides).
import type { Confidence } from '../basins/defaults';

/** Soil the structure is dug into; it sets the side slope of the excavation. */
export const SOIL_KINDS = ['rock', 'stiffCohesive', 'cohesive', 'granular'] as const;
export type SoilKind = (typeof SOIL_KINDS)[number];

/**
 * Side slope of a temporary excavation by soil, horizontal per 1 vertical [mem: OSHA 29 CFR
 * 1926 Subpart P, App. B, maximum allowable slopes for excavations under 20 ft: type A 3/4:1,
 * type B 1:1, type C 1½:1; rock is allowed vertical there, 1/4:1 is taken as common practice].
 */
export const SOIL_SIDE_SLOPES: Readonly<Record<SoilKind, number>> = {
  rock: 0.25,
  stiffCohesive: 0.75,
  cohesive: 1,
  granular: 1.5,
};

/** The soil assumed when the design names none (the flattest slope: the largest dig). */
export const DEFAULT_SOIL: SoilKind = 'granular';

/**
 * The unit of an assumption:
 * length m ⇄ ft; ratio (dimensionless fraction); slope H:V (dimensionless);
 * density kg/m³ ⇄ lb/ft³; reinforcement kg of steel per m³ of concrete ⇄ lb/yd³.
 */
export type TakeoffAssumptionUnit = 'length' | 'ratio' | 'slope' | 'density' | 'reinforcement';

export const TAKEOFF_ASSUMPTION_KEYS = [
  'slabThickness',
  'wallThickness',
  'concreteWaste',
  'rebarSlab',
  'rebarWalls',
  'rebarAppurtenances',
  'rebarCutoffs',
  'workingRoom',
  'sideSlope',
  'beddingThickness',
  'riprapDensity',
  'geotextileLap',
  'jointSpacing',
] as const;
export type TakeoffAssumptionKey = (typeof TAKEOFF_ASSUMPTION_KEYS)[number];

export interface TakeoffAssumptionSpec {
  /**
   * the default, SI; null where the default is the design's own figure (slab and wall
   * thickness, the side slope of the soil)
   */
  value: number | null;
  unitKind: TakeoffAssumptionUnit;
  /** SI unit label */
  unit: string;
  /** where the figure comes from */
  source: string;
  confidence: Confidence;
  /** an illustrative figure (hydraulics.md §5): replace it with the firm's own */
  illustrative: boolean;
  /** what it is, in plain words */
  label: string;
}

export const TAKEOFF_ASSUMPTIONS: Readonly<Record<TakeoffAssumptionKey, TakeoffAssumptionSpec>> = {
  slabThickness: {
    value: null,
    unitKind: 'length',
    unit: 'm',
    source: 'the sizing: slab by flotation, at least the least slab thickness',
    confidence: 'calc',
    illustrative: false,
    label: 'Floor slab thickness (basin, transition and sill base)',
  },
  wallThickness: {
    value: null,
    unitKind: 'length',
    unit: 'm',
    source: 'the sizing: the larger of the least wall thickness and a ratio of the wall height',
    confidence: 'calc',
    illustrative: false,
    label: 'Wall thickness (side walls, transition, wingwalls, cutoffs)',
  },
  concreteWaste: {
    value: 0.03,
    unitKind: 'ratio',
    unit: '-',
    source: 'common practice',
    confidence: 'practice',
    illustrative: true,
    label: 'Concrete waste added to the neat-line volume',
  },
  rebarSlab: {
    value: 100,
    unitKind: 'reinforcement',
    unit: 'kg/m³',
    source: 'common practice: 60–130 kg/m³ (illustrative range, from memory)',
    confidence: 'mem',
    illustrative: true,
    label: 'Reinforcement in the floor slab and the transition floor',
  },
  rebarWalls: {
    value: 110,
    unitKind: 'reinforcement',
    unit: 'kg/m³',
    source: 'common practice: 60–130 kg/m³ (illustrative range, from memory)',
    confidence: 'mem',
    illustrative: true,
    label: 'Reinforcement in the side walls, transition walls and wingwalls',
  },
  rebarAppurtenances: {
    value: 80,
    unitKind: 'reinforcement',
    unit: 'kg/m³',
    source: 'common practice: 60–130 kg/m³ (illustrative range, from memory)',
    confidence: 'mem',
    illustrative: true,
    label: 'Reinforcement in the blocks, piers, baffle and end sill',
  },
  rebarCutoffs: {
    value: 60,
    unitKind: 'reinforcement',
    unit: 'kg/m³',
    source: 'common practice: 60–130 kg/m³ (illustrative range, from memory)',
    confidence: 'mem',
    illustrative: true,
    label: 'Reinforcement in the cutoff walls',
  },
  workingRoom: {
    value: 0.6,
    unitKind: 'length',
    unit: 'm',
    source: 'common practice (room to set and strip forms beside a wall)',
    confidence: 'practice',
    illustrative: true,
    label: 'Working room beyond the outside face of the structure, each side',
  },
  sideSlope: {
    value: null,
    unitKind: 'slope',
    unit: 'H:V',
    source: 'by soil type: OSHA 29 CFR 1926 Subpart P, Appendix B (from memory)',
    confidence: 'mem',
    illustrative: false,
    label: 'Side slope of the excavation, horizontal per 1 vertical',
  },
  beddingThickness: {
    value: 0.15,
    unitKind: 'length',
    unit: 'm',
    source: 'common practice (granular bedding under riprap)',
    confidence: 'practice',
    illustrative: true,
    label: 'Bedding layer thickness under the riprap',
  },
  riprapDensity: {
    value: 2000,
    unitKind: 'density',
    unit: 'kg/m³',
    source: 'common practice (placed stone of specific gravity 2.65 with about 25 % voids)',
    confidence: 'practice',
    illustrative: true,
    label: 'Placed riprap, mass per volume (for prices by weight)',
  },
  geotextileLap: {
    value: 0.15,
    unitKind: 'ratio',
    unit: '-',
    source: 'common practice (laps and waste)',
    confidence: 'practice',
    illustrative: true,
    label: 'Geotextile laps and waste added to the covered area',
  },
  jointSpacing: {
    value: 9,
    unitKind: 'length',
    unit: 'm',
    source: 'common practice (contraction joints in hydraulic structures)',
    confidence: 'practice',
    illustrative: true,
    label: 'Spacing of the transverse contraction joints along the basin',
  },
};

/** Per-design changes to the take-off's assumptions (SI) and the soil. */
export type TakeoffOverrides = { soil?: SoilKind } & Partial<Record<TakeoffAssumptionKey, number>>;

/** One assumption in force, as listed with the take-off. */
export interface TakeoffAssumption extends TakeoffAssumptionSpec {
  key: TakeoffAssumptionKey;
  value: number;
  defaultValue: number;
  overridden: boolean;
}

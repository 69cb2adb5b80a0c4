// Shared shapes of the dissipator catalogue, screening and sizing. SI units throughout.
import type { BasinDefaults } from './defaults';
import type { Quantity, Quoted, StudyWarning } from '../warnings';

/** The jump basins sizeJumpBasin handles. */
export type JumpBasinType = 'usbr-1' | 'usbr-2' | 'usbr-3' | 'usbr-4' | 'saf';

/** Every type in the catalogue. */
export type DissipatorTypeId =
  JumpBasinType | 'usbr-6' | 'usbr-9' | 'riprap-apron' | 'flip-bucket' | 'slotted-bucket';

export type DissipatorFamily =
  'jump-basin' | 'impact-basin' | 'baffled-apron' | 'riprap-apron' | 'jet';

/** What a screening criterion looks at. */
export type CriterionId =
  | 'froude'
  | 'velocity'
  | 'unitDischarge'
  | 'discharge'
  | 'tailwater'
  | 'debris'
  | 'culvertSize'
  | 'stoneSize'
  | 'inflow'
  | 'head';

export type CriterionStatus = 'pass' | 'warn' | 'fail';

/**
 * Stable codes of the screening's reasons; the sentence of each is made at the edge by
 * `reasonText(criterion, units)` in common/src/messages/reasons.ts.
 */
export type ReasonCode =
  | 'froude-below-range'
  | 'froude-above-range'
  | 'froude-at-least'
  | 'froude-within'
  | 'tailwater-unknown'
  | 'tailwater-short'
  | 'tailwater-drowned-design'
  | 'tailwater-drowned-partial'
  | 'tailwater-holds'
  | 'debris-unstated'
  | 'debris-none'
  | 'debris-plain-apron'
  | 'debris-blocks-teeth'
  | 'debris-piers'
  | 'debris-deflectors'
  | 'debris-saf-blocks'
  | 'debris-under-baffle'
  | 'debris-apron-baffles'
  | 'debris-riprap'
  | 'discharge-no-limit'
  | 'unit-discharge-no-limit'
  | 'plain-apron-not-supercritical'
  | 'plain-apron-weak-jump'
  | 'plain-apron-oscillating'
  | 'plain-apron-steady'
  | 'plain-apron-strong'
  | 'no-blocks-velocity'
  | 'no-piers-velocity'
  | 'unit-discharge-within-tested'
  | 'unit-discharge-above-tested'
  | 'velocity-within'
  | 'piers-cavitation-risk'
  | 'piers-would-cavitate'
  | 'unit-discharge-within'
  | 'unit-discharge-above-tests'
  | 'deflectors-cavitation-risk'
  | 'unit-discharge-small'
  | 'chute-blocks-cavitation-risk'
  | 'chute-blocks-not-advised'
  | 'unit-discharge-small-structures'
  | 'discharge-within'
  | 'discharge-above-type'
  | 'entry-velocity-within'
  | 'entry-velocity-above'
  | 'needs-no-tailwater'
  | 'baffle-overtopped'
  | 'impact-inflow-outlet'
  | 'impact-inflow-chute'
  | 'impact-inflow-other'
  | 'apron-entry-over-crest'
  | 'apron-entry-near-critical'
  | 'apron-entry-supercritical'
  | 'unit-discharge-exceeds'
  | 'outlet-froude-low'
  | 'outlet-froude-high'
  | 'apron-tailwater-unknown'
  | 'apron-tailwater-perched'
  | 'apron-tailwater-outside'
  | 'apron-tailwater-within'
  | 'apron-stone'
  | 'apron-stone-too-large'
  | 'apron-inflow-outlet'
  | 'apron-inflow-other'
  | 'no-culvert'
  | 'culvert-rise-within'
  | 'culvert-rise-above'
  | 'no-discharges'
  | 'jet-velocity-high'
  | 'jet-velocity-low'
  | 'jet-head-high'
  | 'jet-head-low'
  | 'tailwater-not-known'
  | 'bucket-tailwater-deep'
  | 'bucket-tailwater-shallow';

/**
 * One criterion's outcome, as data: a stable `code`, the SI quantities it quotes with their
 * kinds, and the published source it rests on (`source`, a citation tag). For the jet types
 * (flip bucket, slotted bucket) 'pass' means the condition points to that type and 'fail' that
 * it does not.
 */
export interface CriterionResult extends Quoted {
  criterion: CriterionId;
  status: CriterionStatus;
  code: ReasonCode;
  /** citation tag of the rule, e.g. "[src: USBR EM-25]" */
  source?: string;
  /** the inflow kind a reason names (inflow criteria) */
  inflow?: InflowKind;
  /** the discharge (m³/s) where this outcome occurs; absent for criteria that do not vary with Q */
  atQ?: number;
  /** in the per-type summary: how many other discharges share this outcome */
  others?: number;
}

/** One discharge of the study as the screening sees it (SI). */
export interface DischargeRow {
  /** discharge, m³/s */
  Q: number;
  /** unit discharge at the toe, m²/s */
  q: number;
  /** inflow depth at the toe (or outlet), m */
  y1: number;
  /** inflow velocity, m/s */
  v1: number;
  /** inflow Froude number */
  fr1: number;
  /** sequent depth on a horizontal floor, m */
  y2: number;
  /** tailwater depth above the basin floor (or outlet invert), m; undefined when not known */
  tailwaterDepth?: number;
  /** total head above the floor, m; when absent y1 + v1²/2g is used */
  head?: number;
  /** set on the row at the design discharge (the design row) */
  isDesign?: boolean;
}

/** How the fast flow arrives. */
export type InflowKind = 'chute' | 'gate' | 'pipe' | 'culvert' | 'known' | 'drop';

export type DebrisLevel = 'none' | 'light' | 'heavy';

/** Facts about the site that do not change with the discharge. */
export interface ScreeningContext {
  inflow: InflowKind;
  /** basin (or outlet) width, m */
  width: number;
  /** the design discharge, m³/s: its row is the design row (default: the largest discharge) */
  designQ?: number;
  /** tailwater above C·y2 by more than this fraction drowns the jump (range/position.ts; default 0.10) */
  submergenceTolerance?: number;
  debris?: DebrisLevel;
  /** the culvert or pipe at the outlet, when there is one; rise = diameter for a pipe, m */
  culvert?: { shape: 'circular' | 'box'; rise: number; span?: number };
}

/** A published limit, for display in the catalogue (phrased by limitEntryText in messages/). */
export interface LimitEntry {
  criterion: CriterionId;
  /** the limit in words; `{name}` stands for the quantity `quotes[name]`, said in the units read */
  text: string;
  /** the quantities the text quotes (SI with their kinds; a published figure kept as published) */
  quotes?: Readonly<Record<string, Quantity>>;
  /** e.g. "[src: USBR EM-25]" or "[mem: …]" */
  tag: string;
}

export interface BlockSet {
  /** block height, m */
  height: number;
  /** block width across the flow, m */
  width: number;
  /** as-built clear spacing between blocks, m */
  spacing: number;
  count: number;
  /** the rule's spacing before fitting, m */
  nominalSpacing: number;
  /** clear space at each wall, m */
  wallSpace: number;
  /** block length along the flow at the base, m */
  length: number;
  /** top width along the flow (baffle piers), m */
  topLength?: number;
  /** centres across the basin from its centre line, m */
  centres: number[];
  /** share of the width occupied */
  widthFraction: number;
  /** a row staggered with the one upstream (Type III piers): its clear spaces at the −y and +y walls, m (wallSpace is the smaller) */
  wallSpaces?: [number, number];
  /** how many of its blocks stand behind an opening of the row upstream */
  behindOpenings?: number;
}

export interface BaffleSet extends BlockSet {
  /** from the upstream end of the basin floor (toe) to the upstream face, m */
  distanceFromUpstream: number;
  kind: 'baffle-piers' | 'floor-blocks';
}

/**
 * The end sill. Always present in the result (hydraulics.md shape); a USBR Type I plain apron
 * has no sill, which is written kind 'solid', height 0, length 0 and present false.
 */
export interface EndSill {
  kind: 'solid' | 'dentated';
  /** m; 0 for a plain apron without sill */
  height: number;
  /** false when there is no sill (Type I plain apron); additive, set by every sizing */
  present?: boolean;
  /** upstream face slope, horizontal per 1 vertical (0 = vertical) */
  upstreamSlope: number;
  /** length of the sill along the flow, m */
  length: number;
  teeth?: {
    count: number;
    width: number;
    spacing: number;
    wallSpace: number;
    centres: number[];
    narrow?: boolean;
  };
}

/** What sizeJumpBasin returns (hydraulics.md public API); extra fields are additive. */
export interface JumpBasinSizing {
  type: JumpBasinType;
  fr1: number;
  /** sequent depth, Bélanger, m */
  y2: number;
  /** C·y2, m */
  requiredTailwaterDepth: number;
  /** basin length from the toe to the downstream face of the end sill, m */
  length: number;
  chuteBlocks?: BlockSet;
  baffleBlocks?: BaffleSet;
  endSill: EndSill;
  /** m */
  freeboard: number;
  /** from the floor to the top of the walls, m */
  wallHeight: number;
  /** cautions at this discharge, as data (phrase with studyWarningText) */
  warnings: StudyWarning[];
  /** additive: inflow velocity and unit discharge used, tailwater factor and its tag */
  v1: number;
  y1: number;
  q: number;
  tailwaterFactor: number;
  sources: string[];
}

/** The sizing rules of one jump basin type. */
export interface JumpRules {
  /** inclusive Froude range of the published tests */
  froudeRange: readonly [number, number];
  tailwaterFactor(fr1: number, d: BasinDefaults): number;
  tailwaterFactorTag: string;
  /** basin length, m */
  length(fr1: number, y1: number, y2: number, d: BasinDefaults): number;
  lengthTag: string;
  appurtenances(c: {
    fr1: number;
    y1: number;
    y2: number;
    width: number;
    length: number;
    d: BasinDefaults;
  }): {
    chuteBlocks?: BlockSet;
    baffleBlocks?: BaffleSet;
    endSill: EndSill;
  };
  /** 'usbr' = 0.1·(V1 + y2) in ft units; 'saf' = y2/3 above tailwater */
  freeboardRule: 'usbr' | 'saf';
  /** tags of the appurtenance proportions */
  appurtenanceTags: string[];
}

/** One module of the catalogue. */
export interface DissipatorModule {
  id: DissipatorTypeId;
  /** published name */
  name: string;
  /** where it is published */
  source: string;
  family: DissipatorFamily;
  /** one line on what it is and where it suits */
  description: string;
  limits: LimitEntry[];
  jump?: JumpRules;
  /** criteria that vary with the discharge */
  screenRow(
    row: DischargeRow,
    ctx: ScreeningContext,
    d: BasinDefaults,
    rows: readonly DischargeRow[],
  ): CriterionResult[];
  /** criteria that do not */
  screenFixed(
    ctx: ScreeningContext,
    d: BasinDefaults,
    rows: readonly DischargeRow[],
  ): CriterionResult[];
  /** jet types only: no sizing; the screening says when a specialist study is the answer */
  specialist?: boolean;
  /** jet types only: whether the criteria point to this type */
  indicated?: (criteria: readonly CriterionResult[]) => boolean;
}

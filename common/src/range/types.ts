// The study input and the per-discharge row: plain types, SI (m, s, m³/s), elevations on the
// project datum. Nothing here computes.
import type { JumpLengthMethod, JumpResult } from '../hydraulics/jump';
import type { TailwaterSpec } from '../hydraulics/tailwater';
import type { HeadwaterSpec, StudyInflow } from '../hydraulics/toeByInflow';
import type { DissipatorStudyOptions } from '../basins/options';

export type { HeadwaterSpec, StudyInflow };

export type UnitSystem = 'SI' | 'US';

export type DischargeSpec =
  { kind: 'list'; values: number[] } | { kind: 'range'; min: number; max: number; count: number };

/** Factor C on the sequent depth the tailwater must provide: TW ≥ C·y2. */
export type TailwaterFactor =
  | number
  | ((row: { Q: number; fr1: number; y1: number; y2: number; v1: number; q: number }) => number);

export interface StudyInput {
  /**
   * Unit system of the numbers in this object. runStudy takes 'SI' only (toSI converts and
   * says 'SI'); a form or request in US customary says 'US' until converted.
   */
  units: UnitSystem;
  /** the unit system the user reads results in (words and tables); default `units` */
  displayUnits?: UnitSystem;
  /** downstream channel bed elevation on the datum, m */
  channelBedElevation: number;
  /** rectangular basin width, m */
  basinWidth: number;
  /** design discharge, m³/s — always analysed, whatever `discharges` lists */
  designDischarge: number;
  /** discharges to check, m³/s (the design discharge joins them) */
  discharges: DischargeSpec;
  tailwater: TailwaterSpec;
  inflow: StudyInflow;
  /** TW ≥ C·y2 (default 1.0; the basin type sets it later) */
  tailwaterFactor?: number;
  /** a fixed floor elevation to analyse instead of the solved one, m */
  floorElevation?: number;
  /** a safety depth set below the solved floor of every type, m (default 0) */
  floorSafetyDepth?: number;
  /** tailwater above C·y2 by more than this fraction counts as a drowned jump (default 0.10) */
  submergenceTolerance?: number;
  /** Manning's n of the basin floor for the sweep-out distance (default 0.014, concrete) */
  floorManningN?: number;
  jumpLengthMethod?: JumpLengthMethod;
  /** dissipator screening and sizing options (debris, culvert, chosen type, defaults overrides) */
  dissipators?: DissipatorStudyOptions;
}

import type { JumpPosition } from './position';

export type { JumpPosition };

/** Codes of the notes a row carries (phrased by messages/). */
export type RowNoteCode =
  'swept-out' | 'leaves-basin' | 'drowned' | 'tailwater-extended' | 'gate-submerged';

export interface StudyRow extends JumpResult {
  Q: number;
  /** unit discharge Q/b, m²/s */
  q: number;
  /** total head above the floor, m (null for known toe or a gate) */
  H0: number | null;
  yc: number;
  tailwaterElevation: number;
  /** tailwater depth above the basin floor, m */
  tailwaterDepth: number;
  /** 'below'/'above' when Q lies outside the tailwater rating table */
  tailwaterOutside: 'below' | 'above' | null;
  tailwaterFactor: number;
  /** C·y2, m */
  requiredDepth: number;
  /** tailwater depth − C·y2, m (negative: short) */
  margin: number;
  position: JumpPosition;
  /** (TW − y2)/y2: positive = submergence, negative = shortfall */
  submergenceRatio: number;
  /** how far down the horizontal floor the toe is pushed when swept out, m (null otherwise or off the floor) */
  sweepOutDistance: number | null;
  gate: { opening: number; upstreamDepth: number; submerged: boolean } | null;
  /** true on the row at the design discharge */
  isDesign: boolean;
  /** what to know about this row, as codes (phrase with rowNoteText) */
  noteCodes: RowNoteCode[];
}

export interface FloorSolution {
  /** highest floor elevation with TW ≥ C·y2 and Fr1 ≥ the minimum at every discharge, m */
  elevation: number;
  /** discharge where that condition binds, m³/s */
  governingQ: number;
}

// The shape of a study's result (SI). Types only: the edges (units/, web, API) read it without
// importing study.ts.
import type { JumpResult } from './hydraulics/jump';
import type { ToeConditions } from './hydraulics/inflow';
import type { JumpDiagrams } from './hydraulics/diagrams';
import type { DesignEntry, DissipatorStudyResult } from './basins/study';
import type { TypeScreening } from './basins/screening';
import type { DissipatorTypeId, JumpBasinType } from './basins/types';
import type { JumpPosition, StudyInput, StudyRow } from './range/types';
import type { StudyWarning } from './warnings';

/** The jump at the design discharge on one floor, with its diagram data. */
export interface DesignJump {
  Q: number;
  /** floor elevation it stands on, m */
  floorElevation: number;
  /** tailwater factor C the margin is taken against */
  tailwaterFactor: number;
  toe: ToeConditions;
  jump: JumpResult;
  tailwaterDepth: number;
  /** tailwater depth − C·y2, m */
  margin: number;
  position: JumpPosition;
  diagrams: JumpDiagrams;
}

/** Where the jump stands at every discharge on one floor (the one rule, range/position.ts). */
export interface PositionRow {
  Q: number;
  tailwaterDepth: number;
  requiredDepth: number;
  margin: number;
  position: JumpPosition;
  sweepOutDistance: number | null;
}

/** The chosen basin's own floor: its positions over the range and its design-discharge jump. */
export interface ChosenFloorCheck {
  type: JumpBasinType;
  floorElevation: number;
  positions: PositionRow[];
  designJump: DesignJump;
}

export interface StudyResult {
  /** the input with defaults filled in, SI */
  input: StudyInput;
  rows: StudyRow[];
  /** where the design discharge stands in `rows` (always analysed) */
  designIndex: number;
  /** true when the typed discharges lacked the design discharge and it was added */
  designDischargeAdded: boolean;
  floor: {
    /** floor elevation analysed, m */
    elevation: number;
    /** highest floor that holds the jump at every discharge, m (null if not found with a fixed floor) */
    requiredElevation: number | null;
    fixed: boolean;
    /** safety depth set below the required floor, m (0 when none, or when the floor is fixed) */
    safetyDepth: number;
    governingQ: number | null;
    tailwaterFactor: number;
    /** channel bed − floor, m (0 when the floor is at or above the bed) */
    depthBelowBed: number;
    /** floor − channel bed, m (0 when the floor is at or below the bed) */
    heightAboveBed: number;
    /** least tailwater margin over the range on this floor, m, and where */
    leastMargin: { margin: number; Q: number };
    excavation: { depth: number; width: number; length: number; volume: number; basis: string };
  };
  /** the jump at the design discharge on the study floor (C of the study) */
  designJump: DesignJump;
  /** diagram data of the design-discharge jump on the study floor (= designJump.diagrams) */
  diagrams: JumpDiagrams;
  /** the chosen jump basin on its own floor with its C (null when no jump basin is chosen) */
  chosenFloor: ChosenFloorCheck | null;
  /** the study's warnings as data (SI); phrase them with studyWarningText(w, units) */
  warnings: StudyWarning[];
  cautions: string[];
  /** every dissipator type screened at every discharge, in rank order (basins/screening.ts) */
  screening: TypeScreening[];
  /** the best-ranked usable type, or null (see the specialist types) */
  recommendedType: DissipatorTypeId | null;
  /** the chosen type's design with its drawing (the recommended one unless the user chose) */
  design: DesignEntry | null;
  /** the other usable types, designed */
  alternatives: DesignEntry[];
  /** the rest of the dissipator result: floors per type, context, assumptions, notes */
  dissipators: Omit<
    DissipatorStudyResult,
    'screening' | 'design' | 'alternatives' | 'recommended' | 'rowsByType'
  > | null;
}

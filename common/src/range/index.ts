// One discharge-range model: the set prepared once per run, the floor solve, the rows and the
// one jump-position rule. Nothing here imports study.ts.
import { requireFinite } from '../hydraulics/guards';
import { solveFloor } from './floor';
import { prepareRange } from './prepare';
import { rowsAt } from './rows';
import type { FloorSolution, StudyInput, StudyRow, TailwaterFactor } from './types';

export type {
  DischargeSpec,
  FloorSolution,
  HeadwaterSpec,
  JumpPosition,
  RowNoteCode,
  StudyInflow,
  StudyInput,
  StudyRow,
  TailwaterFactor,
  UnitSystem,
} from './types';
export {
  analysedDischarges,
  dischargeList,
  prepareRange,
  RANGE_DEFAULTS,
  type DischargeRange,
  type RangeNote,
} from './prepare';
export { FLOOR_SCAN_STEPS, solveFloor, worstMargin } from './floor';
export { designRowOf, rowAt, rowsAt } from './rows';
export { DEFAULT_SUBMERGENCE_TOLERANCE, jumpPosition } from './position';
export { MAX_DISCHARGES, MAX_ELEVATION_SPAN, MIN_FLOOR_FR1 } from './limits';

/**
 * Highest basin floor elevation (m) with tailwater ≥ C·y2 at every discharge (the design
 * discharge included); a one-off: runStudy prepares the range once and calls solveFloor.
 * [hydraulics.md §3]
 */
export function solveFloorElevation(
  input: StudyInput,
  tailwaterFactor: TailwaterFactor,
): FloorSolution {
  return solveFloor(prepareRange(input), tailwaterFactor);
}

/**
 * Per-discharge rows (SI) at a given floor elevation: toe, jump, tailwater, margin, position.
 * @example analyseRange(input, 85.2, 1.0)[0].position // 'at-toe' | 'swept-out' | 'drowned'
 */
export function analyseRange(
  input: StudyInput,
  floorElevation: number,
  tailwaterFactor: TailwaterFactor,
): StudyRow[] {
  requireFinite('floorElevation', floorElevation);
  return rowsAt(prepareRange(input), floorElevation, tailwaterFactor);
}

// runStudy: a thin orchestration of range → basins → result. Pure; SI in, SI out (toSI
// converts at the edge and runStudy refuses an input still in US customary). Nothing below this
// file imports it.
import { hydraulicJump } from './hydraulics/jump';
import { jumpDiagrams } from './hydraulics/diagrams';
import { withField } from './errors';
import {
  jumpPosition,
  prepareRange,
  rowsAt,
  solveFloor,
  RANGE_DEFAULTS,
  type DischargeRange,
  type FloorSolution,
  type StudyInput,
  type StudyRow,
} from './range';
import { rangeWarnings } from './range/warnings';
import { designDissipators, type DissipatorStudyResult } from './basins/study';
import { isJumpBasinType } from './basins/catalogue';
import { studyWarning, warningCause, type StudyWarning } from './warnings';
import type { ChosenFloorCheck, DesignJump, PositionRow, StudyResult } from './result';
import { STUDY_CAUTIONS } from './cautions';

export type { ChosenFloorCheck, DesignJump, PositionRow, StudyResult } from './result';
export { STUDY_CAUTIONS, studyCautions } from './cautions';

/** The jump at the design discharge on floor z with factor C, and its diagrams. */
function designJumpAt(range: DischargeRange, row: StudyRow, z: number): DesignJump {
  const i = range.designIndex;
  const Q = range.Qs[i]!;
  const toe = range.toeAt(i, z);
  const jump = withField('designDischarge', () =>
    hydraulicJump(range.basin, Q, toe.y1, { lengthMethod: range.jumpLengthMethod }),
  );
  const twDepth = row.tailwaterDepth;
  const required = row.tailwaterFactor * jump.y2;
  return {
    Q,
    floorElevation: z,
    tailwaterFactor: row.tailwaterFactor,
    toe,
    jump,
    tailwaterDepth: twDepth,
    margin: twDepth - required,
    position: jumpPosition(twDepth, required, range.submergenceTolerance),
    diagrams: jumpDiagrams(range.basin, Q, jump.y1, jump.y2, twDepth > 0 ? twDepth : null),
  };
}

const positionsOf = (rows: readonly StudyRow[]): PositionRow[] =>
  rows.map((r) => ({
    Q: r.Q,
    tailwaterDepth: r.tailwaterDepth,
    requiredDepth: r.requiredDepth,
    margin: r.margin,
    position: r.position,
    sweepOutDistance: r.sweepOutDistance,
  }));

/**
 * The whole study: the range prepared once, the floor (solved, less the safety depth, or the
 * fixed one checked), rows, excavation, the design-discharge jump and diagrams on the study
 * floor and on the chosen basin's floor, screening and designs, warnings and cautions.
 * SI in (an input marked US is refused), SI out. [hydraulics.md §1–3, §7]
 */
export function runStudy(input: StudyInput): StudyResult {
  const range = prepareRange(input);
  const C = input.tailwaterFactor ?? RANGE_DEFAULTS.tailwaterFactor;
  const fixed = input.floorElevation !== undefined;
  const extraWarnings: StudyWarning[] = [];
  let solved: FloorSolution | null = null;
  try {
    solved = solveFloor(range, C);
  } catch (e) {
    if (!(e instanceof RangeError) || !fixed) throw e;
    const w = studyWarning(
      'fixed-floor-unsolved',
      { floorElevation: input.floorElevation! },
      {
        floorElevation: 'length',
      },
    );
    w.cause = warningCause(e, 'floorElevation');
    extraWarnings.push(w);
  }
  const safety = fixed ? 0 : range.floorSafetyDepth;
  const z = fixed ? input.floorElevation! : solved!.elevation - safety;
  const rows = rowsAt(range, z, C);
  const designRow = rows[range.designIndex]!;
  const designJump = designJumpAt(range, designRow, z);
  const bed = input.channelBedElevation;
  const depthBelowBed = Math.max(0, bed - z);
  const length = Math.max(...rows.map((r) => r.length), designJump.jump.length);
  const b = input.basinWidth;
  const least = rows.reduce((a, r) => (r.margin < a.margin ? r : a));
  const warnings: StudyWarning[] = [
    ...rangeWarnings(range, rows, { elevation: z, fixed, solved }),
    ...extraWarnings,
  ];

  // Dissipators: each type on its own floor, screened, the chosen one and the alternatives designed.
  let dissipators: DissipatorStudyResult | null = null;
  try {
    dissipators = designDissipators(range, input.dissipators ?? {});
  } catch (e) {
    if (!(e instanceof RangeError)) throw e;
    const w = studyWarning('dissipators-not-run');
    w.cause = warningCause(e, 'dissipators');
    warnings.push(w);
  }
  let chosenFloor: ChosenFloorCheck | null = null;
  const chosen = dissipators?.chosen;
  if (chosen && isJumpBasinType(chosen)) {
    const typeRows = dissipators!.rowsByType[chosen];
    const floor = dissipators!.floors[chosen];
    if (typeRows && floor) {
      const dRow = typeRows[range.designIndex]!;
      chosenFloor = {
        type: chosen,
        floorElevation: floor.elevation,
        positions: positionsOf(typeRows),
        designJump: designJumpAt(range, dRow, floor.elevation),
      };
    }
  }

  return {
    input: {
      ...input,
      tailwaterFactor: C,
      submergenceTolerance: range.submergenceTolerance,
      floorManningN: range.floorManningN,
      jumpLengthMethod: range.jumpLengthMethod,
    },
    rows,
    designIndex: range.designIndex,
    designDischargeAdded: range.notes.some((n) => n.code === 'design-discharge-added'),
    floor: {
      elevation: z,
      requiredElevation: solved ? solved.elevation : null,
      fixed,
      safetyDepth: safety,
      governingQ: solved ? solved.governingQ : null,
      tailwaterFactor: C,
      depthBelowBed,
      heightAboveBed: Math.max(0, z - bed),
      leastMargin: { margin: least.margin, Q: least.Q },
      excavation: {
        depth: depthBelowBed,
        width: b,
        length,
        volume: depthBelowBed * b * length,
        basis:
          'vertical cut of basin width × longest free-jump length over the range × depth of the floor below the channel bed; slab, walls and side slopes come with the basin sizing',
      },
    },
    designJump,
    diagrams: designJump.diagrams,
    chosenFloor,
    warnings,
    cautions: [...STUDY_CAUTIONS],
    screening: dissipators?.screening ?? [],
    recommendedType: dissipators?.recommended ?? null,
    design: dissipators?.design ?? null,
    alternatives: dissipators?.alternatives ?? [],
    dissipators: dissipators
      ? {
          chosen: dissipators.chosen,
          floors: dissipators.floors,
          context: dissipators.context,
          assumptions: dissipators.assumptions,
          notes: dissipators.notes,
        }
      : null,
  };
}

// How sure the floor is, for the proposal (issue 12): the Uncertainty panel keeps nothing on
// the server, so the proposal runs the analysis itself from the issued version's input with the
// engine's default spreads (each naming its basis) and a fixed seed, so the same version always
// prints the same figures. Run in the render process (proposal.worker.ts), never in the API's.
import {
  defaultUncertainInputs,
  InputError,
  refusalText,
  runUncertainty,
  toSI,
  type StudyInput,
  type StudyResult,
  type UncertaintyRequest,
  type UncertaintyResult,
  type UnitSystem,
} from '@basinwright/common';

/** The run the proposal prints: the panel's defaults (2,000 samples, its seed, 90 %). */
export const PROPOSAL_UNCERTAINTY = {
  samples: 2000,
  seed: 'basinwright',
  confidence: 0.9,
} as const;

/** The floor the risk is computed at: the chosen jump basin's, or the study's free-jump floor. */
export interface UncertaintyFloor {
  /** the chosen basin's name, or null for the study's free-jump floor (reference) */
  basin: string | null;
  /** the tailwater factor C the floor is held to */
  tailwaterFactor: number;
}

/** The analysis the proposal prints: the request (SI) and its result, or why there is none. */
export type ProposalUncertainty =
  | { request: UncertaintyRequest; result: UncertaintyResult; floor: UncertaintyFloor }
  | { refused: string };

/**
 * The uncertainty of the floor of an issued version: its input (as saved, in the project's
 * units) → SI → the default spreads → runUncertainty with the fixed seed. When the chosen design
 * is a jump basin the risk is computed at its floor and with its tailwater factor (the floor
 * the proposal prints), otherwise at the study's free-jump floor. A design the engine cannot
 * analyse gives the refusal's sentence instead.
 */
export function proposalUncertainty(
  input: StudyInput,
  result: StudyResult,
  units: UnitSystem,
): ProposalUncertainty {
  const design = result.design?.design;
  const basin = design?.family === 'jump-basin' ? design : null;
  const si: StudyInput = basin
    ? {
        ...toSI(input),
        floorElevation: basin.floorElevation,
        tailwaterFactor: basin.sizing.tailwaterFactor,
      }
    : toSI(input);
  try {
    const request: UncertaintyRequest = {
      inputs: defaultUncertainInputs(si),
      ...PROPOSAL_UNCERTAINTY,
    };
    return {
      request,
      result: runUncertainty(si, request),
      floor: {
        basin: basin?.name ?? null,
        tailwaterFactor: si.tailwaterFactor ?? result.floor.tailwaterFactor,
      },
    };
  } catch (error) {
    if (error instanceof InputError) return { refused: refusalText(error, units) };
    throw error;
  }
}

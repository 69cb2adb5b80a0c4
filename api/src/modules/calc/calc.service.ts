import {
  hydraulicJump,
  locateJump,
  type JumpLocation,
  type JumpSituation,
  runStudy,
  toSI,
  type JumpLengthMethod,
  type JumpResult,
  type Section,
  type StudyInput,
  type StudyResult,
} from '@basinwright/common';
import { validationError } from '../../errors';

export interface JumpRequest {
  section: Section;
  Q: number;
  y1: number;
  lengthMethod?: JumpLengthMethod;
}

/**
 * The engine throws RangeError naming the argument for impossible input (subcritical y1, a
 * conduit that would run full, a floor that cannot be found): that is the user's problem to
 * fix, so it becomes a 422 with the engine's message, never a 500.
 */
function engineError(error: unknown): unknown {
  if (!(error instanceof RangeError)) return error;
  const field = /^([A-Za-z][\w.[\]]*)[\s:]/.exec(error.message)?.[1] ?? 'body';
  return validationError({ [field]: error.message }, error.message);
}

/** Jump calculator: SI in, SI out. */
export function calculateJump(body: JumpRequest): JumpResult {
  try {
    return hydraulicJump(body.section, body.Q, body.y1, {
      lengthMethod: body.lengthMethod ?? 'usbr',
    });
  } catch (error) {
    throw engineError(error);
  }
}

/** The whole study: the input in its own units is converted to SI, the result is SI. */
export function calculateStudy(input: StudyInput): StudyResult {
  try {
    return runStudy(toSI(input));
  } catch (error) {
    throw engineError(error);
  }
}

/** Where the jump forms below a control (slope break, gate, weir): distance and both profiles, SI. */
export function calculateJumpPosition(body: JumpSituation): JumpLocation {
  try {
    return locateJump(body);
  } catch (error) {
    throw engineError(error);
  }
}

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
import { fromEngineError } from '../../errors';

export interface JumpRequest {
  section: Section;
  Q: number;
  y1: number;
  lengthMethod?: JumpLengthMethod;
}

/** Jump calculator: SI in, SI out. */
export function calculateJump(body: JumpRequest): JumpResult {
  try {
    return hydraulicJump(body.section, body.Q, body.y1, {
      lengthMethod: body.lengthMethod ?? 'usbr',
    });
  } catch (error) {
    throw fromEngineError(error);
  }
}

/** The whole study: the input in its own units is converted to SI, the result is SI. */
export function calculateStudy(input: StudyInput): StudyResult {
  try {
    return runStudy(toSI(input));
  } catch (error) {
    throw fromEngineError(error, '', input.units);
  }
}

/** Where the jump forms below a control (slope break, gate, weir): distance and both profiles, SI. */
export function calculateJumpPosition(body: JumpSituation): JumpLocation {
  try {
    return locateJump(body);
  } catch (error) {
    throw fromEngineError(error);
  }
}

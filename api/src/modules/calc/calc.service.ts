import type {
  CheapestRequest,
  CheapestSearchResult,
  JumpLocation,
  JumpResult,
  JumpSituation,
  StudyInput,
  StudyResult,
} from '@basinwright/common';
import { ApiError, fromEngineError } from '../../errors';
import { computePool } from './calc.pool';
import type { JumpRequest } from './calc.worker';

export type { JumpRequest };

// Every calculation runs in the compute pool (calc.pool.ts), off the event loop.

/** Jump calculator: SI in, SI out (presented by the worker). */
export async function calculateJump(body: JumpRequest): Promise<JumpResult> {
  try {
    return await computePool().run({ kind: 'jump', body });
  } catch (error) {
    throw fromEngineError(error);
  }
}

/** An ApiError of the pool (over budget…) with its fields filed below `prefix`. */
function below(prefix: string, error: unknown): unknown {
  if (prefix === '' || !(error instanceof ApiError) || error.details === undefined) return error;
  const details = Object.fromEntries(
    Object.entries(error.details).map(([field, message]) => [`${prefix}.${field}`, message]),
  );
  return new ApiError(error.status, error.code, error.message, details);
}

/**
 * The whole study: the input in its own units is converted to SI, the result is SI. `prefix`
 * names where the input sits in the request body (the design save's `input`).
 */
export async function calculateStudy(input: StudyInput, prefix = ''): Promise<StudyResult> {
  try {
    return await computePool().run({ kind: 'study', input });
  } catch (error) {
    throw error instanceof ApiError
      ? below(prefix, error)
      : fromEngineError(error, prefix, input.units);
  }
}

/** The study for POST /calc/study: its presented result as JSON text, written in the worker. */
export async function calculateStudyJson(input: StudyInput): Promise<string> {
  try {
    return await computePool().run({ kind: 'study-json', input });
  } catch (error) {
    throw fromEngineError(error, '', input.units);
  }
}

/** Where the jump forms below a control (slope break, gate, weir): distance and both profiles, SI. */
export async function calculateJumpPosition(body: JumpSituation): Promise<JumpLocation> {
  try {
    return await computePool().run({ kind: 'jump-position', body });
  } catch (error) {
    throw fromEngineError(error);
  }
}

/** The cheapest design that works over width × passing types (SI result), in the pool. */
export async function calculateCheapest(body: CheapestRequest): Promise<CheapestSearchResult> {
  try {
    return await computePool().run({ kind: 'cheapest', body });
  } catch (error) {
    throw fromEngineError(error, '', body.input.units);
  }
}

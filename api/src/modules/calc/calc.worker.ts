// The engine's compute tasks, run in a worker thread of the compute pool (calc.pool.ts) so a
// long study never holds the API's event loop. Errors come back as data: structured cloning
// would keep an Error's name and message but drop its own properties (field, code).
import {
  cheapestFromRequest,
  hydraulicJump,
  locateJump,
  runStudy,
  toSI,
  type CheapestRequest,
  type CheapestSearchResult,
  type JumpLengthMethod,
  type JumpLocation,
  type JumpResult,
  type JumpSituation,
  type Section,
  type StudyInput,
  type StudyResult,
} from '@basinwright/common';
import { presentJump, presentStudy } from './calc.presenter';

export interface JumpRequest {
  section: Section;
  Q: number;
  y1: number;
  lengthMethod?: JumpLengthMethod;
}

export type ComputeTask =
  | { kind: 'jump'; body: JumpRequest }
  | { kind: 'study'; input: StudyInput }
  /** the study's presented result as JSON text, for a route that only sends it on */
  | { kind: 'study-json'; input: StudyInput }
  | { kind: 'jump-position'; body: JumpSituation }
  /** the cheapest design over width × passing types (POST /calc/cheapest) */
  | { kind: 'cheapest'; body: CheapestRequest };

export interface ComputeResults {
  jump: JumpResult;
  study: StudyResult;
  'study-json': string;
  'jump-position': JumpLocation;
  cheapest: CheapestSearchResult;
}

/** An error thrown by the engine, as plain data: its class, name, message and own properties. */
export interface EngineErrorData {
  isRangeError: boolean;
  name: string;
  message: string;
  props: Record<string, unknown>;
}

export type ComputeReply<T = unknown> =
  { ok: true; value: T } | { ok: false; error: EngineErrorData };

function run(task: ComputeTask): unknown {
  switch (task.kind) {
    case 'jump':
      return presentJump(
        hydraulicJump(task.body.section, task.body.Q, task.body.y1, {
          lengthMethod: task.body.lengthMethod ?? 'usbr',
        }),
      );
    case 'study':
      // The presenter runs here too: its JSON pass over a large result stays off the main thread.
      return presentStudy(runStudy(toSI(task.input)));
    case 'study-json':
      // A large result (tens of MB at 5,000 discharges) is written out here, so the main
      // thread only copies a string instead of rebuilding and serialising an object graph.
      return JSON.stringify(presentStudy(runStudy(toSI(task.input))));
    case 'jump-position':
      return locateJump(task.body);
    case 'cheapest':
      return cheapestFromRequest(task.body);
  }
}

/**
 * An engine error as data that survives structured cloning: its class (RangeError or not),
 * name, message and own properties (field, code, quantities, cause…); a property that cannot
 * be cloned (a function) is left behind. calc.pool.ts rebuilds it (reviveEngineError).
 */
export function toErrorData(error: Error): EngineErrorData {
  const props: Record<string, unknown> = {};
  for (const key of Object.getOwnPropertyNames(error)) {
    if (key === 'stack' || key === 'message' || key === 'name') continue;
    const value: unknown = Reflect.get(error, key);
    try {
      structuredClone(value);
      props[key] = value;
    } catch {
      // cannot cross the thread boundary
    }
  }
  return {
    isRangeError: error instanceof RangeError,
    name: error.name,
    message: error.message,
    props,
  };
}

export default function compute(task: ComputeTask): ComputeReply {
  try {
    return { ok: true, value: run(task) };
  } catch (error) {
    if (!(error instanceof Error)) throw error;
    return { ok: false, error: toErrorData(error) };
  }
}

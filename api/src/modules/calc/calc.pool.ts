// The compute pool: every engine calculation of the API (the calculators and the study on
// save) runs in a worker thread (piscina), so a long study never holds the event loop and
// /health keeps answering. Each calculation has a time budget (CALC_TIME_BUDGET_MS, queue
// included): past it the worker is stopped and the request answered 422, naming the input
// that made the calculation large. A full queue answers 503; a worker out of memory, 422.
import { fileURLToPath } from 'node:url';
import { Piscina } from 'piscina';
import {
  INPUT_ERROR_CODES,
  InputError,
  studySizes,
  type InputErrorCode,
} from '@basinwright/common';
import { getConfig, type ComputeConfig } from '../../config/env';
import { ApiError, serviceUnavailable, validationError } from '../../errors';
import type { ComputeReply, ComputeResults, ComputeTask, EngineErrorData } from './calc.worker';

/** The worker next to this module, as run: calc.worker.ts under tsx, calc.worker.js once built. */
const workerFile = fileURLToPath(
  new URL(`./calc.worker${import.meta.url.endsWith('.ts') ? '.ts' : '.js'}`, import.meta.url),
);
/**
 * A .ts worker is loaded through tsx, with the source condition that makes @basinwright/common
 * resolve to its TypeScript source — the same flags scripts/lib.mjs starts the API with. They
 * are given explicitly (not inherited) because under vitest the parent process has neither.
 */
const workerExecArgv = workerFile.endsWith('.ts')
  ? ['--import', 'tsx', '--conditions=@basinwright/source']
  : [];

/**
 * The engine error a worker sent back, rebuilt on this thread: the same class for a
 * RangeError (so fromEngineError turns it into the same 422 as before), the same name and
 * message, and its own properties (field, code, …) put back.
 */
export function reviveEngineError(data: EngineErrorData): Error {
  const { field, code, values } = data.props;
  // The engine's coded refusal (an InputError or a subclass such as ConduitFullError) comes back
  // as an InputError, so the API phrases it from its code and files it by its field.
  if (
    data.isRangeError &&
    typeof field === 'string' &&
    typeof code === 'string' &&
    (INPUT_ERROR_CODES as readonly string[]).includes(code)
  ) {
    const refusal = new InputError(
      field,
      code as InputErrorCode,
      data.message,
      (values ?? {}) as Record<string, number>,
    );
    refusal.name = data.name;
    return refusal;
  }
  const error = data.isRangeError ? new RangeError(data.message) : new Error(data.message);
  Object.defineProperty(error, 'name', {
    value: data.name,
    configurable: true,
    writable: true,
    enumerable: false,
  });
  Object.assign(error, data.props);
  return error;
}

/** The input size that made a calculation large, for the over-budget and out-of-memory 422s. */
function largest(task: ComputeTask): { field: string; label: string; value: number } {
  if (task.kind === 'study') {
    const [top] = studySizes(task.input);
    if (top !== undefined) return top;
  }
  if (task.kind === 'cheapest') {
    const [top] = studySizes(task.body.input);
    if (top !== undefined) return { ...top, field: `input.${top.field}` };
  }
  if (task.kind === 'uncertainty')
    return {
      field: 'uncertainty.samples',
      label: 'the number of samples',
      value: task.uncertainty.samples,
    };
  return { field: 'body', label: 'the request', value: NaN };
}

function tooLarge(task: ComputeTask, why: string): ApiError {
  const size = largest(task);
  const what = Number.isFinite(size.value)
    ? `${size.label} (${size.field} = ${size.value}) is what makes it large`
    : 'the request is too large to compute';
  const message = `${why}; ${what}. Make it smaller and try again.`;
  return validationError({ [size.field]: message }, message);
}

export class ComputePool {
  private readonly pool: Piscina<ComputeTask, ComputeReply>;
  private inFlight = 0;

  constructor(readonly options: ComputeConfig) {
    this.pool = new Piscina<ComputeTask, ComputeReply>({
      filename: workerFile,
      execArgv: workerExecArgv,
      minThreads: 1,
      maxThreads: options.threads,
      maxQueue: options.queueMax,
      // Idle workers beyond the first are let go after a minute; starting one costs ~1 s.
      idleTimeout: 60_000,
      resourceLimits: { maxOldGenerationSizeMb: options.memoryMb },
      // Engine work yields the CPU to the event loop (Linux thread priority, via @napi-rs/nice).
      niceIncrement: options.nice,
    });
  }

  /** Calculations submitted and not yet answered (queued or running). */
  get pending(): number {
    return this.inFlight;
  }

  /**
   * Runs one engine task in a worker. Resolves its result; rejects with the engine's own error
   * (rebuilt, for the caller's fromEngineError) or with an ApiError (422 over budget or out
   * of memory, 503 when the queue is full).
   */
  async run<K extends ComputeTask['kind']>(
    task: Extract<ComputeTask, { kind: K }>,
    budgetMs = this.options.budgetMs,
  ): Promise<ComputeResults[K]> {
    // At most one calculation per thread running and queueMax waiting: counted here, as
    // piscina's own maxQueue leaves out tasks waiting for a thread that is still starting.
    if (this.inFlight >= this.options.threads + this.options.queueMax)
      throw serviceUnavailable('The calculators are busy. Try again in a moment.');
    const budget = new AbortController();
    const timer = setTimeout(() => budget.abort(), budgetMs);
    this.inFlight += 1;
    let reply: ComputeReply;
    try {
      reply = await this.pool.run(task, { signal: budget.signal });
    } catch (error) {
      if (budget.signal.aborted)
        throw tooLarge(
          task,
          `The calculation took longer than ${budgetMs / 1000} s, the most one request may use`,
        );
      const code = (error as { code?: unknown } | null)?.code;
      if (code === 'ERR_WORKER_OUT_OF_MEMORY')
        throw tooLarge(task, 'The calculation needed more memory than one request may use');
      if (error instanceof Error && /queue is at limit/i.test(error.message))
        throw serviceUnavailable('The calculators are busy. Try again in a moment.');
      throw error;
    } finally {
      clearTimeout(timer);
      this.inFlight -= 1;
    }
    if (!reply.ok) throw reviveEngineError(reply.error);
    return reply.value as ComputeResults[K];
  }

  async close(): Promise<void> {
    await this.pool.destroy();
  }
}

let shared: ComputePool | undefined;

/** The process's compute pool, started on first use with the configured size and budget. */
export function computePool(): ComputePool {
  shared ??= new ComputePool(getConfig().compute);
  return shared;
}

/** Stops the shared pool's workers (shutdown, end of a test file). */
export async function closeComputePool(): Promise<void> {
  const pool = shared;
  shared = undefined;
  await pool?.close();
}

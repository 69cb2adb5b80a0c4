// The study off the page's main thread: a client for the study worker (workers/study.worker.ts)
// that answers only the newest request. A request sent while the worker is still busy with an
// older one supersedes it: the worker is ended and a fresh one started, so long runs never queue
// behind each other and a late answer to an older input is never shown. Where there is no
// Worker (jsdom in the unit tests) the study runs in the thread: at once, or with a promise while
// the engine is fetched the first time (useStudy's evaluateInThread).
import type {
  CheapestSearchResult,
  DissipatorTypeId,
  EngineFailure,
  UncertaintyRequest,
} from '@basinwright/common';
import type { StudyOutcome } from '@/composables/useStudy';
import type { UncertaintyOutcome } from '@/composables/useUncertainty';

/** One evaluation: the form's raw values and the basin type chosen beside them. */
export interface StudyRequest {
  raw: unknown;
  chosenType: DissipatorTypeId | null;
}

/** Page → worker. */
export interface StudyCall {
  id: number;
  request: StudyRequest;
}

/** Worker → page. */
export interface StudyAnswer {
  id: number;
  outcome: StudyOutcome;
}

/** What the client uses of a Worker; a fake stands in for it in tests. */
export interface StudyPort {
  postMessage(call: StudyCall): void;
  terminate(): void;
  onmessage: ((event: MessageEvent<StudyAnswer>) => void) | null;
  onerror: ((event: Event) => void) | null;
}

export interface StudyClient {
  /** 'worker' while the study runs in a worker; 'thread' without one, or after it failed */
  readonly mode: 'worker' | 'thread';
  /**
   * Runs the study on `request`. In the thread: the outcome, at once (or a promise of it while
   * the engine is first fetched). With a worker: a promise of the outcome, or of null when a
   * newer request (or dispose) superseded this one.
   */
  run(request: StudyRequest): StudyOutcome | Promise<StudyOutcome | null>;
  /**
   * Abandons the run under way, if any (its input has changed): a busy worker is ended and the
   * run resolves with null. The next run starts a fresh worker.
   */
  cancel(): void;
  /** Ends the worker; a run still waiting resolves with null. */
  dispose(): void;
}

/** A deep plain copy of the form's values (Vue's reactive proxies cannot cross to a worker). */
export function plainCopy(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(plainCopy);
  if (value !== null && typeof value === 'object')
    return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, plainCopy(v)]));
  return value;
}

interface Job {
  id: number;
  request: StudyRequest;
  resolve: (outcome: StudyOutcome | null | PromiseLike<StudyOutcome>) => void;
}

/**
 * `spawn` starts a worker (null: no Worker here, run in the thread); `evaluate` is the same
 * study run in the thread, used without a worker and after the worker itself failed (a script
 * that could not load, a crash) — never for an input the engine refuses: that is an outcome.
 */
export function createStudyClient(options: {
  spawn: (() => StudyPort) | null;
  evaluate: (request: StudyRequest) => StudyOutcome | Promise<StudyOutcome>;
}): StudyClient {
  const { spawn, evaluate } = options;
  let port: StudyPort | null = null;
  let job: Job | null = null;
  let lastId = 0;
  let failed = spawn === null;

  function stop(): void {
    port?.terminate();
    port = null;
  }

  function cancel(): void {
    if (!job) return;
    stop();
    job.resolve(null);
    job = null;
  }

  function start(make: () => StudyPort): StudyPort {
    const own = make();
    own.onmessage = (event) => {
      // An answer from an ended worker, or to a request already superseded, is dropped.
      if (own !== port || !job || event.data.id !== job.id) return;
      const done = job;
      job = null;
      done.resolve(event.data.outcome);
    };
    own.onerror = (event) => {
      if (own !== port) return;
      event.preventDefault?.();
      stop();
      failed = true;
      const pending = job;
      job = null;
      pending?.resolve(evaluate(pending.request));
    };
    return own;
  }

  return {
    get mode() {
      return failed ? 'thread' : 'worker';
    },
    run(request) {
      if (failed || spawn === null) return evaluate(request);
      // Busy with an older input: end that run rather than queue this one behind it.
      cancel();
      const id = ++lastId;
      const target = port ?? start(spawn);
      port = target;
      return new Promise<StudyOutcome | null>((resolve) => {
        job = { id, request, resolve };
        target.postMessage({ id, request: { ...request, raw: plainCopy(request.raw) } });
      });
    },
    cancel,
    dispose() {
      stop();
      job?.resolve(null);
      job = null;
    },
  };
}

// ---- The cheapest-design search, in the same worker script (workers/study.worker.ts) ----

/** One search: the request as the form gives it (study input, width limits, rates, overrides). */
export interface SearchRequest {
  body: unknown;
}

/** What a search gives back: the result, or the reason it could not run. */
export interface SearchOutcome {
  result: CheapestSearchResult | null;
  /** why the engine gave no result, as data (phrased on the page by failureText) */
  failure: EngineFailure | null;
  /** schema messages when the request is not complete */
  inputProblems: string[];
}

/** Page → worker (a search; a study call carries `request` instead). */
export interface SearchCall {
  id: number;
  search: SearchRequest;
}

/** Worker → page. */
export interface SearchAnswer {
  id: number;
  search: SearchOutcome;
}

/** What the search client uses of a Worker; a fake stands in for it in tests. */
export interface SearchPort {
  postMessage(call: SearchCall): void;
  terminate(): void;
  onmessage: ((event: MessageEvent<SearchAnswer>) => void) | null;
  onerror: ((event: Event) => void) | null;
}

export interface SearchClient {
  /**
   * Runs a search in a fresh worker (ended once it answers). A newer run, cancel or dispose
   * ends the one under way, which resolves with null. Without a worker, or when the worker
   * fails to load or crashes, the search runs in the thread.
   */
  run(request: SearchRequest): Promise<SearchOutcome | null>;
  cancel(): void;
  dispose(): void;
}

export function createSearchClient(options: {
  spawn: (() => SearchPort) | null;
  evaluate: (request: SearchRequest) => SearchOutcome;
}): SearchClient {
  const { spawn, evaluate } = options;
  let port: SearchPort | null = null;
  let pending: ((outcome: SearchOutcome | null) => void) | null = null;
  let lastId = 0;
  let failed = spawn === null;

  function cancel(): void {
    port?.terminate();
    port = null;
    const done = pending;
    pending = null;
    done?.(null);
  }

  return {
    run(request) {
      cancel();
      if (failed || spawn === null) return Promise.resolve(evaluate(request));
      const id = ++lastId;
      const own = spawn();
      port = own;
      return new Promise<SearchOutcome | null>((resolve) => {
        pending = resolve;
        own.onmessage = (event) => {
          if (own !== port || event.data.id !== id) return;
          own.terminate();
          port = null;
          pending = null;
          resolve(event.data.search);
        };
        own.onerror = (event) => {
          if (own !== port) return;
          event.preventDefault?.();
          own.terminate();
          port = null;
          pending = null;
          failed = true;
          resolve(evaluate(request));
        };
        own.postMessage({ id, search: { body: plainCopy(request.body) } });
      });
    },
    cancel,
    dispose: cancel,
  };
}

// The Uncertainty panel's run (composables/useUncertainty.ts) in a worker of its own, on the
// same script: progress messages while it runs, cancelled by ending the worker.

/** Page → worker: one uncertainty run. */
export interface UncertaintyCall {
  kind: 'uncertainty';
  id: number;
  raw: unknown;
  spec: UncertaintyRequest;
}

/** Worker → page: progress while it runs, then the outcome. */
export type UncertaintyMessage =
  | { id: number; progress: { done: number; total: number } }
  | { id: number; outcome: UncertaintyOutcome };

export interface UncertaintyPort {
  postMessage(call: UncertaintyCall): void;
  terminate(): void;
  onmessage: ((event: MessageEvent<UncertaintyMessage>) => void) | null;
  onerror: ((event: Event) => void) | null;
}

export interface UncertaintyClient {
  /** the outcome, or null when cancelled (or superseded by a newer run) */
  run(
    raw: unknown,
    spec: UncertaintyRequest,
    onProgress: (done: number, total: number) => void,
  ): Promise<UncertaintyOutcome | null>;
  cancel(): void;
  dispose(): void;
}

/**
 * Runs in a worker (a fresh one for each run; cancel ends it), or in the thread where there is
 * no Worker or the worker failed to load.
 */
export function createUncertaintyClient(options: {
  spawn: (() => UncertaintyPort) | null;
  evaluate: (
    raw: unknown,
    spec: UncertaintyRequest,
    onProgress: (done: number, total: number) => void,
  ) => UncertaintyOutcome;
}): UncertaintyClient {
  const { spawn, evaluate } = options;
  let port: UncertaintyPort | null = null;
  let pending: ((o: UncertaintyOutcome | null) => void) | null = null;
  let lastId = 0;
  let failed = spawn === null;
  const cancel = (): void => {
    port?.terminate();
    port = null;
    const done = pending;
    pending = null;
    done?.(null);
  };
  return {
    run(raw, spec, onProgress) {
      cancel();
      if (failed || spawn === null) return Promise.resolve(evaluate(raw, spec, onProgress));
      const id = ++lastId;
      const own = spawn();
      port = own;
      return new Promise((resolve) => {
        pending = resolve;
        own.onmessage = (event) => {
          if (own !== port || event.data.id !== id) return;
          if ('progress' in event.data) {
            onProgress(event.data.progress.done, event.data.progress.total);
            return;
          }
          own.terminate();
          port = null;
          pending = null;
          resolve(event.data.outcome);
        };
        own.onerror = (event) => {
          if (own !== port) return;
          event.preventDefault?.();
          own.terminate();
          port = null;
          pending = null;
          failed = true;
          resolve(evaluate(raw, spec, onProgress));
        };
        own.postMessage({
          kind: 'uncertainty',
          id,
          raw: plainCopy(raw),
          spec: plainCopy(spec) as UncertaintyRequest,
        });
      });
    },
    cancel,
    dispose: cancel,
  };
}

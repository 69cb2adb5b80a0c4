// The cheapest-design search in the browser: schema (in the input's units) → the engine's
// search, never throwing; and the worker that runs it off the page's main thread.
import { ValidationError } from 'yup';
import {
  cheapestFromRequest,
  cheapestRequestSchema,
  engineFailure,
  type UnitSystem,
} from '@basinwright/common';
import {
  createSearchClient,
  type SearchClient,
  type SearchOutcome,
  type SearchPort,
  type SearchRequest,
} from '@/composables/studyWorker';

/** The lead of a search's refusal on the page (failureText). */
export const SEARCH_FAILURE_LEAD = 'The search cannot run with these inputs.';

/** The unit system of a search request's study input, SI unless it says US. */
export function searchUnitsOf(body: unknown): UnitSystem {
  const input = (body as { input?: { units?: unknown } } | null)?.input;
  return input?.units === 'US' ? 'US' : 'SI';
}

/** One search, without a worker: every failure becomes a message. */
export function evaluateSearch(request: SearchRequest): SearchOutcome {
  let body;
  try {
    body = cheapestRequestSchema.validateSync(request.body, {
      abortEarly: false,
      stripUnknown: true,
    });
  } catch (e) {
    if (e instanceof ValidationError)
      return { result: null, failure: null, inputProblems: [...new Set(e.errors)] };
    return { result: null, failure: engineFailure(e), inputProblems: [] };
  }
  try {
    return { result: cheapestFromRequest(body), failure: null, inputProblems: [] };
  } catch (e) {
    return { result: null, failure: engineFailure(e), inputProblems: [] };
  }
}

/** A search client on the study worker script, or in the thread where there is no Worker. */
export function searchClient(): SearchClient {
  return createSearchClient({
    spawn:
      typeof Worker === 'undefined'
        ? null
        : () =>
            new Worker(new URL('../workers/study.worker.ts', import.meta.url), {
              type: 'module',
            }) as SearchPort,
    evaluate: evaluateSearch,
  });
}

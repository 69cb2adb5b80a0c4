import { InputError, refusalText, type PhraseUnits } from '@basinwright/common';
/** Every error the API answers with: `{ code, message, details? }` and an HTTP status. */
export type ErrorCode =
  | 'validation_error'
  | 'bad_json'
  | 'unauthorized'
  | 'forbidden'
  | 'not_found'
  | 'conflict'
  | 'plan_limit'
  | 'read_only'
  | 'rate_limited'
  | 'payload_too_large'
  | 'invalid_token'
  | 'unsupported_media_type'
  | 'bad_request'
  | 'service_unavailable'
  | 'internal_error';

export type ErrorDetails = Record<string, string>;

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: ErrorCode,
    message: string,
    readonly details?: ErrorDetails,
    /** Seconds for a Retry-After header (429 answers). */
    readonly retryAfter?: number,
  ) {
    super(message);
    this.name = 'ApiError';
  }

  toJSON(): { code: ErrorCode; message: string; details?: ErrorDetails } {
    return this.details === undefined
      ? { code: this.code, message: this.message }
      : { code: this.code, message: this.message, details: this.details };
  }
}

export const validationError = (details: ErrorDetails, message = 'Some fields need attention.') =>
  new ApiError(422, 'validation_error', message, details);
export const badJson = (message = 'The request body is not valid JSON.') =>
  new ApiError(400, 'bad_json', message);
export const badRequest = (message: string) => new ApiError(400, 'bad_request', message);
export const unauthorized = (message = 'Sign in to continue.') =>
  new ApiError(401, 'unauthorized', message);
export const forbidden = (message = 'Your role does not allow this.') =>
  new ApiError(403, 'forbidden', message);
export const notFound = (message = 'Not found.') => new ApiError(404, 'not_found', message);
export const conflict = (message: string) => new ApiError(409, 'conflict', message);

/**
 * A 409 that carries the server's current copy (`current`), so a client whose copy is stale can
 * reload it or compare it with its own: a draft saved or issued from a stale revision.
 */
export class StaleCopyError extends ApiError {
  constructor(
    message: string,
    readonly current: unknown,
  ) {
    super(409, 'conflict', message);
  }

  override toJSON(): { code: ErrorCode; message: string; current: unknown } {
    return { code: this.code, message: this.message, current: this.current };
  }
}
/**
 * A plan's limit or feature refused the action: 403 `plan_limit`, `details.limit` naming the
 * limit or feature (see common/src/plans.ts) and `details.liftedBy` the plan that lifts it
 * (absent when no plan does, e.g. seats on a paid plan: buy seats).
 */
export const planLimit = (message: string, limit?: string, liftedBy?: string | null) =>
  new ApiError(
    403,
    'plan_limit',
    message,
    limit === undefined
      ? undefined
      : liftedBy === undefined || liftedBy === null
        ? { limit }
        : { limit, liftedBy },
  );
/** The firm or the project is read-only (billing, or over a plan's project limit): 403. */
export const readOnly = (message: string, reason: string) =>
  new ApiError(403, 'read_only', message, { reason });
export const rateLimited = (
  message = 'Too many attempts. Wait a little and try again.',
  retryAfterSeconds?: number,
) => new ApiError(429, 'rate_limited', message, undefined, retryAfterSeconds);
export const payloadTooLarge = (message = 'The request body is too large.') =>
  new ApiError(413, 'payload_too_large', message);
export const invalidToken = (message = 'This link is invalid or has expired. Ask for a new one.') =>
  new ApiError(400, 'invalid_token', message);
export const unsupportedMediaType = (message = 'Send the request body as JSON.') =>
  new ApiError(415, 'unsupported_media_type', message);
export const serviceUnavailable = (message: string) =>
  new ApiError(503, 'service_unavailable', message);

/**
 * The engine throws a coded InputError (field, code, SI quantities) for impossible input
 * (subcritical y1, a conduit that would run full, a floor that cannot be found): that is the
 * user's problem to fix, so it becomes a 422 phrased from its code by refusalText in `units`
 * (the project's), filed under the field it names (below `prefix` when the engine's input sits
 * inside the request body), never a 500. An uncoded RangeError (an internal guard) is a 422 with
 * a plain sentence, never its own text. Anything else is passed through unchanged.
 */
export function fromEngineError(error: unknown, prefix = '', units: PhraseUnits = 'SI'): unknown {
  if (!(error instanceof RangeError)) return error;
  const message = refusalText(error, units);
  const under = (field: string): string =>
    field === 'body' || field === ''
      ? prefix === ''
        ? 'body'
        : prefix
      : prefix === ''
        ? field
        : `${prefix}.${field}`;
  // The engine's refusals carry their field: filed there, never read back from the sentence.
  if (error instanceof InputError)
    return validationError({ [under(error.field)]: message }, message);
  return validationError({ [under('')]: message }, message);
}

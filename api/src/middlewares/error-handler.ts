import type { NextFunction, Request, Response } from 'express';
import {
  ConnectionError,
  DatabaseError,
  UniqueConstraintError,
  ValidationError as SequelizeValidationError,
} from 'sequelize';
import {
  ApiError,
  badJson,
  badRequest,
  conflict,
  payloadTooLarge,
  serviceUnavailable,
  unsupportedMediaType,
  validationError,
} from '../errors';
import { getConfig } from '../config/env';
import { logger } from '../logger';

/** body-parser marks its errors with a `type` string and an HTTP status. */
function bodyParserError(error: unknown): { type: string; status: number } | null {
  if (typeof error !== 'object' || error === null) return null;
  const { type, status } = error as { type?: unknown; status?: unknown };
  return typeof type === 'string' && typeof status === 'number' ? { type, status } : null;
}

/**
 * The database went away under a running query: PostgreSQL shutting down or restarting
 * (SQLSTATE class 57P: admin_shutdown, crash_shutdown, cannot_connect_now), a connection
 * exception (class 08), or the socket closing or already closed by the driver (`pg`'s own
 * messages). Like a refused connection, a 503.
 */
function databaseGoneAway(error: unknown): boolean {
  if (!(error instanceof DatabaseError)) return false;
  const parent = error.parent as Error & { code?: unknown };
  const code = typeof parent.code === 'string' ? parent.code : '';
  return (
    code.startsWith('57P') ||
    code.startsWith('08') ||
    ['ECONNRESET', 'EPIPE', 'ECONNREFUSED'].includes(code) ||
    /^Connection terminated|is not queryable/i.test(parent.message)
  );
}

/** Maps anything thrown to the one error shape; unknown errors become a 500. */
export function toApiError(error: unknown): ApiError {
  if (error instanceof ApiError) return error;
  const parser = bodyParserError(error);
  if (parser !== null) {
    if (parser.type === 'entity.parse.failed') return badJson();
    if (parser.type === 'entity.too.large')
      return payloadTooLarge('The request body is larger than 1 MB.');
    if (parser.type === 'encoding.unsupported' || parser.type === 'charset.unsupported')
      return unsupportedMediaType();
    if (parser.status >= 400 && parser.status < 500)
      return badRequest('The request body could not be read.');
  }
  // A parameter whose percent-escapes do not decode (wellFormedPath catches the path first).
  if (error instanceof URIError)
    return badRequest('The address contains a malformed percent-escape.');
  // A race that slipped past a service check (two sign-ups with one e-mail at the same time).
  if (error instanceof UniqueConstraintError) return conflict('That already exists.');
  if (error instanceof SequelizeValidationError) {
    const details: Record<string, string> = {};
    for (const item of error.errors) details[item.path ?? 'body'] ??= item.message;
    return validationError(details);
  }
  if (error instanceof ConnectionError || databaseGoneAway(error))
    return serviceUnavailable('The database is not reachable. Try again shortly.');
  const message =
    getConfig().nodeEnv === 'production' || !(error instanceof Error)
      ? 'Something went wrong on our side.'
      : error.message;
  return new ApiError(500, 'internal_error', message);
}

export function errorHandler(
  error: unknown,
  req: Request,
  res: Response,
  next: NextFunction,
): void {
  if (res.headersSent) {
    next(error);
    return;
  }
  const apiError = toApiError(error);
  if (apiError.status >= 500)
    (req.log ?? logger()).error({ err: error, reqId: req.id }, 'request failed');
  if (apiError.retryAfter !== undefined) res.setHeader('Retry-After', String(apiError.retryAfter));
  res.status(apiError.status).json(apiError.toJSON());
}

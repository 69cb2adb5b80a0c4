import type { RequestHandler } from 'express';
import { ValidationError, type AnyObjectSchema } from 'yup';
import { validationError, type ErrorDetails } from '../errors';

export type ValidationSource = 'body' | 'query';

function isPlainObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/** yup's errors as `{ [fieldPath]: firstMessage }`; a whole-object rule is keyed by the source. */
export function detailsOf(error: ValidationError, source: ValidationSource): ErrorDetails {
  const details: ErrorDetails = {};
  const errors = error.inner.length > 0 ? error.inner : [error];
  for (const item of errors) {
    const key = item.path === undefined || item.path === '' ? source : item.path;
    details[key] ??= item.message;
  }
  return details;
}

/**
 * Validates and casts the body (or query) with a shared yup schema: every error at once,
 * unknown keys dropped. The cast body replaces req.body; a cast query goes to
 * res.locals.query (Express 5's req.query cannot be reassigned).
 */
export function validate(
  schema: AnyObjectSchema,
  source: ValidationSource = 'body',
): RequestHandler {
  return async (req, res, next) => {
    const input: unknown = source === 'body' ? (req.body ?? {}) : req.query;
    if (!isPlainObject(input)) throw validationError({ [source]: 'Send a JSON object.' });
    let value: unknown;
    try {
      value = await schema.validate(input, { abortEarly: false, stripUnknown: true });
    } catch (error) {
      if (!(error instanceof ValidationError)) throw error;
      const details = detailsOf(error, source);
      const keys = Object.keys(details);
      const only = keys.length === 1 && keys[0] === source ? details[source] : undefined;
      throw validationError(details, only);
    }
    if (source === 'body') req.body = value;
    else res.locals.query = value;
    next();
  };
}

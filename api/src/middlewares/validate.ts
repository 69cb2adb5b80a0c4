import type { RequestHandler } from 'express';
import { ValidationError, type Schema } from 'yup';
import { validationError, type ErrorDetails } from '../errors';
import { assertStorable } from './request-shape';

export type ValidationSource = 'body' | 'query';

function isPlainObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

// Keys that name the prototype machinery: yup looks fields up by key and would take
// `constructor` for a field of its own, and no request of ours has a use for any of them.
const PROTOTYPE_KEYS = new Set(['__proto__', 'constructor', 'prototype']);

/** A copy of parsed JSON without prototype keys, at any depth. */
export function withoutPrototypeKeys(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(withoutPrototypeKeys);
  if (typeof value !== 'object' || value === null) return value;
  const out: Record<string, unknown> = {};
  for (const [key, item] of Object.entries(value)) {
    if (!PROTOTYPE_KEYS.has(key)) out[key] = withoutPrototypeKeys(item);
  }
  return out;
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
export function validate(schema: Schema, source: ValidationSource = 'body'): RequestHandler {
  return async (req, res, next) => {
    const raw: unknown = source === 'body' ? (req.body ?? {}) : req.query;
    if (!isPlainObject(raw)) throw validationError({ [source]: 'Send a JSON object.' });
    // Bodies were checked by jsonBody(); query strings are checked here.
    if (source === 'query') assertStorable(raw, source);
    const input = withoutPrototypeKeys(raw);
    let value: unknown;
    try {
      value = await schema.validate(input, { abortEarly: false, stripUnknown: true });
    } catch (error) {
      // A transform that met a value of the wrong kind (an object where text belongs) throws a
      // TypeError rather than a ValidationError: it is still the request that is wrong.
      if (error instanceof TypeError)
        throw validationError({ [source]: 'Some fields have values of the wrong type.' });
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

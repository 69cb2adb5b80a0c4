import express, { type RequestHandler } from 'express';
import { badJson, badRequest, validationError, type ErrorDetails } from '../errors';

/** Deepest nesting of arrays and objects a JSON body may have (our deepest request uses 5). */
export const MAX_JSON_DEPTH = 32;
/** Largest JSON body, in bytes. */
export const MAX_JSON_BYTES = 1024 * 1024;

export const BAD_TEXT_MESSAGE =
  'Text may not contain NUL characters or unpaired UTF-16 surrogates.';

const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** False for text PostgreSQL refuses (NUL) or that is not valid Unicode (a lone surrogate). */
export function isStorableText(text: string): boolean {
  return !text.includes('\0') && !LONE_SURROGATE.test(text);
}

/**
 * Every string (keys included) in a parsed JSON value or query object that is not storable
 * text, by field path; throws 400 when arrays and objects nest deeper than MAX_JSON_DEPTH.
 * Iterative, so no input can exhaust the stack.
 */
export function badTextIn(value: unknown, root: string): ErrorDetails {
  const details: ErrorDetails = {};
  const stack: [unknown, string, number][] = [[value, '', 0]];
  for (let item = stack.pop(); item !== undefined; item = stack.pop()) {
    const [node, path, depth] = item;
    if (typeof node === 'string') {
      if (!isStorableText(node)) details[path === '' ? root : path] ??= BAD_TEXT_MESSAGE;
      continue;
    }
    if (typeof node !== 'object' || node === null) continue;
    if (depth >= MAX_JSON_DEPTH)
      throw badJson(`The request is nested more than ${MAX_JSON_DEPTH} levels deep.`);
    const entries = Array.isArray(node)
      ? node.map((v, i) => [String(i), v] as const)
      : Object.entries(node as Record<string, unknown>);
    for (const [key, child] of entries) {
      const childPath =
        path === '' ? key : Array.isArray(node) ? `${path}[${key}]` : `${path}.${key}`;
      if (!isStorableText(key)) details[path === '' ? root : path] ??= BAD_TEXT_MESSAGE;
      stack.push([child, childPath, depth + 1]);
    }
  }
  return details;
}

/** Throws 400 for nesting beyond the limit and 422 for unstorable text anywhere in `value`. */
export function assertStorable(value: unknown, root: string): void {
  const details = badTextIn(value, root);
  if (Object.keys(details).length > 0) throw validationError(details, BAD_TEXT_MESSAGE);
}

/**
 * JSON bodies up to MAX_JSON_BYTES, then checked as a whole before any route sees them: no
 * nesting beyond MAX_JSON_DEPTH (400) and no NUL or lone surrogate in any key or string
 * (422), whatever the route does with the field (free-form `options` included).
 */
export function jsonBody(): RequestHandler[] {
  return [
    express.json({ limit: MAX_JSON_BYTES }),
    (req, _res, next) => {
      if (req.body !== undefined) assertStorable(req.body, 'body');
      next();
    },
  ];
}

/**
 * 400 for a path whose percent-escapes do not decode (`/api/v1/projects/%ZZ`), before any
 * router tries to read it as a parameter or a file.
 */
export const wellFormedPath: RequestHandler = (req, _res, next) => {
  try {
    decodeURIComponent(req.path);
  } catch {
    throw badRequest('The address contains a malformed percent-escape (such as %ZZ).');
  }
  next();
};

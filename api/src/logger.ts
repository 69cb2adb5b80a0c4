import { randomUUID } from 'node:crypto';
import type { RequestHandler } from 'express';
import { pino, type DestinationStream, type Logger, type LoggerOptions } from 'pino';
import { getConfig } from './config/env';

// Never written to a log: credentials in headers, passwords and tokens wherever a body or an
// error carries them, and the SQL (with its bound values) of a failed query.
const SECRET_KEYS = ['password', 'currentPassword', 'newPassword', 'token', 'passwordHash'];
export const REDACT_PATHS = [
  'req.headers.authorization',
  'req.headers.cookie',
  'res.headers["set-cookie"]',
  'headers.authorization',
  ...SECRET_KEYS.flatMap((key) => [key, `*.${key}`, `*.*.${key}`]),
  'err.sql',
  'err.parameters',
  'err.original',
  'err.parent',
];

/** A pino logger with the project's redaction; `destination` only for tests. */
export function createLogger(level: string, destination?: DestinationStream): Logger {
  const options: LoggerOptions = { level, redact: { paths: REDACT_PATHS, censor: '[redacted]' } };
  return destination === undefined ? pino(options) : pino(options, destination);
}

let base: Logger | undefined;

/** The process logger (JSON lines on stdout); silent in tests unless LOG_LEVEL says otherwise. */
export function logger(): Logger {
  base ??= createLogger(getConfig().logLevel);
  return base;
}

// Paths whose last segment is an e-mailed secret (GET /api/v1/invitations/:token), and query
// parameters that carry one (the web app's /reset-password?token=…, /accept-invitation?token=…).
const TOKEN_IN_PATH = /^(\/api\/v1\/invitations\/)(?!accept(?:$|[/?#]))[^/?#]+/;
const SECRET_PARAM = /^(token|password|secret|key|code|signature|access_token|id_token)$/i;

/** The URL as it may be logged: tokens in the path and secret query parameters replaced. */
export function redactUrl(url: string): string {
  const q = url.indexOf('?');
  const path = (q === -1 ? url : url.slice(0, q)).replace(TOKEN_IN_PATH, '$1[redacted]');
  if (q === -1) return path;
  const query = url
    .slice(q + 1)
    .split('&')
    .map((pair) => {
      const eq = pair.indexOf('=');
      const rawName = eq === -1 ? pair : pair.slice(0, eq);
      let name = rawName;
      try {
        name = decodeURIComponent(rawName);
      } catch {
        // a malformed escape names nothing we know; keep it as sent
      }
      return eq !== -1 && SECRET_PARAM.test(name) ? `${rawName}=[redacted]` : pair;
    })
    .join('&');
  return `${path}?${query}`;
}

/**
 * One log line per request (method, path, status, duration, request id echoed from a sane
 * X-Request-Id). A few lines on pino instead of pino-http: pino-http builds a child logger
 * and serialises request and response on every call, which alone costs about a third of a
 * small JSON route's throughput; this does the same job for the levels that are enabled.
 * Bodies and headers are never logged; the URL goes through redactUrl().
 */
export function httpLogger(log: Logger = logger()): RequestHandler {
  return (req, res, next) => {
    const started = process.hrtime.bigint();
    const given = req.headers['x-request-id'];
    const id = typeof given === 'string' && /^[\w-]{1,64}$/.test(given) ? given : randomUUID();
    req.id = id;
    req.log = log;
    res.setHeader('X-Request-Id', id);
    res.once('finish', () => {
      if (req.originalUrl === '/api/v1/health') return;
      const level = res.statusCode >= 500 ? 'error' : res.statusCode >= 400 ? 'warn' : 'info';
      if (!log.isLevelEnabled(level)) return;
      const ms = Number(process.hrtime.bigint() - started) / 1e6;
      log[level](
        {
          reqId: id,
          method: req.method,
          url: redactUrl(req.originalUrl),
          status: res.statusCode,
          ms,
        },
        'request',
      );
    });
    next();
  };
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      /** Set by httpLogger(): the request id, also sent back as X-Request-Id. */
      id?: string;
      /** Set by httpLogger(): the logger of this request's app. */
      log?: Logger;
    }
  }
}

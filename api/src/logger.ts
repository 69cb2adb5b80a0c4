import { randomUUID } from 'node:crypto';
import type { IncomingMessage } from 'node:http';
import { pino, type Logger } from 'pino';
import { pinoHttp, type HttpLogger } from 'pino-http';
import { getConfig } from './config/env';

let base: Logger | undefined;

/** The process logger (JSON lines on stdout); silent in tests unless LOG_LEVEL says otherwise. */
export function logger(): Logger {
  base ??= pino({
    level: getConfig().logLevel,
    redact: ['req.headers.authorization', 'req.headers.cookie', 'res.headers["set-cookie"]'],
  });
  return base;
}

/** One log line per request, with a request id echoed from X-Request-Id when sane. */
export function httpLogger(): HttpLogger {
  return pinoHttp({
    logger: logger(),
    genReqId: (req: IncomingMessage) => {
      const given = req.headers['x-request-id'];
      return typeof given === 'string' && /^[\w-]{1,64}$/.test(given) ? given : randomUUID();
    },
    customLogLevel: (_req, res, error) => {
      if (error !== undefined || res.statusCode >= 500) return 'error';
      if (res.statusCode >= 400) return 'warn';
      return 'info';
    },
    autoLogging: { ignore: (req) => req.url === '/api/v1/health' },
  });
}

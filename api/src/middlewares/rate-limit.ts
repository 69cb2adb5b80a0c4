import {
  rateLimit,
  type IncrementResponse,
  type Options,
  type RateLimitRequestHandler,
  type Store,
} from 'express-rate-limit';
import { QueryTypes, type Sequelize } from 'sequelize';
import { rateLimited } from '../errors';

/**
 * express-rate-limit store on PostgreSQL: fixed-window counters in `rate_limits`, updated
 * with one atomic upsert, so every API process behind a load balancer shares them.
 */
export class PostgresRateLimitStore implements Store {
  readonly localKeys = false;
  private windowMs = 60_000;

  constructor(
    private readonly sequelize: Sequelize,
    readonly prefix: string,
  ) {}

  init(options: Options): void {
    this.windowMs = options.windowMs;
  }

  private key(key: string): string {
    return `${this.prefix}${key}`.slice(0, 300);
  }

  async get(key: string): Promise<IncrementResponse | undefined> {
    const rows = await this.sequelize.query<{ hits: number; reset_at: Date }>(
      'SELECT hits, reset_at FROM rate_limits WHERE key = :key AND reset_at > now()',
      { replacements: { key: this.key(key) }, type: QueryTypes.SELECT },
    );
    const row = rows[0];
    return row === undefined
      ? undefined
      : { totalHits: row.hits, resetTime: new Date(row.reset_at) };
  }

  async increment(key: string): Promise<IncrementResponse> {
    const rows = await this.sequelize.query<{ hits: number; reset_at: Date }>(
      `INSERT INTO rate_limits (key, hits, reset_at)
       VALUES (:key, 1, now() + make_interval(secs => :seconds))
       ON CONFLICT (key) DO UPDATE SET
         hits = CASE WHEN rate_limits.reset_at <= now() THEN 1 ELSE rate_limits.hits + 1 END,
         reset_at = CASE WHEN rate_limits.reset_at <= now() THEN EXCLUDED.reset_at ELSE rate_limits.reset_at END
       RETURNING hits, reset_at`,
      {
        replacements: { key: this.key(key), seconds: this.windowMs / 1000 },
        type: QueryTypes.SELECT,
      },
    );
    const row = rows[0];
    if (row === undefined) throw new Error('rate limit upsert returned no row');
    // Now and then, clear windows that ended long ago so the table stays small.
    if (Math.random() < 0.01) {
      await this.sequelize.query(
        "DELETE FROM rate_limits WHERE reset_at < now() - interval '1 day'",
      );
    }
    return { totalHits: row.hits, resetTime: new Date(row.reset_at) };
  }

  async decrement(key: string): Promise<void> {
    await this.sequelize.query(
      'UPDATE rate_limits SET hits = GREATEST(hits - 1, 0) WHERE key = :key AND reset_at > now()',
      { replacements: { key: this.key(key) } },
    );
  }

  async resetKey(key: string): Promise<void> {
    await this.sequelize.query('DELETE FROM rate_limits WHERE key = :key', {
      replacements: { key: this.key(key) },
    });
  }
}

/** E-mail from a body already validated (and lowercased) by the shared schema. */
function bodyEmail(body: unknown): string {
  if (
    typeof body === 'object' &&
    body !== null &&
    'email' in body &&
    typeof body.email === 'string'
  )
    return body.email;
  return '';
}

export interface RateLimits {
  loginByIp: RateLimitRequestHandler;
  signupByIp: RateLimitRequestHandler;
  forgotByIp: RateLimitRequestHandler;
  forgotByAccount: RateLimitRequestHandler;
  tokenByIp: RateLimitRequestHandler;
}

const MINUTE = 60_000;

/** Rate limits for the unauthenticated auth routes; answers 429 rate_limited with Retry-After. */
export function createRateLimits(sequelize: Sequelize): RateLimits {
  const limiter = (prefix: string, windowMs: number, limit: number, extra: Partial<Options> = {}) =>
    rateLimit({
      windowMs,
      limit,
      standardHeaders: 'draft-7',
      legacyHeaders: false,
      store: new PostgresRateLimitStore(sequelize, prefix),
      handler: (_req, _res, next) => next(rateLimited()),
      ...extra,
    });
  return {
    loginByIp: limiter('login-ip:', 15 * MINUTE, 30),
    signupByIp: limiter('signup-ip:', 60 * MINUTE, 20),
    forgotByIp: limiter('forgot-ip:', 60 * MINUTE, 20),
    forgotByAccount: limiter('forgot-account:', 60 * MINUTE, 5, {
      keyGenerator: (req) => bodyEmail(req.body),
    }),
    tokenByIp: limiter('token-ip:', 15 * MINUTE, 30),
  };
}

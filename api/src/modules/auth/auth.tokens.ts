import { createSecretKey, type KeyObject } from 'node:crypto';
import jwt, { type SignOptions } from 'jsonwebtoken';
import { getConfig } from '../../config/env';
import { unauthorized } from '../../errors';
import { isUuid } from '../../security';

export const JWT_ISSUER = 'basinwright';
export const JWT_AUDIENCE = 'basinwright-app';
const ALGORITHM = 'HS256';

export interface TokenClaims {
  /** User id. */
  sub: string;
  /** Firm id. */
  fid: string;
  /** User's token version when issued; a bump revokes the token. */
  tv: number;
}

let key: KeyObject | undefined;

// A KeyObject built once: verification is ~40× faster than with a string secret.
function signingKey(): KeyObject {
  key ??= createSecretKey(Buffer.from(getConfig().jwtSecret, 'utf8'));
  return key;
}

export function issueToken(user: { id: string; firmId: string; tokenVersion: number }): string {
  return jwt.sign({ fid: user.firmId, tv: user.tokenVersion }, signingKey(), {
    algorithm: ALGORITHM,
    subject: user.id,
    issuer: JWT_ISSUER,
    audience: JWT_AUDIENCE,
    // Validated in env.ts as seconds or a duration string.
    expiresIn: getConfig().jwtTtl as NonNullable<SignOptions['expiresIn']>,
  });
}

/** Verifies signature (HS256 only), issuer, audience and expiry; throws 401 otherwise. */
function verifyUncached(token: string): TokenClaims & { expMs: number } {
  let payload: string | jwt.JwtPayload;
  try {
    payload = jwt.verify(token, signingKey(), {
      algorithms: [ALGORITHM],
      issuer: JWT_ISSUER,
      audience: JWT_AUDIENCE,
    });
  } catch (error) {
    if (error instanceof jwt.TokenExpiredError)
      throw unauthorized('Your session has expired. Sign in again.');
    throw unauthorized('Your session is not valid. Sign in again.');
  }
  if (
    typeof payload === 'string' ||
    !isUuid(payload.sub) ||
    !isUuid(payload.fid) ||
    !Number.isInteger(payload.tv)
  ) {
    throw unauthorized('Your session is not valid. Sign in again.');
  }
  const expMs = typeof payload.exp === 'number' ? payload.exp * 1000 : 0;
  return { sub: payload.sub, fid: payload.fid, tv: payload.tv as number, expMs };
}

// Tokens this process has already verified, with their expiry. A token is immutable and the key
// is fixed for the process's life, so a hit only needs the expiry re-checked; this saves the
// HMAC and two JSON parses on every request of a session. Per process and bounded, so it holds
// nothing other processes need (revocation is checked against the database by authenticate()).
const verified = new Map<string, TokenClaims & { expMs: number }>();
const VERIFIED_MAX = 5000;

/** Verifies signature (HS256 only), issuer, audience and expiry; throws 401 otherwise. */
export function verifyToken(token: string): TokenClaims {
  const hit = verified.get(token);
  if (hit !== undefined && Date.now() < hit.expMs)
    return { sub: hit.sub, fid: hit.fid, tv: hit.tv };
  if (hit !== undefined) verified.delete(token);
  const claims = verifyUncached(token);
  if (verified.size >= VERIFIED_MAX) {
    const oldest = verified.keys().next().value;
    if (oldest !== undefined) verified.delete(oldest);
  }
  verified.set(token, claims);
  return { sub: claims.sub, fid: claims.fid, tv: claims.tv };
}

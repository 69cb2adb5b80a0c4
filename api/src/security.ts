import { createHash, randomBytes } from 'node:crypto';
import bcrypt from 'bcryptjs';
import { getConfig } from './config/env';

/** bcrypt hash at the configured cost. The caller has already checked the 72-byte limit. */
export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, getConfig().bcryptCost);
}

let dummyHash: Promise<string> | undefined;

/**
 * Compares a password with a stored hash. With no hash (unknown e-mail) it still runs one
 * bcrypt comparison, so the answer takes as long whether or not the account exists.
 */
export async function verifyPassword(password: string, hash: string | null): Promise<boolean> {
  if (hash === null) {
    dummyHash ??= bcrypt.hash('basinwright-no-such-account', getConfig().bcryptCost);
    await bcrypt.compare(password, await dummyHash);
    return false;
  }
  return bcrypt.compare(password, hash);
}

/** A token for an e-mailed link: 32 random bytes, base64url (43 characters). */
export function newEmailToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, tokenHash: hashEmailToken(token) };
}

/** Only this digest is stored, so a leaked table cannot be used to reset or join. */
export function hashEmailToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Ids are UUIDs; anything else cannot name a row (and must not reach PostgreSQL as a cast error). */
export function isUuid(value: unknown): value is string {
  return typeof value === 'string' && UUID.test(value);
}

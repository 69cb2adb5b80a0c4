import { createHash } from 'node:crypto';
import { RateLimiterPostgres } from 'rate-limiter-flexible';
import { rateLimited } from '../../errors';
import { sequelize } from '../../models';

// Throttling of password guesses, kept in PostgreSQL (table auth_throttle) so every API process
// agrees. Nothing here refuses an account as a whole: a stranger's wrong guesses slow down only
// the address they come from (OWASP ASVS 5.0 §6.3, Authentication cheat sheet), so the owner,
// signing in from anywhere else, is never locked out.

const DAY_S = 24 * 60 * 60;
const HOUR_S = 60 * 60;

/** Consecutive failures for one account from one address that cost nothing. */
export const FREE_FAILURES = 3;
/** Longest wait between two guesses for one account from one address, in seconds. */
export const MAX_WAIT_S = 15 * 60;
/** Failed sign-ins one address may make in a day, over all accounts (guessing across accounts). */
export const ADDRESS_FAILURES_PER_DAY = 100;
/** Wrong current passwords one member may give to change-password in an hour. */
export const CHANGE_PASSWORD_FAILURES_PER_HOUR = 5;

/**
 * Wait after the n-th consecutive failure of one account from one address: none for the first
 * FREE_FAILURES, then 1 s, 2 s, 4 s … doubling up to MAX_WAIT_S.
 */
export function waitAfterFailure(n: number): number {
  if (n <= FREE_FAILURES) return 0;
  return Math.min(2 ** (n - FREE_FAILURES - 1), MAX_WAIT_S);
}

function limiter(keyPrefix: string, points: number, duration: number, clean = false) {
  return new RateLimiterPostgres({
    storeClient: sequelize,
    storeType: 'sequelize',
    tableName: 'auth_throttle',
    tableCreated: true, // by the migration
    clearExpiredByTimeout: clean,
    keyPrefix,
    points,
    duration,
  });
}

let limiters:
  | {
      pairFailures: RateLimiterPostgres;
      pairWait: RateLimiterPostgres;
      addressFailures: RateLimiterPostgres;
      changePassword: RateLimiterPostgres;
    }
  | undefined;

function all() {
  limiters ??= {
    // counts consecutive failures of one account from one address (forgotten after a day)
    pairFailures: limiter('login-pair-fails', 1_000_000, DAY_S, true),
    // holds the current wait of that pair, set with block()
    pairWait: limiter('login-pair-wait', 1, MAX_WAIT_S),
    addressFailures: limiter('login-address-fails', ADDRESS_FAILURES_PER_DAY, DAY_S),
    changePassword: limiter('change-password-fails', CHANGE_PASSWORD_FAILURES_PER_HOUR, HOUR_S),
  };
  return limiters;
}

/** Keys are digests: the table holds no e-mail address and stays within its key length. */
function digest(...parts: string[]): string {
  return createHash('sha256').update(parts.join('\n'), 'utf8').digest('hex');
}

const tooSoon = (ms: number) =>
  rateLimited(
    'Too many attempts from here. Wait a little and try again.',
    Math.max(1, Math.ceil(ms / 1000)),
  );

/** Throws 429 (with Retry-After) while this address must wait before guessing this account again. */
export async function beforeLogin(email: string, address: string): Promise<void> {
  const { pairWait, addressFailures } = all();
  const [wait, spent] = await Promise.all([
    pairWait.get(digest(email, address)),
    addressFailures.get(digest(address)),
  ]);
  if (wait !== null && wait.consumedPoints > pairWait.points) throw tooSoon(wait.msBeforeNext);
  if (spent !== null && spent.consumedPoints >= ADDRESS_FAILURES_PER_DAY)
    throw tooSoon(spent.msBeforeNext);
}

/** Records a failed sign-in and sets the pair's next wait. */
export async function loginFailed(email: string, address: string): Promise<void> {
  const { pairFailures, pairWait, addressFailures } = all();
  const pair = digest(email, address);
  const [failures] = await Promise.all([
    pairFailures.penalty(pair, 1),
    addressFailures.penalty(digest(address), 1),
  ]);
  const wait = waitAfterFailure(failures.consumedPoints);
  if (wait > 0) await pairWait.block(pair, wait);
}

/** A correct password from this address clears its failures for the account. */
export async function loginSucceeded(email: string, address: string): Promise<void> {
  const { pairFailures, pairWait } = all();
  const pair = digest(email, address);
  await Promise.all([pairFailures.delete(pair), pairWait.delete(pair)]);
}

/** Throws 429 once a member has given too many wrong current passwords this hour. */
export async function beforePasswordChange(userId: string): Promise<void> {
  const { changePassword } = all();
  const spent = await changePassword.get(digest(userId));
  if (spent !== null && spent.consumedPoints >= CHANGE_PASSWORD_FAILURES_PER_HOUR)
    throw tooSoon(spent.msBeforeNext);
}

export async function passwordChangeFailed(userId: string): Promise<void> {
  await all().changePassword.penalty(digest(userId), 1);
}

import type { NextFunction, Request, RequestHandler, Response } from 'express';
import { allowedWhileReadOnly, can, type Action } from '@basinwright/common';
import { forbidden, readOnly, unauthorized } from '../errors';
import { Firm, sequelize, User } from '../models';
import { verifyToken } from '../modules/auth/auth.tokens';
import { BILLING_READ_ONLY_MESSAGE, effectiveBillingStatus } from '../modules/plans/plans.service';
import { SessionChecker } from './session-check';

export interface AuthContext {
  user: User;
  firm: Firm;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      /** Set by authenticate(): the signed-in member and their firm. */
      auth?: AuthContext;
    }
  }
}

/** The token of `Authorization: Bearer <jwt>`; 401 when the header is missing or malformed. */
function bearerToken(req: Request): string {
  const header = req.get('authorization');
  const match = header === undefined ? null : /^Bearer\s+(\S+)$/i.exec(header);
  if (match?.[1] === undefined) throw unauthorized();
  return match[1];
}

/**
 * Requires `Authorization: Bearer <jwt>`. The user is loaded on every request so that a
 * deactivated member, a changed role or a bumped token version takes effect at once.
 */
export const authenticate: RequestHandler = async (
  req: Request,
  _res: Response,
  next: NextFunction,
) => {
  const claims = verifyToken(bearerToken(req));
  // The logo's bytes are not needed to authorize; brand code loads them itself.
  const user = await User.findByPk(claims.sub, {
    include: [{ model: Firm, as: 'firm', attributes: { exclude: ['logo'] } }],
  });
  if (
    user === null ||
    user.firm === undefined ||
    !user.active ||
    user.tokenVersion !== claims.tv ||
    user.firmId !== claims.fid
  ) {
    throw unauthorized('Your session has ended. Sign in again.');
  }
  req.auth = { user, firm: user.firm };
  next();
};

const sessions = new SessionChecker(sequelize);

/**
 * Requires a valid token that is still the member's current one, without loading the member:
 * for routes that compute and neither read nor write firm data (the engine). A token from
 * before a sign-out, a password change or a deactivation is refused here exactly as in
 * authenticate() (see SessionChecker: one indexed query, shared by requests arriving together,
 * never a cache). Everything else uses authenticate().
 */
export const authenticateSession: RequestHandler = async (req, _res, next) => {
  const claims = verifyToken(bearerToken(req));
  if (!(await sessions.isCurrent(claims)))
    throw unauthorized('Your session has ended. Sign in again.');
  next();
};

/** The signed-in context; only valid after authenticate(). */
export function authOf(req: Request): AuthContext {
  if (req.auth === undefined) throw unauthorized();
  return req.auth;
}

const READS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Allows the request only when the member's role may perform `action` (see POLICY), and, while
 * the firm is read-only for billing (an unpaid grace ended), refuses every write but signing
 * out, one's own profile and billing itself (`allowedWhileReadOnly`): everything stays readable.
 */
export function authorize(action: Action): RequestHandler {
  return (req, _res, next) => {
    const { user, firm } = authOf(req);
    if (!can(user.role, action)) throw forbidden();
    if (
      !READS.has(req.method) &&
      !allowedWhileReadOnly(action) &&
      effectiveBillingStatus(firm) === 'read_only'
    )
      throw readOnly(BILLING_READ_ONLY_MESSAGE, 'billing');
    next();
  };
}

/** authenticate + authorize(action), for a route's handler list. */
export function guard(action: Action): RequestHandler[] {
  return [authenticate, authorize(action)];
}

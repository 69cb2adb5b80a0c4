import {
  PLAN_LIMITS,
  TOKEN_TTL_MS,
  type ChangePasswordInput,
  type ConfirmSignupInput,
  type ForgotPasswordInput,
  type ProfileUpdateInput,
  type LoginInput,
  type ResetPasswordInput,
  type SignupInput,
} from '@basinwright/common';
import { Op, UniqueConstraintError } from 'sequelize';
import { conflict, invalidToken, unauthorized, validationError } from '../../errors';
import { Firm, PasswordReset, sequelize, SignupRequest, User } from '../../models';
import { hashEmailToken, hashPassword, verifyPassword } from '../../security';
import { queueMail } from '../../jobs';
import { issueToken } from './auth.tokens';
import * as throttle from './auth.throttle';

export interface Session {
  token: string;
  user: User;
  firm: Firm;
}

const WRONG_CREDENTIALS = 'Incorrect e-mail or password.';
export const EMAIL_TAKEN =
  'An account with this e-mail already exists. Sign in, or reset the password.';

export const SIGNUP_MESSAGE =
  'Check your e-mail: we have sent a link to finish creating the account. It expires in 24 hours.';

/**
 * Records the sign-up and queues its mail; the answer is the same whether or not the address
 * already has an account (the request path does the same work either way: one password hash,
 * one row, one job). The job sends a link to finish, or tells an existing account's owner that
 * someone tried.
 */
export async function signup(input: SignupInput): Promise<void> {
  const passwordHash = await hashPassword(input.password);
  const request = await SignupRequest.create({
    email: input.email,
    name: input.name,
    firmName: input.firmName,
    passwordHash,
    expiresAt: new Date(Date.now() + TOKEN_TTL_MS.signup),
  });
  await queueMail({ kind: 'signup', requestId: request.id });
}

/**
 * Finishes a sign-up from its e-mailed link (single use): creates a firm on the Concept plan
 * and its owner in one transaction, then signs the owner in.
 */
export async function confirmSignup(input: ConfirmSignupInput): Promise<Session> {
  const tokenHash = hashEmailToken(input.token);
  try {
    const { user, firm } = await sequelize.transaction(async (transaction) => {
      const request = await SignupRequest.findOne({
        where: { tokenHash },
        lock: transaction.LOCK.UPDATE,
        transaction,
      });
      const now = new Date();
      if (request === null || request.usedAt !== null || request.expiresAt <= now)
        throw invalidToken();
      if ((await User.count({ where: { email: request.email }, transaction })) > 0)
        throw conflict(EMAIL_TAKEN);
      const firm = await Firm.create(
        { name: request.firmName, plan: 'concept', seats: PLAN_LIMITS.concept.defaultSeats },
        { transaction },
      );
      const user = await User.create(
        {
          firmId: firm.id,
          name: request.name,
          email: request.email,
          passwordHash: request.passwordHash,
          role: 'owner',
          lastLoginAt: now,
        },
        { transaction },
      );
      await request.update({ usedAt: now }, { transaction });
      return { user, firm };
    });
    return { token: issueToken(user), user, firm };
  } catch (error) {
    if (error instanceof UniqueConstraintError) throw conflict(EMAIL_TAKEN);
    throw error;
  }
}

/**
 * Same answer, and about the same time, for an unknown e-mail, a wrong password or a deactivated
 * member. Guesses are throttled per account and address (auth.throttle.ts), never per account.
 */
export async function login(input: LoginInput, address: string): Promise<Session> {
  await throttle.beforeLogin(input.email, address);
  const user = await User.findOne({
    where: { email: input.email },
    include: [{ model: Firm, as: 'firm' }],
  });
  const ok = await verifyPassword(input.password, user?.passwordHash ?? null);
  if (user === null || !ok || !user.active || user.firm === undefined) {
    await throttle.loginFailed(input.email, address);
    throw unauthorized(WRONG_CREDENTIALS);
  }
  await throttle.loginSucceeded(input.email, address);
  await user.update({ lastLoginAt: new Date() });
  return { token: issueToken(user), user, firm: user.firm };
}

/** Revokes every token of the member (all devices) by bumping the token version. */
export async function logout(user: User): Promise<void> {
  await User.increment({ tokenVersion: 1 }, { where: { id: user.id } });
}

export const FORGOT_PASSWORD_MESSAGE =
  'If an account exists for that e-mail, we have sent a link to choose a new password. It expires in 1 hour.';

/**
 * Queues the reset mail for any address, known or not: the request path does the same work
 * either way (one job queued), and the job alone decides whether there is anyone to write to.
 */
export async function forgotPassword(input: ForgotPasswordInput): Promise<void> {
  await queueMail({ kind: 'password-reset', email: input.email });
}

/** Sets a new password from a single-use, unexpired token; ends every other session. */
export async function resetPassword(input: ResetPasswordInput): Promise<Session> {
  const passwordHash = await hashPassword(input.password);
  const tokenHash = hashEmailToken(input.token);
  const user = await sequelize.transaction(async (transaction) => {
    const reset = await PasswordReset.findOne({
      where: { tokenHash },
      lock: transaction.LOCK.UPDATE,
      transaction,
    });
    const now = new Date();
    if (reset === null || reset.usedAt !== null || reset.expiresAt <= now) throw invalidToken();
    const user = await User.findByPk(reset.userId, { lock: transaction.LOCK.UPDATE, transaction });
    if (user === null || !user.active) throw invalidToken();
    await user.update({ passwordHash, tokenVersion: user.tokenVersion + 1 }, { transaction });
    // This and every other open link of the member stop working.
    await PasswordReset.update(
      { usedAt: now },
      { where: { userId: user.id, usedAt: { [Op.is]: null } }, transaction },
    );
    return user;
  });
  const firm = await Firm.findByPk(user.firmId, { rejectOnEmpty: true });
  return { token: issueToken(user), user, firm };
}

/** Changes the member's own name. */
export async function updateProfile(user: User, input: ProfileUpdateInput): Promise<User> {
  return user.update({ name: input.name });
}

/**
 * Changes the member's password after checking the current one; every other session ends
 * (token version bumped) and this one continues with the new token returned.
 */
export async function changePassword(
  user: User,
  firm: Firm,
  input: ChangePasswordInput,
): Promise<Session> {
  await throttle.beforePasswordChange(user.id);
  if (!(await verifyPassword(input.currentPassword, user.passwordHash))) {
    await throttle.passwordChangeFailed(user.id);
    throw validationError(
      { currentPassword: 'The current password is not right.' },
      'The current password is not right.',
    );
  }
  const passwordHash = await hashPassword(input.newPassword);
  await user.update({ passwordHash, tokenVersion: user.tokenVersion + 1 });
  return { token: issueToken(user), user, firm };
}

import type { Request, Response } from 'express';
import type {
  ChangePasswordInput,
  ConfirmSignupInput,
  ForgotPasswordInput,
  ProfileUpdateInput,
  LoginInput,
  ResetPasswordInput,
  SignupInput,
} from '@basinwright/common';
import { authOf } from '../../middlewares/auth';
import { presentFirm, presentSession, presentUser } from './auth.presenter';
import * as auth from './auth.service';

export async function signup(req: Request, res: Response): Promise<void> {
  await auth.signup(req.body as SignupInput);
  res.status(202).json({ message: auth.SIGNUP_MESSAGE });
}

export async function confirmSignup(req: Request, res: Response): Promise<void> {
  const session = await auth.confirmSignup(req.body as ConfirmSignupInput);
  res.status(201).json(presentSession(session.token, session.user, session.firm));
}

export async function login(req: Request, res: Response): Promise<void> {
  // req.ip follows the 'trust proxy' setting; without an address all share one bucket.
  const session = await auth.login(req.body as LoginInput, req.ip ?? '');
  res.json(presentSession(session.token, session.user, session.firm));
}

export async function logout(req: Request, res: Response): Promise<void> {
  await auth.logout(authOf(req).user);
  res.status(204).end();
}

export function me(req: Request, res: Response): void {
  const { user, firm } = authOf(req);
  res.json({ user: presentUser(user), firm: presentFirm(firm) });
}

export async function forgotPassword(req: Request, res: Response): Promise<void> {
  await auth.forgotPassword(req.body as ForgotPasswordInput);
  res.status(202).json({ message: auth.FORGOT_PASSWORD_MESSAGE });
}

export async function resetPassword(req: Request, res: Response): Promise<void> {
  const session = await auth.resetPassword(req.body as ResetPasswordInput);
  res.json(presentSession(session.token, session.user, session.firm));
}

export async function updateMe(req: Request, res: Response): Promise<void> {
  const { user, firm } = authOf(req);
  const updated = await auth.updateProfile(user, req.body as ProfileUpdateInput);
  res.json({ user: presentUser(updated), firm: presentFirm(firm) });
}

export async function changePassword(req: Request, res: Response): Promise<void> {
  const { user, firm } = authOf(req);
  const session = await auth.changePassword(user, firm, req.body as ChangePasswordInput);
  res.json(presentSession(session.token, session.user, session.firm));
}

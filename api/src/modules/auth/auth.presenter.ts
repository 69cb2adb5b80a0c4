import type { BillingStatus, Plan, Role } from '@basinwright/common';
import { effectiveBillingStatus } from '../plans/plans.service';
import type { Firm, User } from '../../models';

export interface UserView {
  id: string;
  name: string;
  email: string;
  role: Role;
  active: boolean;
  createdAt: string;
}

export interface FirmView {
  id: string;
  name: string;
  plan: Plan;
  seats: number;
  /** In force now: a past-due firm whose grace has ended reads 'read_only'. */
  billingStatus: BillingStatus;
  graceEndsAt: string | null;
}

export interface SessionView {
  token: string;
  user: UserView;
  firm: FirmView;
}

// Presenters name every field they send, so no column (password hash, token version) leaks.
export function presentUser(user: User): UserView {
  return {
    id: user.id,
    name: user.name,
    email: user.email,
    role: user.role,
    active: user.active,
    createdAt: user.createdAt.toISOString(),
  };
}

export function presentFirm(firm: Firm): FirmView {
  return {
    id: firm.id,
    name: firm.name,
    plan: firm.plan,
    seats: firm.seats,
    billingStatus: effectiveBillingStatus(firm),
    graceEndsAt: firm.graceEndsAt === null ? null : firm.graceEndsAt.toISOString(),
  };
}

export function presentSession(token: string, user: User, firm: Firm): SessionView {
  return { token, user: presentUser(user), firm: presentFirm(firm) };
}

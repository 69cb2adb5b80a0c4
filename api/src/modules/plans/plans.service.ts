import {
  BILLING_STATUSES,
  PLANS,
  featureLimitText,
  featureLiftedBy,
  limitFor,
  limitLiftedBy,
  limitReachedText,
  minimumSeats,
  planAllows,
  type BillingStatus,
  type Plan,
  type PlanFeature,
  type PlanLimitName,
} from '@basinwright/common';
import type { Transaction } from 'sequelize';
import { planLimit } from '../../errors';
import type { Firm } from '../../models';
import { lockFirm } from '../members/members.service';

/** What the billing side may change on a firm; every field is optional. */
export interface PlanChange {
  plan?: Plan;
  seats?: number;
  billingStatus?: BillingStatus;
  graceEndsAt?: Date | null;
  stripeCustomerId?: string | null;
  stripeSubscriptionId?: string | null;
  cancelAtPeriodEnd?: boolean;
  currentPeriodEnd?: Date | null;
  billingSyncedAt?: Date | null;
}

/**
 * Sets a firm's plan, seats and billing state inside the caller's transaction, under the firm's
 * row lock (the same lock invitations and project creation take, so seat counts and limits are
 * read consistently). Never deletes anything: a firm holding more than the new plan allows keeps
 * it all, and what is over the limit becomes read-only (see projectWritability). Seats below a
 * plan's minimum are raised to it; seats on Concept are 1. Throws RangeError on a value outside
 * the table (a programming error, not user input).
 */
export async function applyPlanChange(
  firmId: string,
  change: PlanChange,
  transaction: Transaction,
): Promise<Firm> {
  const firm = await lockFirm(firmId, transaction);
  const plan = change.plan ?? firm.plan;
  if (!(PLANS as readonly string[]).includes(plan)) throw new RangeError(`Unknown plan ${plan}.`);
  if (change.billingStatus !== undefined && !BILLING_STATUSES.includes(change.billingStatus))
    throw new RangeError(`Unknown billing status ${change.billingStatus}.`);
  let seats = change.seats ?? firm.seats;
  if (!Number.isInteger(seats) || seats < 1) throw new RangeError(`Seats must be ≥ 1: ${seats}.`);
  const cap = limitFor(plan, 'seats');
  seats = Math.max(seats, minimumSeats(plan));
  if (cap !== null) seats = Math.min(seats, cap);
  const defined = Object.fromEntries(
    Object.entries(change).filter(
      ([key, v]) => v !== undefined && key !== 'plan' && key !== 'seats',
    ),
  );
  await firm.update({ ...defined, plan, seats }, { transaction });
  return firm;
}

/** Refuses (403 plan_limit) when the firm's plan does not include `feature`. */
export function requireFeature(firm: Pick<Firm, 'plan'>, feature: PlanFeature): void {
  if (!planAllows(firm.plan, feature))
    throw planLimit(featureLimitText(firm.plan, feature), feature, featureLiftedBy(feature));
}

/**
 * Refuses (403 plan_limit) adding one more under `limit` when the firm already holds `count`.
 * Call it under lockFirm in the same transaction as the insert, so two requests cannot both
 * take the last place.
 */
export function requireBelowLimit(
  firm: Pick<Firm, 'plan' | 'seats'>,
  limit: PlanLimitName,
  count: number,
): void {
  const planCap = limitFor(firm.plan, limit);
  const cap =
    limit === 'seats' ? (planCap === null ? firm.seats : Math.min(planCap, firm.seats)) : planCap;
  if (cap !== null && count >= cap)
    throw planLimit(
      limitReachedText(firm.plan, limit, cap),
      limit,
      limitLiftedBy(limit, firm.plan),
    );
}

/** Price-book hook (the pricing helper calls it): importing a price book needs Professional. */
export function requirePriceBookImport(firm: Pick<Firm, 'plan'>): void {
  requireFeature(firm, 'priceBookImport');
}

/**
 * Price-book hook: refuses creating (or importing) another price book when the firm holds
 * `existingBooks` already and its plan allows no more (Concept and Professional: 1; Firm: any).
 */
export function requireAnotherPriceBook(
  firm: Pick<Firm, 'plan' | 'seats'>,
  existingBooks: number,
): void {
  requireBelowLimit(firm, 'priceBooks', existingBooks);
}

/**
 * The billing status in force now: a past-due firm whose grace has ended is read-only even
 * before anything has written 'read_only' (no timer needed for correctness).
 */
export function effectiveBillingStatus(
  firm: Pick<Firm, 'billingStatus' | 'graceEndsAt'>,
  now: Date = new Date(),
): BillingStatus {
  if (
    firm.billingStatus === 'past_due' &&
    firm.graceEndsAt !== null &&
    firm.graceEndsAt.getTime() <= now.getTime()
  )
    return 'read_only';
  return firm.billingStatus;
}

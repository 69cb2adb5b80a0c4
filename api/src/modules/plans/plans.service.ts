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
  planName,
  seatLimit,
  type BillingStatus,
  type Plan,
  type PlanFeature,
  type PlanLimitName,
} from '@basinwright/common';
import type { Transaction } from 'sequelize';
import { notFound, planLimit, readOnly, type ApiError } from '../../errors';
import { Firm, Project } from '../../models';
import { isUuid } from '../../security';

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
  // The same row lock as members.service's lockFirm (not imported: members.service imports this).
  const firm = await Firm.findByPk(firmId, { lock: transaction.LOCK.UPDATE, transaction });
  if (firm === null) throw notFound();
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

/** Why a project cannot be changed now; null when it can. */
export interface ReadOnlyReason {
  reason: 'billing' | 'project_over_limit';
  message: string;
}

export const BILLING_READ_ONLY_MESSAGE =
  'Your firm is read-only because a payment is overdue and the grace period has ended. Everything stays readable; the owner can settle the payment under Billing to make changes again.';

/**
 * Which of the firm's projects stay writable under its plan's project cap: the `cap` oldest by
 * creation (created_at, then id). Returns null when every project is writable (no cap).
 */
export async function writableProjectIds(
  firm: Pick<Firm, 'id' | 'plan'>,
  transaction?: Transaction,
): Promise<Set<string> | null> {
  const cap = limitFor(firm.plan, 'projects');
  if (cap === null) return null;
  const rows = await Project.findAll({
    where: { firmId: firm.id },
    attributes: ['id'],
    order: [
      ['createdAt', 'ASC'],
      ['id', 'ASC'],
    ],
    limit: cap,
    transaction,
  });
  return new Set(rows.map((row) => row.id));
}

function overLimitReason(plan: Plan): ReadOnlyReason {
  const cap = limitFor(plan, 'projects') ?? 0;
  const lifted = limitLiftedBy('projects', plan);
  return {
    reason: 'project_over_limit',
    message: `This project is read-only: the ${planName(plan)} plan keeps its ${cap} oldest projects editable and this one is newer.${lifted === null ? '' : ` Upgrade to ${planName(lifted)} to edit it again, or delete an older project.`} Nothing has been deleted.`,
  };
}

/** The read-only reason of each of `projectIds` (absent key: writable). */
export async function readOnlyReasons(
  firm: Pick<Firm, 'id' | 'plan' | 'billingStatus' | 'graceEndsAt'>,
  projectIds: readonly string[],
): Promise<Map<string, ReadOnlyReason>> {
  const reasons = new Map<string, ReadOnlyReason>();
  if (effectiveBillingStatus(firm) === 'read_only') {
    for (const id of projectIds)
      reasons.set(id, { reason: 'billing', message: BILLING_READ_ONLY_MESSAGE });
    return reasons;
  }
  const writable = await writableProjectIds(firm);
  if (writable === null) return reasons;
  for (const id of projectIds) if (!writable.has(id)) reasons.set(id, overLimitReason(firm.plan));
  return reasons;
}

/**
 * Refuses (403 read_only) a change to a project over the plan's project cap (after a downgrade)
 * or to any project of a firm read-only for billing. The project helpers call it before every
 * write to a project or anything inside it (design, versions, take-off, estimate, proposal).
 */
export async function requireProjectWritable(
  firm: Pick<Firm, 'id' | 'plan' | 'billingStatus' | 'graceEndsAt'>,
  projectId: string,
  transaction?: Transaction,
): Promise<void> {
  if (!isUuid(projectId)) throw notFound('No such project.');
  const exists = await Project.count({ where: { id: projectId, firmId: firm.id }, transaction });
  if (exists === 0) throw notFound('No such project.'); // another firm's id: exactly like a missing one
  if (effectiveBillingStatus(firm) === 'read_only')
    throw readOnly(BILLING_READ_ONLY_MESSAGE, 'billing');
  const writable = await writableProjectIds(firm, transaction);
  if (writable !== null && !writable.has(projectId)) {
    const { message } = overLimitReason(firm.plan);
    throw readOnly(message, 'project_over_limit');
  }
}

/** 403 plan_limit for a full seat count (invitations, accepting, reactivating a member). */
export function seatLimitError(firm: Pick<Firm, 'plan' | 'seats'>): ApiError {
  const cap = seatLimit(firm.plan, firm.seats);
  return planLimit(
    limitReachedText(firm.plan, 'seats', cap),
    'seats',
    limitLiftedBy('seats', firm.plan),
  );
}

import { isUuid } from '../../security';
import type Stripe from 'stripe';
import { QueryTypes, type Transaction } from 'sequelize';
import type { Plan } from '@basinwright/common';
import { getConfig } from '../../config/env';
import { badRequest } from '../../errors';
import { Firm, sequelize } from '../../models';
import { applyPlanChange, type PlanChange } from '../plans/plans.service';
import { stripe } from './billing.stripe';

/** How old a signed delivery may be (seconds): the SDK's default tolerance. */
export const SIGNATURE_TOLERANCE_S = 300;

export type EventOutcome = 'applied' | 'duplicate' | 'stale' | 'no_firm' | 'ignored';

/**
 * Checks the Stripe-Signature header against the RAW body (before any JSON parsing) with the
 * endpoint secret; 400 when it is missing, wrong or older than the tolerance.
 */
export function verifiedEvent(raw: unknown, header: string | undefined): Stripe.Event {
  if (!Buffer.isBuffer(raw) || raw.length === 0)
    throw badRequest('The event has no body to verify.');
  if (header === undefined || header.trim() === '')
    throw badRequest('The Stripe-Signature header is missing.');
  let event: Stripe.Event;
  try {
    event = stripe().webhooks.constructEvent(
      raw,
      header,
      getConfig().stripe.webhookSecret,
      SIGNATURE_TOLERANCE_S,
    );
  } catch {
    throw badRequest('The event signature does not match, or it is too old.');
  }
  const shape = event as unknown as Record<string, unknown>;
  if (
    typeof shape.id !== 'string' ||
    shape.id.length > 255 ||
    typeof shape.type !== 'string' ||
    shape.type.length > 80 ||
    !Number.isInteger(shape.created) ||
    typeof (shape.data as { object?: unknown } | undefined)?.object !== 'object'
  )
    throw badRequest('The event lacks an id, a type, a creation time or its object.');
  return event;
}

function idOf(value: string | { id: string } | null | undefined): string | null {
  if (value === null || value === undefined) return null;
  return typeof value === 'string' ? value : value.id;
}

/** The plan a price id stands for, by configuration; null for a price we do not sell. */
export function planOfPrice(priceId: string | null | undefined): Plan | null {
  const { prices } = getConfig().stripe;
  if (priceId === prices.professional) return 'professional';
  if (priceId === prices.firm) return 'firm';
  return null;
}

async function firmFor(
  customerId: string | null,
  firmIdHint: string | null | undefined,
  transaction: Transaction,
): Promise<Firm | null> {
  if (customerId !== null) {
    const firm = await Firm.findOne({ where: { stripeCustomerId: customerId }, transaction });
    if (firm !== null) return firm;
  }
  if (typeof firmIdHint === 'string' && isUuid(firmIdHint)) {
    const firm = await Firm.findByPk(firmIdHint, { transaction });
    // A hint is only trusted for a firm not yet linked to another customer.
    if (firm !== null && (firm.stripeCustomerId === null || firm.stripeCustomerId === customerId))
      return firm;
  }
  return null;
}

/** True when an event created at `created` (s) is older than the state the firm holds. */
function isStale(firm: Firm, created: number): boolean {
  return firm.billingSyncedAt !== null && created * 1000 < firm.billingSyncedAt.getTime();
}

function subscriptionChange(sub: Stripe.Subscription, created: number): PlanChange {
  const item = sub.items.data[0];
  const change: PlanChange = {
    stripeSubscriptionId: sub.id,
    stripeCustomerId: idOf(sub.customer),
    cancelAtPeriodEnd: sub.cancel_at_period_end,
    currentPeriodEnd:
      item?.current_period_end === undefined ? null : new Date(item.current_period_end * 1000),
    billingSyncedAt: new Date(created * 1000),
  };
  const plan = planOfPrice(item?.price.id);
  if (plan !== null) change.plan = plan;
  if (item?.quantity !== undefined && item.quantity >= 1) change.seats = item.quantity;
  return change;
}

/** What one verified event does to its firm, inside the transaction that records it. */
async function applyEvent(
  event: Stripe.Event,
  transaction: Transaction,
): Promise<{
  firmId: string | null;
  outcome: EventOutcome;
}> {
  const graceMs = getConfig().stripe.graceDays * 86_400_000;
  switch (event.type) {
    case 'checkout.session.completed': {
      const session = event.data.object;
      if (session.mode !== 'subscription') return { firmId: null, outcome: 'ignored' };
      const firm = await firmFor(
        idOf(session.customer),
        session.client_reference_id ?? session.metadata?.firmId,
        transaction,
      );
      if (firm === null) return { firmId: null, outcome: 'no_firm' };
      const change: PlanChange = {
        stripeCustomerId: idOf(session.customer),
        stripeSubscriptionId: idOf(session.subscription),
        billingStatus: 'active',
        graceEndsAt: null,
      };
      if (!isStale(firm, event.created)) {
        const plan = session.metadata?.plan;
        const seats = Number(session.metadata?.seats);
        if (plan === 'professional' || plan === 'firm') change.plan = plan;
        if (Number.isInteger(seats) && seats >= 1) change.seats = seats;
        change.cancelAtPeriodEnd = false;
        change.billingSyncedAt = new Date(event.created * 1000);
      }
      await applyPlanChange(firm.id, change, transaction);
      return { firmId: firm.id, outcome: 'applied' };
    }
    case 'customer.subscription.created':
    case 'customer.subscription.updated': {
      const sub = event.data.object;
      const firm = await firmFor(idOf(sub.customer), sub.metadata.firmId, transaction);
      if (firm === null) return { firmId: null, outcome: 'no_firm' };
      if (isStale(firm, event.created)) return { firmId: firm.id, outcome: 'stale' };
      if (firm.stripeSubscriptionId !== null && firm.stripeSubscriptionId !== sub.id)
        return { firmId: firm.id, outcome: 'ignored' };
      const change = subscriptionChange(sub, event.created);
      if (sub.status === 'canceled') return endSubscription(firm, event, transaction);
      if (sub.status === 'unpaid') change.billingStatus = 'read_only';
      if (sub.status === 'past_due' && firm.billingStatus === 'active') {
        change.billingStatus = 'past_due';
        change.graceEndsAt = new Date(event.created * 1000 + graceMs);
      }
      await applyPlanChange(firm.id, change, transaction);
      return { firmId: firm.id, outcome: 'applied' };
    }
    case 'customer.subscription.deleted': {
      const sub = event.data.object;
      const firm = await firmFor(idOf(sub.customer), sub.metadata.firmId, transaction);
      if (firm === null) return { firmId: null, outcome: 'no_firm' };
      if (isStale(firm, event.created)) return { firmId: firm.id, outcome: 'stale' };
      // The end of a subscription the firm has since replaced changes nothing.
      if (firm.stripeSubscriptionId !== null && firm.stripeSubscriptionId !== sub.id)
        return { firmId: firm.id, outcome: 'ignored' };
      return endSubscription(firm, event, transaction);
    }
    case 'invoice.payment_failed': {
      const invoice = event.data.object;
      const firm = await firmFor(idOf(invoice.customer), null, transaction);
      if (firm === null) return { firmId: null, outcome: 'no_firm' };
      if (firm.billingStatus !== 'active') return { firmId: firm.id, outcome: 'ignored' };
      // The grace runs from the failure (the event's time), whenever it is delivered.
      await applyPlanChange(
        firm.id,
        { billingStatus: 'past_due', graceEndsAt: new Date(event.created * 1000 + graceMs) },
        transaction,
      );
      return { firmId: firm.id, outcome: 'applied' };
    }
    case 'invoice.paid': {
      const invoice = event.data.object;
      const firm = await firmFor(idOf(invoice.customer), null, transaction);
      if (firm === null) return { firmId: null, outcome: 'no_firm' };
      if (firm.billingStatus === 'active') return { firmId: firm.id, outcome: 'ignored' };
      // A payment made before the failure that started the grace does not end it.
      const failedAt = firm.graceEndsAt === null ? null : firm.graceEndsAt.getTime() - graceMs;
      if (failedAt !== null && event.created * 1000 < failedAt)
        return { firmId: firm.id, outcome: 'stale' };
      await applyPlanChange(firm.id, { billingStatus: 'active', graceEndsAt: null }, transaction);
      return { firmId: firm.id, outcome: 'applied' };
    }
    default:
      return { firmId: null, outcome: 'ignored' };
  }
}

/** The subscription ended: back to Concept (nothing deleted; what is over its limits is read-only). */
async function endSubscription(
  firm: Firm,
  event: Stripe.Event,
  transaction: Transaction,
): Promise<{ firmId: string; outcome: EventOutcome }> {
  await applyPlanChange(
    firm.id,
    {
      plan: 'concept',
      seats: 1,
      stripeSubscriptionId: null,
      cancelAtPeriodEnd: false,
      currentPeriodEnd: null,
      billingStatus: 'active',
      graceEndsAt: null,
      billingSyncedAt: new Date(event.created * 1000),
    },
    transaction,
  );
  return { firmId: firm.id, outcome: 'applied' };
}

/**
 * Processes one verified event in ONE short transaction: the event id is inserted first
 * (ON CONFLICT DO NOTHING — a second delivery, even at the same moment, waits on the key and then
 * finds it taken) and its effect applied in the same transaction, so an event is applied exactly
 * once or, if anything fails, not at all (and the sender retries).
 */
export async function processEvent(event: Stripe.Event): Promise<EventOutcome> {
  return sequelize.transaction(async (transaction) => {
    const inserted = await sequelize.query<{ id: string }>(
      `INSERT INTO billing_events (id, type, created, outcome) VALUES (:id, :type, :created, 'pending')
       ON CONFLICT (id) DO NOTHING RETURNING id`,
      {
        replacements: { id: event.id, type: event.type, created: event.created },
        type: QueryTypes.SELECT,
        transaction,
      },
    );
    if (inserted.length === 0) return 'duplicate';
    const { firmId, outcome } = await applyEvent(event, transaction);
    await sequelize.query(
      'UPDATE billing_events SET firm_id = :firmId, outcome = :outcome WHERE id = :id',
      { replacements: { id: event.id, firmId, outcome }, transaction },
    );
    return outcome;
  });
}

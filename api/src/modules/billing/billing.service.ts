import {
  fewerSeatsText,
  minimumSeats,
  planName,
  type CheckoutInput,
  type Plan,
  type PlanChangeInput,
} from '@basinwright/common';
import type Stripe from 'stripe';
import { getConfig } from '../../config/env';
import { conflict } from '../../errors';
import { Firm, sequelize, type User } from '../../models';
import { effectiveBillingStatus } from '../plans/plans.service';
import { lockFirm, seatsInUse } from '../members/members.service';
import { paymentCall, stripe } from './billing.stripe';

export interface InvoiceView {
  id: string;
  number: string | null;
  status: string | null;
  amountDue: number;
  amountPaid: number;
  currency: string;
  created: string;
  periodStart: string | null;
  periodEnd: string | null;
}

export interface BillingSummary {
  plan: Plan;
  planName: string;
  seats: { paid: number; used: number };
  billingStatus: 'active' | 'past_due' | 'read_only';
  graceEndsAt: string | null;
  subscription: { cancelAtPeriodEnd: boolean; currentPeriodEnd: string | null } | null;
  nextInvoice: { amountDue: number; currency: string; date: string | null } | null;
  invoices: InvoiceView[];
  offers: {
    plan: 'professional' | 'firm';
    unitAmount: number | null;
    currency: string;
    minimumSeats: number;
  }[];
  /** false when the payment service could not be asked (invoices and prices then missing) */
  paymentServiceReachable: boolean;
  canManage: boolean;
}

const iso = (seconds: number | null | undefined): string | null =>
  seconds === null || seconds === undefined ? null : new Date(seconds * 1000).toISOString();

function invoiceView(invoice: Stripe.Invoice): InvoiceView {
  return {
    id: invoice.id ?? '',
    number: invoice.number,
    status: invoice.status,
    amountDue: invoice.amount_due,
    amountPaid: invoice.amount_paid,
    currency: invoice.currency,
    created: iso(invoice.created) ?? '',
    periodStart: iso(invoice.period_start),
    periodEnd: iso(invoice.period_end),
  };
}

/** The firm's plan, seats and billing state; invoices and prices as the payment service tells. */
export async function billingSummary(firmId: string, user: User): Promise<BillingSummary> {
  const { firm, used } = await sequelize.transaction(async (transaction) => {
    const found = await Firm.findByPk(firmId, { transaction });
    if (found === null) throw new Error('firm vanished');
    return { firm: found, used: await seatsInUse(firmId, transaction) };
  });
  const summary: BillingSummary = {
    plan: firm.plan,
    planName: planName(firm.plan),
    seats: { paid: firm.seats, used },
    billingStatus: effectiveBillingStatus(firm),
    graceEndsAt: firm.graceEndsAt?.toISOString() ?? null,
    subscription:
      firm.stripeSubscriptionId === null
        ? null
        : {
            cancelAtPeriodEnd: firm.cancelAtPeriodEnd,
            currentPeriodEnd: firm.currentPeriodEnd?.toISOString() ?? null,
          },
    nextInvoice: null,
    invoices: [],
    offers: [],
    paymentServiceReachable: true,
    canManage: user.role === 'owner',
  };
  const { prices } = getConfig().stripe;
  try {
    const client = stripe();
    const [professional, firmPrice] = await Promise.all([
      client.prices.retrieve(prices.professional),
      client.prices.retrieve(prices.firm),
    ]);
    summary.offers = [
      { plan: 'professional', price: professional },
      { plan: 'firm', price: firmPrice },
    ].map(({ plan, price }) => ({
      plan: plan as 'professional' | 'firm',
      unitAmount: price.unit_amount,
      currency: price.currency,
      minimumSeats: minimumSeats(plan as Plan),
    }));
    if (firm.stripeCustomerId !== null) {
      const list = await client.invoices.list({ customer: firm.stripeCustomerId, limit: 24 });
      summary.invoices = list.data.map(invoiceView);
    }
    if (firm.stripeSubscriptionId !== null && !firm.cancelAtPeriodEnd) {
      try {
        const next = await client.invoices.createPreview({
          customer: firm.stripeCustomerId ?? undefined,
          subscription: firm.stripeSubscriptionId,
        });
        summary.nextInvoice = {
          amountDue: next.amount_due,
          currency: next.currency,
          date: iso(next.next_payment_attempt ?? next.period_end),
        };
      } catch (error) {
        // No next invoice (e.g. the subscription has just ended) is not an outage.
        if (!(error instanceof Error && error.name === 'StripeInvalidRequestError')) throw error;
      }
    }
  } catch {
    summary.paymentServiceReachable = false;
    summary.offers = [];
  }
  return summary;
}

/** The customer of the firm at the payment service, created (once, under the firm lock) if new. */
async function ensureCustomer(firmId: string, owner: User): Promise<string> {
  return sequelize.transaction(async (transaction) => {
    const firm = await lockFirm(firmId, transaction);
    if (firm.stripeCustomerId !== null) return firm.stripeCustomerId;
    const customer = await paymentCall(() =>
      stripe().customers.create(
        { name: firm.name, email: owner.email, metadata: { firmId: firm.id } },
        { idempotencyKey: `customer-${firm.id}` },
      ),
    );
    await firm.update({ stripeCustomerId: customer.id }, { transaction });
    return customer.id;
  });
}

async function seatsTaken(firmId: string): Promise<number> {
  return sequelize.transaction((transaction) => seatsInUse(firmId, transaction));
}

function refuseFewerSeats(plan: Plan, seats: number, used: number): void {
  const least = Math.max(minimumSeats(plan), used);
  if (seats < least) throw conflict(fewerSeatsText(plan, used));
}

/** Starts the payment service's Checkout for a paid plan; the webhook changes the firm. */
export async function startCheckout(owner: User, input: CheckoutInput): Promise<{ url: string }> {
  const firm = await Firm.findByPk(owner.firmId);
  if (firm === null) throw new Error('firm vanished');
  if (firm.stripeSubscriptionId !== null)
    throw conflict('The firm already has a subscription: change its seats instead.');
  refuseFewerSeats(input.plan, input.seats, await seatsTaken(firm.id));
  const customer = await ensureCustomer(firm.id, owner);
  const { appUrl, stripe: settings } = getConfig();
  const metadata = { firmId: firm.id, plan: input.plan, seats: String(input.seats) };
  const session = await paymentCall(() =>
    stripe().checkout.sessions.create({
      mode: 'subscription',
      customer,
      client_reference_id: firm.id,
      line_items: [{ price: settings.prices[input.plan], quantity: input.seats }],
      metadata,
      subscription_data: { metadata },
      success_url: `${appUrl}/billing?checkout=done`,
      cancel_url: `${appUrl}/billing?checkout=cancelled`,
    }),
  );
  if (session.url === null) throw conflict('The payment service gave no Checkout address.');
  return { url: session.url };
}

async function subscriptionOf(firmId: string): Promise<Stripe.Subscription> {
  const id = (await Firm.findByPk(firmId))?.stripeSubscriptionId ?? null;
  if (id === null) throw conflict('The firm has no subscription: upgrade first.');
  return paymentCall(() => stripe().subscriptions.retrieve(id));
}

/**
 * Asks the payment service for a new seat count, prorated and invoiced at once; the firm's
 * seats change when its webhook says so. Never below the seats in use or the plan's minimum.
 */
export async function changeSeats(owner: User, seats: number): Promise<{ requested: number }> {
  const firm = await Firm.findByPk(owner.firmId);
  if (firm === null) throw new Error('firm vanished');
  refuseFewerSeats(firm.plan, seats, await seatsTaken(firm.id));
  const sub = await subscriptionOf(firm.id);
  const item = sub.items.data[0];
  if (item === undefined) throw conflict('The subscription has no seat line to change.');
  if (sub.status === 'canceled') throw conflict('The subscription has ended: upgrade again.');
  await paymentCall(() =>
    stripe().subscriptions.update(sub.id, {
      items: [{ id: item.id, quantity: seats }],
      proration_behavior: 'always_invoice',
    }),
  );
  return { requested: seats };
}

/**
 * Moves a subscribed firm to the other paid plan (Professional ↔ Firm): the payment service
 * changes the subscription's price (and seats, when the new plan needs more), prorated and
 * invoiced at once; the firm's plan changes when its webhook says so, never here. Seats are
 * kept unless given, raised to the new plan's minimum (Firm: 3), never below the seats in use.
 */
export async function changePlan(
  owner: User,
  input: PlanChangeInput,
): Promise<{ requested: { plan: Plan; seats: number } }> {
  const firm = await Firm.findByPk(owner.firmId);
  if (firm === null) throw new Error('firm vanished');
  const sub = await subscriptionOf(firm.id);
  const item = sub.items.data[0];
  if (item === undefined) throw conflict('The subscription has no seat line to change.');
  if (sub.status === 'canceled') throw conflict('The subscription has ended: upgrade again.');
  const { prices } = getConfig().stripe;
  if (item.price.id === prices[input.plan])
    throw conflict(`The firm is already on the ${planName(input.plan)} plan.`);
  const seats = input.seats ?? Math.max(item.quantity ?? 1, minimumSeats(input.plan));
  refuseFewerSeats(input.plan, seats, await seatsTaken(firm.id));
  await paymentCall(() =>
    stripe().subscriptions.update(sub.id, {
      items: [{ id: item.id, price: prices[input.plan], quantity: seats }],
      proration_behavior: 'always_invoice',
    }),
  );
  return { requested: { plan: input.plan, seats } };
}

/** Cancels at the end of the paid period (true) or takes that back (false). */
export async function setCancelAtPeriodEnd(
  owner: User,
  cancel: boolean,
): Promise<{ cancelAtPeriodEnd: boolean }> {
  const sub = await subscriptionOf(owner.firmId);
  if (sub.status === 'canceled') throw conflict('The subscription has already ended.');
  await paymentCall(() => stripe().subscriptions.update(sub.id, { cancel_at_period_end: cancel }));
  return { cancelAtPeriodEnd: cancel };
}

/** A page of the payment service where the owner changes the card and sees payments. */
export async function portalSession(owner: User): Promise<{ url: string }> {
  const customer = (await Firm.findByPk(owner.firmId))?.stripeCustomerId ?? null;
  if (customer === null) throw conflict('The firm has no payment details yet: upgrade first.');
  const session = await paymentCall(() =>
    stripe().billingPortal.sessions.create({
      customer,
      return_url: `${getConfig().appUrl}/billing`,
    }),
  );
  return { url: session.url };
}

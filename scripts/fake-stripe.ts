// A local, project-owned stand-in for the payment service, Stripe-shaped for exactly what the
// API calls through the official `stripe` SDK (api/src/modules/billing/billing.stripe.ts):
// customers, seeded products and per-seat prices, Checkout Sessions (subscription mode, one
// line with a quantity) with a hosted page of our own that completes, declines or cancels,
// subscriptions (retrieve, quantity or price change with proration, cancel at period end, resume),
// invoices (list, preview of the next one), a billing-portal page, and webhook delivery signed
// exactly as the real service signs (`t=…,v1=HMAC-SHA256(secret, "${t}.${body}")`) with retries
// and back-off. Requests are form-encoded (`a[b][0]=c`) as the real API's are; answers JSON.
// Plain node:http, listening on 127.0.0.1 only. State lives in memory and, when `stateFile` is
// given, in a JSON file (so `npm start` keeps it across restarts, beside the database).
//
// Run: node --import tsx scripts/fake-stripe.ts   (FAKE_STRIPE_PORT, FAKE_STRIPE_KEY,
// FAKE_STRIPE_WEBHOOK_URL, FAKE_STRIPE_WEBHOOK_SECRET, FAKE_STRIPE_STATE)
import { createHmac, randomBytes } from 'node:crypto';
import fs from 'node:fs';
import http, { type IncomingMessage, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

type Obj = Record<string, unknown>;

export interface FakeStripeOptions {
  /** 0 for a free port */
  port?: number;
  /** the secret key the API must send as a bearer token */
  apiKey: string;
  /** where events are POSTed; null for none (tests that sign their own) */
  webhookUrl: string | null;
  webhookSecret: string;
  /** JSON file the state is kept in; null for memory only */
  stateFile?: string | null;
  /** first retry pause of a failed webhook delivery, doubled each time (ms) */
  retryBaseMs?: number;
  /** attempts per event before it is given up */
  maxAttempts?: number;
  log?: (message: string) => void;
}

export interface FakeStripe {
  port: number;
  /** http://127.0.0.1:port */
  url: string;
  /** Events sent (or being sent) to the webhook, oldest first, with their delivery outcome. */
  deliveries: { event: Obj; attempts: number; delivered: boolean }[];
  /** Where events go from now on (null: nowhere). */
  setWebhookUrl(url: string | null): void;
  /** Drives a renewal of a subscription whose payment fails (invoice.payment_failed, past_due). */
  failRenewal(subscriptionId: string): void;
  /** Drives a successful renewal (invoice.paid, active). */
  payRenewal(subscriptionId: string): void;
  close(): Promise<void>;
}

interface State {
  seq: number;
  customers: Record<string, Obj>;
  products: Record<string, Obj>;
  prices: Record<string, Obj>;
  sessions: Record<string, Obj>;
  subscriptions: Record<string, Obj>;
  invoices: Record<string, Obj>;
  portals: Record<string, Obj>;
  /** proration lines waiting for the next invoice, by subscription */
  pending: Record<string, Obj[]>;
}

const DAY = 86_400;
const PERIOD = 30 * DAY;
const API_VERSION = 'fake';

/** The seeded catalogue: two per-seat monthly prices (demo amounts, in cents). */
export const FAKE_PRICES = {
  professional: {
    id: 'price_professional_seat',
    product: 'prod_professional',
    name: 'Professional',
    unitAmount: 3900,
  },
  firm: { id: 'price_firm_seat', product: 'prod_firm', name: 'Firm', unitAmount: 5900 },
} as const;

function now(): number {
  return Math.floor(Date.now() / 1000);
}

function seeded(): State {
  const state: State = {
    seq: 0,
    customers: {},
    products: {},
    prices: {},
    sessions: {},
    subscriptions: {},
    invoices: {},
    portals: {},
    pending: {},
  };
  for (const p of Object.values(FAKE_PRICES)) {
    state.products[p.product] = { id: p.product, object: 'product', name: p.name, active: true };
    state.prices[p.id] = {
      id: p.id,
      object: 'price',
      active: true,
      currency: 'usd',
      product: p.product,
      nickname: `${p.name} seat`,
      unit_amount: p.unitAmount,
      recurring: { interval: 'month', interval_count: 1, usage_type: 'licensed' },
      type: 'recurring',
    };
  }
  return state;
}

/**
 * Parses a form-encoded body with bracketed keys (`items[0][quantity]=2`,
 * `metadata[firmId]=…`) into nested objects; numeric keys make arrays.
 */
export function parseForm(text: string): Obj {
  const root: Obj = {};
  for (const [key, value] of new URLSearchParams(text)) {
    const parts = key.replace(/\]/g, '').split('[');
    let node: Obj = root;
    parts.forEach((part, i) => {
      if (part === '__proto__' || part === 'constructor' || part === 'prototype') return;
      if (i === parts.length - 1) {
        node[part] = value;
        return;
      }
      const next = parts[i + 1] ?? '';
      if (typeof node[part] !== 'object' || node[part] === null)
        node[part] = /^\d+$/.test(next) ? [] : {};
      node = node[part] as Obj;
    });
  }
  return root;
}

/** The Stripe-Signature header for `body` at `t` (seconds), as the real service computes it. */
export function signPayload(body: string, secret: string, t = now()): string {
  const v1 = createHmac('sha256', secret).update(`${t}.${body}`, 'utf8').digest('hex');
  return `t=${t},v1=${v1}`;
}

class StripeError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly type = 'invalid_request_error',
    readonly param?: string,
  ) {
    super(message);
  }
}

function str(body: Obj, key: string): string | undefined {
  const v = body[key];
  return typeof v === 'string' ? v : undefined;
}

function int(value: unknown, param: string): number {
  const n = typeof value === 'string' ? Number(value) : NaN;
  if (!Number.isInteger(n) || n < 1 || n > 10_000)
    throw new StripeError(400, `Invalid integer: ${String(value)}`, 'invalid_request_error', param);
  return n;
}

/** A session as the API shows it: its line items and subscription settings stay inside. */
function publicSession(session: Obj): Obj {
  const shown = { ...session };
  delete shown.line_items;
  delete shown.subscription_data;
  return shown;
}

function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

function money(cents: number, currency: string): string {
  return `${(cents / 100).toFixed(2)} ${currency.toUpperCase()}`;
}

export async function startFakeStripe(options: FakeStripeOptions): Promise<FakeStripe> {
  const log = options.log ?? (() => undefined);
  const retryBaseMs = options.retryBaseMs ?? 1000;
  const maxAttempts = options.maxAttempts ?? 8;
  const stateFile = options.stateFile ?? null;
  let state: State = seeded();
  if (stateFile !== null && fs.existsSync(stateFile)) {
    try {
      state = { ...seeded(), ...(JSON.parse(fs.readFileSync(stateFile, 'utf8')) as State) };
    } catch (error) {
      log(`fake payments: could not read ${stateFile} (${String(error)}); starting empty`);
    }
  }
  const save = () => {
    if (stateFile === null) return;
    fs.mkdirSync(path.dirname(stateFile), { recursive: true });
    fs.writeFileSync(stateFile, JSON.stringify(state));
  };
  const id = (prefix: string) => {
    state.seq += 1;
    return `${prefix}_${randomBytes(6).toString('hex')}${state.seq.toString(36)}`;
  };

  let webhookUrl = options.webhookUrl;
  const deliveries: FakeStripe['deliveries'] = [];
  const timers = new Set<NodeJS.Timeout>();
  let closed = false;
  let baseUrl = '';

  async function deliver(entry: FakeStripe['deliveries'][number]): Promise<void> {
    if (webhookUrl === null || closed) return;
    entry.attempts += 1;
    const body = JSON.stringify(entry.event);
    let ok: boolean;
    try {
      const res = await fetch(webhookUrl, {
        method: 'POST',
        headers: {
          'content-type': 'application/json; charset=utf-8',
          'stripe-signature': signPayload(body, options.webhookSecret),
        },
        body,
      });
      ok = res.ok;
      await res.arrayBuffer();
    } catch {
      ok = false;
    }
    if (ok) {
      entry.delivered = true;
      return;
    }
    if (entry.attempts >= maxAttempts || closed) {
      log(
        `fake payments: gave up delivering ${String(entry.event.id)} after ${entry.attempts} tries`,
      );
      return;
    }
    const wait = retryBaseMs * 2 ** (entry.attempts - 1);
    const timer = setTimeout(() => {
      timers.delete(timer);
      void deliver(entry);
    }, wait);
    timers.add(timer);
  }

  function emit(type: string, object: Obj): void {
    const event: Obj = {
      id: id('evt'),
      object: 'event',
      api_version: API_VERSION,
      created: now(),
      livemode: false,
      pending_webhooks: 1,
      request: { id: null, idempotency_key: null },
      type,
      data: { object: structuredClone(object) },
    };
    const entry = { event, attempts: 0, delivered: false };
    deliveries.push(entry);
    void deliver(entry);
  }

  const need = <T extends Obj>(table: Record<string, Obj>, key: string, what: string): T => {
    const found = table[key];
    if (found === undefined)
      throw new StripeError(404, `No such ${what}: '${key}'`, 'invalid_request_error', 'id');
    return found as T;
  };

  function priceOf(sub: Obj): { price: Obj; quantity: number; item: Obj } {
    const item = ((sub.items as Obj).data as Obj[])[0] as Obj;
    return { price: item.price as Obj, quantity: item.quantity as number, item };
  }

  function makeInvoice(sub: Obj, lines: Obj[], paid: boolean, reason: string): Obj {
    const total = lines.reduce((sum, l) => sum + (l.amount as number), 0);
    const { item } = priceOf(sub);
    const invoice: Obj = {
      id: id('in'),
      object: 'invoice',
      customer: sub.customer,
      number: `BW-${String(Object.keys(state.invoices).length + 1).padStart(4, '0')}`,
      status: paid ? 'paid' : 'open',
      billing_reason: reason,
      currency: 'usd',
      created: now(),
      period_start: item.current_period_start,
      period_end: item.current_period_end,
      amount_due: total,
      amount_paid: paid ? total : 0,
      amount_remaining: paid ? 0 : total,
      total,
      hosted_invoice_url: null,
      lines: { object: 'list', data: lines, has_more: false },
      parent: { type: 'subscription_details', subscription_details: { subscription: sub.id } },
    };
    state.invoices[invoice.id as string] = invoice;
    return invoice;
  }

  function periodLine(sub: Obj): Obj {
    const { price, quantity } = priceOf(sub);
    return {
      object: 'line_item',
      description: `${quantity} × ${String(price.nickname)}`,
      amount: (price.unit_amount as number) * quantity,
      quantity,
      proration: false,
    };
  }

  function createSubscription(session: Obj): Obj {
    const line = ((session.line_items as Obj).data as Obj[])[0] as Obj;
    const start = now();
    const sub: Obj = {
      id: id('sub'),
      object: 'subscription',
      customer: session.customer,
      status: 'active',
      cancel_at_period_end: false,
      cancel_at: null,
      canceled_at: null,
      created: start,
      metadata: { ...((session.subscription_data as Obj | undefined)?.metadata as Obj) },
      items: {
        object: 'list',
        data: [
          {
            id: id('si'),
            object: 'subscription_item',
            price: state.prices[line.price as string],
            quantity: line.quantity,
            current_period_start: start,
            current_period_end: start + PERIOD,
          },
        ],
      },
      latest_invoice: null,
    };
    state.subscriptions[sub.id as string] = sub;
    const invoice = makeInvoice(sub, [periodLine(sub)], true, 'subscription_create');
    sub.latest_invoice = invoice.id;
    return sub;
  }

  /** POST /v1/subscriptions/:id */
  function updateSubscription(sub: Obj, body: Obj): Obj {
    if (sub.status === 'canceled')
      throw new StripeError(
        400,
        'A canceled subscription can only update its cancellation_details and metadata.',
      );
    const { price, quantity, item } = priceOf(sub);
    const items = body.items as Obj[] | undefined;
    const wanted = items?.[0];
    if (wanted !== undefined) {
      if (wanted.id !== undefined && wanted.id !== item.id)
        throw new StripeError(
          400,
          `No such subscription item: '${String(wanted.id)}'`,
          'invalid_request_error',
          'items[0][id]',
        );
      const next =
        wanted.quantity === undefined ? quantity : int(wanted.quantity, 'items[0][quantity]');
      // A new price on the same item (a change of plan); the quantity stays unless also given.
      const priceId = str(wanted, 'price');
      const nextPrice = priceId === undefined ? price : need<Obj>(state.prices, priceId, 'price');
      const samePrice = nextPrice.id === price.id;
      if (next !== quantity || !samePrice) {
        const behavior = str(body, 'proration_behavior') ?? 'create_prorations';
        if (behavior !== 'none') {
          // Proration of the rest of the period, to the second (the real service's default rule).
          const left = Math.max(0, (item.current_period_end as number) - now());
          const rest = (seats: number, p: Obj) =>
            Math.round((seats * (p.unit_amount as number) * left) / PERIOD);
          const lines: Obj[] = samePrice
            ? [
                {
                  object: 'line_item',
                  description: `${next > quantity ? 'Added' : 'Removed'} ${Math.abs(next - quantity)} × ${String(price.nickname)} for the rest of the period`,
                  amount: rest(next - quantity, price),
                  quantity: next - quantity,
                  proration: true,
                },
              ]
            : [
                // A change of price: the unused time of the old lines is credited and the rest
                // of the period charged at the new price.
                {
                  object: 'line_item',
                  description: `Unused time on ${quantity} × ${String(price.nickname)}`,
                  amount: -rest(quantity, price),
                  quantity,
                  proration: true,
                },
                {
                  object: 'line_item',
                  description: `Remaining time on ${next} × ${String(nextPrice.nickname)}`,
                  amount: rest(next, nextPrice),
                  quantity: next,
                  proration: true,
                },
              ];
          if (behavior === 'always_invoice') makeInvoice(sub, lines, true, 'subscription_update');
          else (state.pending[sub.id as string] ??= []).push(...lines);
        }
        item.quantity = next;
        item.price = nextPrice;
      }
    }
    const cancel = str(body, 'cancel_at_period_end');
    if (cancel !== undefined) {
      sub.cancel_at_period_end = cancel === 'true';
      sub.cancel_at = cancel === 'true' ? item.current_period_end : null;
    }
    emit('customer.subscription.updated', sub);
    return sub;
  }

  function renew(subscriptionId: string, pays: boolean): void {
    const sub = need<Obj>(state.subscriptions, subscriptionId, 'subscription');
    const { item } = priceOf(sub);
    const lines = [periodLine(sub), ...(state.pending[subscriptionId] ?? [])];
    delete state.pending[subscriptionId];
    const invoice = makeInvoice(sub, lines, pays, 'subscription_cycle');
    sub.latest_invoice = invoice.id;
    if (pays) {
      item.current_period_start = item.current_period_end;
      item.current_period_end = (item.current_period_end as number) + PERIOD;
      sub.status = 'active';
      emit('invoice.paid', invoice);
    } else {
      sub.status = 'past_due';
      emit('invoice.payment_failed', invoice);
    }
    emit('customer.subscription.updated', sub);
    save();
  }

  function payOpenInvoices(subscriptionId: string): void {
    const sub = need<Obj>(state.subscriptions, subscriptionId, 'subscription');
    const open = Object.values(state.invoices).filter(
      (i) =>
        i.status === 'open' &&
        (i.parent as Obj).subscription_details !== undefined &&
        ((i.parent as Obj).subscription_details as Obj).subscription === subscriptionId,
    );
    if (open.length === 0) return renew(subscriptionId, true);
    for (const invoice of open) {
      invoice.status = 'paid';
      invoice.amount_paid = invoice.amount_due;
      invoice.amount_remaining = 0;
      emit('invoice.paid', invoice);
    }
    sub.status = 'active';
    emit('customer.subscription.updated', sub);
    save();
  }

  function cancelNow(subscriptionId: string): void {
    const sub = need<Obj>(state.subscriptions, subscriptionId, 'subscription');
    sub.status = 'canceled';
    sub.canceled_at = now();
    emit('customer.subscription.deleted', sub);
    save();
  }

  // ----- the API ------------------------------------------------------------------------------

  function api(method: string, route: string, body: Obj, query: URLSearchParams): unknown {
    let m: RegExpExecArray | null;
    if (method === 'POST' && route === '/v1/customers') {
      const customer: Obj = {
        id: id('cus'),
        object: 'customer',
        created: now(),
        email: str(body, 'email') ?? null,
        name: str(body, 'name') ?? null,
        metadata: (body.metadata as Obj | undefined) ?? {},
      };
      state.customers[customer.id as string] = customer;
      return customer;
    }
    if (method === 'GET' && (m = /^\/v1\/customers\/([\w-]+)$/.exec(route)))
      return need(state.customers, m[1] ?? '', 'customer');
    if (method === 'GET' && route === '/v1/prices') {
      const data = Object.values(state.prices);
      return { object: 'list', data, has_more: false, url: '/v1/prices' };
    }
    if (method === 'GET' && (m = /^\/v1\/prices\/([\w-]+)$/.exec(route)))
      return need(state.prices, m[1] ?? '', 'price');
    if (method === 'POST' && route === '/v1/checkout/sessions') {
      if (str(body, 'mode') !== 'subscription')
        throw new StripeError(
          400,
          'This stand-in supports mode=subscription only.',
          'invalid_request_error',
          'mode',
        );
      const customer = str(body, 'customer');
      if (customer === undefined || state.customers[customer] === undefined)
        throw new StripeError(
          400,
          `No such customer: '${String(customer)}'`,
          'invalid_request_error',
          'customer',
        );
      const items = body.line_items as Obj[] | undefined;
      const line = items?.[0];
      if (line === undefined || items?.length !== 1)
        throw new StripeError(
          400,
          'Give exactly one line item.',
          'invalid_request_error',
          'line_items',
        );
      const price = str(line, 'price') ?? '';
      need(state.prices, price, 'price');
      const quantity = int(line.quantity, 'line_items[0][quantity]');
      const successUrl = str(body, 'success_url');
      const cancelUrl = str(body, 'cancel_url');
      if (successUrl === undefined)
        throw new StripeError(
          400,
          'Missing required param: success_url.',
          'invalid_request_error',
          'success_url',
        );
      const sessionId = id('cs');
      const session: Obj = {
        id: sessionId,
        object: 'checkout.session',
        mode: 'subscription',
        status: 'open',
        payment_status: 'unpaid',
        customer,
        client_reference_id: str(body, 'client_reference_id') ?? null,
        metadata: (body.metadata as Obj | undefined) ?? {},
        subscription_data: body.subscription_data ?? {},
        line_items: { object: 'list', data: [{ price, quantity: quantity }] },
        success_url: successUrl,
        cancel_url: cancelUrl ?? null,
        subscription: null,
        created: now(),
        expires_at: now() + DAY,
        url: `${baseUrl}/pay/${sessionId}`,
      };
      state.sessions[sessionId] = session;
      return publicSession(session);
    }
    if (method === 'GET' && (m = /^\/v1\/checkout\/sessions\/([\w-]+)$/.exec(route)))
      return need(state.sessions, m[1] ?? '', 'checkout session');
    if ((m = /^\/v1\/subscriptions\/([\w-]+)$/.exec(route))) {
      const sub = need<Obj>(state.subscriptions, m[1] ?? '', 'subscription');
      if (method === 'GET') return sub;
      if (method === 'POST') return updateSubscription(sub, body);
      if (method === 'DELETE') {
        cancelNow(sub.id as string);
        return sub;
      }
    }
    if (method === 'GET' && route === '/v1/invoices') {
      const customer = query.get('customer');
      const limit = Math.min(100, Math.max(1, Number(query.get('limit') ?? 10) || 10));
      const data = Object.values(state.invoices)
        .filter((i) => customer === null || i.customer === customer)
        .sort(
          (a, b) =>
            (b.created as number) - (a.created as number) ||
            String(b.number).localeCompare(String(a.number)),
        )
        .slice(0, limit);
      return { object: 'list', data, has_more: false, url: '/v1/invoices' };
    }
    if (method === 'POST' && route === '/v1/invoices/create_preview') {
      const subId = str(body, 'subscription');
      const sub = need<Obj>(state.subscriptions, subId ?? '', 'subscription');
      if (sub.status === 'canceled' || sub.cancel_at_period_end === true)
        throw new StripeError(
          400,
          'No upcoming invoices for this subscription.',
          'invalid_request_error',
          'subscription',
        );
      const { item } = priceOf(sub);
      const lines = [periodLine(sub), ...(state.pending[sub.id as string] ?? [])];
      const total = lines.reduce((sum, l) => sum + (l.amount as number), 0);
      return {
        id: `upcoming_${String(sub.id)}`,
        object: 'invoice',
        customer: sub.customer,
        status: 'draft',
        currency: 'usd',
        amount_due: total,
        total,
        created: item.current_period_end,
        period_start: item.current_period_end,
        period_end: (item.current_period_end as number) + PERIOD,
        next_payment_attempt: item.current_period_end,
        lines: { object: 'list', data: lines, has_more: false },
        parent: { type: 'subscription_details', subscription_details: { subscription: sub.id } },
      };
    }
    if (method === 'POST' && route === '/v1/billing_portal/sessions') {
      const customer = str(body, 'customer') ?? '';
      need(state.customers, customer, 'customer');
      const portalId = id('bps');
      const portal: Obj = {
        id: portalId,
        object: 'billing_portal.session',
        customer,
        return_url: str(body, 'return_url') ?? null,
        created: now(),
        url: `${baseUrl}/portal/${portalId}`,
      };
      state.portals[portalId] = portal;
      return portal;
    }
    throw new StripeError(404, `Unrecognized request URL (${method}: ${route}).`);
  }

  // ----- the hosted pages (our own plain look) ------------------------------------------------

  function page(title: string, inner: string): string {
    return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(title)}</title>
<link rel="icon" href="data:,"><meta name="viewport" content="width=device-width">
<style>body{font:16px system-ui,sans-serif;max-width:36rem;margin:3rem auto;padding:0 1rem;color:#1d2a33}
h1{font-size:1.4rem}.note{background:#f3f0e6;border:1px solid #d9d1b8;padding:.6rem .8rem;margin:1rem 0}
.bad{background:#fbe9e7;border-color:#e0a59b}button{font:inherit;padding:.5rem 1rem;margin:.3rem .4rem .3rem 0;cursor:pointer}
table{border-collapse:collapse}td{padding:.2rem .8rem .2rem 0}</style></head>
<body><p><small>Local stand-in for the payment service — no money moves.</small></p>${inner}</body></html>`;
  }

  function checkoutPage(session: Obj, notice = ''): string {
    const line = ((session.line_items as Obj).data as Obj[])[0] as Obj;
    const price = state.prices[line.price as string] as Obj;
    const quantity = line.quantity as number;
    const total = (price.unit_amount as number) * quantity;
    const sid = escapeHtml(session.id as string);
    if (session.status !== 'open')
      return page(
        'Payment',
        `<h1>This payment page is closed</h1><p>It was ${escapeHtml(String(session.status))}.</p>`,
      );
    return page(
      'Payment',
      `<h1>Pay for ${escapeHtml(String(price.nickname))}s</h1>${notice}
<table><tr><td>Seats</td><td data-test="seats">${quantity}</td></tr>
<tr><td>Price a seat, monthly</td><td>${money(price.unit_amount as number, 'usd')}</td></tr>
<tr><td>Due today</td><td data-test="total">${money(total, 'usd')}</td></tr></table>
<form method="post" action="/pay/${sid}/complete"><button type="submit" name="do" value="complete">Pay now</button></form>
<form method="post" action="/pay/${sid}/decline"><button type="submit">Try a card that is declined</button></form>
<form method="post" action="/pay/${sid}/cancel"><button type="submit">Go back without paying</button></form>`,
    );
  }

  function portalPage(portal: Obj): string {
    const pid = escapeHtml(portal.id as string);
    const subs = Object.values(state.subscriptions).filter(
      (s) => s.customer === portal.customer && s.status !== 'canceled',
    );
    const rows = subs
      .map((s) => {
        const { price, quantity } = priceOf(s);
        const sid = escapeHtml(s.id as string);
        return `<div class="note"><p>${quantity} × ${escapeHtml(String(price.nickname))} — ${escapeHtml(String(s.status))}${s.cancel_at_period_end === true ? ', ends at the end of the period' : ''}</p>
<form method="post" action="/portal/${pid}/renew-fails/${sid}"><button type="submit">Make the next payment fail</button></form>
<form method="post" action="/portal/${pid}/renew-pays/${sid}"><button type="submit">Pay now</button></form>
<form method="post" action="/portal/${pid}/end/${sid}"><button type="submit">End the subscription now</button></form></div>`;
      })
      .join('');
    const back =
      typeof portal.return_url === 'string'
        ? `<p><a href="${escapeHtml(portal.return_url)}">Back to Basinwright</a></p>`
        : '';
    return page(
      'Payment details',
      `<h1>Payment details</h1>${rows || '<p>No subscription.</p>'}${back}`,
    );
  }

  function pages(method: string, route: string, res: ServerResponse): boolean {
    let m: RegExpExecArray | null;
    const html = (status: number, text: string) => {
      res.writeHead(status, { 'content-type': 'text/html; charset=utf-8' });
      res.end(text);
    };
    const redirect = (to: string) => {
      res.writeHead(303, { location: to });
      res.end();
    };
    if (method === 'GET' && (m = /^\/pay\/([\w-]+)$/.exec(route))) {
      const session = state.sessions[m[1] ?? ''];
      if (session === undefined) html(404, page('Payment', '<h1>No such payment page</h1>'));
      else html(200, checkoutPage(session));
      return true;
    }
    if (method === 'POST' && (m = /^\/pay\/([\w-]+)\/(complete|decline|cancel)$/.exec(route))) {
      const session = state.sessions[m[1] ?? ''];
      if (session === undefined || session.status !== 'open') {
        html(404, page('Payment', '<h1>No open payment page</h1>'));
        return true;
      }
      if (m[2] === 'decline') {
        html(
          402,
          checkoutPage(
            session,
            '<p class="note bad" role="alert">The card was declined. Nothing was charged.</p>',
          ),
        );
        return true;
      }
      if (m[2] === 'cancel') {
        redirect(String(session.cancel_url ?? session.success_url));
        return true;
      }
      const sub = createSubscription(session);
      session.status = 'complete';
      session.payment_status = 'paid';
      session.subscription = sub.id;
      emit('customer.subscription.created', sub);
      emit('checkout.session.completed', publicSession(session));
      emit('invoice.paid', state.invoices[sub.latest_invoice as string] as Obj);
      save();
      redirect(String(session.success_url).replace('{CHECKOUT_SESSION_ID}', session.id as string));
      return true;
    }
    if (method === 'GET' && (m = /^\/portal\/([\w-]+)$/.exec(route))) {
      const portal = state.portals[m[1] ?? ''];
      if (portal === undefined) html(404, page('Payment details', '<h1>No such page</h1>'));
      else html(200, portalPage(portal));
      return true;
    }
    if (
      method === 'POST' &&
      (m = /^\/portal\/([\w-]+)\/(renew-fails|renew-pays|end)\/([\w-]+)$/.exec(route))
    ) {
      const portal = state.portals[m[1] ?? ''];
      const sub = state.subscriptions[m[3] ?? ''];
      if (portal === undefined || sub === undefined || sub.customer !== portal.customer) {
        html(404, page('Payment details', '<h1>No such page</h1>'));
        return true;
      }
      if (m[2] === 'renew-fails') renew(sub.id as string, false);
      else if (m[2] === 'renew-pays') payOpenInvoices(sub.id as string);
      else cancelNow(sub.id as string);
      redirect(`/portal/${portal.id as string}`);
      return true;
    }
    return false;
  }

  async function readBody(req: IncomingMessage): Promise<string> {
    const chunks: Buffer[] = [];
    let size = 0;
    for await (const chunk of req) {
      size += (chunk as Buffer).length;
      if (size > 1024 * 1024) throw new StripeError(413, 'Request too large.');
      chunks.push(chunk as Buffer);
    }
    return Buffer.concat(chunks).toString('utf8');
  }

  const server = http.createServer((req, res) => {
    void (async () => {
      const url = new URL(req.url ?? '/', 'http://127.0.0.1');
      const method = req.method ?? 'GET';
      try {
        const text = await readBody(req);
        if (pages(method, url.pathname, res)) return;
        if (!url.pathname.startsWith('/v1/')) throw new StripeError(404, 'Not found.');
        const auth = req.headers.authorization ?? '';
        if (auth !== `Bearer ${options.apiKey}`)
          throw new StripeError(401, 'Invalid API Key provided.', 'invalid_request_error');
        const answer = api(method, url.pathname, parseForm(text), url.searchParams);
        save();
        res.writeHead(200, { 'content-type': 'application/json', 'request-id': id('req') });
        res.end(JSON.stringify(answer));
      } catch (error) {
        const e =
          error instanceof StripeError ? error : new StripeError(500, String(error), 'api_error');
        res.writeHead(e.status, { 'content-type': 'application/json' });
        res.end(JSON.stringify({ error: { type: e.type, message: e.message, param: e.param } }));
      }
    })();
  });
  await new Promise<void>((resolve) => server.listen(options.port ?? 0, '127.0.0.1', resolve));
  const port = (server.address() as AddressInfo).port;
  baseUrl = `http://127.0.0.1:${port}`;
  save();

  return {
    port,
    url: baseUrl,
    deliveries,
    setWebhookUrl: (url) => {
      webhookUrl = url;
    },
    failRenewal: (subscriptionId) => renew(subscriptionId, false),
    payRenewal: (subscriptionId) => payOpenInvoices(subscriptionId),
    async close() {
      closed = true;
      for (const t of timers) clearTimeout(t);
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}

// Run as a program (npm start / npm test start it this way).
if (
  process.argv[1] !== undefined &&
  path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)
) {
  const env = process.env;
  const fake = await startFakeStripe({
    port: Number(env.FAKE_STRIPE_PORT ?? 0),
    apiKey: env.FAKE_STRIPE_KEY ?? 'sk_test_local',
    webhookUrl: env.FAKE_STRIPE_WEBHOOK_URL ?? null,
    webhookSecret: env.FAKE_STRIPE_WEBHOOK_SECRET ?? 'whsec_local',
    stateFile: env.FAKE_STRIPE_STATE ?? null,
    log: (message) => process.stderr.write(`${message}\n`),
  });
  process.stdout.write(`fake payments listening on ${fake.url}\n`);
  const stop = () => void fake.close().then(() => process.exit(0));
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
}

// Billing: the payment service's webhook (signature on the raw body, each event applied once,
// an older subscription state never over a newer one, a failed payment's grace then read-only)
// and the owner's routes driven through the official SDK against the local stand-in
// (scripts/fake-stripe.ts), whose own Checkout page and signed webhooks change the firm.
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { FAKE_PRICES, signPayload } from '../../scripts/fake-stripe';
import { fakePaymentsForFile } from '../support/fake-payments';
import { addMember, apiForFile, bearer, signUpFirm, type SignedUp } from '../support/api-app';

const pay = fakePaymentsForFile();
const h = apiForFile();

const DAY_S = 86_400;
/** The default grace of a failed payment, days (BILLING_GRACE_DAYS; common practice: two weeks). */
const GRACE_DAYS = 14;

let server: http.Server;
beforeAll(async () => {
  // a second app of the same process, listening, for the stand-in to deliver its events to
  server = http.createServer(h.createApp());
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  pay.fake.setWebhookUrl(`http://127.0.0.1:${port}/api/v1/billing/webhook`);
});
afterAll(async () => {
  pay.fake.setWebhookUrl(null);
  server.closeAllConnections();
  await new Promise<void>((resolve) => server.close(() => resolve()));
});

const nowS = () => Math.floor(Date.now() / 1000);

function eventId(): string {
  return `evt_test_${randomBytes(8).toString('hex')}`;
}

function subscriptionObject(
  customer: string,
  subscription: string,
  quantity: number,
  extra: Record<string, unknown> = {},
) {
  return {
    id: subscription,
    object: 'subscription',
    customer,
    status: 'active',
    cancel_at_period_end: false,
    metadata: {},
    items: {
      object: 'list',
      data: [
        {
          id: 'si_test',
          object: 'subscription_item',
          price: { id: FAKE_PRICES.professional.id, object: 'price' },
          quantity,
          current_period_start: nowS(),
          current_period_end: nowS() + 30 * DAY_S,
        },
      ],
    },
    ...extra,
  };
}

function event(type: string, object: object, created = nowS(), id = eventId()) {
  return { id, object: 'event', api_version: 'fake', created, type, data: { object } };
}

/** POSTs an event body signed as the payment service signs it (or with the header given). */
function deliver(body: string, signature?: string | null) {
  const req = h
    .http()
    .post('/api/v1/billing/webhook')
    .set('Content-Type', 'application/json')
    .send(body);
  if (signature !== null) req.set('Stripe-Signature', signature ?? pay.sign(body));
  return req;
}

/** A signed-up firm linked to a customer and subscription id (no call to the stand-in). */
async function linkedFirm(label: string) {
  const firm = await signUpFirm(h, label);
  const customer = `cus_test_${randomBytes(6).toString('hex')}`;
  const subscription = `sub_test_${randomBytes(6).toString('hex')}`;
  await h.models.Firm.update(
    { stripeCustomerId: customer, stripeSubscriptionId: subscription, plan: 'professional' },
    { where: { id: firm.firm.id } },
  );
  return { firm, customer, subscription };
}

const firmRow = async (id: string) => {
  const row = await h.models.Firm.findByPk(id);
  if (row === null) throw new Error('no firm');
  return row;
};
const eventCount = (id: string) => h.models.BillingEvent.count({ where: { id } });

async function waitUntil(what: string, probe: () => Promise<boolean>): Promise<void> {
  // Waits for a condition, not for a time: the test's own timeout bounds it.
  for (;;) {
    if (await probe()) return;
    await new Promise((resolve) => setTimeout(resolve, 50));
    void what;
  }
}

describe('the webhook refuses what it cannot verify (400, nothing recorded or changed)', () => {
  let linked: Awaited<ReturnType<typeof linkedFirm>>;
  beforeAll(async () => {
    linked = await linkedFirm('signature');
  });

  const cases: [string, (body: string) => string | null][] = [
    ['a missing signature', () => null],
    ['a signature made with another secret', (body) => signPayload(body, 'whsec_someone_else')],
    ['a signature over other bytes', (body) => pay.sign(`${body} `)],
    // The SDK's tolerance is 300 s (SIGNATURE_TOLERANCE_S): an hour-old signature is stale.
    ['a stale signature (an hour old)', (body) => pay.sign(body, nowS() - 3600)],
    ['a garbled header', () => 'nonsense'],
  ];
  it.each(cases)('%s', async (_name, header) => {
    const e = event(
      'customer.subscription.updated',
      subscriptionObject(linked.customer, linked.subscription, 9),
    );
    const body = JSON.stringify(e);
    const res = await deliver(body, header(body));
    expect(res.status).toBe(400);
    expect(res.body.code).toBe('bad_request');
    expect(await eventCount(e.id)).toBe(0);
    expect((await firmRow(linked.firm.firm.id)).seats).not.toBe(9);
  });

  it('a body that is not JSON, correctly signed, is refused too', async () => {
    const body = 'not json at all';
    const res = await deliver(body);
    expect(res.status).toBe(400);
  });
});

describe('each event is applied once', () => {
  it('the same event twice, one after the other: the second changes nothing', async () => {
    const linked = await linkedFirm('twice');
    const e = event(
      'customer.subscription.updated',
      subscriptionObject(linked.customer, linked.subscription, 4),
    );
    const body = JSON.stringify(e);
    const first = await deliver(body);
    expect(first.status).toBe(200);
    expect(first.body.outcome).toBe('applied');
    expect((await firmRow(linked.firm.firm.id)).seats).toBe(4);
    // Someone changes the seats afterwards; a repeat of the old delivery must not undo it.
    await h.models.Firm.update({ seats: 2 }, { where: { id: linked.firm.firm.id } });
    const again = await deliver(body);
    expect(again.status).toBe(200);
    expect(again.body.outcome).toBe('duplicate');
    expect((await firmRow(linked.firm.firm.id)).seats).toBe(2);
    expect(await eventCount(e.id)).toBe(1);
  });

  it('the same event ten times at once: exactly one is applied, all are acknowledged', async () => {
    const linked = await linkedFirm('concurrent');
    const e = event('invoice.payment_failed', {
      id: 'in_x',
      object: 'invoice',
      customer: linked.customer,
    });
    const body = JSON.stringify(e);
    const answers = await Promise.all(Array.from({ length: 10 }, () => deliver(body)));
    expect(answers.map((a) => a.status)).toEqual(Array(10).fill(200));
    const outcomes = answers.map((a) => a.body.outcome as string).sort();
    expect(outcomes.filter((o) => o === 'applied')).toHaveLength(1);
    expect(outcomes.filter((o) => o === 'duplicate')).toHaveLength(9);
    expect(await eventCount(e.id)).toBe(1);
    expect((await firmRow(linked.firm.firm.id)).billingStatus).toBe('past_due');
  });
});

describe('order', () => {
  it('an older subscription update arriving after a newer one leaves the newer state', async () => {
    const linked = await linkedFirm('order');
    const t = nowS();
    const newer = event(
      'customer.subscription.updated',
      subscriptionObject(linked.customer, linked.subscription, 6),
      t,
    );
    const older = event(
      'customer.subscription.updated',
      subscriptionObject(linked.customer, linked.subscription, 3, { cancel_at_period_end: true }),
      t - 60,
    );
    expect((await deliver(JSON.stringify(newer))).body.outcome).toBe('applied');
    const late = await deliver(JSON.stringify(older));
    expect(late.status).toBe(200);
    expect(late.body.outcome).toBe('stale');
    const firm = await firmRow(linked.firm.firm.id);
    expect(firm.seats).toBe(6);
    expect(firm.cancelAtPeriodEnd).toBe(false);
  });

  it('an older subscription end after a newer update does not downgrade the firm', async () => {
    const linked = await linkedFirm('order-end');
    const t = nowS();
    await deliver(
      JSON.stringify(
        event(
          'customer.subscription.updated',
          subscriptionObject(linked.customer, linked.subscription, 5),
          t,
        ),
      ),
    );
    const ended = event(
      'customer.subscription.deleted',
      subscriptionObject(linked.customer, linked.subscription, 5, { status: 'canceled' }),
      t - 30,
    );
    expect((await deliver(JSON.stringify(ended))).body.outcome).toBe('stale');
    expect((await firmRow(linked.firm.firm.id)).plan).toBe('professional');
  });
});

describe('a failed payment: grace shown to the owner, then read-only; a payment restores', () => {
  it('past due with the grace end, then active again when paid', async () => {
    const linked = await linkedFirm('grace');
    const failedAt = nowS();
    const failed = event(
      'invoice.payment_failed',
      { id: 'in_1', object: 'invoice', customer: linked.customer },
      failedAt,
    );
    expect((await deliver(JSON.stringify(failed))).body.outcome).toBe('applied');
    const summary = await h.http().get('/api/v1/billing').set(bearer(linked.firm.token));
    expect(summary.status).toBe(200);
    expect(summary.body.billingStatus).toBe('past_due');
    // grace end = the failure's time + 14 days (the setting's default)
    expect(Date.parse(summary.body.graceEndsAt)).toBe((failedAt + GRACE_DAYS * DAY_S) * 1000);
    const paid = event(
      'invoice.paid',
      { id: 'in_1', object: 'invoice', customer: linked.customer },
      failedAt + 5,
    );
    expect((await deliver(JSON.stringify(paid))).body.outcome).toBe('applied');
    const after = await h.http().get('/api/v1/billing').set(bearer(linked.firm.token));
    expect(after.body.billingStatus).toBe('active');
    expect(after.body.graceEndsAt).toBeNull();
  });

  it('once the grace has run out the firm is read-only (its data kept); a payment restores it', async () => {
    const linked = await linkedFirm('lapsed');
    const project = await h
      .http()
      .post('/api/v1/projects')
      .set(bearer(linked.firm.token))
      .send({ name: 'Kept through a lapse', units: 'SI' });
    expect(project.status).toBe(201);
    const failedAt = nowS() - (GRACE_DAYS + 1) * DAY_S;
    // Delivered late (signed now) but created fifteen days ago: the grace ran from then.
    await deliver(
      JSON.stringify(
        event(
          'invoice.payment_failed',
          { id: 'in_2', object: 'invoice', customer: linked.customer },
          failedAt,
        ),
      ),
    );
    const lapsed = await h.http().get('/api/v1/billing').set(bearer(linked.firm.token));
    expect(lapsed.body.billingStatus).toBe('read_only');
    const read = await h
      .http()
      .get(`/api/v1/projects/${project.body.id}`)
      .set(bearer(linked.firm.token));
    expect(read.status).toBe(200);
    // a payment made before the failure does not end it
    const early = event(
      'invoice.paid',
      { id: 'in_0', object: 'invoice', customer: linked.customer },
      failedAt - 100,
    );
    expect((await deliver(JSON.stringify(early))).body.outcome).toBe('stale');
    await deliver(
      JSON.stringify(
        event('invoice.paid', { id: 'in_2', object: 'invoice', customer: linked.customer }),
      ),
    );
    const back = await h.http().get('/api/v1/billing').set(bearer(linked.firm.token));
    expect(back.body.billingStatus).toBe('active');
    expect(await h.models.Project.count({ where: { firmId: linked.firm.firm.id } })).toBe(1);
  });
});

describe('the owner buys, adds a seat, cancels and resumes through the stand-in', () => {
  let owner: SignedUp;
  beforeAll(async () => {
    owner = await signUpFirm(h, 'buyer');
  });

  it('Checkout → the stand-in page → its signed webhooks make the firm Professional', async () => {
    const res = await h
      .http()
      .post('/api/v1/billing/checkout')
      .set(bearer(owner.token))
      .send({ plan: 'professional', seats: 2 });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.url).toMatch(new RegExp(`^${pay.fake.url}/pay/cs_`));
    const page = await fetch(res.body.url);
    expect(await page.text()).toContain('Pay now');
    const done = await fetch(`${res.body.url}/complete`, { method: 'POST', redirect: 'manual' });
    expect(done.status).toBe(303);
    expect(done.headers.get('location')).toContain('/billing?checkout=done');
    await waitUntil(
      'the upgrade',
      async () => (await firmRow(owner.firm.id)).plan === 'professional',
    );
    const firm = await firmRow(owner.firm.id);
    expect(firm.seats).toBe(2);
    expect(firm.stripeSubscriptionId).toMatch(/^sub_/);
    // the subscription's own event brings the paid period (30 days in the stand-in)
    await waitUntil(
      'the period',
      async () => (await firmRow(owner.firm.id)).currentPeriodEnd !== null,
    );
    // A second Checkout while subscribed is refused: change the seats instead.
    const again = await h
      .http()
      .post('/api/v1/billing/checkout')
      .set(bearer(owner.token))
      .send({ plan: 'professional', seats: 3 });
    expect(again.status).toBe(409);
  });

  it('a seat added is prorated at once and the webhook raises the paid seats', async () => {
    const res = await h
      .http()
      .patch('/api/v1/billing/seats')
      .set(bearer(owner.token))
      .send({ seats: 3 });
    expect(res.status, JSON.stringify(res.body)).toBe(202);
    await waitUntil('the seat', async () => (await firmRow(owner.firm.id)).seats === 3);
    const summary = await h.http().get('/api/v1/billing').set(bearer(owner.token));
    expect(summary.status).toBe(200);
    expect(summary.body.plan).toBe('professional');
    expect(summary.body.seats).toEqual({ paid: 3, used: 1 });
    expect(summary.body.paymentServiceReachable).toBe(true);
    // Next invoice: 3 seats at the catalogue's unit price (the stand-in's seeded price).
    expect(summary.body.nextInvoice.amountDue).toBe(3 * FAKE_PRICES.professional.unitAmount);
    const invoices = summary.body.invoices as { amountPaid: number; status: string }[];
    expect(invoices).toHaveLength(2);
    // The first: two seats for a whole period; the proration: one seat for at most a period
    // (a fact of proration: part of a period never costs more than the whole one).
    const amounts = invoices.map((i) => i.amountPaid).sort((a, b) => a - b);
    expect(amounts[1]).toBe(2 * FAKE_PRICES.professional.unitAmount);
    expect(amounts[0]).toBeGreaterThan(0);
    expect(amounts[0]).toBeLessThanOrEqual(FAKE_PRICES.professional.unitAmount);
  });

  it('fewer seats than are in use is refused (409), nothing asked of the stand-in', async () => {
    await addMember(h, owner.firm.id, 'engineer');
    await addMember(h, owner.firm.id, 'viewer');
    const res = await h
      .http()
      .patch('/api/v1/billing/seats')
      .set(bearer(owner.token))
      .send({ seats: 2 });
    expect(res.status).toBe(409);
    expect(res.body.message).toMatch(/3 seats are in use/);
    expect((await firmRow(owner.firm.id)).seats).toBe(3);
  });

  it('switching plan: Firm needs 3 seats; the stand-in changes the price, the webhook the plan', async () => {
    const sub = (await firmRow(owner.firm.id)).stripeSubscriptionId ?? '';
    const priceAt = async () =>
      (await pay.stripe.subscriptions.retrieve(sub)).items.data[0]?.price.id;
    // Fewer than the Firm plan's three seats (product brief's plan table): 409, nothing asked.
    const few = await h
      .http()
      .patch('/api/v1/billing/plan')
      .set(bearer(owner.token))
      .send({ plan: 'firm', seats: 2 });
    expect(few.status).toBe(409);
    expect(few.body.message).toMatch(/at least 3 seats/);
    expect(await priceAt()).toBe(FAKE_PRICES.professional.id);
    // The plan already held: 409.
    const same = await h
      .http()
      .patch('/api/v1/billing/plan')
      .set(bearer(owner.token))
      .send({ plan: 'professional' });
    expect(same.status).toBe(409);

    // Events held back: the route changes the subscription only, never the firm.
    const { port } = server.address() as AddressInfo;
    pay.fake.setWebhookUrl(`http://127.0.0.1:${port}/api/v1/billing/not-here`);
    const before = pay.fake.deliveries.length;
    const up = await h
      .http()
      .patch('/api/v1/billing/plan')
      .set(bearer(owner.token))
      .send({ plan: 'firm' });
    expect(up.status, JSON.stringify(up.body)).toBe(202);
    expect(up.body.requested).toEqual({ plan: 'firm', seats: 3 });
    expect(await priceAt()).toBe(FAKE_PRICES.firm.id);
    const updated = () =>
      pay.fake.deliveries
        .slice(before)
        .find((d) => d.event.type === 'customer.subscription.updated');
    await waitUntil('a refused try', async () => (updated()?.attempts ?? 0) >= 1);
    expect((await firmRow(owner.firm.id)).plan).toBe('professional');
    pay.fake.setWebhookUrl(`http://127.0.0.1:${port}/api/v1/billing/webhook`);
    await waitUntil('the Firm plan', async () => (await firmRow(owner.firm.id)).plan === 'firm');
    expect((await firmRow(owner.firm.id)).seats).toBe(3);
    // The change is prorated at once: an invoice crediting the unused Professional time and
    // charging the rest of the period on Firm, so it is more than 0 and at most the difference of
    // a whole period (a fact of proration: part of a period never costs more than the whole).
    const customer = (await firmRow(owner.firm.id)).stripeCustomerId ?? '';
    const invoices = (await pay.stripe.invoices.list({ customer })).data;
    const change = invoices.find(
      (i) => i.billing_reason === 'subscription_update' && i.lines.data.length === 2,
    );
    expect(change).toBeDefined();
    const diff = 3 * (FAKE_PRICES.firm.unitAmount - FAKE_PRICES.professional.unitAmount);
    expect(change?.amount_due).toBeGreaterThan(0);
    expect(change?.amount_due).toBeLessThanOrEqual(diff);

    // And back to Professional (seats kept).
    const down = await h
      .http()
      .patch('/api/v1/billing/plan')
      .set(bearer(owner.token))
      .send({ plan: 'professional' });
    expect(down.status).toBe(202);
    await waitUntil(
      'the Professional plan',
      async () => (await firmRow(owner.firm.id)).plan === 'professional',
    );
    expect((await firmRow(owner.firm.id)).seats).toBe(3);
  });

  it('cancel at the period end, then resume', async () => {
    const cancel = await h.http().post('/api/v1/billing/cancel').set(bearer(owner.token)).send({});
    expect(cancel.status).toBe(202);
    await waitUntil('cancel', async () => (await firmRow(owner.firm.id)).cancelAtPeriodEnd);
    const resume = await h.http().post('/api/v1/billing/resume').set(bearer(owner.token)).send({});
    expect(resume.status).toBe(202);
    await waitUntil('resume', async () => !(await firmRow(owner.firm.id)).cancelAtPeriodEnd);
  });

  it('a renewal whose payment fails, then is paid, through the stand-in', async () => {
    const firm = await firmRow(owner.firm.id);
    pay.fake.failRenewal(firm.stripeSubscriptionId ?? '');
    await waitUntil(
      'past due',
      async () => (await firmRow(owner.firm.id)).billingStatus === 'past_due',
    );
    pay.fake.payRenewal(firm.stripeSubscriptionId ?? '');
    await waitUntil(
      'active',
      async () => (await firmRow(owner.firm.id)).billingStatus === 'active',
    );
  });

  it('an event the app did not take is sent again, with a growing pause, until it is', async () => {
    const firm = await firmRow(owner.firm.id);
    const { port } = server.address() as AddressInfo;
    // The endpoint answers 404 for now: the stand-in must keep trying.
    pay.fake.setWebhookUrl(`http://127.0.0.1:${port}/api/v1/billing/not-here`);
    const before = pay.fake.deliveries.length;
    pay.fake.failRenewal(firm.stripeSubscriptionId ?? '');
    const failed = () =>
      pay.fake.deliveries.slice(before).find((d) => d.event.type === 'invoice.payment_failed');
    await waitUntil('two tries', async () => (failed()?.attempts ?? 0) >= 2);
    expect(failed()?.delivered).toBe(false);
    expect((await firmRow(owner.firm.id)).billingStatus).toBe('active');
    pay.fake.setWebhookUrl(`http://127.0.0.1:${port}/api/v1/billing/webhook`);
    await waitUntil('delivered', async () => failed()?.delivered === true);
    await waitUntil(
      'past due',
      async () => (await firmRow(owner.firm.id)).billingStatus === 'past_due',
    );
    pay.fake.payRenewal(firm.stripeSubscriptionId ?? '');
    await waitUntil(
      'active',
      async () => (await firmRow(owner.firm.id)).billingStatus === 'active',
    );
  });

  it("the stand-in's page: a declined card or going back buys nothing", async () => {
    const other = await signUpFirm(h, 'decliner');
    const res = await h
      .http()
      .post('/api/v1/billing/checkout')
      .set(bearer(other.token))
      .send({ plan: 'firm', seats: 3 });
    expect(res.status).toBe(200);
    const declined = await fetch(`${res.body.url}/decline`, { method: 'POST' });
    expect(declined.status).toBe(402);
    expect(await declined.text()).toContain('declined');
    const back = await fetch(`${res.body.url}/cancel`, { method: 'POST', redirect: 'manual' });
    expect(back.status).toBe(303);
    expect(back.headers.get('location')).toContain('/billing?checkout=cancelled');
    const firm = await firmRow(other.firm.id);
    expect(firm.plan).toBe('concept');
    expect(firm.stripeSubscriptionId).toBeNull();
  });

  it("fewer than the Firm plan's three seats is refused before the payment page", async () => {
    const small = await signUpFirm(h, 'small');
    const res = await h
      .http()
      .post('/api/v1/billing/checkout')
      .set(bearer(small.token))
      .send({ plan: 'firm', seats: 2 });
    expect(res.status).toBe(409);
    expect(res.body.message).toMatch(/at least 3 seats/);
  });

  it('the payment page link for the owner', async () => {
    const res = await h.http().post('/api/v1/billing/portal').set(bearer(owner.token)).send({});
    expect(res.status).toBe(200);
    expect(res.body.url).toMatch(new RegExp(`^${pay.fake.url}/portal/`));
  });

  it('an admin reads the plan and seats but cannot change them', async () => {
    const admin = await addMember(h, owner.firm.id, 'admin');
    const read = await h.http().get('/api/v1/billing').set(bearer(admin.token));
    expect(read.status).toBe(200);
    expect(read.body.canManage).toBe(false);
    expect(read.body.seats.paid).toBe(3);
    const change = await h
      .http()
      .patch('/api/v1/billing/seats')
      .set(bearer(admin.token))
      .send({ seats: 9 });
    expect(change.status).toBe(403);
  });

  it('another firm sees only its own billing, and its events never reach this firm', async () => {
    const other = await signUpFirm(h, 'other');
    const theirs = await h.http().get('/api/v1/billing').set(bearer(other.token));
    expect(theirs.body.plan).toBe('concept');
    expect(theirs.body.invoices).toEqual([]);
    // an event naming the other firm but this firm's customer applies to the customer's firm only
    const mine = await firmRow(owner.firm.id);
    const e = event('checkout.session.completed', {
      id: 'cs_x',
      object: 'checkout.session',
      mode: 'subscription',
      customer: 'cus_nobody',
      client_reference_id: owner.firm.id,
      subscription: 'sub_nobody',
      metadata: { firmId: owner.firm.id, plan: 'firm', seats: '40' },
    });
    const res = await deliver(JSON.stringify(e));
    expect(res.body.outcome).toBe('no_firm');
    const after = await firmRow(owner.firm.id);
    expect(after.seats).toBe(mine.seats);
    expect(after.plan).toBe('professional');
  });
});

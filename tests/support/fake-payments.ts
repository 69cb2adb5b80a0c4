import { randomBytes } from 'node:crypto';
import Stripe from 'stripe';
import { afterAll, beforeAll } from 'vitest';
import type { Plan } from '@basinwright/common';
import {
  FAKE_PRICES,
  signPayload,
  startFakeStripe,
  type FakeStripe,
} from '../../scripts/fake-stripe';

export interface FakePayments {
  fake: FakeStripe;
  /** the SDK pointed at the fake with the same key as the API (for arranging state) */
  stripe: Stripe;
  webhookSecret: string;
  /** A Stripe-Signature header for `body`, made by the fake's signer (t defaults to now). */
  sign(body: string, t?: number): string;
  /**
   * Buys `seats` of `plan` for a customer through the fake's own Checkout page (as a person
   * would), returning the customer and subscription ids; the firm row is not touched.
   */
  subscribe(
    firmId: string,
    plan: Exclude<Plan, 'concept'>,
    seats: number,
  ): Promise<{ customer: string; subscription: string }>;
}

/**
 * Starts the local payment stand-in for one API test file and points the API's settings at it.
 * Call it BEFORE apiForFile(): its beforeAll then runs first, so env.ts reads these settings.
 * Events are delivered nowhere until `fake.setWebhookUrl` is called.
 */
export function fakePaymentsForFile(): FakePayments {
  let current: FakePayments | undefined;
  beforeAll(async () => {
    const apiKey = `sk_test_${randomBytes(8).toString('hex')}`;
    const webhookSecret = `whsec_${randomBytes(16).toString('hex')}`;
    const fake = await startFakeStripe({
      apiKey,
      webhookSecret,
      webhookUrl: null,
      retryBaseMs: 50,
    });
    Object.assign(process.env, {
      STRIPE_SECRET_KEY: apiKey,
      STRIPE_WEBHOOK_SECRET: webhookSecret,
      STRIPE_API_BASE: fake.url,
      STRIPE_PRICE_PROFESSIONAL: FAKE_PRICES.professional.id,
      STRIPE_PRICE_FIRM: FAKE_PRICES.firm.id,
    });
    const stripe = new Stripe(apiKey, {
      host: '127.0.0.1',
      port: fake.port,
      protocol: 'http',
      maxNetworkRetries: 0,
      telemetry: false,
    });
    current = {
      fake,
      stripe,
      webhookSecret,
      sign: (body, t) => signPayload(body, webhookSecret, t),
      async subscribe(firmId, plan, seats) {
        const customer = await stripe.customers.create({ metadata: { firmId } });
        const metadata = { firmId, plan, seats: String(seats) };
        const session = await stripe.checkout.sessions.create({
          mode: 'subscription',
          customer: customer.id,
          client_reference_id: firmId,
          line_items: [{ price: FAKE_PRICES[plan].id, quantity: seats }],
          metadata,
          subscription_data: { metadata },
          success_url: 'http://127.0.0.1:9/done',
        });
        const paid = await fetch(`${fake.url}/pay/${session.id}/complete`, {
          method: 'POST',
          redirect: 'manual',
        });
        if (paid.status !== 303) throw new Error(`the fake checkout answered ${paid.status}`);
        const done = await stripe.checkout.sessions.retrieve(session.id);
        if (typeof done.subscription !== 'string')
          throw new Error('no subscription after checkout');
        return { customer: customer.id, subscription: done.subscription };
      },
    };
  });
  afterAll(async () => {
    await current?.fake.close();
  });
  return new Proxy({} as FakePayments, {
    get(_target, key) {
      if (current === undefined)
        throw new Error('The payment stand-in starts in beforeAll: use it inside hooks and tests.');
      const value: unknown = Reflect.get(current, key);
      return typeof value === 'function' ? value.bind(current) : value;
    },
  });
}

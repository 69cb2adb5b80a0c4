import Stripe from 'stripe';
import { getConfig } from '../../config/env';
import { serviceUnavailable, conflict } from '../../errors';

let client: Stripe | undefined;

/**
 * The official SDK, pointed by configuration alone: at the real service (no STRIPE_API_BASE)
 * or at the local fake that `npm start` and `npm test` run on 127.0.0.1.
 */
export function stripe(): Stripe {
  if (client !== undefined) return client;
  const { secretKey, apiBase } = getConfig().stripe;
  client = new Stripe(secretKey, {
    maxNetworkRetries: 1,
    timeout: 20_000,
    telemetry: false,
    ...(apiBase === null
      ? {}
      : { host: apiBase.host, port: apiBase.port, protocol: apiBase.protocol }),
  });
  return client;
}

/**
 * Runs one call to the payment service: a refusal of the request becomes a 409 with its
 * message, anything else (unreachable, its own failure) a 503 — never a 500.
 */
export async function paymentCall<T>(call: () => Promise<T>): Promise<T> {
  try {
    return await call();
  } catch (error) {
    if (error instanceof Stripe.errors.StripeInvalidRequestError)
      throw conflict(`The payment service refused the change: ${error.message}`);
    if (error instanceof Stripe.errors.StripeError)
      throw serviceUnavailable(
        'The payment service cannot be reached just now. Nothing was changed; try again in a minute.',
      );
    throw error;
  }
}

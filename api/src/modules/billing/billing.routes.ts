import express, { Router } from 'express';
import { checkoutSchema, planChangeSchema, seatChangeSchema } from '@basinwright/common';
import { guard } from '../../middlewares/auth';
import { validate } from '../../middlewares/validate';
import * as controller from './billing.controller';

/** Largest event body accepted from the payment service. */
const WEBHOOK_MAX_BYTES = 512 * 1024;

/**
 * The payment service's webhook. Mounted BEFORE the JSON body parser: its signature covers the
 * exact bytes sent, so the body stays a Buffer. Unauthenticated by design — the signature is
 * the authentication.
 */
export function billingWebhookRouter(): Router {
  const router = Router();
  router.post(
    '/webhook',
    express.raw({ type: () => true, limit: WEBHOOK_MAX_BYTES }),
    controller.webhook,
  );
  return router;
}

export function billingRouter(): Router {
  const router = Router();
  router.get('/', guard('billing.read'), controller.summary);
  router.post(
    '/checkout',
    guard('billing.checkout'),
    validate(checkoutSchema),
    controller.checkout,
  );
  router.patch('/seats', guard('billing.seats'), validate(seatChangeSchema), controller.seats);
  router.patch('/plan', guard('billing.plan'), validate(planChangeSchema), controller.plan);
  router.post('/cancel', guard('billing.cancel'), controller.cancel);
  router.post('/resume', guard('billing.resume'), controller.resume);
  router.post('/portal', guard('billing.portal'), controller.portal);
  return router;
}

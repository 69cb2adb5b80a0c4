import type { Request, Response } from 'express';
import type { CheckoutInput, PlanChangeInput, SeatChangeInput } from '@basinwright/common';
import { authOf } from '../../middlewares/auth';
import * as billing from './billing.service';
import { processEvent, verifiedEvent } from './billing.webhook';

export async function summary(req: Request, res: Response): Promise<void> {
  const { user, firm } = authOf(req);
  res.json(await billing.billingSummary(firm.id, user));
}

export async function checkout(req: Request, res: Response): Promise<void> {
  res.json(await billing.startCheckout(authOf(req).user, req.body as CheckoutInput));
}

export async function seats(req: Request, res: Response): Promise<void> {
  res
    .status(202)
    .json(await billing.changeSeats(authOf(req).user, (req.body as SeatChangeInput).seats));
}

export async function plan(req: Request, res: Response): Promise<void> {
  res.status(202).json(await billing.changePlan(authOf(req).user, req.body as PlanChangeInput));
}

export async function cancel(req: Request, res: Response): Promise<void> {
  res.status(202).json(await billing.setCancelAtPeriodEnd(authOf(req).user, true));
}

export async function resume(req: Request, res: Response): Promise<void> {
  res.status(202).json(await billing.setCancelAtPeriodEnd(authOf(req).user, false));
}

export async function portal(req: Request, res: Response): Promise<void> {
  res.json(await billing.portalSession(authOf(req).user));
}

/** The payment service's events: verified on the raw body, applied once, answered at once. */
export async function webhook(req: Request, res: Response): Promise<void> {
  const event = verifiedEvent(req.body, req.get('stripe-signature'));
  const outcome = await processEvent(event);
  res.json({ received: true, outcome });
}

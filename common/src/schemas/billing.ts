import { number, object, string, type InferType } from 'yup';
import type { Plan } from './limits';
import { minimumSeats, planName } from '../plans';

/** Plans bought through the payment service (Concept is free and never bought). */
export const PAID_PLANS = ['professional', 'firm'] as const satisfies readonly Plan[];
export type PaidPlan = (typeof PAID_PLANS)[number];

/** Most seats one firm may buy in one step (a bound on input, not a plan limit). */
export const MAX_SEATS = 1000;

const seatsField = number()
  .typeError('Seats must be a whole number.')
  .required('Give the number of seats.')
  .integer('Seats must be a whole number.')
  .min(1, 'Buy at least one seat.')
  .max(MAX_SEATS, `At most ${MAX_SEATS} seats.`);

/** The sentence for fewer seats than `plan` is bought with or than are in use (`used`). */
export function fewerSeatsText(plan: Plan, used: number): string {
  const least = Math.max(minimumSeats(plan), used);
  return used > minimumSeats(plan)
    ? `${used} seats are in use (members and open invitations): buy at least ${used}, or free seats first.`
    : `The ${planName(plan)} plan is bought with at least ${least} seat${least === 1 ? '' : 's'}.`;
}

/**
 * The seat count of a purchase or a change on `plan` with `used` seats in use: a whole number
 * from the plan's minimum (and the seats in use) to MAX_SEATS. The billing page checks what is
 * typed with it; the API refuses the same counts with the same sentence (fewerSeatsText).
 */
export function seatCountSchema(plan: Plan, used: number) {
  const least = Math.max(1, minimumSeats(plan), used);
  return object({ seats: seatsField.min(least, fewerSeatsText(plan, used)) });
}

export const checkoutSchema = object({
  plan: string<PaidPlan>()
    .required('Choose a plan.')
    .oneOf(PAID_PLANS, 'Choose Professional or Firm.'),
  seats: seatsField,
});
export type CheckoutInput = InferType<typeof checkoutSchema>;

export const seatChangeSchema = object({ seats: seatsField });
export type SeatChangeInput = InferType<typeof seatChangeSchema>;

/** A change of paid plan while subscribed; seats kept (raised to the plan's minimum) when absent. */
export const planChangeSchema = object({
  plan: string<PaidPlan>()
    .required('Choose a plan.')
    .oneOf(PAID_PLANS, 'Choose Professional or Firm.'),
  seats: seatsField.optional().default(undefined),
});
export type PlanChangeInput = InferType<typeof planChangeSchema>;

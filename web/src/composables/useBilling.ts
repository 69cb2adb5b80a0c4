import { billingApi, type BillingSummary, type PaidPlan } from '@/api/billing';
import { useResource } from '@/composables/useResource';
import { useAuthStore } from '@/stores/auth';

/** Pause between two reads while a change waits for the payment service's confirmation. */
const CONFIRM_POLL_MS = 1000;
/** Reads before the page stops waiting and says the change is still on its way. */
const CONFIRM_POLLS = 30;

/**
 * The Billing page's data and the owner's changes. Changes are asked of the payment service;
 * the firm changes when its webhook arrives, so after each change the summary is read again
 * until it shows the change (or the page gives up waiting and says so). The plan badge in the
 * app shell follows through the auth store.
 */
export function useBilling() {
  const auth = useAuthStore();
  const resource = useResource((signal) => billingApi.summary(signal), {
    initial: null as BillingSummary | null,
    what: 'billing',
  });

  /** Reads until `done(summary)` holds; true when it did. */
  async function waitFor(done: (s: BillingSummary) => boolean): Promise<boolean> {
    for (let i = 0; i < CONFIRM_POLLS; i += 1) {
      await resource.reload();
      const s = resource.data.value;
      if (s !== null && done(s)) {
        await auth.refreshFirm();
        return true;
      }
      await new Promise((resolve) => setTimeout(resolve, CONFIRM_POLL_MS));
    }
    return false;
  }

  async function checkout(plan: PaidPlan, seats: number): Promise<void> {
    const { url } = await billingApi.checkout({ plan, seats });
    window.location.assign(url);
  }

  async function changeSeats(seats: number): Promise<boolean> {
    await billingApi.changeSeats(seats);
    return waitFor((s) => s.seats.paid === seats);
  }

  /** Professional ↔ Firm while subscribed; confirmed when the summary shows the new plan. */
  async function changePlan(plan: PaidPlan, seats: number): Promise<boolean> {
    await billingApi.changePlan({ plan, seats });
    return waitFor((s) => s.plan === plan && s.seats.paid === seats);
  }

  async function setCancelled(cancel: boolean): Promise<boolean> {
    await (cancel ? billingApi.cancel() : billingApi.resume());
    return waitFor((s) => s.subscription?.cancelAtPeriodEnd === cancel);
  }

  async function openPortal(): Promise<void> {
    const { url } = await billingApi.portal();
    window.location.assign(url);
  }

  return { ...resource, waitFor, checkout, changeSeats, changePlan, setCancelled, openPortal };
}

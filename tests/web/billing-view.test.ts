import { afterEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { createMemoryHistory } from 'vue-router';
import BillingView from '../../web/src/views/BillingView.vue';
import type { BillingSummary } from '../../web/src/api/billing';
import { createAppRouter } from '../../web/src/router';
import { TOKEN_KEY } from '../../web/src/stores/auth';
import { demoFirm, demoUser, stubApi, type Routes } from './fetch-stub';

afterEach(() => {
  vi.unstubAllGlobals();
});

const offers: BillingSummary['offers'] = [
  { plan: 'professional', unitAmount: 3900, currency: 'usd', minimumSeats: 1 },
  { plan: 'firm', unitAmount: 5900, currency: 'usd', minimumSeats: 3 },
];

function summary(over: Partial<BillingSummary> = {}): BillingSummary {
  return {
    plan: 'concept',
    planName: 'Concept',
    seats: { paid: 1, used: 5 },
    billingStatus: 'active',
    graceEndsAt: null,
    subscription: null,
    nextInvoice: null,
    invoices: [],
    offers,
    paymentServiceReachable: true,
    canManage: true,
    ...over,
  };
}

async function mountAs(role: 'owner' | 'admin', routes: Routes) {
  localStorage.setItem(TOKEN_KEY, `tok-${role}`);
  setActivePinia(createPinia());
  const api = stubApi({
    'GET /auth/me': { status: 200, body: { user: demoUser(role), firm: demoFirm } },
    ...routes,
  });
  const router = createAppRouter(createMemoryHistory());
  await router.push('/billing');
  const wrapper = mount(BillingView, { global: { plugins: [router] }, attachTo: document.body });
  await vi.waitFor(() =>
    expect(wrapper.find('[data-test="billing-seats-paid"]').exists()).toBe(true),
  );
  await flushPromises();
  return { wrapper, api };
}

describe('BillingView', () => {
  it('offers the owner of a Concept firm an upgrade with one seat more than are in use', async () => {
    const { wrapper, api } = await mountAs('owner', {
      'GET /billing': { status: 200, body: summary() },
      'POST /billing/checkout': { status: 200, body: { url: 'about:blank' } },
    });
    expect(wrapper.find('[data-test="billing-upgrade"]').exists()).toBe(true);
    const seats = wrapper.find(
      'input[data-test="billing-buy-seats"], [data-test="billing-buy-seats"] input',
    );
    expect((seats.element as HTMLInputElement).value).toBe('6');
    // 6 seats × 39.00 a month (the offer shown), in the page's own words
    expect(wrapper.text()).toContain('234.00');
    await wrapper.find('[data-test="billing-upgrade"] form').trigger('submit');
    await vi.waitFor(() =>
      expect(api.calls.some((c) => c.method === 'POST' && c.path === '/billing/checkout')).toBe(
        true,
      ),
    );
    const call = api.calls.find((c) => c.path === '/billing/checkout');
    expect(JSON.parse(String(call?.init.body))).toEqual({ plan: 'professional', seats: 6 });
    wrapper.unmount();
  });

  it('shows an admin the plan and seats read-only', async () => {
    const { wrapper } = await mountAs('admin', {
      'GET /billing': {
        status: 200,
        body: summary({
          plan: 'professional',
          planName: 'Professional',
          seats: { paid: 7, used: 5 },
          subscription: { cancelAtPeriodEnd: false, currentPeriodEnd: '2027-01-01T00:00:00.000Z' },
          canManage: false,
        }),
      },
    });
    expect(wrapper.find('[data-test="billing-seats-paid"]').text()).toBe('7');
    expect(wrapper.find('[data-test="billing-read-only-role"]').exists()).toBe(true);
    expect(wrapper.find('[data-test="billing-upgrade"]').exists()).toBe(false);
    expect(wrapper.find('[data-test="billing-seats-input"]').exists()).toBe(false);
    expect(wrapper.find('[data-test="billing-cancel"]').exists()).toBe(false);
    wrapper.unmount();
  });

  it('asks for a new seat count and shows it once the summary confirms it', async () => {
    let paid = 6;
    const subscribed = () =>
      summary({
        plan: 'professional',
        planName: 'Professional',
        seats: { paid, used: 5 },
        subscription: { cancelAtPeriodEnd: false, currentPeriodEnd: '2027-01-01T00:00:00.000Z' },
      });
    const { wrapper, api } = await mountAs('owner', {
      'GET /billing': () => ({ status: 200, body: subscribed() }),
      'PATCH /billing/seats': (init) => {
        paid = (JSON.parse(String(init.body)) as { seats: number }).seats;
        return { status: 202, body: { requested: paid } };
      },
    });
    const input = wrapper.find(
      'input[data-test="billing-seats-input"], [data-test="billing-seats-input"] input',
    );
    await input.setValue('7');
    await input.trigger('blur');
    await flushPromises();
    await wrapper.find('[data-test="billing-change-seats"]').trigger('click');
    await vi.waitFor(() =>
      expect(wrapper.find('[data-test="billing-seats-paid"]').text()).toBe('7'),
    );
    const patch = api.calls.find((c) => c.method === 'PATCH');
    expect(JSON.parse(String(patch?.init.body))).toEqual({ seats: 7 });
    wrapper.unmount();
  });

  it('moves a subscribed Professional firm to Firm with at least 3 seats, shown once confirmed', async () => {
    let plan: 'professional' | 'firm' = 'professional';
    let paid = 2;
    const current = () =>
      summary({
        plan,
        planName: plan === 'firm' ? 'Firm' : 'Professional',
        seats: { paid, used: 2 },
        subscription: { cancelAtPeriodEnd: false, currentPeriodEnd: '2027-01-01T00:00:00.000Z' },
      });
    const { wrapper, api } = await mountAs('owner', {
      'GET /billing': () => ({ status: 200, body: current() }),
      'PATCH /billing/plan': (init) => {
        const body = JSON.parse(String(init.body)) as { plan: 'firm'; seats: number };
        plan = body.plan;
        paid = body.seats;
        return { status: 202, body: { requested: body } };
      },
    });
    const offer = wrapper.find('[data-test="billing-switch"]');
    // The Firm plan's minimum is 3 seats (product brief's plan table); 3 × 59.00 a month.
    expect(offer.text()).toContain('3 seats');
    expect(offer.text()).toContain('177.00');
    await wrapper.find('[data-test="billing-switch-plan"]').trigger('click');
    await vi.waitFor(() => expect(wrapper.find('[data-test="billing-plan"]').text()).toBe('Firm'));
    const patch = api.calls.find((c) => c.method === 'PATCH' && c.path === '/billing/plan');
    expect(JSON.parse(String(patch?.init.body))).toEqual({ plan: 'firm', seats: 3 });
    // Now on Firm, the page offers the way back.
    expect(wrapper.find('[data-test="billing-switch-plan"]').text()).toContain('Professional');
    wrapper.unmount();
  });

  it('tells the owner of a past-due firm when the grace ends, and that nothing is deleted', async () => {
    const { wrapper } = await mountAs('owner', {
      'GET /billing': {
        status: 200,
        body: summary({
          plan: 'professional',
          billingStatus: 'past_due',
          graceEndsAt: '2027-01-15T12:00:00.000Z',
          subscription: { cancelAtPeriodEnd: false, currentPeriodEnd: null },
        }),
      },
    });
    const grace = wrapper.find('[data-test="billing-grace"]');
    expect(grace.exists()).toBe(true);
    expect(grace.text()).toContain('2027');
    expect(grace.text()).toContain('Nothing is deleted');
    wrapper.unmount();
  });
});

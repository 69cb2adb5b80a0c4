import { afterEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { createMemoryHistory } from 'vue-router';
import BillingView from '../../web/src/views/BillingView.vue';
import type { BillingSummary } from '../../web/src/api/billing';
import { createAppRouter } from '../../web/src/router';
import { TOKEN_KEY } from '../../web/src/stores/auth';
import { demoFirm, demoUser, stubApi, type Routes } from './fetch-stub';
import { helpFor } from './form-help';

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

  it('keeps an out-of-range or fractional seat change as typed, says why and waits', async () => {
    const { wrapper, api } = await mountAs('owner', {
      'GET /billing': {
        status: 200,
        body: summary({
          plan: 'professional',
          planName: 'Professional',
          seats: { paid: 6, used: 5 },
          subscription: { cancelAtPeriodEnd: false, currentPeriodEnd: '2027-01-01T00:00:00.000Z' },
        }),
      },
      'PATCH /billing/seats': { status: 202, body: { requested: 7 } },
    });
    const input = wrapper.find<HTMLInputElement>(
      'input[data-test="billing-seats-input"], [data-test="billing-seats-input"] input',
    );
    const button = () => wrapper.find('[data-test="billing-change-seats"]');
    // [typed, the shared schema's message (seatCountSchema, common/src/schemas/billing.ts)]
    const cases: [string, string][] = [
      [
        '3',
        '5 seats are in use (members and open invitations): buy at least 5, or free seats first.',
      ],
      ['6.5', 'Seats must be a whole number.'],
      ['2000', 'At most 1000 seats.'],
      ['', 'Give the number of seats.'],
    ];
    for (const [typed, said] of cases) {
      await input.setValue(typed);
      await input.trigger('blur');
      await flushPromises();
      expect(input.element.value, typed).toBe(typed); // kept as typed, never pulled to a bound
      expect(helpFor(wrapper, 'Seats'), typed).toBe(said);
      expect(button().attributes('disabled'), typed).toBeDefined();
      await wrapper
        .find('[data-test="billing-seats-input"]')
        .element.closest('form')!
        .dispatchEvent(new Event('submit', { cancelable: true }));
      await flushPromises();
      expect(
        api.calls.some((c) => c.method === 'PATCH'),
        typed,
      ).toBe(false);
    }
    await input.setValue('7');
    await input.trigger('blur');
    await flushPromises();
    expect(helpFor(wrapper, 'Seats')).toBeNull();
    expect(button().attributes('disabled')).toBeUndefined();
    wrapper.unmount();
  });

  it('says the Firm plan is bought with at least 3 seats, and offers no payment below it', async () => {
    const { wrapper, api } = await mountAs('owner', {
      'GET /billing': { status: 200, body: summary({ seats: { paid: 1, used: 1 } }) },
      'POST /billing/checkout': { status: 200, body: { url: 'about:blank' } },
    });
    await wrapper.find('[data-test="billing-plan-choice"] input[value="firm"]').setValue(true);
    await flushPromises();
    const input = wrapper.find<HTMLInputElement>(
      'input[data-test="billing-buy-seats"], [data-test="billing-buy-seats"] input',
    );
    await input.setValue('2');
    await input.trigger('blur');
    await flushPromises();
    expect(input.element.value).toBe('2');
    // the Firm plan's minimum is 3 seats (product brief's plan table)
    expect(helpFor(wrapper, 'Seats')).toBe('The Firm plan is bought with at least 3 seats.');
    expect(wrapper.find('[data-test="billing-checkout"]').attributes('disabled')).toBeDefined();
    await wrapper.find('[data-test="billing-upgrade"] form').trigger('submit');
    await flushPromises();
    expect(api.calls.some((c) => c.path === '/billing/checkout')).toBe(false);
    await input.setValue('4');
    await input.trigger('blur');
    await flushPromises();
    expect(helpFor(wrapper, 'Seats')).toBeNull();
    await wrapper.find('[data-test="billing-upgrade"] form').trigger('submit');
    await vi.waitFor(() =>
      expect(api.calls.some((c) => c.path === '/billing/checkout')).toBe(true),
    );
    const call = api.calls.find((c) => c.path === '/billing/checkout');
    expect(JSON.parse(String(call?.init.body))).toEqual({ plan: 'firm', seats: 4 });
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

import { afterEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount, type VueWrapper } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { createMemoryHistory } from 'vue-router';
import DesignEstimateStep from '../../web/src/components/DesignEstimateStep.vue';
import { createAppRouter } from '../../web/src/router';
import { TOKEN_KEY, useAuthStore } from '../../web/src/stores/auth';
import { demoFirm, demoUser, stubApi } from './fetch-stub';
import { helpFor } from './form-help';

afterEach(() => {
  vi.unstubAllGlobals();
});

// What the server answers for a draft and for the same revision once issued. The figures are
// the server's; this test checks what the step shows and what it lets each role do.
const draft = {
  id: 'e1',
  projectId: 'p1',
  revision: 1,
  status: 'draft',
  priceBook: { id: 'b1', name: 'Invented demo rates', currency: 'USD' },
  settings: {
    locationFactor: 1,
    percentages: { mobilisation: 0, careOfWater: 0, contingency: 0, overheadAndProfit: 0 },
    escalation: { annualRate: 0, years: 0 },
    accuracy: { aaceClass: 5 },
  },
  mapping: { 'concrete.floorSlab': 'CONC' },
  takeoffLines: [
    {
      key: 'concrete.floorSlab',
      kind: 'concrete',
      element: 'floorSlab',
      quantityKind: 'earthwork',
      quantity: 100,
      unit: 'm³',
      basis: '',
    },
  ],
  lines: [
    {
      key: 'concrete.floorSlab',
      code: 'CONC',
      description: 'Concrete',
      unit: 'm³',
      unitPrice: 500,
      currency: 'USD',
      quantity: 100,
      quantityUsed: 100,
      override: null,
      amount: 50000,
    },
  ],
  unpriced: [],
  totals: {
    direct: 50000,
    located: 50000,
    mobilisation: 0,
    careOfWater: 0,
    contingency: 0,
    overheadAndProfit: 0,
    escalation: 0,
    total: 50000,
    accuracy: {
      aaceClass: 5,
      lowPct: -0.5,
      highPct: 1,
      low: 25000,
      high: 100000,
      basis: 'band-ends',
      source: 'AACE International Recommended Practice 18R-97',
    },
  },
  steps: [],
  pricedFrom: {
    designId: 'd1',
    engineVersion: '2.2.0',
    computedAt: null,
    designUpdatedAt: '2026-12-01T00:00:00.000Z',
  },
  stale: false,
  problem: null,
  issuedAt: null,
  issuedBy: null,
  createdAt: '2026-12-01T00:00:00.000Z',
  audit: [],
};

async function mountAs(
  role: 'estimator' | 'viewer',
  estimate: object = draft,
  more: Parameters<typeof stubApi>[0] = {},
) {
  localStorage.setItem(TOKEN_KEY, `tok-${role}`);
  setActivePinia(createPinia());
  const api = stubApi({
    'GET /auth/me': { status: 200, body: { user: demoUser(role), firm: demoFirm } },
    'GET /projects/p1/estimates': {
      status: 200,
      body: {
        items: [
          { id: 'e1', revision: 1, status: 'draft', issuedAt: null, total: null, createdAt: '' },
        ],
      },
    },
    'GET /price-books': { status: 200, body: { items: [] } },
    'GET /price-books/b1': {
      status: 200,
      body: { id: 'b1', name: 'Invented demo rates', currency: 'USD', items: [] },
    },
    'GET /estimates/e1': { status: 200, body: estimate },
    'POST /estimates/e1/issue': { status: 200, body: { ...draft, status: 'issued' } },
    ...more,
  });
  const router = createAppRouter(createMemoryHistory());
  await useAuthStore().ensureLoaded();
  const wrapper = mount(DesignEstimateStep, {
    props: { projectId: 'p1', units: 'SI' },
    global: { plugins: [router] },
    attachTo: document.body,
  });
  await vi.waitFor(() => expect(wrapper.find('[data-test="estimate-total"]').exists()).toBe(true));
  await flushPromises();
  return { wrapper, api };
}

/** A number box by its data-test (ant-design-vue puts it on the input or on its wrapper). */
const box$ = (w: Pick<VueWrapper, 'find'>, test: string) =>
  w.find<HTMLInputElement>(`input[data-test="${test}"], [data-test="${test}"] input`);

describe('DesignEstimateStep', () => {
  it('shows the total with its class range beside it, and offers an estimator the changes', async () => {
    const { wrapper } = await mountAs('estimator');
    expect(wrapper.find('[data-test="estimate-total"]').text()).toBe('50,000.00');
    expect(wrapper.find('[data-test="estimate-range"]').text()).toMatch(
      /Class 5 range 25,000.00 \(-50 %\) to 100,000.00 \(\+100 %\)/,
    );
    expect(wrapper.find('[data-test="estimate-issue"]').exists()).toBe(true);
    expect(wrapper.find('[data-test="estimate-override-concrete.floorSlab"]').exists()).toBe(true);
    wrapper.unmount();
  });

  it('hides every change from a viewer, and from everyone once issued', async () => {
    const viewer = await mountAs('viewer');
    expect(viewer.wrapper.find('[data-test="estimate-issue"]').exists()).toBe(false);
    expect(viewer.wrapper.find('[data-test="estimate-override-concrete.floorSlab"]').exists()).toBe(
      false,
    );
    expect(viewer.wrapper.find('[data-test="estimate-download-xlsx"]').exists()).toBe(true);
    viewer.wrapper.unmount();
    const issued = await mountAs('estimator', {
      ...draft,
      status: 'issued',
      issuedAt: '2026-12-02T00:00:00.000Z',
      issuedBy: 'Demo estimator',
    });
    expect(issued.wrapper.find('[data-test="estimate-issued"]').text()).toMatch(/does not change/);
    expect(issued.wrapper.find('[data-test="estimate-issue"]').exists()).toBe(false);
    issued.wrapper.unmount();
  });

  it('keeps an out-of-range setting as typed, says why under it and saves nothing until it is valid', async () => {
    const { wrapper, api } = await mountAs('estimator', draft, {
      'PATCH /estimates/e1': (init) => ({
        status: 200,
        body: {
          ...draft,
          settings: (JSON.parse(String(init.body)) as { settings: object }).settings,
        },
      }),
    });
    const box = box$(wrapper, 'estimate-field-mobilisation');
    await box.setValue('250');
    await box.trigger('blur');
    // The shared schema's bound (ESTIMATE_LIMITS.percentage.max = 2, i.e. 200 %), said in percent.
    await vi.waitFor(() =>
      expect(helpFor(wrapper, 'Mobilisation (%)')).toBe('Mobilisation is at most 200 %.'),
    );
    expect(box.element.value).toBe('250'); // not pulled back to 200
    expect(wrapper.find('[data-test="estimate-settings-invalid"]').exists()).toBe(true);
    const save = wrapper.find('[data-test="estimate-save-settings"]');
    expect(save.attributes('disabled')).toBeDefined();
    await save.trigger('click');
    await flushPromises();
    expect(api.calls.filter((c) => c.method === 'PATCH')).toHaveLength(0);

    const escalation = box$(wrapper, 'estimate-field-annualRate');
    await escalation.setValue('-25');
    await escalation.trigger('blur');
    await vi.waitFor(() =>
      expect(helpFor(wrapper, 'Escalation a year (%)')).toBe(
        'The escalation rate is at least -20 %.',
      ),
    );
    expect(escalation.element.value).toBe('-25');
    await escalation.setValue('3');
    await box.setValue('5');
    await box.trigger('blur');
    await vi.waitFor(() => expect(helpFor(wrapper, 'Mobilisation (%)')).toBeNull());
    await vi.waitFor(() =>
      expect(
        wrapper.find('[data-test="estimate-save-settings"]').attributes('disabled'),
      ).toBeUndefined(),
    );
    await wrapper.find('[data-test="estimate-save-settings"]').trigger('click');
    await vi.waitFor(() => expect(api.calls.some((c) => c.method === 'PATCH')).toBe(true));
    const sent = JSON.parse(String(api.calls.find((c) => c.method === 'PATCH')!.init.body)) as {
      settings: { percentages: { mobilisation: number }; escalation: { annualRate: number } };
    };
    // Sent as fractions: 5 % → 0.05, 3 % → 0.03 (a percentage is a hundredth, by definition).
    expect(sent.settings.percentages.mobilisation).toBe(0.05);
    expect(sent.settings.escalation.annualRate).toBe(0.03);
    wrapper.unmount();
  });

  it('asks for the reason of a changed quantity and refuses a negative one, under the fields', async () => {
    const { wrapper, api } = await mountAs('estimator');
    await wrapper.find('[data-test="estimate-override-concrete.floorSlab"]').trigger('click');
    await flushPromises();
    const qty = document.querySelector<HTMLInputElement>(
      '[data-test="override-quantity"] input, input[data-test="override-quantity"]',
    )!;
    qty.value = '-3';
    qty.dispatchEvent(new Event('input'));
    qty.dispatchEvent(new Event('blur'));
    const ok = [...document.querySelectorAll<HTMLButtonElement>('.ant-modal button')].find(
      (b) => b.textContent?.trim() === 'Change',
    )!;
    ok.click();
    await vi.waitFor(() => {
      const explains = [
        ...document.querySelectorAll('.ant-modal .ant-form-item-explain-error'),
      ].map((e) => e.textContent);
      expect(explains).toEqual(['A quantity cannot be negative.', 'Say why the quantity changes.']);
    });
    expect(qty.value).toBe('-3');
    expect(api.calls.filter((c) => c.method === 'POST')).toHaveLength(0);
    wrapper.unmount();
  });
});

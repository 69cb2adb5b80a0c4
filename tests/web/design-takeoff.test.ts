// The Take-off step's forms: an assumption or a search width out of range stays as typed, the
// shared schema's message stands under it (takeoffOverridesSchema, cheapestRequestSchema), and
// nothing is saved or searched until it is valid. The take-off shown is the engine's own, of the
// seeded demo design (the invented scenario of product.md).
import { afterEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount, type VueWrapper } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { createMemoryHistory } from 'vue-router';
import { runStudy, takeoff, TAKEOFF_ASSUMPTIONS } from '@basinwright/common';
import DesignTakeoffStep from '../../web/src/components/DesignTakeoffStep.vue';
import { createAppRouter } from '../../web/src/router';
import { TOKEN_KEY, useAuthStore } from '../../web/src/stores/auth';
import { fenwickDesign } from '../../seed/designs';
import { demoFirm, demoUser, stubApi } from './fetch-stub';

afterEach(() => vi.unstubAllGlobals());

const SI_UNIT = { earthwork: 'm³', mass: 'kg', area: 'm²', length: 'm' } as const;
const result = runStudy(fenwickDesign);
const t = takeoff(result.design!, {});
const view = {
  projectId: 'p1',
  units: 'SI',
  problem: null,
  stale: false,
  type: t.type,
  lines: t.lines.map((l) => ({ ...l, unit: SI_UNIT[l.quantityKind] })),
  totals: t.totals,
  assumptions: t.assumptions,
  soil: t.soil,
  notes: t.notes,
  overrides: {},
};

async function mountStep() {
  localStorage.setItem(TOKEN_KEY, 'tok-estimator');
  setActivePinia(createPinia());
  const api = stubApi({
    'GET /auth/me': { status: 200, body: { user: demoUser('estimator'), firm: demoFirm } },
    'GET /projects/p1/takeoff': { status: 200, body: view },
    'GET /price-books': { status: 200, body: { items: [] } },
  });
  const router = createAppRouter(createMemoryHistory());
  await useAuthStore().ensureLoaded();
  const wrapper = mount(DesignTakeoffStep, {
    props: { projectId: 'p1', units: 'SI' },
    global: { plugins: [router] },
    attachTo: document.body,
  });
  await vi.waitFor(() =>
    expect(wrapper.find('[data-test="takeoff-assumptions"]').exists()).toBe(true),
  );
  await flushPromises();
  return { wrapper, api };
}

const box = (w: Pick<VueWrapper, 'find'>, test: string) =>
  w.find<HTMLInputElement>(`input[data-test="${test}"], [data-test="${test}"] input`);
/** The message under the box `test`, or null. */
const messageUnder = (w: Pick<VueWrapper, 'find'>, test: string): string | null =>
  box(w, test).element.closest('.ant-form-item')?.querySelector('.ant-form-item-explain-error')
    ?.textContent ?? null;

async function type(w: VueWrapper, test: string, value: string): Promise<void> {
  const b = box(w, test);
  await b.setValue(value);
  await b.trigger('blur');
  await flushPromises();
}

describe('DesignTakeoffStep', () => {
  it('an assumption out of its bounds stays as typed, says why and is not saved', async () => {
    const { wrapper, api } = await mountStep();
    const waste = TAKEOFF_ASSUMPTIONS.concreteWaste.label;
    await type(wrapper, 'takeoff-assumption-concreteWaste', '1.5');
    // TAKEOFF_LIMITS.fraction: a waste of more than the neat volume is a different job
    await vi.waitFor(() =>
      expect(messageUnder(wrapper, 'takeoff-assumption-concreteWaste')).toBe(
        `${waste} must be at most 1.`,
      ),
    );
    expect(box(wrapper, 'takeoff-assumption-concreteWaste').element.value).toBe('1.5');
    await type(wrapper, 'takeoff-assumption-workingRoom', '-0.5');
    await vi.waitFor(() =>
      expect(messageUnder(wrapper, 'takeoff-assumption-workingRoom')).toBe(
        `${TAKEOFF_ASSUMPTIONS.workingRoom.label} must be at least 0 m.`,
      ),
    );
    const save = wrapper.find('[data-test="takeoff-save"]');
    expect(save.attributes('disabled')).toBeDefined();
    await save.trigger('click');
    await flushPromises();
    expect(api.calls.filter((c) => c.method === 'PUT')).toHaveLength(0);
    // emptied, the box is no override: the message goes
    await type(wrapper, 'takeoff-assumption-workingRoom', '');
    await vi.waitFor(() =>
      expect(messageUnder(wrapper, 'takeoff-assumption-workingRoom')).toBeNull(),
    );
    wrapper.unmount();
  });

  it('the search widths say what is wrong under each and the search waits for valid ones', async () => {
    const { wrapper } = await mountStep();
    await type(wrapper, 'cheapest-min', '-20');
    await type(wrapper, 'cheapest-steps', '50');
    await vi.waitFor(() => {
      expect(messageUnder(wrapper, 'cheapest-min')).toBe('The smallest width must be above zero.');
      // SEARCH_LIMITS.maxWidthSteps
      expect(messageUnder(wrapper, 'cheapest-steps')).toBe('Try at most 41 widths.');
    });
    expect(box(wrapper, 'cheapest-min').element.value).toBe('-20');
    expect(box(wrapper, 'cheapest-steps').element.value).toBe('50');
    expect(wrapper.find('[data-test="cheapest-run"]').attributes('disabled')).toBeDefined();
    await type(wrapper, 'cheapest-min', '50'); // above the largest, 40 m
    await type(wrapper, 'cheapest-steps', '9');
    await vi.waitFor(() =>
      expect(messageUnder(wrapper, 'cheapest-max')).toBe(
        'The largest width must not be below the smallest.',
      ),
    );
    wrapper.unmount();
  });
});

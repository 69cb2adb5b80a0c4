// The comparison of alternatives out to a spreadsheet is a Firm-plan feature (product brief,
// plans table): on Concept and Professional the upgrade prompt takes the buttons' place and
// names Firm; on Firm the buttons ask the server, and a plan_limit answer (the plan changed
// since sign-in) brings the prompt with the server's sentence.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { createMemoryHistory } from 'vue-router';
import { runStudy } from '@basinwright/common';
import DesignAlternativesTable from '../../web/src/components/DesignAlternativesTable.vue';
import { createAppRouter } from '../../web/src/router';
import { useAuthStore } from '../../web/src/stores/auth';
import { fenwickDesign } from '../../seed/designs';
import { demoFirm, demoUser, stubApi } from './fetch-stub';

// the SI demo designs a chosen basin and sized alternatives (seed/designs.ts)
const result = runStudy(fenwickDesign);

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

async function mountTable(plan: 'concept' | 'professional' | 'firm') {
  setActivePinia(createPinia());
  const auth = useAuthStore();
  auth.firm = { ...demoFirm, plan };
  auth.user = demoUser('engineer');
  const router = createAppRouter(createMemoryHistory());
  const wrapper = mount(DesignAlternativesTable, {
    props: { result, units: 'SI', projectId: 'p1' },
    global: { plugins: [router] },
    attachTo: document.body,
  });
  await flushPromises();
  return wrapper;
}

describe('alternatives export gate', () => {
  it('has alternatives to compare (the demo study)', () => {
    expect(result.alternatives.length).toBeGreaterThan(0);
  });

  it.each(['concept', 'professional'] as const)(
    'on %s: the upgrade prompt names Firm, no download buttons',
    async (plan) => {
      const w = await mountTable(plan);
      const prompt = w.find('[data-test="upgrade-prompt"]');
      expect(prompt.exists()).toBe(true);
      expect(prompt.text()).toContain('Available on the Firm plan');
      expect(prompt.text()).toContain('Exporting the comparison of alternatives');
      expect(w.find('[data-test="alternatives-xlsx"]').exists()).toBe(false);
      w.unmount();
    },
  );

  it('on Firm: the buttons ask the server for the file; a plan_limit answer brings the prompt', async () => {
    const w = await mountTable('firm');
    expect(w.find('[data-test="upgrade-prompt"]').exists()).toBe(false);
    const api = stubApi({
      'GET /projects/p1/alternatives/export': {
        status: 403,
        body: {
          code: 'plan_limit',
          message: 'Exporting the comparison of alternatives is available on the Firm plan.',
          details: { limit: 'alternativesExport', liftedBy: 'firm' },
        },
      },
    });
    await w.find('[data-test="alternatives-xlsx"]').trigger('click');
    await vi.waitFor(() => expect(w.find('[data-test="upgrade-prompt"]').exists()).toBe(true));
    expect(api.calls.map((c) => `${c.method} ${c.path}`)).toEqual([
      'GET /projects/p1/alternatives/export',
    ]);
    expect(String(api.fetchMock.mock.calls[0]![0])).toContain('format=xlsx');
    expect(w.find('[data-test="upgrade-prompt"]').text()).toContain('Firm plan');
    expect(w.find('[data-test="alternatives-xlsx"]').exists()).toBe(false);
    w.unmount();
  });
});

// The design workspace view: read-only for those who cannot edit, saving for engineers, and a
// server 422 put back on the form.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { createMemoryHistory } from 'vue-router';
import type { StudyInput } from '@basinwright/common';
import DesignWorkspaceView from '../../web/src/views/DesignWorkspaceView.vue';
import { createAppRouter } from '../../web/src/router';
import { STUDY_DEBOUNCE_MS } from '../../web/src/composables/useStudy';
import { TOKEN_KEY } from '../../web/src/stores/auth';
import { demoFirm, demoUser, stubApi, type Reply } from './fetch-stub';
import { helpFor } from './form-help';
import { fenwickDesign } from '../../seed/designs';

const project = {
  id: 'p1',
  name: 'Fenwick Mill Pond — auxiliary spillway outlet',
  client: null,
  location: null,
  units: 'SI',
  status: 'draft',
  notes: null,
  createdBy: null,
  createdAt: '2025-01-01T00:00:00.000Z',
  updatedAt: '2025-01-01T00:00:00.000Z',
};
// the demo design of product.md (invented scenario), as seeded
const input: StudyInput = fenwickDesign;
const design = {
  projectId: 'p1',
  input,
  options: null,
  updatedAt: '2025-01-02T00:00:00.000Z',
  updatedBy: { id: 'u-engineer', name: 'Demo engineer' },
  revision: 1,
};

afterEach(() => vi.unstubAllGlobals());

async function mountAs(
  role: 'engineer' | 'viewer' | 'estimator',
  put?: (init: RequestInit) => Reply,
  step = 'site',
) {
  localStorage.setItem(TOKEN_KEY, `tok-${role}`);
  setActivePinia(createPinia());
  const api = stubApi({
    'GET /auth/me': { status: 200, body: { user: demoUser(role), firm: demoFirm } },
    'GET /projects/p1': { status: 200, body: project },
    'GET /projects/p1/design': { status: 200, body: design },
    'GET /projects/p1/versions': {
      status: 200,
      body: { items: [], status: 'draft', reviewer: false },
    },
    ...(put ? { 'PUT /projects/p1/design': put } : {}),
  });
  const router = createAppRouter(createMemoryHistory());
  await router.push(`/projects/p1/design?step=${step}`);
  const wrapper = mount(DesignWorkspaceView, {
    props: { id: 'p1' },
    global: { plugins: [router] },
    attachTo: document.body,
  });
  // Each step's form and the summary load when first shown, and the first study fetches the engine
  // into the thread (no Worker in jsdom): wait for both, however long the imports take here.
  const shown = { timeout: 20_000 };
  await vi.waitFor(
    () => expect(wrapper.find('[data-test="summary-floor"]').exists()).toBe(true),
    shown,
  );
  await vi.waitFor(
    () => expect(wrapper.find('[data-test="step-panel"] form input').exists()).toBe(true),
    shown,
  );
  await flushPromises();
  return { wrapper, api };
}

describe('DesignWorkspaceView', () => {
  it.each(['viewer', 'estimator'] as const)(
    'is read-only for a %s: no save, inputs disabled, results shown',
    async (role) => {
      const { wrapper, api } = await mountAs(role);
      expect(wrapper.find('[data-test="read-only"]').exists()).toBe(true);
      expect(wrapper.find('[data-test="save-design"]').exists()).toBe(false);
      const width = wrapper.find<HTMLInputElement>('#design-basinWidth');
      expect(width.element.value).toBe('12');
      expect(width.element.disabled).toBe(true);
      expect(wrapper.find('[data-test="summary-floor"]').text()).toMatch(/^\d+\.\d{2} m$/);
      window.dispatchEvent(new KeyboardEvent('keydown', { key: 's', ctrlKey: true }));
      await flushPromises();
      expect(api.calls.some((c) => c.method === 'PUT')).toBe(false);
      wrapper.unmount();
    },
  );

  it('lets an engineer save with Ctrl-S, sending the input in the project units', async () => {
    const { wrapper, api } = await mountAs('engineer', (init) => ({
      status: 200,
      body: { ...design, input: JSON.parse(String(init.body)).input },
    }));
    const width = wrapper.find<HTMLInputElement>('#design-basinWidth');
    expect(width.element.disabled).toBe(false);
    await width.setValue('12.5');
    await width.trigger('blur');
    await flushPromises();
    await vi.waitFor(() => expect(wrapper.find('[data-test="unsaved"]').exists()).toBe(true));
    window.dispatchEvent(new KeyboardEvent('keydown', { key: 's', ctrlKey: true }));
    await vi.waitFor(() => expect(api.calls.some((c) => c.method === 'PUT')).toBe(true));
    const put = api.calls.find((c) => c.method === 'PUT')!;
    const body = JSON.parse(String(put.init.body)) as {
      input: StudyInput;
      options: object;
      revision: number;
    };
    expect(body.input).toEqual({ ...input, basinWidth: 12.5 });
    expect(body.options).toEqual({});
    // based on the copy it loaded (optimistic concurrency)
    expect(body.revision).toBe(1);
    await vi.waitFor(() => expect(wrapper.find('[data-test="unsaved"]').exists()).toBe(false));
    wrapper.unmount();
  });

  it('a save refused because someone else saved first keeps the changes and offers compare, reload or save over', async () => {
    const theirs = { ...design, input: { ...input, basinWidth: 14 }, revision: 2 };
    let puts = 0;
    const { wrapper, api } = await mountAs('engineer', (init) => {
      puts += 1;
      const body = JSON.parse(String(init.body)) as { revision: number; input: StudyInput };
      // the first save is based on revision 1: stale; saving over theirs is based on 2
      return body.revision === 2
        ? { status: 200, body: { ...theirs, input: body.input, revision: 3 } }
        : {
            status: 409,
            body: {
              code: 'conflict',
              message: 'Someone saved this design after you opened it.',
              current: theirs,
            },
          };
    });
    const width = wrapper.find<HTMLInputElement>('#design-basinWidth');
    await width.setValue('12.5');
    await width.trigger('blur');
    await wrapper.find('[data-test="save-design"]').trigger('click');
    await vi.waitFor(() => expect(wrapper.find('[data-test="stale-save"]').exists()).toBe(true));
    // nothing silently overwritten, nothing of ours lost
    expect(wrapper.find('[data-test="stale-save"]').text()).toContain(
      'Your changes are still here',
    );
    expect(wrapper.find<HTMLInputElement>('#design-basinWidth').element.value).toBe('12.5');
    await wrapper.find('[data-test="stale-compare"]').trigger('click');
    await vi.waitFor(() =>
      expect(document.querySelector('[data-test="stale-changes"]')).not.toBeNull(),
    );
    const rows = [...document.querySelectorAll('[data-test="stale-changes"] tr')].map((r) =>
      [...r.querySelectorAll('td')].map((td) => td.textContent?.trim()).join(' '),
    );
    expect(rows).toContain('basinWidth 14 12.5');
    // saving mine over theirs, knowingly, is based on their revision
    await wrapper.find('[data-test="stale-save-ours"]').trigger('click');
    await vi.waitFor(() => expect(puts).toBe(2));
    const last = api.calls.filter((c) => c.method === 'PUT').at(-1)!;
    expect(JSON.parse(String(last.init.body)).revision).toBe(2);
    await vi.waitFor(() => expect(wrapper.find('[data-test="stale-save"]').exists()).toBe(false));
    wrapper.unmount();
  });

  it('reloading their copy after a refused save shows their values', async () => {
    const theirs = { ...design, input: { ...input, basinWidth: 14 }, revision: 2 };
    const { wrapper } = await mountAs('engineer', () => ({
      status: 409,
      body: { code: 'conflict', message: 'Someone saved this design.', current: theirs },
    }));
    const width = wrapper.find<HTMLInputElement>('#design-basinWidth');
    await width.setValue('12.5');
    await width.trigger('blur');
    await wrapper.find('[data-test="save-design"]').trigger('click');
    await vi.waitFor(() => expect(wrapper.find('[data-test="stale-reload"]').exists()).toBe(true));
    await wrapper.find('[data-test="stale-reload"]').trigger('click');
    await vi.waitFor(() =>
      expect(wrapper.find<HTMLInputElement>('#design-basinWidth').element.value).toBe('14'),
    );
    expect(wrapper.find('[data-test="stale-save"]').exists()).toBe(false);
    wrapper.unmount();
  });

  it("puts a server 422's field message under the field", async () => {
    const { wrapper } = await mountAs('engineer', () => ({
      status: 422,
      body: {
        code: 'validation_error',
        message: 'The basin is too wide for this site.',
        details: { 'input.basinWidth': 'Basin width exceeds the site limit.' },
      },
    }));
    await wrapper.find('[data-test="save-design"]').trigger('click');
    await vi.waitFor(() => expect(wrapper.find('[data-test="design-error"]').exists()).toBe(true));
    await flushPromises();
    expect(wrapper.find('[data-test="design-error"]').text()).toContain(
      'The basin is too wide for this site.',
    );
    const item = wrapper.find('#design-basinWidth').element.closest('.ant-form-item')!;
    const fieldMessage = () => item.querySelector('.ant-form-item-explain-error')?.textContent;
    await vi.waitFor(() => expect(fieldMessage()).toBe('Basin width exceeds the site limit.'));
    // The form's own check after a pause in typing passes 12 m, yet the server's message stays.
    await new Promise((resolve) => setTimeout(resolve, STUDY_DEBOUNCE_MS * 2));
    await flushPromises();
    expect(fieldMessage()).toBe('Basin width exceeds the site limit.');
    // A new value on that field is the engineer's answer to it: the message goes.
    const width = wrapper.find<HTMLInputElement>('#design-basinWidth');
    await width.setValue('11');
    await width.trigger('blur');
    await vi.waitFor(() => expect(fieldMessage() ?? '').toBe(''), { timeout: 3000 });
    wrapper.unmount();
  });

  // Issue 13: a value out of range used to be pulled back to the input's bound without a word
  // (a loss fraction of 1.5 became 0.95, a width of −20 became 0). It now stays as typed, the
  // shared schema's message stands under it, and the live study waits for a valid value.
  it.each([
    [
      'site',
      '#design-basinWidth',
      'Basin width (m)',
      '-20',
      'The basin width must be greater than zero.',
    ],
    [
      'inflow',
      '#design-inflow-lossModel-value',
      'Loss as a fraction of the head',
      '1.5',
      'The loss fraction must be below 0.95.',
    ],
    [
      'inflow',
      '#design-inflow-lossModel-value',
      'Loss as a fraction of the head',
      '-0.1',
      'The loss fraction must not be negative.',
    ],
  ])(
    'on the %s step, %s = %s stays as typed, is explained and pauses the study',
    async (step, id, label, typed, said) => {
      const { wrapper } = await mountAs('engineer', undefined, step);
      const floor = wrapper.find('[data-test="summary-floor"]').text();
      const box = wrapper.find<HTMLInputElement>(id);
      await box.setValue(typed);
      await box.trigger('blur');
      await vi.waitFor(() => expect(helpFor(wrapper, label)).toBe(said));
      expect(Number(box.element.value)).toBe(Number(typed)); // shown to the field's step, unchanged
      await vi.waitFor(() =>
        expect(wrapper.find('[data-test="input-problems"]').text()).toMatch(
          /Results are paused: waiting for a valid value in every input \(1 to fix\)/,
        ),
      );
      // No study ran on the invalid value: the figures shown are the last valid input's, said so.
      expect(wrapper.find('[data-test="stale-note"]').text()).toMatch(/last valid input/);
      expect(wrapper.find('[data-test="summary-floor"]').text()).toBe(floor);
      expect(wrapper.find('[data-test="engine-error"]').exists()).toBe(false);
      wrapper.unmount();
    },
  );
});

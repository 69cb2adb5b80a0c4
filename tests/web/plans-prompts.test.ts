// Where a plan limit bites, the page says so and names the plan that lifts it (issue 10): the
// project list at the Concept cap (3 projects, product brief's plan table), the Team page with
// more members than seats, a project read only after a downgrade, and the Firm brand page.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { createMemoryHistory } from 'vue-router';
import ProjectListView from '../../web/src/views/ProjectListView.vue';
import TeamView from '../../web/src/views/TeamView.vue';
import BrandView from '../../web/src/views/BrandView.vue';
import { createAppRouter } from '../../web/src/router';
import { TOKEN_KEY } from '../../web/src/stores/auth';
import { demoFirm, demoUser, stubApi, type Routes } from './fetch-stub';

const conceptFirm = { ...demoFirm, plan: 'concept' as const, seats: 1 };

function project(id: string, readOnly: { reason: string; message: string } | null = null) {
  return {
    id,
    name: `Project ${id}`,
    client: null,
    location: null,
    units: 'SI',
    status: 'draft',
    notes: '',
    createdBy: null,
    createdAt: '2026-01-01T00:00:00.000Z',
    updatedAt: '2026-01-01T00:00:00.000Z',
    readOnly,
  };
}

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

async function mountView(
  component: Parameters<typeof mount>[0],
  path: string,
  routes: Routes,
  role: 'owner' | 'admin' | 'engineer' = 'owner',
) {
  localStorage.setItem(TOKEN_KEY, `tok-${role}`);
  setActivePinia(createPinia());
  const api = stubApi({
    'GET /auth/me': { status: 200, body: { user: demoUser(role), firm: conceptFirm } },
    ...routes,
  });
  const router = createAppRouter(createMemoryHistory());
  await router.push(path);
  const wrapper = mount(component, { global: { plugins: [router] }, attachTo: document.body });
  await flushPromises();
  return { wrapper, api };
}

describe('the project list on Concept', () => {
  it('at 3 projects: "New project" is off and the prompt names Professional', async () => {
    const items = [project('a'), project('b'), project('c')];
    const { wrapper } = await mountView(ProjectListView, '/projects', {
      'GET /projects': { status: 200, body: { items, total: 3, page: 1, pageSize: 20 } },
    });
    await vi.waitFor(() =>
      expect(wrapper.find('[data-test="upgrade-prompt"]').exists()).toBe(true),
    );
    const prompt = wrapper.find('[data-test="upgrade-prompt"]').text();
    expect(prompt).toContain('Professional');
    expect(prompt).toContain('up to 3 projects');
    expect(wrapper.find('[data-test="new-project"]').attributes('disabled')).toBeDefined();
    wrapper.unmount();
  });

  it('below the cap: no prompt; a project over the cap after a downgrade is tagged read only', async () => {
    const items = [project('a'), project('b', { reason: 'project_over_limit', message: 'Why' })];
    const { wrapper } = await mountView(ProjectListView, '/projects', {
      'GET /projects': { status: 200, body: { items, total: 2, page: 1, pageSize: 20 } },
    });
    await vi.waitFor(() => expect(wrapper.findAll('[data-test="row-read-only"]')).toHaveLength(1));
    expect(wrapper.find('[data-test="upgrade-prompt"]').exists()).toBe(false);
    expect(wrapper.find('[data-test="new-project"]').attributes('disabled')).toBeUndefined();
    wrapper.unmount();
  });
});

describe('the Team page with more members than seats', () => {
  it('says existing members keep their access and invitations wait for seats', async () => {
    const members = [demoUser('owner'), demoUser('admin'), demoUser('engineer')];
    const { wrapper } = await mountView(TeamView, '/team', {
      'GET /members': { status: 200, body: { items: members } },
      'GET /members/invitations': { status: 200, body: { items: [] } },
    });
    await vi.waitFor(() =>
      expect(wrapper.find('[data-test="upgrade-prompt"]').exists()).toBe(true),
    );
    const prompt = wrapper.find('[data-test="upgrade-prompt"]').text();
    expect(prompt).toContain('single seat');
    expect(prompt).toContain('keeps their access');
    expect(prompt).toContain('Professional');
    expect(wrapper.find('[data-test="seats"]').text()).toContain('3 / 1');
    wrapper.unmount();
  });
});

describe('the Firm brand page', () => {
  const brand = {
    firmName: 'Harrow & Lune Engineering',
    plan: 'concept',
    onProposals: false,
    // WCAG 2.x: white on #767676 has a contrast of 4.54:1 (widely published figure).
    color: '#767676',
    footer: 'Harrowdale office',
    sealStatement: null,
    logo: null,
  };

  it('on Concept: the preview is unbranded with the watermark, the prompt names Professional, the contrast is shown', async () => {
    const { wrapper } = await mountView(BrandView, '/firm/brand', {
      'GET /firm/brand': { status: 200, body: brand },
    });
    await vi.waitFor(() => expect(wrapper.find('[data-test="brand-preview"]').exists()).toBe(true));
    expect(wrapper.find('[data-test="preview-watermark"]').text()).toBe('Concept plan');
    expect(wrapper.find('[data-test="preview-head"]').exists()).toBe(false);
    expect(wrapper.find('[data-test="upgrade-prompt"]').text()).toContain('Professional');
    expect(wrapper.text()).toContain('contrast 4.54:1');
    expect(wrapper.find('[data-test="brand-preview"]').text()).toContain('Harrowdale office');
    wrapper.unmount();
  });

  it('on Professional: the preview head carries the brand colour; a refused logo shows the server’s reason', async () => {
    const { wrapper, api } = await mountView(BrandView, '/firm/brand', {
      'GET /firm/brand': {
        status: 200,
        body: { ...brand, plan: 'professional', onProposals: true },
      },
      'PUT /firm/brand/logo': {
        status: 415,
        body: { code: 'unsupported_media_type', message: 'The logo must be a PNG or JPEG image.' },
      },
    });
    await vi.waitFor(() => expect(wrapper.find('[data-test="preview-head"]').exists()).toBe(true));
    expect(wrapper.find('[data-test="preview-head"]').attributes('style')).toContain(
      'rgb(118, 118, 118)',
    );
    expect(wrapper.find('[data-test="upgrade-prompt"]').exists()).toBe(false);
    const input = wrapper.find('[data-test="logo-file"]');
    const file = new File(['<svg/>'], 'logo.svg', { type: 'image/svg+xml' });
    Object.defineProperty(input.element, 'files', { value: [file], configurable: true });
    await input.trigger('change');
    await vi.waitFor(() => expect(wrapper.find('[data-test="logo-error"]').exists()).toBe(true));
    expect(wrapper.find('[data-test="logo-error"]').text()).toContain('PNG or JPEG');
    const sent = api.calls.find((c) => c.method === 'PUT' && c.path === '/firm/brand/logo');
    expect(sent?.init.body).toBeInstanceOf(FormData);
    wrapper.unmount();
  });
});

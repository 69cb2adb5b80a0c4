import { afterEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { createMemoryHistory } from 'vue-router';
import ProjectListView from '../../web/src/views/ProjectListView.vue';
import { createAppRouter } from '../../web/src/router';
import { TOKEN_KEY } from '../../web/src/stores/auth';
import { demoFirm, demoUser, stubApi } from './fetch-stub';

type Role = 'owner' | 'admin' | 'engineer' | 'estimator' | 'viewer';

const fenwick = {
  id: 'p-fenwick',
  name: 'Fenwick Mill Pond — auxiliary spillway outlet',
  client: 'Fenwick Estates',
  location: null,
  units: 'SI',
  status: 'in review',
  notes: '',
  createdBy: { id: 'u-engineer', name: 'Demo engineer' },
  createdAt: '2025-01-02T00:00:00.000Z',
  updatedAt: '2025-01-03T00:00:00.000Z',
  designStatus: 'approved',
  latestVersion: {
    id: 'v-1',
    number: 1,
    reviewState: 'approved',
    issuedAt: '2025-01-03T00:00:00.000Z',
  },
};

afterEach(() => {
  vi.unstubAllGlobals();
});

async function mountAs(role: Role, items: unknown[], path = '/projects') {
  localStorage.setItem(TOKEN_KEY, `tok-${role}`);
  setActivePinia(createPinia());
  const api = stubApi({
    'GET /auth/me': { status: 200, body: { user: demoUser(role), firm: demoFirm } },
    'GET /projects': { status: 200, body: { items, total: items.length, page: 1, pageSize: 20 } },
  });
  const router = createAppRouter(createMemoryHistory());
  await router.push(path);
  const wrapper = mount(ProjectListView, {
    global: { plugins: [router] },
    attachTo: document.body,
  });
  await flushPromises();
  await vi.waitFor(() => expect(api.calls.some((c) => c.path === '/projects')).toBe(true));
  await flushPromises();
  return { wrapper, api, router };
}

describe('ProjectListView', () => {
  it.each(['owner', 'admin', 'engineer'] as const)('offers "New project" to a %s', async (role) => {
    const { wrapper } = await mountAs(role, []);
    expect(wrapper.find('[data-test="new-project"]').exists()).toBe(true);
    expect(wrapper.find('[data-test="empty-first-run"]').text()).toContain(
      'Create your first project',
    );
    wrapper.unmount();
  });

  it.each(['estimator', 'viewer'] as const)('hides "New project" from a %s', async (role) => {
    const { wrapper } = await mountAs(role, []);
    expect(wrapper.find('[data-test="new-project"]').exists()).toBe(false);
    const empty = wrapper.find('[data-test="empty-first-run"]');
    expect(empty.text()).toContain('No projects yet');
    expect(empty.text()).not.toContain('Create your first project');
    wrapper.unmount();
  });

  it('lists projects with a link, status tag and units', async () => {
    const { wrapper } = await mountAs('viewer', [fenwick]);
    const row = wrapper.find('tr[data-row-key="p-fenwick"]');
    expect(row.exists()).toBe(true);
    expect(row.find('a').text()).toBe(fenwick.name);
    expect(row.find('a').attributes('href')).toBe('/projects/p-fenwick');
    expect(row.text()).toContain('In review');
    expect(row.text()).toContain('SI');
    expect(row.text()).toContain('Fenwick Estates');
    // the design's review status, from its latest issued version
    expect(row.find('[data-test="design-status-p-fenwick"]').text()).toBe('Approved');
    expect(row.text()).toContain('v1');
    wrapper.unmount();
  });

  it('passes the search, sort and page from the address to the API', async () => {
    const { wrapper, api } = await mountAs(
      'viewer',
      [fenwick],
      '/projects?search=mill&sort=name&order=asc&page=2',
    );
    const call = api.fetchMock.mock.calls.find((c) => String(c[0]).startsWith('/api/v1/projects'));
    const url = new URL(String(call![0]), 'http://localhost');
    expect(url.searchParams.get('search')).toBe('mill');
    expect(url.searchParams.get('sort')).toBe('name');
    expect(url.searchParams.get('order')).toBe('asc');
    expect(url.searchParams.get('page')).toBe('2');
    wrapper.unmount();
  });
});

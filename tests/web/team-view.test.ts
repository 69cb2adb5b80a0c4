import { afterEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { createMemoryHistory } from 'vue-router';
import TeamView from '../../web/src/views/TeamView.vue';
import { createAppRouter } from '../../web/src/router';
import { TOKEN_KEY } from '../../web/src/stores/auth';
import { demoFirm, demoUser, stubApi } from './fetch-stub';

const members = [demoUser('owner'), demoUser('admin'), demoUser('engineer')];
const invitation = {
  id: 'inv-1',
  email: 'new.hire@harrow-lune.example',
  role: 'estimator',
  expiresAt: '2025-02-01T00:00:00.000Z',
  invitedBy: { id: 'u-owner', name: 'Demo owner' },
  createdAt: '2025-01-25T00:00:00.000Z',
};

afterEach(() => {
  vi.unstubAllGlobals();
});

async function mountAs(role: 'owner' | 'admin') {
  localStorage.setItem(TOKEN_KEY, `tok-${role}`);
  setActivePinia(createPinia());
  const api = stubApi({
    'GET /auth/me': { status: 200, body: { user: demoUser(role), firm: demoFirm } },
    'GET /members': { status: 200, body: { items: members } },
    'GET /members/invitations': { status: 200, body: { items: [invitation] } },
    'DELETE /members/invitations/inv-1': { status: 204 },
  });
  const router = createAppRouter(createMemoryHistory());
  await router.push('/team');
  const wrapper = mount(TeamView, { global: { plugins: [router] }, attachTo: document.body });
  await vi.waitFor(() => expect(wrapper.find('tr[data-row-key="u-owner"]').exists()).toBe(true));
  await flushPromises();
  return { wrapper, api };
}

const row = (wrapper: Awaited<ReturnType<typeof mountAs>>['wrapper'], id: string) =>
  wrapper.find(`[data-test="member-table"] tr[data-row-key="${id}"]`);

describe('TeamView', () => {
  it('lets an admin change engineers but not the owner or themself', async () => {
    const { wrapper } = await mountAs('admin');
    expect(row(wrapper, 'u-owner').find('.ant-select').exists()).toBe(false);
    expect(row(wrapper, 'u-owner').text()).toContain('Owner');
    expect(row(wrapper, 'u-owner').find('button').exists()).toBe(false);
    expect(row(wrapper, 'u-admin').find('.ant-select').exists()).toBe(false);
    expect(row(wrapper, 'u-admin').text()).toContain('You');
    expect(row(wrapper, 'u-engineer').find('.ant-select').exists()).toBe(true);
    const engineerButtons = row(wrapper, 'u-engineer')
      .findAll('button')
      .map((b) => b.text());
    expect(engineerButtons).toContain('Switch off');
    // an engineer may review: the admin can mark them as licensed reviewer
    expect(engineerButtons).toContain('Mark as reviewer');
    wrapper.unmount();
  });

  it('lets the owner change an admin', async () => {
    const { wrapper } = await mountAs('owner');
    expect(row(wrapper, 'u-admin').find('.ant-select').exists()).toBe(true);
    expect(row(wrapper, 'u-owner').find('.ant-select').exists()).toBe(false);
    wrapper.unmount();
  });

  it('counts active members and pending invitations against the seats', async () => {
    const { wrapper } = await mountAs('owner');
    expect(wrapper.find('[data-test="seats"]').text()).toContain(`4 / ${demoFirm.seats}`);
    wrapper.unmount();
  });

  it('withdraws an invitation after confirmation', async () => {
    const { wrapper, api } = await mountAs('owner');
    const invRow = wrapper.find('[data-test="invitation-table"] tr[data-row-key="inv-1"]');
    expect(invRow.text()).toContain('new.hire@harrow-lune.example');
    await invRow.find('button').trigger('click');
    // The confirmation opens in a popover attached to the document body.
    const confirm = await vi.waitFor(() => {
      const button = Array.from(
        document.querySelectorAll<HTMLButtonElement>('.ant-popover button'),
      ).find((b) => b.textContent?.trim() === 'Withdraw');
      if (!button) throw new Error('confirmation not open yet');
      return button;
    });
    expect(api.calls.some((c) => c.method === 'DELETE')).toBe(false);
    confirm.click();
    await vi.waitFor(() =>
      expect(
        api.calls.some((c) => c.method === 'DELETE' && c.path === '/members/invitations/inv-1'),
      ).toBe(true),
    );
    await flushPromises();
    expect(wrapper.find('[data-test="invitation-table"] tr[data-row-key="inv-1"]').exists()).toBe(
      false,
    );
    wrapper.unmount();
  });
});

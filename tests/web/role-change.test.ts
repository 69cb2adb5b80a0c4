// A role change on the Team page asks first and names what the member gains or loses, read from
// the action × role table (common/src/policy.ts); nothing is sent until it is confirmed.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { createMemoryHistory } from 'vue-router';
import { Select } from 'ant-design-vue';
import { ACTIONS, POLICY, type Role } from '@basinwright/common';
import TeamView from '../../web/src/views/TeamView.vue';
import { createAppRouter } from '../../web/src/router';
import { TOKEN_KEY } from '../../web/src/stores/auth';
import { ABILITIES, roleChangeEffects } from '../../web/src/roleChange';
import { demoFirm, demoUser, stubApi } from './fetch-stub';

const ALL_ROLES: Role[] = ['owner', 'admin', 'engineer', 'estimator', 'viewer'];

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

async function mountAsOwner() {
  localStorage.setItem(TOKEN_KEY, 'tok-owner');
  setActivePinia(createPinia());
  const members = [demoUser('owner'), demoUser('engineer')];
  const api = stubApi({
    'GET /auth/me': { status: 200, body: { user: demoUser('owner'), firm: demoFirm } },
    'GET /members': { status: 200, body: { items: members } },
    'GET /members/invitations': { status: 200, body: { items: [] } },
    'PATCH /members/u-engineer': (init) => ({
      status: 200,
      body: { ...demoUser('engineer'), ...(JSON.parse(String(init.body)) as object) },
    }),
  });
  const router = createAppRouter(createMemoryHistory());
  await router.push('/team');
  const wrapper = mount(TeamView, { global: { plugins: [router] }, attachTo: document.body });
  await vi.waitFor(() =>
    expect(wrapper.find('tr[data-row-key="u-engineer"] .ant-select').exists()).toBe(true),
  );
  await flushPromises();
  const select = () => wrapper.find('tr[data-row-key="u-engineer"]').findComponent(Select);
  const patches = () => api.calls.filter((c) => c.method === 'PATCH');
  return { wrapper, select, patches };
}

const dialog = () =>
  vi.waitFor(() => {
    const d = document.querySelector<HTMLElement>('.ant-modal');
    if (!d || (d.offsetParent === null && d.style.display === 'none'))
      throw new Error('no confirmation open');
    return d;
  });
const buttonIn = (root: HTMLElement, text: string) =>
  Array.from(root.querySelectorAll('button')).find((b) => b.textContent?.trim() === text)!;

describe('Team page: a role change asks for confirmation', () => {
  it('names what an engineer loses as viewer and sends nothing until confirmed', async () => {
    const { wrapper, select, patches } = await mountAsOwner();
    select().vm.$emit('change', 'viewer');
    const d = await dialog();
    expect(d.textContent).toContain('Make Demo engineer viewer?');
    // policy.ts: projects.create/update/delete and designs.write are owner, admin, engineer.
    const losses = Array.from(d.querySelectorAll('[data-test="role-losses"] li')).map(
      (li) => li.textContent,
    );
    expect(losses).toContain('create, edit and delete projects');
    expect(losses).toContain('edit designs');
    expect(losses).toContain('start, change and issue estimates');
    expect(d.querySelector('[data-test="role-gains"]')).toBeNull();
    expect(patches()).toEqual([]);
    // the select still shows the member's current role
    expect(wrapper.find('tr[data-row-key="u-engineer"]').text()).toContain('Engineer');

    buttonIn(d, 'Change role').click();
    await vi.waitFor(() => expect(patches()).toHaveLength(1));
    expect(patches()[0]!.path).toBe('/members/u-engineer');
    expect(JSON.parse(String(patches()[0]!.init.body))).toEqual({ role: 'viewer' });
    wrapper.unmount();
  });

  it('names what an engineer gains as admin; keeping the role sends nothing', async () => {
    const { wrapper, select, patches } = await mountAsOwner();
    select().vm.$emit('change', 'admin');
    const d = await dialog();
    const gains = Array.from(d.querySelectorAll('[data-test="role-gains"] li')).map(
      (li) => li.textContent,
    );
    // policy.ts: members.*, invitations.*, brand.*, billing.read and reviewers.* are owner and admin.
    expect(gains).toEqual(
      expect.arrayContaining([
        'see and manage the team (roles, access, invitations)',
        'mark members as licensed reviewers',
        "see and change the firm's brand",
        'see billing',
      ]),
    );
    // paying and changing the plan stay the owner's (billing.checkout … are owner only)
    expect(gains).not.toContain('pay for the plan and change its seats, plan and payment details');
    expect(d.querySelector('[data-test="role-losses"]')).toBeNull();
    buttonIn(d, 'Keep the role').click();
    await flushPromises();
    expect(patches()).toEqual([]);
    wrapper.unmount();
  });
});

describe('the abilities named in a role change cover the policy table', () => {
  const rolesOf = (action: (typeof ACTIONS)[number]) => [...POLICY[action]].sort().join(',');

  it('every action not open to every role is in exactly one ability', () => {
    for (const action of ACTIONS) {
      const inAbilities = ABILITIES.filter((a) => a.actions.includes(action)).length;
      const openToAll = POLICY[action].length === ALL_ROLES.length;
      expect(inAbilities, action).toBe(openToAll ? 0 : 1);
    }
  });

  it("an ability's actions are allowed to the same roles", () => {
    for (const ability of ABILITIES) {
      const sets = new Set(ability.actions.map(rolesOf));
      expect(sets.size, ability.label).toBe(1);
    }
  });

  it('the same role gains and loses nothing; a change and its reverse swap gains and losses', () => {
    for (const from of ALL_ROLES) {
      expect(roleChangeEffects(from, from)).toEqual({ gains: [], losses: [] });
      for (const to of ALL_ROLES) {
        const there = roleChangeEffects(from, to);
        const back = roleChangeEffects(to, from);
        expect(there.gains).toEqual(back.losses);
      }
    }
  });
});

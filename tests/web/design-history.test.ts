// The history panel of the design workspace: issuing the saved draft with a note, the review
// steps a member may take (a marked reviewer approves others' versions, never their own), and
// the comparison of two versions.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import type { VersionFigures } from '@basinwright/common';
import DesignHistoryPanel from '../../web/src/components/DesignHistoryPanel.vue';
import { useAuthStore } from '../../web/src/stores/auth';
import { demoFirm, demoUser, stubApi } from './fetch-stub';
import { fenwickDesign } from '../../seed/designs';

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

// Figures as the API sends them (SI); invented for the panel, not engine output.
const figures = (length: number): VersionFigures => ({
  floorElevation: 85.5,
  type: 'usbr-2',
  typeName: 'USBR Type II basin',
  length,
  concrete: 410,
  cost: null,
  costStatus: 'not_priced',
});

function version(number: number, issuedBy: string, reviewState: string, length: number) {
  return {
    id: `v${number}`,
    projectId: 'p1',
    number,
    designRevision: number,
    engineVersion: '2.2.0',
    figures: figures(length),
    note: `note ${number}`,
    issuedBy: { id: issuedBy, name: `Demo ${issuedBy}` },
    issuedAt: '2026-12-01T10:00:00.000Z',
    reviewState,
    sentBy: reviewState === 'in_review' ? { id: issuedBy } : null,
    sentAt: null,
    review: null,
    superseded: false,
    supersededBy: null,
  };
}

async function mountAs(role: 'owner' | 'engineer', list: object, extra = {}) {
  setActivePinia(createPinia());
  const api = stubApi({ 'GET /projects/p1/versions': { status: 200, body: list }, ...extra });
  const auth = useAuthStore();
  auth.user = demoUser(role);
  auth.firm = demoFirm;
  const wrapper = mount(DesignHistoryPanel, {
    props: { projectId: 'p1', revision: 3, dirty: false, units: 'SI' },
    attachTo: document.body,
  });
  await vi.waitFor(() => expect(wrapper.find('[data-test="version-table"]').exists()).toBe(true));
  await flushPromises();
  return { wrapper, api };
}

describe('DesignHistoryPanel', () => {
  it('lists versions with their figures, "Not priced" for a cost not yet estimated, and issues the saved draft with a note', async () => {
    const v1 = version(1, 'u-engineer', 'not_sent', 20.5);
    const { wrapper, api } = await mountAs(
      'engineer',
      { items: [v1], status: 'draft', reviewer: false },
      { 'POST /projects/p1/versions': { status: 201, body: { ...v1, number: 2, id: 'v2' } } },
    );
    const text = wrapper.find('[data-test="version-table"]').text();
    expect(text).toContain('Version 1');
    expect(text).toContain('20.50');
    expect(text).toContain('Not priced');
    expect(wrapper.find('[data-test="send-1"]').exists()).toBe(true);
    await wrapper.find('[data-test="issue-note"]').setValue('For the client');
    await wrapper.find('[data-test="issue-version"]').trigger('click');
    await vi.waitFor(() => expect(api.calls.some((c) => c.method === 'POST')).toBe(true));
    const post = api.calls.find((c) => c.method === 'POST')!;
    expect(JSON.parse(String(post.init.body))).toEqual({ revision: 3, note: 'For the client' });
    wrapper.unmount();
  });

  it('a priced version shows its estimate total in whole currency units', async () => {
    const v1 = version(1, 'u-engineer', 'not_sent', 20.5);
    // an invented total for the panel (the API's join is tested in tests/api/versions.test.ts)
    const priced = { ...v1, figures: { ...v1.figures, cost: 479338.42, costStatus: 'priced' } };
    const { wrapper } = await mountAs('engineer', {
      items: [priced],
      status: 'draft',
      reviewer: false,
    });
    const text = wrapper.find('[data-test="version-table"]').text();
    expect(text).toContain('479,338');
    expect(text).not.toContain('Not priced');
    wrapper.unmount();
  });

  it('with unsaved changes, issuing waits for a save', async () => {
    setActivePinia(createPinia());
    stubApi({
      'GET /projects/p1/versions': {
        status: 200,
        body: { items: [], status: 'draft', reviewer: false },
      },
    });
    const auth = useAuthStore();
    auth.user = demoUser('engineer');
    auth.firm = demoFirm;
    const wrapper = mount(DesignHistoryPanel, {
      props: { projectId: 'p1', revision: 3, dirty: true, units: 'SI' },
    });
    await flushPromises();
    expect(wrapper.find('[data-test="issue-version"]').attributes('disabled')).toBeDefined();
    expect(wrapper.find('[data-test="issue-blocked"]').text()).toMatch(/Save your changes first/);
    wrapper.unmount();
  });

  it("a marked reviewer approves another member's version in review, and is offered nothing on their own", async () => {
    const theirs = version(2, 'u-engineer', 'in_review', 21);
    const mine = version(1, 'u-owner', 'in_review', 20.5);
    const { wrapper, api } = await mountAs(
      'owner',
      { items: [theirs, mine], status: 'in_review', reviewer: true },
      {
        'POST /projects/p1/versions/v2/approve': {
          status: 200,
          body: { ...theirs, reviewState: 'approved' },
        },
      },
    );
    expect(wrapper.find('[data-test="approve-2"]').exists()).toBe(true);
    expect(wrapper.find('[data-test="approve-1"]').exists()).toBe(false);
    await wrapper.find('[data-test="approve-2"]').trigger('click');
    // The dialog's code (antd's Modal) loads when a dialog is first opened.
    await vi.waitFor(
      () => expect(document.querySelector('.ant-modal .ant-btn-primary')).not.toBeNull(),
      { timeout: 15_000 },
    );
    (document.querySelector('.ant-modal .ant-btn-primary') as HTMLButtonElement).click();
    await vi.waitFor(() =>
      expect(api.calls.some((c) => c.path === '/projects/p1/versions/v2/approve')).toBe(true),
    );
    wrapper.unmount();
  });

  it('a member who is not a marked reviewer is offered no approval', async () => {
    const theirs = version(2, 'u-owner', 'in_review', 21);
    const { wrapper } = await mountAs('engineer', {
      items: [theirs],
      status: 'in_review',
      reviewer: false,
    });
    expect(wrapper.find('[data-test="approve-2"]').exists()).toBe(false);
    expect(wrapper.find('[data-test="return-2"]').exists()).toBe(false);
    wrapper.unmount();
  });

  it('compares two versions: the inputs and the figures that changed', async () => {
    const v1 = version(1, 'u-engineer', 'not_sent', 20.5);
    const v2 = version(2, 'u-engineer', 'not_sent', 22);
    const full = (v: typeof v1, width: number) => ({
      ...v,
      input: { ...fenwickDesign, basinWidth: width },
      options: null,
      result: {},
      computedAt: v.issuedAt,
    });
    const { wrapper } = await mountAs(
      'engineer',
      { items: [v2, v1], status: 'draft', reviewer: false },
      {
        'GET /projects/p1/versions/v1': { status: 200, body: full(v1, 12) },
        'GET /projects/p1/versions/v2': { status: 200, body: full(v2, 13) },
      },
    );
    const boxes = wrapper.findAll('[data-test="version-table"] tbody input[type="checkbox"]');
    expect(boxes).toHaveLength(2);
    await boxes[0]!.setValue(true);
    await boxes[1]!.setValue(true);
    await wrapper.find('[data-test="compare-versions"]').trigger('click');
    await vi.waitFor(
      () => expect(document.querySelector('[data-test="inputs-changed"]')).not.toBeNull(),
      { timeout: 15_000 },
    );
    const rows = (sel: string) =>
      [...document.querySelectorAll(`[data-test="${sel}"] tr`)].map((r) =>
        [...r.querySelectorAll('td')].map((td) => td.textContent?.trim()).join(' | '),
      );
    expect(rows('inputs-changed')).toContain('basinWidth | 12 | 13');
    expect(rows('figures-changed')).toContain('Length | 20.50 m | 22.00 m');
    wrapper.unmount();
  });
});

// The Proposal step: the preview of the issued version's figures and the proposal's sections,
// making a proposal and following it as the job reports (queued → ready), the download and
// sending to the client; a member who may only read sees neither button; with no issued
// version, the step says to issue one first.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { PROPOSAL_SECTIONS, figuresOf, runStudy } from '@basinwright/common';
import DesignProposalStep from '../../web/src/components/DesignProposalStep.vue';
import { useAuthStore } from '../../web/src/stores/auth';
import { fenwickDesign } from '../../seed/designs';
import { demoFirm, demoUser, stubApi, type Reply } from './fetch-stub';

afterEach(() => vi.unstubAllGlobals());

const figures = figuresOf(runStudy(fenwickDesign));
const version = {
  id: 'v1',
  projectId: 'p1',
  number: 1,
  designRevision: 1,
  engineVersion: 'x',
  figures,
  note: '',
  issuedBy: { id: 'u-engineer', name: 'Demo engineer' },
  issuedAt: '2025-01-02T00:00:00.000Z',
  reviewState: 'approved',
  sentBy: null,
  sentAt: null,
  review: {
    by: { id: 'u-owner', name: 'Demo owner' },
    at: '2025-01-03T00:00:00.000Z',
    licenceNumber: 'PE-1',
    jurisdiction: 'Harrowdale',
    statement: 'Reviewed.',
    comments: null,
  },
  superseded: false,
  supersededBy: null,
};
const proposal = (status: string, extra: object = {}) => ({
  id: 'pr1',
  projectId: 'p1',
  versionId: 'v1',
  status,
  error: null,
  pages: status === 'done' ? 10 : null,
  byteSize: null,
  createdAt: '2025-01-04T00:00:00.000Z',
  renderedAt: status === 'done' ? '2025-01-04T00:00:05.000Z' : null,
  download: status === 'done' ? '/projects/p1/proposals/pr1/pdf' : null,
  sent: [],
  ...extra,
});

function mountAs(
  role: 'engineer' | 'viewer',
  routes: Record<string, Reply | ((init: RequestInit) => Reply)>,
  versions = [version],
) {
  setActivePinia(createPinia());
  const auth = useAuthStore();
  auth.user = demoUser(role);
  auth.firm = { ...demoFirm, plan: 'concept' };
  const api = stubApi({
    'GET /projects/p1/versions': {
      status: 200,
      body: { items: versions, status: 'approved', reviewer: false },
    },
    ...routes,
  });
  const w = mount(DesignProposalStep, {
    props: { projectId: 'p1', client: 'Fenwick Mill Pond Trust', units: 'SI' },
  });
  return { w, api };
}

describe('the Proposal step', () => {
  it('previews the version, makes the proposal and follows it until it is ready', async () => {
    let answered = 0;
    const { w, api } = mountAs('engineer', {
      // the first list is empty; after the request it is queued once, then ready
      'GET /projects/p1/proposals': () => {
        const calls = api.calls.filter((c) => c.method === 'POST').length;
        if (calls === 0) return { status: 200, body: { items: [] } };
        answered += 1;
        return {
          status: 200,
          body: { items: [proposal(answered === 1 ? 'queued' : 'done')] },
        };
      },
      'POST /projects/p1/proposals': { status: 202, body: proposal('queued') },
    });
    await vi.waitFor(() => expect(w.find('[data-test="proposal-preview"]').exists()).toBe(true));
    const preview = w.find('[data-test="proposal-preview"]').text();
    expect(preview).toContain(figures.typeName!);
    expect(preview).toContain(`${figures.floorElevation!.toFixed(2)} m`);
    expect(preview).toContain('Approved by Demo owner');
    for (const s of PROPOSAL_SECTIONS) expect(preview).toContain(s);
    expect(w.find('[data-test="proposal-watermark-note"]').exists()).toBe(true);

    await w.find('[data-test="proposal-generate"]').trigger('click');
    await flushPromises();
    const post = api.calls.find((c) => c.method === 'POST');
    expect(JSON.parse(String(post?.init.body))).toEqual({ versionId: 'v1' });
    // the step asks again while the proposal is queued, until it is ready
    await vi.waitFor(() => expect(w.find('[data-test="proposal-status"]').text()).toBe('Ready'), {
      timeout: 20_000,
    });
    expect(w.find('[data-test="proposal-download"]').exists()).toBe(true);
    expect(w.find('[data-test="proposal-send"]').exists()).toBe(true);
  });

  it('sends the ready proposal to the address typed, and lists it', async () => {
    let sent = false;
    const { w, api } = mountAs('engineer', {
      'GET /projects/p1/proposals': () => ({
        status: 200,
        body: {
          items: [
            proposal(
              'done',
              sent
                ? {
                    sent: [
                      {
                        to: 'client@x.example',
                        by: 'Demo engineer',
                        at: '2025-01-05T00:00:00.000Z',
                      },
                    ],
                  }
                : {},
            ),
          ],
        },
      }),
      'POST /projects/p1/proposals/pr1/send': () => {
        sent = true;
        return { status: 200, body: proposal('done') };
      },
    });
    await vi.waitFor(() => expect(w.find('[data-test="proposal-send-to"]').exists()).toBe(true));
    await w.find('[data-test="proposal-send-to"]').setValue('client@x.example');
    await w.find('[data-test="proposal-send"] form').trigger('submit');
    await flushPromises();
    const call = api.calls.find((c) => c.path === '/projects/p1/proposals/pr1/send');
    expect(JSON.parse(String(call?.init.body))).toEqual({ to: 'client@x.example', message: '' });
    await vi.waitFor(() =>
      expect(w.find('[data-test="proposal-sent"]').text()).toContain('client@x.example'),
    );
  });

  it('a viewer sees the proposal but cannot make or send one', async () => {
    const { w } = mountAs('viewer', {
      'GET /projects/p1/proposals': { status: 200, body: { items: [proposal('done')] } },
    });
    await vi.waitFor(() => expect(w.find('[data-test="proposal-download"]').exists()).toBe(true));
    expect(w.find('[data-test="proposal-generate"]').exists()).toBe(false);
    expect(w.find('[data-test="proposal-send"]').exists()).toBe(false);
  });

  it('without an issued version, says to issue one first', async () => {
    const { w } = mountAs(
      'engineer',
      { 'GET /projects/p1/proposals': { status: 200, body: { items: [] } } },
      [],
    );
    await vi.waitFor(() =>
      expect(w.find('[data-test="proposal-needs-version"]').exists()).toBe(true),
    );
    expect(w.find('[data-test="proposal-generate"]').exists()).toBe(false);
  });
});

import { describe, expect, it } from 'vitest';
import { compareVersions } from '@basinwright/common';
import { fenwickDesign } from '../../seed/designs';
import { addMember, apiForFile, bearer, setPlan, signUpFirm } from '../support/api-app';
import { expectRel } from '../support/tolerance';

// Issued versions, draft concurrency, review and sign-off, the audit trail (issue 11).

let firmId = '';
let owner = { id: '', token: '' };
let engineer = { id: '', token: '' };
let otherEngineer = { id: '', token: '' };
let viewer = { id: '', token: '' };

const h = apiForFile(async () => {
  const firm = await signUpFirm(h, 'versions');
  firmId = firm.firm.id;
  owner = { id: firm.user.id, token: firm.token };
  await setPlan(h, firmId, 'firm', 20);
  engineer = await addMember(h, firmId, 'engineer');
  otherEngineer = await addMember(h, firmId, 'engineer');
  viewer = await addMember(h, firmId, 'viewer');
});

const api = (t: string) => ({
  get: (url: string) => h.http().get(`/api/v1${url}`).set(bearer(t)),
  post: (url: string, body: object = {}) =>
    h.http().post(`/api/v1${url}`).set(bearer(t)).send(body),
  put: (url: string, body: object = {}) => h.http().put(`/api/v1${url}`).set(bearer(t)).send(body),
  delete: (url: string) => h.http().delete(`/api/v1${url}`).set(bearer(t)),
});

async function newProjectWithDraft(name: string): Promise<{ id: string; revision: number }> {
  const p = await api(engineer.token).post('/projects', { name, units: 'SI' });
  expect(p.status).toBe(201);
  const saved = await api(engineer.token).put(`/projects/${p.body.id}/design`, {
    input: fenwickDesign,
  });
  expect(saved.status, JSON.stringify(saved.body)).toBe(200);
  expect(saved.body.revision).toBe(1);
  return { id: p.body.id as string, revision: 1 };
}

describe('draft saves: optimistic concurrency', () => {
  it('two saves based on one revision: exactly one wins, the other gets 409 with the winner’s copy, nothing is lost', async () => {
    const { id } = await newProjectWithDraft('Concurrent saves');
    const a = { ...fenwickDesign, basinWidth: 13 };
    const b = { ...fenwickDesign, basinWidth: 15 };
    const [ra, rb] = await Promise.all([
      api(engineer.token).put(`/projects/${id}/design`, { input: a, revision: 1 }),
      api(otherEngineer.token).put(`/projects/${id}/design`, { input: b, revision: 1 }),
    ]);
    expect([ra.status, rb.status].sort()).toEqual([200, 409]);
    const [won, lost, lostInput] = ra.status === 200 ? [ra, rb, b] : [rb, ra, a];
    expect(won.body.revision).toBe(2);
    expect(lost.body.code).toBe('conflict');
    expect(lost.body.message).toMatch(/revision 2/);
    // the refused one is handed the current copy: the winner's, whole
    expect(lost.body.current.input).toEqual(won.body.input);
    expect(lost.body.current.revision).toBe(2);
    // the stored draft is the winner's; the loser, reloading, saves on top of it
    const stored = await api(viewer.token).get(`/projects/${id}/design`);
    expect(stored.body.input).toEqual(won.body.input);
    const retry = await api(engineer.token).put(`/projects/${id}/design`, {
      input: lostInput,
      revision: 2,
    });
    expect(retry.status).toBe(200);
    expect(retry.body.revision).toBe(3);
    expect(retry.body.input).toEqual(lostInput);
  });

  it('a save without a revision on an existing design is refused, not applied', async () => {
    const { id } = await newProjectWithDraft('No revision');
    const res = await api(engineer.token).put(`/projects/${id}/design`, {
      input: { ...fenwickDesign, basinWidth: 11 },
    });
    expect(res.status).toBe(409);
    expect(res.body.current.revision).toBe(1);
    const stored = await api(engineer.token).get(`/projects/${id}/design`);
    expect(stored.body.input).toEqual(fenwickDesign);
  });
});

describe('issued versions', () => {
  it('issues the stored draft as an immutable snapshot with its key figures', async () => {
    const { id } = await newProjectWithDraft('Issue one');
    const draft = await api(engineer.token).get(`/projects/${id}/design`);
    const res = await api(engineer.token).post(`/projects/${id}/versions`, {
      revision: 1,
      note: 'For the client meeting',
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const v = res.body;
    expect(v.number).toBe(1);
    expect(v.note).toBe('For the client meeting');
    expect(v.issuedBy.id).toBe(engineer.id);
    expect(v.reviewState).toBe('not_sent');
    expect(v.superseded).toBe(false);
    // the snapshot is the draft as stored: input, result and engine version, not recomputed
    expect(v.input).toEqual(draft.body.input);
    expect(v.result).toEqual(draft.body.result);
    expect(v.engineVersion).toBe(draft.body.engineVersion);
    expect(v.computedAt).toBe(draft.body.computedAt);
    // key figures read from the stored result's chosen design
    const chosen = draft.body.result.design;
    expect(v.figures.type).toBe(chosen.type);
    expect(v.figures.length).toBe(chosen.design.length);
    expect(v.figures.concrete).toBe(chosen.design.concrete.total);
    expect(v.figures.floorElevation).toBe(chosen.design.floorElevation);
    // no estimate yet: the cost says so
    expect(v.figures.cost).toBeNull();
    expect(v.figures.costStatus).toBe('not_priced');

    const list = await api(viewer.token).get(`/projects/${id}/versions`);
    expect(list.status).toBe(200);
    expect(list.body.status).toBe('draft');
    expect(list.body.reviewer).toBe(false);
    expect(list.body.items).toHaveLength(1);
    expect(list.body.items[0].figures).toEqual(v.figures);
    expect(list.body.items[0].input).toBeUndefined();
  });

  it('issuing a stale revision is refused with the current draft', async () => {
    const { id } = await newProjectWithDraft('Issue stale');
    await api(engineer.token).put(`/projects/${id}/design`, {
      input: { ...fenwickDesign, basinWidth: 13 },
      revision: 1,
    });
    const res = await api(otherEngineer.token).post(`/projects/${id}/versions`, { revision: 1 });
    expect(res.status).toBe(409);
    expect(res.body.current.revision).toBe(2);
    expect(await h.models.DesignVersion.count({ where: { projectId: id } })).toBe(0);
    const none = await api(engineer.token).post('/projects', { name: 'No draft', units: 'SI' });
    const noDraft = await api(engineer.token).post(`/projects/${none.body.id}/versions`, {
      revision: 1,
    });
    expect(noDraft.status).toBe(409);
    expect(noDraft.body.message).toMatch(/Save the design/);
  });

  it('an issued version cannot change: PUT and DELETE are 409, the database refuses too, and later draft saves leave it as issued', async () => {
    const { id } = await newProjectWithDraft('Immutable');
    const v = (await api(engineer.token).post(`/projects/${id}/versions`, { revision: 1 })).body;
    const url = `/projects/${id}/versions/${v.id}`;
    const put = await api(engineer.token).put(url, { note: 'rewritten', input: fenwickDesign });
    expect(put.status).toBe(409);
    expect(put.body.message).toMatch(/cannot change/);
    expect((await api(owner.token).delete(url)).status).toBe(409);
    const row = await h.models.DesignVersion.findByPk(v.id, { rejectOnEmpty: true });
    await expect(row.update({ note: 'changed behind the API' })).rejects.toThrow(/cannot change/);
    // a new draft save changes the draft, not the issued version
    await api(engineer.token).put(`/projects/${id}/design`, {
      input: { ...fenwickDesign, basinWidth: 16 },
      revision: 1,
    });
    const again = await api(viewer.token).get(url);
    expect(again.body.input).toEqual(v.input);
    expect(again.body.result).toEqual(v.result);
    expect(again.body.note).toBe('');
  });
});

/** Estimate settings of the cost tests, and their total written out by hand in the stated order. */
const COST_SETTINGS = {
  locationFactor: 1.2,
  percentages: { mobilisation: 0.1, careOfWater: 0.1, contingency: 0.1, overheadAndProfit: 0.1 },
  escalation: { annualRate: 0.03, years: 1 },
  accuracy: { aaceClass: 4 },
};
function handTotal(direct: number): number {
  const located = direct * 1.2;
  const withSiteCosts = located + 0.1 * located + 0.1 * located;
  const withContingency = withSiteCosts * 1.1;
  const withOverhead = withContingency * 1.1;
  return withOverhead * 1.03; // one year at 3 %
}

describe('cost in the key figures', () => {
  it('a version shows the total of the latest issued estimate priced from its own result; others stay not priced', async () => {
    const { id } = await newProjectWithDraft('Priced versions');
    const v1 = await api(engineer.token).post(`/projects/${id}/versions`, { revision: 1 });
    expect(v1.status).toBe(201);
    const book = await api(owner.token).post('/price-books', {
      name: 'Cost join',
      currency: 'USD',
    });
    expect(book.status).toBe(201);
    const items = (price: number) =>
      api(owner.token).put(`/price-books/${book.body.id}/items`, {
        items: [{ code: 'CON', description: 'Slab concrete', unit: 'm³', unitPrice: price }],
      });
    expect((await items(400)).status).toBe(200);
    const slab = async () => {
      const t = await api(engineer.token).get(`/projects/${id}/takeoff`);
      return (t.body.lines as { key: string; quantity: number }[]).find(
        (l) => l.key === 'concrete.floorSlab',
      )!.quantity;
    };
    const q1 = await slab();

    const e1 = await api(engineer.token).post(`/projects/${id}/estimates`, {
      priceBookId: book.body.id,
    });
    expect(e1.status).toBe(201);
    const patched = await h
      .http()
      .patch(`/api/v1/estimates/${e1.body.id}`)
      .set(bearer(engineer.token))
      .send({ settings: COST_SETTINGS, mapping: { 'concrete.floorSlab': 'CON' } });
    expect(patched.status, JSON.stringify(patched.body).slice(0, 300)).toBe(200);
    // a draft estimate is not the version's cost
    let list = await api(viewer.token).get(`/projects/${id}/versions`);
    expect(list.body.items[0].figures).toMatchObject({ cost: null, costStatus: 'not_priced' });
    expect((await api(engineer.token).post(`/estimates/${e1.body.id}/issue`)).status).toBe(200);

    list = await api(viewer.token).get(`/projects/${id}/versions`);
    expect(list.body.items[0].figures.costStatus).toBe('priced');
    expectRel(list.body.items[0].figures.cost, handTotal(q1 * 400), 1e-12);
    const one = await api(viewer.token).get(`/projects/${id}/versions/${v1.body.id}`);
    expect(one.body.figures).toEqual(list.body.items[0].figures);

    // A new save recomputes the result: version 2 is issued from it and nobody priced it yet.
    const saved = await api(engineer.token).put(`/projects/${id}/design`, {
      input: { ...fenwickDesign, basinWidth: 14 },
      revision: 1,
    });
    expect(saved.status).toBe(200);
    const v2 = await api(engineer.token).post(`/projects/${id}/versions`, { revision: 2 });
    expect(v2.status).toBe(201);
    expect(v2.body.figures).toMatchObject({ cost: null, costStatus: 'not_priced' });
    list = await api(viewer.token).get(`/projects/${id}/versions`);
    expect(list.body.items.map((v: { number: number }) => v.number)).toEqual([2, 1]);
    expect(list.body.items[0].figures.costStatus).toBe('not_priced');
    expectRel(list.body.items[1].figures.cost, handTotal(q1 * 400), 1e-12);

    // Revision 2, priced at a new rate from version 2's result, is version 2's cost only.
    expect((await items(500)).status).toBe(200);
    const q2 = await slab();
    expect(q2).not.toBe(q1); // a wider basin has a bigger slab
    const e2 = await api(engineer.token).post(`/projects/${id}/estimates`, {});
    expect(e2.status).toBe(201);
    expect((await api(engineer.token).post(`/estimates/${e2.body.id}/issue`)).status).toBe(200);
    list = await api(viewer.token).get(`/projects/${id}/versions`);
    const [second, first] = list.body.items;
    expect(second.figures.costStatus).toBe('priced');
    expectRel(second.figures.cost, handTotal(q2 * 500), 1e-12);
    expectRel(first.figures.cost, handTotal(q1 * 400), 1e-12);
    // the comparison of the two versions names the cost among the figures that changed
    const full = await Promise.all(
      [first, second].map((v: { id: string }) =>
        api(viewer.token).get(`/projects/${id}/versions/${v.id}`),
      ),
    );
    const diff = compareVersions(full[0]!.body, full[1]!.body);
    expect(diff.figures.map((c) => c.field)).toContain('cost');
  });
});

describe('review and sign-off', () => {
  it('only a marked reviewer approves, never their own version; the audit trail lists every step', async () => {
    const { id } = await newProjectWithDraft('Review');
    const base = `/projects/${id}/versions`;
    const v1 = (await api(engineer.token).post(base, { revision: 1, note: 'first' })).body;
    expect((await api(engineer.token).post(`${base}/${v1.id}/send`)).status).toBe(200);
    expect((await api(engineer.token).post(`${base}/${v1.id}/send`)).status).toBe(409);

    // not marked: refused whatever the role
    const unmarked = await api(otherEngineer.token).post(`${base}/${v1.id}/approve`);
    expect(unmarked.status).toBe(403);
    expect(unmarked.body.message).toMatch(/licensed reviewer/);

    // the owner marks two members; the issuer is one of them but cannot review their own
    const mark = (memberId: string, licence: string) =>
      api(owner.token).put(`/members/${memberId}/reviewer`, {
        licenceNumber: licence,
        jurisdiction: 'Harrowdale',
        statement: `Reviewed under licence ${licence}.`,
      });
    expect((await mark(engineer.id, 'PE-1')).status).toBe(200);
    expect((await mark(otherEngineer.id, 'PE-2')).status).toBe(200);
    expect((await mark(viewer.id, 'PE-3')).status).toBe(409); // a viewer cannot review
    const own = await api(engineer.token).post(`${base}/${v1.id}/approve`);
    expect(own.status).toBe(403);
    expect(own.body.message).toMatch(/issued or sent/);

    // returned with comments (required)
    expect((await api(otherEngineer.token).post(`${base}/${v1.id}/return`, {})).status).toBe(422);
    const returned = await api(otherEngineer.token).post(`${base}/${v1.id}/return`, {
      comments: 'Check the tailwater at the low flows.',
    });
    expect(returned.status).toBe(200);
    expect(returned.body.reviewState).toBe('returned');
    expect(returned.body.review.comments).toBe('Check the tailwater at the low flows.');
    expect((await api(viewer.token).get(`/projects/${id}`)).body.designStatus).toBe('returned');

    // sent again, then approved: reviewer, time and statement recorded
    expect((await api(engineer.token).post(`${base}/${v1.id}/send`)).status).toBe(200);
    expect((await api(viewer.token).get(`/projects/${id}`)).body.designStatus).toBe('in_review');
    const approved = await api(otherEngineer.token).post(`${base}/${v1.id}/approve`, {
      comments: '',
    });
    expect(approved.status, JSON.stringify(approved.body)).toBe(200);
    expect(approved.body.reviewState).toBe('approved');
    expect(approved.body.review.by).toEqual({ id: otherEngineer.id, name: expect.any(String) });
    expect(approved.body.review.licenceNumber).toBe('PE-2');
    expect(approved.body.review.statement).toBe('Reviewed under licence PE-2.');
    expect(Date.parse(approved.body.review.at)).not.toBeNaN();
    expect((await api(otherEngineer.token).post(`${base}/${v1.id}/approve`)).status).toBe(409);

    // status in the project list and on the project page
    const page = await api(viewer.token).get(`/projects/${id}`);
    expect(page.body.designStatus).toBe('approved');
    expect(page.body.latestVersion).toMatchObject({
      id: v1.id,
      number: 1,
      reviewState: 'approved',
    });
    const listed = await api(viewer.token).get('/projects?search=Review&pageSize=100');
    const row = (listed.body.items as { id: string; designStatus: string }[]).find(
      (p) => p.id === id,
    );
    expect(row?.designStatus).toBe('approved');

    // a later version supersedes it: said so, and the old one can no longer be sent
    const v2 = (await api(engineer.token).post(base, { revision: 1, note: 'second' })).body;
    expect(v2.number).toBe(2);
    const old = await api(viewer.token).get(`${base}/${v1.id}`);
    expect(old.body.superseded).toBe(true);
    expect(old.body.supersededBy).toBe(2);
    expect(old.body.reviewState).toBe('approved'); // its approval stays on record
    expect((await api(viewer.token).get(`/projects/${id}`)).body.designStatus).toBe('draft');

    // every step, in order, readable by any member of the firm
    const audit = await api(viewer.token).get(`/projects/${id}/audit`);
    expect(audit.status).toBe(200);
    expect((audit.body.items as { action: string }[]).map((e) => e.action)).toEqual([
      'version.issued',
      'version.sent',
      'version.returned',
      'version.sent',
      'version.approved',
      'version.issued',
    ]);
    const firmTrail = await api(viewer.token).get('/audit');
    const actions = (firmTrail.body.items as { action: string }[]).map((e) => e.action);
    expect(actions.filter((a) => a === 'reviewer.marked')).toHaveLength(2);

    // the Team page shows the marks
    const members = await api(owner.token).get('/members');
    const marked = (
      members.body.items as { id: string; reviewer: { licenceNumber: string } | null }[]
    ).find((m) => m.id === otherEngineer.id);
    expect(marked?.reviewer?.licenceNumber).toBe('PE-2');
    expect(
      (members.body.items as { id: string; reviewer: unknown }[]).find((m) => m.id === viewer.id)
        ?.reviewer,
    ).toBeNull();

    // unmarked, a member can no longer decide
    expect((await api(owner.token).delete(`/members/${otherEngineer.id}/reviewer`)).status).toBe(
      204,
    );
    expect((await api(engineer.token).post(`${base}/${v2.id}/send`)).status).toBe(200);
    expect((await api(otherEngineer.token).post(`${base}/${v2.id}/approve`)).status).toBe(403);
  });
});

describe('reviewer marks', () => {
  it("only an owner changes an owner's mark; an inactive member cannot be marked", async () => {
    const admin = await addMember(h, firmId, 'admin');
    const mark = { licenceNumber: 'PE-9', jurisdiction: 'Harrowdale', statement: 'Reviewed.' };
    const byAdmin = await api(admin.token).put(`/members/${owner.id}/reviewer`, mark);
    expect(byAdmin.status).toBe(403);
    expect(await h.models.ReviewerCredential.findByPk(owner.id)).toBeNull();
    expect((await api(owner.token).put(`/members/${owner.id}/reviewer`, mark)).status).toBe(200);
    expect((await api(admin.token).delete(`/members/${owner.id}/reviewer`)).status).toBe(403);
    expect(await h.models.ReviewerCredential.findByPk(owner.id)).not.toBeNull();
    const gone = await addMember(h, firmId, 'engineer', { active: false });
    expect((await api(admin.token).put(`/members/${gone.id}/reviewer`, mark)).status).toBe(409);
    expect((await api(admin.token).put(`/members/${gone.id}/reviewer`, {})).status).toBe(422);
    await api(owner.token).delete(`/members/${owner.id}/reviewer`);
  });
});

describe("another firm's data answers 404 and changes nothing", () => {
  it('on every new route', async () => {
    const { id } = await newProjectWithDraft('Cross-firm');
    const base = `/projects/${id}/versions`;
    const v = (await api(engineer.token).post(base, { revision: 1 })).body;
    await api(engineer.token).post(`${base}/${v.id}/send`);
    const other = await signUpFirm(h, 'versions-other');
    await setPlan(h, other.firm.id, 'firm', 5);
    await h.models.ReviewerCredential.create({
      userId: other.user.id,
      firmId: other.firm.id,
      licenceNumber: 'X-1',
      jurisdiction: 'Elsewhere',
      statement: 'Elsewhere.',
      markedById: other.user.id,
    });
    const them = api(other.token);
    const target = await addMember(h, firmId, 'engineer');
    const probes = [
      await them.get(base),
      await them.post(base, { revision: 1 }),
      await them.get(`${base}/${v.id}`),
      await them.put(`${base}/${v.id}`, {}),
      await them.delete(`${base}/${v.id}`),
      await them.post(`${base}/${v.id}/send`),
      await them.post(`${base}/${v.id}/approve`),
      await them.post(`${base}/${v.id}/return`, { comments: 'no' }),
      await them.get(`/projects/${id}/audit`),
      await them.put(`/members/${target.id}/reviewer`, {
        licenceNumber: 'X',
        jurisdiction: 'X',
        statement: 'X',
      }),
      await them.delete(`/members/${target.id}/reviewer`),
    ];
    expect(probes.map((r) => r.status)).toEqual(probes.map(() => 404));
    // their own project cannot reach our version either
    const theirs = await them.post('/projects', { name: 'Theirs', units: 'SI' });
    expect((await them.get(`/projects/${theirs.body.id}/versions/${v.id}`)).status).toBe(404);
    expect((await them.post(`/projects/${theirs.body.id}/versions/${v.id}/approve`)).status).toBe(
      404,
    );
    // their firm-wide trail holds none of ours
    const trail = await them.get('/audit');
    expect(
      (trail.body.items as { projectId: string | null }[]).some((e) => e.projectId === id),
    ).toBe(false);
    const stored = await h.models.DesignVersion.findByPk(v.id, { rejectOnEmpty: true });
    expect(stored.reviewState).toBe('in_review');
    expect(await h.models.DesignVersion.count({ where: { projectId: id } })).toBe(1);
    expect(await h.models.ReviewerCredential.findByPk(target.id)).toBeNull();
  });
});

// Plan limits on the server (issue 10): every limit on its gated action, a downgrade that keeps
// all data, the seats race, and a firm read-only for billing. The caps are the product brief's
// plan table (../shared/design/product.md, "Plans"): Concept 1 seat and 3 projects; Professional
// per seat, unlimited projects, price-book import; Firm per seat (3 or more), several price books.
import { describe, expect, it } from 'vitest';
import { fenwickDesign } from '../../seed/designs';
import {
  addMember,
  bearer,
  setPlan,
  signUpFirm,
  apiForFile,
  uniqueEmail,
} from '../support/api-app';

const h = apiForFile();

const plans = () => import('../../api/src/modules/plans/plans.service');
const brand = () => import('../../api/src/modules/brand/brand.service');

async function change(
  firmId: string,
  values: Parameters<Awaited<ReturnType<typeof plans>>['applyPlanChange']>[1],
) {
  const { applyPlanChange } = await plans();
  return h.models.sequelize.transaction((t) => applyPlanChange(firmId, values, t));
}

const invite = (token: string, email = uniqueEmail('x')) =>
  h.http().post('/api/v1/members/invitations').set(bearer(token)).send({ email, role: 'viewer' });

const createProject = (token: string, name: string) =>
  h.http().post('/api/v1/projects').set(bearer(token)).send({ name, units: 'SI' });

/** Creates projects one after another with distinct creation times (oldest first). */
async function projectsOf(firmId: string, ownerId: string, names: string[]) {
  const made = [];
  for (const [i, name] of names.entries()) {
    made.push(
      await h.models.Project.create({
        firmId,
        name,
        units: 'SI',
        createdById: ownerId,
        createdAt: new Date(Date.UTC(2026, 0, 1 + i)),
      }),
    );
  }
  return made;
}

describe('the project cap (Concept: 3)', () => {
  it('refuses the 4th with plan_limit naming the limit and Professional as the plan that lifts it', async () => {
    const firm = await signUpFirm(h, 'plan-cap');
    for (const name of ['A', 'B', 'C'])
      expect((await createProject(firm.token, name)).status).toBe(201);
    const res = await createProject(firm.token, 'D');
    expect(res.status).toBe(403);
    expect(res.body).toMatchObject({
      code: 'plan_limit',
      details: { limit: 'projects', liftedBy: 'professional' },
    });
    expect(res.body.message).toContain('Concept');
    expect(res.body.message).toContain('Professional');
    expect(await h.models.Project.count({ where: { firmId: firm.firm.id } })).toBe(3);
  });
});

describe('seats', () => {
  it('Concept has one seat: an invitation is plan_limit (seats, lifted by Professional)', async () => {
    const firm = await signUpFirm(h, 'plan-seat');
    const res = await invite(firm.token, uniqueEmail('x'));
    expect(res.status).toBe(403);
    expect(res.body).toMatchObject({
      code: 'plan_limit',
      details: { limit: 'seats', liftedBy: 'professional' },
    });
  });

  it('on a paid plan a full firm is told to add seats (no plan lifts it)', async () => {
    const firm = await signUpFirm(h, 'plan-seat-paid');
    await setPlan(h, firm.firm.id, 'professional', 1);
    const res = await invite(firm.token, uniqueEmail('x'));
    expect(res.status).toBe(403);
    expect(res.body.code).toBe('plan_limit');
    expect(res.body.details).toEqual({ limit: 'seats' });
    expect(res.body.message).toContain('Add seats');
  });

  it('20 parallel invitations against 5 free seats: exactly 5 succeed', async () => {
    const firm = await signUpFirm(h, 'plan-race');
    await setPlan(h, firm.firm.id, 'professional', 6); // the owner holds 1 of 6 → 5 free
    const emails = Array.from({ length: 20 }, (_, i) => uniqueEmail(`race${i}`));
    const results = await Promise.all(emails.map((email) => invite(firm.token, email)));
    const statuses = results.map((r) => r.status);
    expect(statuses.filter((s) => s === 201)).toHaveLength(5);
    expect(statuses.filter((s) => s === 403)).toHaveLength(15);
    expect(results.filter((r) => r.status === 403).every((r) => r.body.code === 'plan_limit')).toBe(
      true,
    );
    expect(await h.models.Invitation.count({ where: { firmId: firm.firm.id } })).toBe(5);
  });

  it('members over the seat count keep their access; new invitations are refused', async () => {
    const firm = await signUpFirm(h, 'plan-over-seats');
    await setPlan(h, firm.firm.id, 'professional', 3);
    const a = await addMember(h, firm.firm.id, 'engineer');
    const b = await addMember(h, firm.firm.id, 'viewer');
    await change(firm.firm.id, { plan: 'concept', seats: 1 });
    for (const member of [a, b]) {
      const res = await h.http().get('/api/v1/projects').set(bearer(member.token));
      expect(res.status).toBe(200);
    }
    const invited = await invite(firm.token, uniqueEmail('late'));
    expect(invited.body.code).toBe('plan_limit');
    expect(await h.models.User.count({ where: { firmId: firm.firm.id, active: true } })).toBe(3);
  });
});

describe('a downgrade never deletes data', () => {
  it('keeps every project and design; the 3 oldest stay editable, newer ones are read-only and say why', async () => {
    const firm = await signUpFirm(h, 'plan-downgrade');
    await change(firm.firm.id, { plan: 'professional', seats: 2 });
    const made = await projectsOf(firm.firm.id, firm.user.id, ['P1', 'P2', 'P3', 'P4', 'P5']);
    for (const project of made) {
      const saved = await h
        .http()
        .put(`/api/v1/projects/${project.id}/design`)
        .set(bearer(firm.token))
        .send({ input: fenwickDesign });
      expect(saved.status).toBe(200);
    }

    const firmAfter = await change(firm.firm.id, { plan: 'concept', seats: 1 });
    expect(firmAfter.plan).toBe('concept');
    expect(firmAfter.seats).toBe(1);

    // Everything is still there and readable.
    expect(await h.models.Project.count({ where: { firmId: firm.firm.id } })).toBe(5);
    expect(await h.models.Design.count({ where: { firmId: firm.firm.id } })).toBe(5);
    const list = await h
      .http()
      .get('/api/v1/projects?sort=createdAt&order=asc')
      .set(bearer(firm.token));
    expect(list.status).toBe(200);
    expect(list.body.total).toBe(5);
    const readOnly = Object.fromEntries(
      (list.body.items as { name: string; readOnly: { reason: string } | null }[]).map((p) => [
        p.name,
        p.readOnly?.reason ?? null,
      ]),
    );
    expect(readOnly).toEqual({
      P1: null,
      P2: null,
      P3: null,
      P4: 'project_over_limit',
      P5: 'project_over_limit',
    });
    for (const project of made) {
      expect(
        (await h.http().get(`/api/v1/projects/${project.id}`).set(bearer(firm.token))).status,
      ).toBe(200);
      const design = await h
        .http()
        .get(`/api/v1/projects/${project.id}/design`)
        .set(bearer(firm.token));
      expect(design.status).toBe(200);
      expect(design.body.input).not.toBeNull();
    }

    // The oldest three are editable; the newer two refuse edits with the reason.
    const [p1, , , p4, p5] = made;
    const ok = await h
      .http()
      .patch(`/api/v1/projects/${p1!.id}`)
      .set(bearer(firm.token))
      .send({ notes: 'still mine' });
    expect(ok.status).toBe(200);
    const refused = await h
      .http()
      .patch(`/api/v1/projects/${p4!.id}`)
      .set(bearer(firm.token))
      .send({ notes: 'x' });
    expect(refused.status).toBe(403);
    expect(refused.body).toMatchObject({
      code: 'read_only',
      details: { reason: 'project_over_limit' },
    });
    expect(refused.body.message).toContain('Nothing has been deleted');
    expect((await h.models.Project.findByPk(p4!.id))?.notes).toBe('');
    const design = await h
      .http()
      .put(`/api/v1/projects/${p5!.id}/design`)
      .set(bearer(firm.token))
      .send({ input: fenwickDesign });
    expect(design.status).toBe(403);
    expect(design.body.code).toBe('read_only');
    // No new project while over the cap.
    expect((await createProject(firm.token, 'P6')).body.code).toBe('plan_limit');

    // Upgrading again makes every project editable.
    await change(firm.firm.id, { plan: 'professional', seats: 1 });
    const again = await h
      .http()
      .patch(`/api/v1/projects/${p5!.id}`)
      .set(bearer(firm.token))
      .send({ notes: 'back' });
    expect(again.status).toBe(200);
    expect(again.body.readOnly).toBeNull();
  });

  it('another firm’s project id answers 404 on the writability check, not read_only', async () => {
    const a = await signUpFirm(h, 'plan-probe-a');
    const b = await signUpFirm(h, 'plan-probe-b');
    const [theirs] = await projectsOf(b.firm.id, b.user.id, ['B1']);
    const res = await h
      .http()
      .patch(`/api/v1/projects/${theirs!.id}`)
      .set(bearer(a.token))
      .send({ notes: 'x' });
    expect(res.status).toBe(404);
  });
});

describe('a firm read-only for billing', () => {
  it('refuses every write but stays readable; one’s own profile can still be changed', async () => {
    const firm = await signUpFirm(h, 'plan-billing');
    const [project] = await projectsOf(firm.firm.id, firm.user.id, ['Kept']);
    await change(firm.firm.id, { billingStatus: 'read_only' });
    const created = await createProject(firm.token, 'New');
    expect(created.status).toBe(403);
    expect(created.body).toMatchObject({ code: 'read_only', details: { reason: 'billing' } });
    const edited = await h
      .http()
      .patch(`/api/v1/projects/${project!.id}`)
      .set(bearer(firm.token))
      .send({ notes: 'x' });
    expect(edited.body.code).toBe('read_only');
    const read = await h.http().get(`/api/v1/projects/${project!.id}`).set(bearer(firm.token));
    expect(read.status).toBe(200);
    expect(read.body.readOnly).toMatchObject({ reason: 'billing' });
    const me = await h.http().get('/api/v1/auth/me').set(bearer(firm.token));
    expect(me.body.firm.billingStatus).toBe('read_only');
    const profile = await h
      .http()
      .patch('/api/v1/auth/me')
      .set(bearer(firm.token))
      .send({ name: 'Still Me' });
    expect(profile.status).toBe(200);
    expect(await h.models.Project.count({ where: { firmId: firm.firm.id } })).toBe(1);
  });

  it('past due: writes go on during the grace period and stop once it has ended', async () => {
    const firm = await signUpFirm(h, 'plan-grace');
    await change(firm.firm.id, {
      billingStatus: 'past_due',
      graceEndsAt: new Date(Date.now() + 7 * 24 * 3600 * 1000),
    });
    expect((await createProject(firm.token, 'During grace')).status).toBe(201);
    await change(firm.firm.id, { graceEndsAt: new Date(Date.now() - 1000) });
    const after = await createProject(firm.token, 'After grace');
    expect(after.status).toBe(403);
    expect(after.body.code).toBe('read_only');
    await change(firm.firm.id, { billingStatus: 'active', graceEndsAt: null });
    expect((await createProject(firm.token, 'Paid again')).status).toBe(201);
  });
});

describe('applyPlanChange and the hooks for price books and proposals', () => {
  it('raises seats to the plan’s minimum (Firm: 3) and caps Concept at 1', async () => {
    const firm = await signUpFirm(h, 'plan-min');
    expect((await change(firm.firm.id, { plan: 'firm', seats: 1 })).seats).toBe(3);
    expect((await change(firm.firm.id, { plan: 'concept', seats: 8 })).seats).toBe(1);
  });

  it('price-book import needs Professional; a second price book needs Firm', async () => {
    const { requirePriceBookImport, requireAnotherPriceBook } = await plans();
    const refusal = (fn: () => void) => {
      try {
        fn();
        return null;
      } catch (error) {
        return (error as { code?: string; details?: Record<string, string> }).details ?? null;
      }
    };
    expect(refusal(() => requirePriceBookImport({ plan: 'concept' }))).toEqual({
      limit: 'priceBookImport',
      liftedBy: 'professional',
    });
    expect(refusal(() => requirePriceBookImport({ plan: 'professional' }))).toBeNull();
    expect(refusal(() => requireAnotherPriceBook({ plan: 'concept', seats: 1 }, 0))).toBeNull();
    expect(refusal(() => requireAnotherPriceBook({ plan: 'professional', seats: 2 }, 1))).toEqual({
      limit: 'priceBooks',
      liftedBy: 'firm',
    });
    expect(refusal(() => requireAnotherPriceBook({ plan: 'firm', seats: 3 }, 12))).toBeNull();
  });

  it('brandFor is null on Concept (watermarked) and the brand on Professional', async () => {
    const { brandFor, proposalWatermark } = await brand();
    const base = {
      name: 'Brand Co',
      brandColor: '#0f6e6e',
      logo: null,
      logoType: null,
      proposalFooter: 'Footer',
      sealStatement: 'Sealed by',
    } as const;
    expect(brandFor({ ...base, plan: 'concept' })).toBeNull();
    expect(proposalWatermark('concept')).toBe('Concept plan');
    expect(brandFor({ ...base, plan: 'professional' })).toEqual({
      firmName: 'Brand Co',
      color: '#0f6e6e',
      logo: null,
      footer: 'Footer',
      sealStatement: 'Sealed by',
    });
    expect(proposalWatermark('firm')).toBeNull();
  });
});

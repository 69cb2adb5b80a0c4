import { describe, expect, it } from 'vitest';
import {
  TEST_PASSWORD,
  addMember,
  bearer,
  login,
  setPlan,
  signUpFirm,
  apiForFile,
} from '../support/api-app';

const h = apiForFile();

async function teamFirm(label: string, seats = 10) {
  const firm = await signUpFirm(h, label);
  await setPlan(h, firm.firm.id, 'firm', seats);
  return firm;
}

const patch = (token: string, id: string, body: object) =>
  h.http().patch(`/api/v1/members/${id}`).set(bearer(token)).send(body);

describe('GET /members', () => {
  it('lists the firm’s members in joining order, without secrets', async () => {
    const firm = await teamFirm('list');
    const eng = await addMember(h, firm.firm.id, 'engineer');
    const res = await h.http().get('/api/v1/members').set(bearer(firm.token));
    expect(res.status).toBe(200);
    expect(res.body.items.map((m: { id: string }) => m.id)).toEqual([firm.user.id, eng.id]);
    for (const item of res.body.items) {
      expect(Object.keys(item).sort()).toEqual([
        'active',
        'createdAt',
        'email',
        'id',
        'name',
        'reviewer',
        'role',
      ]);
    }
  });
});

describe('PATCH /members/:id', () => {
  it('changes a role, and the new role applies to the next request', async () => {
    const firm = await teamFirm('role');
    const viewer = await addMember(h, firm.firm.id, 'viewer');
    expect(
      (
        await h
          .http()
          .post('/api/v1/projects')
          .set(bearer(viewer.token))
          .send({ name: 'P', units: 'SI' })
      ).status,
    ).toBe(403);
    const res = await patch(firm.token, viewer.id, { role: 'engineer' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: viewer.id, role: 'engineer' });
    expect(
      (
        await h
          .http()
          .post('/api/v1/projects')
          .set(bearer(viewer.token))
          .send({ name: 'P', units: 'SI' })
      ).status,
    ).toBe(201);
  });

  it('deactivating ends the member’s sessions and sign-ins; reactivating restores sign-in', async () => {
    const firm = await teamFirm('deact');
    const eng = await addMember(h, firm.firm.id, 'engineer');
    const off = await patch(firm.token, eng.id, { active: false });
    expect(off.status).toBe(200);
    expect(off.body.active).toBe(false);
    expect((await h.http().get('/api/v1/auth/me').set(bearer(eng.token))).status).toBe(401);
    expect((await login(h, eng.email, TEST_PASSWORD)).status).toBe(401);
    expect((await patch(firm.token, eng.id, { active: true })).status).toBe(200);
    expect((await login(h, eng.email, TEST_PASSWORD)).status).toBe(200);
  });

  it('an admin cannot change an owner or make one', async () => {
    const firm = await teamFirm('admin-owner');
    const admin = await addMember(h, firm.firm.id, 'admin');
    const viewer = await addMember(h, firm.firm.id, 'viewer');
    const onOwner = await patch(admin.token, firm.user.id, { active: false });
    expect(onOwner.status).toBe(403);
    expect(onOwner.body.code).toBe('forbidden');
    expect((await patch(admin.token, firm.user.id, { role: 'viewer' })).status).toBe(403);
    expect((await patch(admin.token, viewer.id, { role: 'owner' })).status).toBe(403);
    const owner = await h.models.User.findByPk(firm.user.id);
    expect(owner).toMatchObject({ role: 'owner', active: true });
    // Admins can manage the other roles.
    expect((await patch(admin.token, viewer.id, { role: 'estimator' })).status).toBe(200);
  });

  it('the last active owner can be neither demoted nor deactivated; with a second owner it can step down', async () => {
    const firm = await teamFirm('last-owner');
    const demote = await patch(firm.token, firm.user.id, { role: 'admin' });
    expect(demote.status).toBe(409);
    expect(demote.body.code).toBe('conflict');
    const second = await addMember(h, firm.firm.id, 'admin');
    expect((await patch(firm.token, second.id, { role: 'owner' })).status).toBe(200);
    const stepDown = await patch(firm.token, firm.user.id, { role: 'admin' });
    expect(stepDown.status).toBe(200);
    expect(stepDown.body.role).toBe('admin');
    // Now the second one is the last owner.
    expect((await patch(second.token, second.id, { role: 'engineer' })).status).toBe(409);
  });

  it('nobody can deactivate themselves', async () => {
    const firm = await teamFirm('self');
    await addMember(h, firm.firm.id, 'owner');
    const res = await patch(firm.token, firm.user.id, { active: false });
    expect(res.status).toBe(403);
    expect(res.body.message).toMatch(/yourself/);
    expect((await h.models.User.findByPk(firm.user.id))?.active).toBe(true);
  });

  it('reactivating needs a free seat', async () => {
    const firm = await teamFirm('seats', 2);
    const off = await addMember(h, firm.firm.id, 'viewer', { active: false });
    await addMember(h, firm.firm.id, 'viewer'); // owner + this one fill 2 seats
    const res = await patch(firm.token, off.id, { active: true });
    expect(res.status).toBe(403);
    expect(res.body.code).toBe('plan_limit');
  });

  it('validates the body and answers 404 for an unknown or malformed id', async () => {
    const firm = await teamFirm('val');
    const viewer = await addMember(h, firm.firm.id, 'viewer');
    const empty = await patch(firm.token, viewer.id, {});
    expect(empty.status).toBe(422);
    expect(empty.body.details).toEqual({ body: 'Change the role or the active flag.' });
    expect((await patch(firm.token, viewer.id, { role: 'chief' })).status).toBe(422);
    expect(
      (await patch(firm.token, '00000000-0000-4000-8000-000000000000', { role: 'viewer' })).status,
    ).toBe(404);
    expect((await patch(firm.token, 'nope', { role: 'viewer' })).status).toBe(404);
  });
});

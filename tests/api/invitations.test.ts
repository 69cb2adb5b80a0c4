import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import {
  TEST_PASSWORD,
  addMember,
  bearer,
  setPlan,
  signUpFirm,
  apiForFile,
  tokenFromMail,
  uniqueEmail,
} from '../support/api-app';

const h = apiForFile();

async function paidFirm(label: string, seats = 5) {
  const firm = await signUpFirm(h, label);
  await setPlan(h, firm.firm.id, 'professional', seats);
  return firm;
}

const invite = (token: string, email: string, role = 'engineer') =>
  h.http().post('/api/v1/members/invitations').set(bearer(token)).send({ email, role });

describe('invitations', () => {
  it('work end to end: invite → e-mail → preview → accept → the new member is signed in to the firm', async () => {
    const firm = await paidFirm('inv');
    const email = uniqueEmail('invitee');
    const created = await invite(firm.token, email.toUpperCase(), 'estimator');
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({
      email,
      role: 'estimator',
      invitedBy: { id: firm.user.id, name: firm.user.name },
    });
    expect(Object.keys(created.body).sort()).toEqual([
      'createdAt',
      'email',
      'expiresAt',
      'id',
      'invitedBy',
      'role',
    ]);
    const ttl = Date.parse(created.body.expiresAt) - Date.parse(created.body.createdAt);
    expect(Math.abs(ttl - 7 * 24 * 3_600_000)).toBeLessThan(5_000);

    const mail = await h.waitForMail(email);
    expect(mail.raw).toContain(firm.firm.name);
    const token = tokenFromMail(mail, '/accept-invitation');
    const row = await h.models.Invitation.findByPk(created.body.id);
    expect(row?.tokenHash).toBe(createHash('sha256').update(token).digest('hex'));

    const listed = await h.http().get('/api/v1/members/invitations').set(bearer(firm.token));
    expect(listed.status).toBe(200);
    expect(listed.body.items.map((i: { id: string }) => i.id)).toEqual([created.body.id]);

    const preview = await h.http().get(`/api/v1/invitations/${token}`);
    expect(preview.status).toBe(200);
    expect(preview.body).toEqual({ email, role: 'estimator', firmName: firm.firm.name });

    const accepted = await h
      .http()
      .post('/api/v1/invitations/accept')
      .send({ token, name: 'Nell Invitee', password: TEST_PASSWORD });
    expect(accepted.status).toBe(201);
    expect(accepted.body.user).toMatchObject({
      email,
      name: 'Nell Invitee',
      role: 'estimator',
      active: true,
    });
    expect(accepted.body.firm.id).toBe(firm.firm.id);
    const me = await h.http().get('/api/v1/auth/me').set(bearer(accepted.body.token));
    expect(me.body.firm.id).toBe(firm.firm.id);
    expect(
      (await h.http().post('/api/v1/auth/login').send({ email, password: TEST_PASSWORD })).status,
    ).toBe(200);

    const members = await h.http().get('/api/v1/members').set(bearer(firm.token));
    expect(members.body.items.map((m: { email: string }) => m.email)).toContain(email);
    const after = await h.http().get('/api/v1/members/invitations').set(bearer(firm.token));
    expect(after.body.items).toEqual([]);

    // Single use.
    const again = await h
      .http()
      .post('/api/v1/invitations/accept')
      .send({ token, name: 'Twice', password: TEST_PASSWORD });
    expect(again.status).toBe(400);
    expect(again.body.code).toBe('invalid_token');
    expect((await h.http().get(`/api/v1/invitations/${token}`)).status).toBe(404);
  });

  it('an expired invitation cannot be previewed or accepted, and can be sent again', async () => {
    const firm = await paidFirm('inv-exp');
    const email = uniqueEmail('late');
    const created = await invite(firm.token, email);
    const token = tokenFromMail(await h.waitForMail(email), '/accept-invitation');
    await h.models.Invitation.update(
      { expiresAt: new Date(Date.now() - 1000) },
      { where: { id: created.body.id } },
    );
    expect((await h.http().get(`/api/v1/invitations/${token}`)).status).toBe(404);
    const accept = await h
      .http()
      .post('/api/v1/invitations/accept')
      .send({ token, name: 'Late', password: TEST_PASSWORD });
    expect(accept.status).toBe(400);
    expect(await h.models.User.count({ where: { email } })).toBe(0);
    expect((await invite(firm.token, email)).status).toBe(201);
  });

  it('withdrawing an invitation kills its link', async () => {
    const firm = await paidFirm('inv-rev');
    const email = uniqueEmail('withdrawn');
    const created = await invite(firm.token, email);
    const token = tokenFromMail(await h.waitForMail(email), '/accept-invitation');
    const del = await h
      .http()
      .delete(`/api/v1/members/invitations/${created.body.id}`)
      .set(bearer(firm.token));
    expect(del.status).toBe(204);
    expect((await h.http().get(`/api/v1/invitations/${token}`)).status).toBe(404);
    expect(
      (
        await h
          .http()
          .delete(`/api/v1/members/invitations/${created.body.id}`)
          .set(bearer(firm.token))
      ).status,
    ).toBe(404);
    expect(
      (await h.http().delete('/api/v1/members/invitations/not-a-uuid').set(bearer(firm.token)))
        .status,
    ).toBe(404);
  });

  it('refuses a second open invitation, a member of the firm and the owner role', async () => {
    const firm = await paidFirm('inv-dup');
    const email = uniqueEmail('twice');
    expect((await invite(firm.token, email)).status).toBe(201);
    const dup = await invite(firm.token, email);
    expect(dup.status).toBe(409);
    expect(dup.body.code).toBe('conflict');
    const existing = await invite(firm.token, firm.email);
    expect(existing.status).toBe(409);
    expect(existing.body.message).toBe('This person is already a member of your firm.');
    const owner = await invite(firm.token, uniqueEmail('owner'), 'owner');
    expect(owner.status).toBe(422);
    expect(owner.body.details).toHaveProperty('role');
  });

  it('an address with an account in another firm is answered like any other; its owner gets a notice, not a link', async () => {
    const firm = await paidFirm('inv-elsewhere');
    const elsewhere = await signUpFirm(h, 'inv-other-firm');
    const fresh = uniqueEmail('fresh');
    const a = await invite(firm.token, fresh);
    const b = await invite(firm.token, elsewhere.email);
    expect([a.status, b.status]).toEqual([201, 201]);
    // The same fields, and values alike apart from the address and ids.
    expect(Object.keys(b.body).sort()).toEqual(Object.keys(a.body).sort());
    const same = (body: Record<string, unknown>) => ({
      ...body,
      id: '',
      email: '',
      expiresAt: '',
      createdAt: '',
    });
    expect(same(b.body)).toEqual(same(a.body));
    const notice = await h.waitForMail(elsewhere.email);
    expect(notice.text).toMatch(/already belongs to an account in another firm/);
    expect(notice.text).not.toMatch(/accept-invitation\?token=/);
    const link = await h.waitForMail(fresh);
    expect(tokenFromMail(link, '/accept-invitation')).toHaveLength(43);
    // The other firm's member stays where they are.
    const member = await h.models.User.findByPk(elsewhere.user.id);
    expect(member?.firmId).toBe(elsewhere.firm.id);
  });

  it('the Concept plan has one seat: inviting is a plan_limit, and nothing is saved or sent', async () => {
    const firm = await signUpFirm(h, 'inv-concept');
    const email = uniqueEmail('noseat');
    const res = await invite(firm.token, email);
    expect(res.status).toBe(403);
    expect(res.body.code).toBe('plan_limit');
    expect(await h.models.Invitation.count({ where: { firmId: firm.firm.id } })).toBe(0);
    await new Promise((resolve) => setTimeout(resolve, 200));
    expect(h.mail.some((m) => m.to.includes(email))).toBe(false);
  });

  it('open invitations hold seats: with 3 seats, owner + 2 invitations fill the firm', async () => {
    const firm = await paidFirm('inv-seats', 3);
    expect((await invite(firm.token, uniqueEmail('s1'))).status).toBe(201);
    expect((await invite(firm.token, uniqueEmail('s2'))).status).toBe(201);
    const third = await invite(firm.token, uniqueEmail('s3'));
    expect(third.status).toBe(403);
    expect(third.body.code).toBe('plan_limit');
  });

  it('if the e-mail cannot be sent, the invitation is not saved', async () => {
    const firm = await paidFirm('inv-smtp');
    const { createInvitation } =
      await import('../../api/src/modules/invitations/invitations.service');
    const user = await h.models.User.findByPk(firm.user.id, { rejectOnEmpty: true });
    const { closeMail } = await import('../../api/src/mail');
    // Point the mailer at a closed port for one call (the transport is rebuilt from config on next use).
    const config = (await import('../../api/src/config/env')).getConfig();
    const port = config.smtpPort;
    closeMail();
    config.smtpPort = 1;
    try {
      // a 503 with a plain message, never a 500 with the socket error
      await expect(
        createInvitation(user, { email: uniqueEmail('unsent'), role: 'viewer' }),
      ).rejects.toMatchObject({ status: 503, code: 'service_unavailable' });
    } finally {
      config.smtpPort = port;
      closeMail();
    }
    expect(await h.models.Invitation.count({ where: { firmId: firm.firm.id } })).toBe(0);
  });

  it('accept validates its input', async () => {
    const res = await h
      .http()
      .post('/api/v1/invitations/accept')
      .send({ token: '', name: '', password: 'short' });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.details).sort()).toEqual(['name', 'password', 'token']);
  });

  it('a member of another role added by the owner shows in the list with its role', async () => {
    const firm = await paidFirm('inv-list');
    const viewer = await addMember(h, firm.firm.id, 'viewer');
    const res = await h.http().get('/api/v1/members').set(bearer(firm.token));
    expect(res.body.items.find((m: { id: string }) => m.id === viewer.id)).toMatchObject({
      role: 'viewer',
      active: true,
    });
  });
});

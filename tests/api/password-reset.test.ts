import { createHash } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { describe, expect, it } from 'vitest';
import {
  TEST_PASSWORD,
  bearer,
  login,
  signUpFirm,
  apiForFile,
  tokenFromMail,
  uniqueEmail,
} from '../support/api-app';

const h = apiForFile();

/** The mail jobs queued for an address (pg-boss keeps finished jobs for a while). */
function mailJobs(email: string) {
  return h.models.sequelize.query<{ data: unknown; state: string }>(
    "SELECT data, state FROM pgboss.job WHERE name = 'mail' AND data->>'email' = :email",
    { replacements: { email }, type: QueryTypes.SELECT },
  );
}

/** Polls a condition (no fixed sleeps): the suite waits for states, never for time. */
async function waitFor(condition: () => Promise<boolean>, timeoutMs = 15_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!(await condition())) {
    if (Date.now() > deadline) throw new Error('condition not met in time');
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}

const NEW_PASSWORD = 'a brand new passphrase';

async function requestReset(email: string) {
  const res = await h.http().post('/api/v1/auth/forgot-password').send({ email });
  expect(res.status).toBe(202);
  return res;
}

describe('password reset by e-mail', () => {
  it('works end to end: mail → link token → new password → sign in; old password and sessions stop working', async () => {
    const firm = await signUpFirm(h, 'reset');
    await requestReset(firm.email.toUpperCase());
    const mail = await h.waitForMail(firm.email);
    expect(mail.raw).toMatch(/Subject: Reset your Basinwright password/);
    const token = tokenFromMail(mail, '/reset-password');
    expect(token).toHaveLength(43); // 32 random bytes, base64url

    // Only the sha256 of the token is stored.
    const rows = await h.models.PasswordReset.findAll({ where: { userId: firm.user.id } });
    expect(rows).toHaveLength(1);
    expect(rows[0]?.tokenHash).toBe(createHash('sha256').update(token).digest('hex'));
    expect(rows[0]?.tokenHash).not.toContain(token);
    const ttl = (rows[0]?.expiresAt.getTime() ?? 0) - (rows[0]?.createdAt.getTime() ?? 0);
    expect(Math.abs(ttl - 3_600_000)).toBeLessThan(5_000);

    const reset = await h
      .http()
      .post('/api/v1/auth/reset-password')
      .send({ token, password: NEW_PASSWORD });
    expect(reset.status).toBe(200);
    expect(reset.body.user.id).toBe(firm.user.id);
    expect((await h.http().get('/api/v1/auth/me').set(bearer(reset.body.token))).status).toBe(200);

    expect((await h.http().get('/api/v1/auth/me').set(bearer(firm.token))).status).toBe(401);
    expect((await login(h, firm.email, TEST_PASSWORD)).status).toBe(401);
    expect((await login(h, firm.email, NEW_PASSWORD)).status).toBe(200);
  });

  it('a link works once', async () => {
    const firm = await signUpFirm(h, 'reset-once');
    await requestReset(firm.email);
    const token = tokenFromMail(await h.waitForMail(firm.email), '/reset-password');
    expect(
      (await h.http().post('/api/v1/auth/reset-password').send({ token, password: NEW_PASSWORD }))
        .status,
    ).toBe(200);
    const again = await h
      .http()
      .post('/api/v1/auth/reset-password')
      .send({ token, password: 'yet another password' });
    expect(again.status).toBe(400);
    expect(again.body.code).toBe('invalid_token');
    expect((await login(h, firm.email, NEW_PASSWORD)).status).toBe(200);
  });

  it('an expired link is refused and changes nothing', async () => {
    const firm = await signUpFirm(h, 'reset-expired');
    await requestReset(firm.email);
    const token = tokenFromMail(await h.waitForMail(firm.email), '/reset-password');
    await h.models.PasswordReset.update(
      { expiresAt: new Date(Date.now() - 1000) },
      { where: { userId: firm.user.id } },
    );
    const res = await h
      .http()
      .post('/api/v1/auth/reset-password')
      .send({ token, password: NEW_PASSWORD });
    expect(res.status).toBe(400);
    expect(res.body.code).toBe('invalid_token');
    expect((await login(h, firm.email, TEST_PASSWORD)).status).toBe(200);
    expect((await h.http().get('/api/v1/auth/me').set(bearer(firm.token))).status).toBe(200);
  });

  it('an unknown token is refused; a bad new password is a 422', async () => {
    const unknown = await h
      .http()
      .post('/api/v1/auth/reset-password')
      .send({ token: 'x'.repeat(43), password: NEW_PASSWORD });
    expect(unknown.status).toBe(400);
    expect(unknown.body.code).toBe('invalid_token');
    const weak = await h
      .http()
      .post('/api/v1/auth/reset-password')
      .send({ token: 'x'.repeat(43), password: 'short' });
    expect(weak.status).toBe(422);
    expect(weak.body.details).toEqual({ password: 'Use at least 8 characters.' });
  });

  it('answers alike for an unknown e-mail: a job is queued for both, mail goes only to the known', async () => {
    const email = uniqueEmail('nobody');
    const known = await signUpFirm(h, 'reset-known');
    const a = await requestReset(email);
    const b = await requestReset(known.email);
    // Same status, same body, same headers that matter: nothing on the wire tells them apart.
    expect(a.body).toEqual(b.body);
    expect(a.body.message).toMatch(/If an account exists/);
    expect(a.headers['content-length']).toBe(b.headers['content-length']);
    // The response path did the same work for both: one mail job each, holding no token.
    for (const address of [email, known.email]) {
      const jobs = await mailJobs(address);
      expect(jobs, address).toHaveLength(1);
      expect(jobs[0]?.data).toEqual({ kind: 'password-reset', email: address });
    }
    await h.waitForMail(known.email); // the known one did get mail…
    await waitFor(async () => (await mailJobs(email))[0]?.state === 'completed');
    expect(h.mail.some((m) => m.to.includes(email))).toBe(false); // …the unknown one none
    expect(await h.models.PasswordReset.count({ where: { userId: known.user.id } })).toBe(1);
  });

  it('a newer reset makes older links useless once one is used', async () => {
    const firm = await signUpFirm(h, 'reset-two');
    await requestReset(firm.email);
    const first = tokenFromMail(await h.waitForMail(firm.email), '/reset-password');
    await requestReset(firm.email);
    const deadline = Date.now() + 5000;
    while (h.mail.filter((m) => m.to.includes(firm.email)).length < 2 && Date.now() < deadline) {
      await new Promise((resolve) => setTimeout(resolve, 25));
    }
    const second = tokenFromMail(
      h.mail.filter((m) => m.to.includes(firm.email))[1]!,
      '/reset-password',
    );
    expect(second).not.toBe(first);
    expect(
      (
        await h
          .http()
          .post('/api/v1/auth/reset-password')
          .send({ token: second, password: NEW_PASSWORD })
      ).status,
    ).toBe(200);
    expect(
      (
        await h
          .http()
          .post('/api/v1/auth/reset-password')
          .send({ token: first, password: 'other password!' })
      ).status,
    ).toBe(400);
  });
});

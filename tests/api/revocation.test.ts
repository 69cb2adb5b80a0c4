// Revocation reaches the engine routes too: a token from before a sign-out, a password change or
// a deactivation is refused by /calc/* exactly as by firm routes (issue 8, item 2).
import { describe, expect, it } from 'vitest';
import {
  addMember,
  bearer,
  login,
  signUpFirm,
  apiForFile,
  TEST_PASSWORD,
} from '../support/api-app';

const h = apiForFile();

// Demo-like jump (invented demo values, as in scripts/bench-http.ts); only the status matters here.
const jumpBody = { section: { shape: 'rectangular', width: 12 }, Q: 85, y1: 0.46 };
const calc = (token: string) =>
  h.http().post('/api/v1/calc/jump').set(bearer(token)).send(jumpBody);
const me = (token: string) => h.http().get('/api/v1/auth/me').set(bearer(token));

describe('revoked tokens are refused by the engine routes', () => {
  it('after sign-out: calc and firm routes both answer 401', async () => {
    const firm = await signUpFirm(h, 'revoke-logout');
    expect((await calc(firm.token)).status).toBe(200);
    expect((await h.http().post('/api/v1/auth/logout').set(bearer(firm.token))).status).toBe(204);
    for (const path of ['/api/v1/calc/jump', '/api/v1/calc/study', '/api/v1/calc/jump-position']) {
      const res = await h.http().post(path).set(bearer(firm.token)).send(jumpBody);
      expect(res.status, path).toBe(401);
      expect(res.body.code).toBe('unauthorized');
    }
    expect((await me(firm.token)).status).toBe(401);
  });

  it('after a password change: the old token is refused, the new one computes', async () => {
    const firm = await signUpFirm(h, 'revoke-password');
    const other = (await login(h, firm.email, TEST_PASSWORD)).body.token as string;
    const changed = await h
      .http()
      .post('/api/v1/auth/change-password')
      .set(bearer(firm.token))
      .send({ currentPassword: TEST_PASSWORD, newPassword: 'a brand new passphrase' });
    expect(changed.status).toBe(200);
    expect((await calc(other)).status).toBe(401);
    expect((await calc(firm.token)).status).toBe(401);
    expect((await calc(changed.body.token as string)).status).toBe(200);
  });

  it('after deactivation by the owner: the member’s token is refused', async () => {
    const firm = await signUpFirm(h, 'revoke-deactivate');
    await h.models.Firm.update({ plan: 'firm', seats: 5 }, { where: { id: firm.firm.id } });
    const member = await addMember(h, firm.firm.id, 'engineer');
    expect((await calc(member.token)).status).toBe(200);
    const off = await h
      .http()
      .patch(`/api/v1/members/${member.id}`)
      .set(bearer(firm.token))
      .send({ active: false });
    expect(off.status).toBe(200);
    expect((await calc(member.token)).status).toBe(401);
  });

  it('requests arriving together share one check and each gets its own answer', async () => {
    const live = await signUpFirm(h, 'revoke-batch-live');
    const ended = await signUpFirm(h, 'revoke-batch-ended');
    await h.http().post('/api/v1/auth/logout').set(bearer(ended.token));
    const answers = await Promise.all(
      Array.from({ length: 20 }, (_, i) => calc(i % 2 === 0 ? live.token : ended.token)),
    );
    answers.forEach((res, i) => expect(res.status, `request ${i}`).toBe(i % 2 === 0 ? 200 : 401));
  });
});

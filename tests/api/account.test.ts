import { describe, expect, it } from 'vitest';
import { TEST_PASSWORD, bearer, login, signUpFirm, apiForFile } from '../support/api-app';
import { CHANGE_PASSWORD_FAILURES_PER_HOUR } from '../../api/src/modules/auth/auth.throttle';

// A member's own account: the name, and the password (which ends every other session).

const h = apiForFile();

describe('PATCH /auth/me', () => {
  it('changes the name (trimmed) and nothing else', async () => {
    const s = await signUpFirm(h, 'profile');
    const res = await h
      .http()
      .patch('/api/v1/auth/me')
      .set(bearer(s.token))
      .send({ name: '  Ada Quill  ', role: 'viewer', email: 'x@y.example' });
    expect(res.status).toBe(200);
    expect(res.body.user.name).toBe('Ada Quill');
    expect(res.body.user.role).toBe('owner');
    expect(res.body.user.email).toBe(s.user.email);
    const me = await h.http().get('/api/v1/auth/me').set(bearer(s.token));
    expect(me.body.user.name).toBe('Ada Quill');
  });

  it('refuses an empty or over-long name with a field message', async () => {
    const s = await signUpFirm(h, 'profile-bad');
    for (const name of ['', '   ', 'x'.repeat(500)]) {
      const res = await h.http().patch('/api/v1/auth/me').set(bearer(s.token)).send({ name });
      expect(res.status).toBe(422);
      expect(res.body.details.name).toBeTruthy();
    }
    expect((await h.models.User.findByPk(s.user.id))?.name).toBe(s.user.name);
  });
});

describe('POST /auth/change-password', () => {
  it(`per member: after ${CHANGE_PASSWORD_FAILURES_PER_HOUR} wrong current passwords, from any address, the next try is a 429`, async () => {
    const firm = await signUpFirm(h, 'pw-limit');
    const change = (currentPassword: string) =>
      h
        .http() // a new client address each time: the limit is the member's, not the address's
        .post('/api/v1/auth/change-password')
        .set(bearer(firm.token))
        .send({ currentPassword, newPassword: 'a brand new passphrase' });
    for (let i = 0; i < CHANGE_PASSWORD_FAILURES_PER_HOUR; i += 1)
      expect((await change(`not it ${i}`)).status).toBe(422);
    const blocked = await change(TEST_PASSWORD);
    expect(blocked.status).toBe(429);
    expect(blocked.body.code).toBe('rate_limited');
    expect(Number(blocked.headers['retry-after'])).toBeGreaterThan(0);
    // Nothing changed: the old password still signs in, this session still works.
    expect((await login(h, firm.email, TEST_PASSWORD)).status).toBe(200);
    expect((await h.http().get('/api/v1/auth/me').set(bearer(firm.token))).status).toBe(200);
  });

  it('a wrong current password is a 422 on that field; nothing changes', async () => {
    const s = await signUpFirm(h, 'pw-wrong');
    const res = await h
      .http()
      .post('/api/v1/auth/change-password')
      .set(bearer(s.token))
      .send({ currentPassword: 'not the password', newPassword: 'another long password' });
    expect(res.status).toBe(422);
    expect(res.body.details.currentPassword).toMatch(/not right/);
    expect((await h.http().get('/api/v1/auth/me').set(bearer(s.token))).status).toBe(200);
    expect((await login(h, s.user.email, TEST_PASSWORD)).status).toBe(200);
  });

  it('the new password works, the old one and every old session do not, this session goes on', async () => {
    const s = await signUpFirm(h, 'pw-ok');
    const other = await login(h, s.user.email, TEST_PASSWORD);
    const res = await h
      .http()
      .post('/api/v1/auth/change-password')
      .set(bearer(s.token))
      .send({ currentPassword: TEST_PASSWORD, newPassword: 'a fresh passphrase 2' });
    expect(res.status).toBe(200);
    expect(typeof res.body.token).toBe('string');
    expect((await h.http().get('/api/v1/auth/me').set(bearer(res.body.token))).status).toBe(200);
    expect((await h.http().get('/api/v1/auth/me').set(bearer(s.token))).status).toBe(401);
    expect((await h.http().get('/api/v1/auth/me').set(bearer(other.body.token))).status).toBe(401);
    const oldLogin = await login(h, s.user.email, TEST_PASSWORD);
    expect(oldLogin.status).toBe(401);
    const newLogin = await login(h, s.user.email, 'a fresh passphrase 2');
    expect(newLogin.status).toBe(200);
  });

  it('a new password over 72 UTF-8 bytes is refused, not cut short (bcrypt reads 72 bytes: fact of the algorithm)', async () => {
    const s = await signUpFirm(h, 'pw-long');
    // 25 × "é" (2 bytes each) + 23 ASCII = 73 bytes in 48 characters
    const tooLong = 'é'.repeat(25) + 'a'.repeat(23);
    const res = await h
      .http()
      .post('/api/v1/auth/change-password')
      .set(bearer(s.token))
      .send({ currentPassword: TEST_PASSWORD, newPassword: tooLong });
    expect(res.status).toBe(422);
    expect(res.body.details.newPassword).toBeTruthy();
  });
});

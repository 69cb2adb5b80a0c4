// Responses that carry a session or firm data are never cached, and the request log never
// holds a secret: tokens in paths and query strings, passwords, Authorization (issue 8, item 5).
import { Writable } from 'node:stream';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { createLogger, redactUrl } from '../../api/src/logger';
import {
  bearer,
  randomClientIp,
  signUpFirm,
  apiForFile,
  TEST_PASSWORD,
  login,
} from '../support/api-app';

const h = apiForFile();

describe('Cache-Control: no-store', () => {
  it('on sign-in, /auth/me, the project list, every auth answer and errors', async () => {
    const firm = await signUpFirm(h, 'no-store');
    const answers = {
      login: await login(h, firm.email, TEST_PASSWORD),
      me: await h.http().get('/api/v1/auth/me').set(bearer(firm.token)),
      projects: await h.http().get('/api/v1/projects').set(bearer(firm.token)),
      members: await h.http().get('/api/v1/members').set(bearer(firm.token)),
      forgot: await h.http().post('/api/v1/auth/forgot-password').send({ email: firm.email }),
      wrongPassword: await login(h, firm.email, 'not the password'),
      noToken: await h.http().get('/api/v1/auth/me'),
      invitationPreview: await h.http().get(`/api/v1/invitations/${'x'.repeat(43)}`),
      calc: await h
        .http()
        .post('/api/v1/calc/jump')
        .set(bearer(firm.token))
        .send({ section: { shape: 'rectangular', width: 12 }, Q: 85, y1: 0.46 }),
    };
    for (const [name, res] of Object.entries(answers)) {
      expect(res.headers['cache-control'], `${name} (${res.status})`).toBe('no-store');
    }
    expect(answers.login.status).toBe(200);
    expect(answers.me.status).toBe(200);
  });
});

describe('request and error logs hold no secrets', () => {
  function capture() {
    const lines: string[] = [];
    const stream = new Writable({
      write(chunk: Buffer, _enc, done) {
        lines.push(...chunk.toString('utf8').split('\n').filter(Boolean));
        done();
      },
    });
    return { lines, log: createLogger('info', stream) };
  }

  it('an invitation token in the path and a reset token in a query string are redacted', async () => {
    const { lines, log } = capture();
    const app = h.createApp({ logger: log, webDist: null });
    const secret = 'Zm9vYmFyYmF6cXV4c2VjcmV0dG9rZW52YWx1ZTEyMzQ';
    await request(app)
      .get(`/api/v1/invitations/${secret}`)
      .set('X-Forwarded-For', randomClientIp());
    await request(app).get(`/reset-password?token=${secret}&next=%2F`);
    await request(app).get(`/accept-invitation?x=1&TOKEN=${secret}`);
    const firm = await signUpFirm(h, 'logs');
    await request(app)
      .post('/api/v1/auth/login')
      .set('X-Forwarded-For', randomClientIp())
      .send({ email: firm.email, password: TEST_PASSWORD });
    await request(app).get('/api/v1/auth/me').set(bearer(firm.token));
    await new Promise((resolve) => setImmediate(resolve));
    const text = lines.join('\n');
    expect(lines.length).toBeGreaterThanOrEqual(5);
    expect(text).toContain('/api/v1/invitations/[redacted]');
    expect(text).toContain('/reset-password?token=[redacted]&next=%2F');
    for (const secretText of [secret, TEST_PASSWORD, firm.token]) {
      expect(text).not.toContain(secretText);
    }
  });

  it('redactUrl keeps what is not a secret', () => {
    expect(redactUrl('/api/v1/invitations/accept')).toBe('/api/v1/invitations/accept');
    expect(redactUrl('/api/v1/projects/abc?page=2')).toBe('/api/v1/projects/abc?page=2');
    expect(redactUrl('/api/v1/invitations/abc?token=1&password=2')).toBe(
      '/api/v1/invitations/[redacted]?token=[redacted]&password=[redacted]',
    );
    expect(redactUrl('/x?%ZZ=1')).toBe('/x?%ZZ=1');
  });

  it('passwords, tokens and failed SQL in logged objects are censored', () => {
    const { lines, log } = capture();
    log.error(
      {
        body: { email: 'a@b.example', password: 'hunter2hunter2', token: 'abc' },
        err: { message: 'boom', sql: "UPDATE users SET password_hash = 'x'", parameters: ['x'] },
        headers: { authorization: 'Bearer eyJ' },
      },
      'failed',
    );
    const line = lines.join('\n');
    for (const leak of ['hunter2hunter2', '"abc"', 'password_hash', 'Bearer eyJ'])
      expect(line).not.toContain(leak);
    expect(line).toContain('a@b.example');
  });
});

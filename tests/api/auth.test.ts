import { spawn, type ChildProcess } from 'node:child_process';
import { createHash } from 'node:crypto';
import { fileURLToPath } from 'node:url';
import jwt from 'jsonwebtoken';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  TEST_JWT_SECRET,
  TEST_PASSWORD,
  addMember,
  bearer,
  login,
  randomClientIp,
  signUpFirm,
  apiForFile,
  tokenFromMail,
  uniqueEmail,
} from '../support/api-app';
import {
  ADDRESS_FAILURES_PER_DAY,
  FREE_FAILURES,
  MAX_WAIT_S,
  loginFailed,
  waitAfterFailure,
} from '../../api/src/modules/auth/auth.throttle';

const h = apiForFile();

const claimsOf = (token: string) => jwt.decode(token) as jwt.JwtPayload;
const b64 = (value: object) => Buffer.from(JSON.stringify(value)).toString('base64url');

describe('POST /auth/signup', () => {
  it('e-mails a link; opening it creates a Concept firm and its owner and signs them in', async () => {
    const email = uniqueEmail('signup');
    const asked = await h.http().post('/api/v1/auth/signup').send({
      firmName: 'Brackwater Consulting',
      name: 'Ada Brack',
      email: email.toUpperCase(),
      password: TEST_PASSWORD,
    });
    expect(asked.status).toBe(202);
    expect(asked.body).toEqual({ message: expect.stringMatching(/Check your e-mail/) });
    expect(await h.models.User.count({ where: { email } })).toBe(0); // nothing yet
    const mail = await h.waitForMail(email);
    expect(mail.raw).toMatch(/Subject: Finish creating your Basinwright account/);
    const token = tokenFromMail(mail, '/confirm-sign-up');
    const stored = await h.models.SignupRequest.findOne({ where: { email } });
    expect(stored?.tokenHash).toBe(createHash('sha256').update(token).digest('hex'));
    const res = await h.http().post('/api/v1/auth/signup/confirm').send({ token });
    expect(res.status).toBe(201);
    expect(res.body.user).toMatchObject({ name: 'Ada Brack', email, role: 'owner', active: true });
    expect(res.body.firm).toMatchObject({
      name: 'Brackwater Consulting',
      plan: 'concept',
      seats: 1,
    });
    expect(Object.keys(res.body.user).sort()).toEqual([
      'active',
      'createdAt',
      'email',
      'id',
      'name',
      'role',
    ]);
    const user = await h.models.User.findByPk(res.body.user.id);
    expect(user?.passwordHash).toMatch(/^\$2[aby]\$10\$/); // bcrypt at BCRYPT_COST=10, never the password
    expect(user?.firmId).toBe(res.body.firm.id);
    const me = await h.http().get('/api/v1/auth/me').set(bearer(res.body.token));
    expect(me.status).toBe(200);
    expect(me.body).toEqual({ user: res.body.user, firm: res.body.firm });
    // The link works once.
    const again = await h.http().post('/api/v1/auth/signup/confirm').send({ token });
    expect(again.status).toBe(400);
    expect(again.body.code).toBe('invalid_token');
  });

  it('answers alike for an address that has an account; its owner is told by e-mail and nothing is created', async () => {
    const first = await signUpFirm(h, 'dup');
    const firmsBefore = await h.models.Firm.count();
    const body = (email: string) => ({
      firmName: 'Second',
      name: 'Other',
      email,
      password: TEST_PASSWORD,
    });
    const fresh = uniqueEmail('fresh');
    const taken = await h.http().post('/api/v1/auth/signup').send(body(first.email.toUpperCase()));
    const free = await h.http().post('/api/v1/auth/signup').send(body(fresh));
    expect(taken.status).toBe(free.status);
    expect(taken.body).toEqual(free.body);
    expect(taken.headers['content-length']).toBe(free.headers['content-length']);
    // The owner gets a notice, not a link; the fresh address gets its link.
    const notice = await h.waitForMail(first.email); // signUpFirm consumed the first one
    expect(notice?.raw).toMatch(/Subject: Someone tried to create a Basinwright account/);
    expect(notice?.text).not.toMatch(/confirm-sign-up\?token=/);
    expect(tokenFromMail(await h.waitForMail(fresh), '/confirm-sign-up')).toHaveLength(43);
    expect(await h.models.Firm.count()).toBe(firmsBefore);
  });

  it('an unknown or expired link is refused and creates nothing', async () => {
    const unknown = await h
      .http()
      .post('/api/v1/auth/signup/confirm')
      .send({ token: 'x'.repeat(43) });
    expect(unknown.status).toBe(400);
    expect(unknown.body.code).toBe('invalid_token');
    const email = uniqueEmail('late');
    await h
      .http()
      .post('/api/v1/auth/signup')
      .send({ firmName: 'Late Ltd', name: 'Late', email, password: TEST_PASSWORD });
    const token = tokenFromMail(await h.waitForMail(email), '/confirm-sign-up');
    await h.models.SignupRequest.update(
      { expiresAt: new Date(Date.now() - 1000) },
      { where: { email } },
    );
    const late = await h.http().post('/api/v1/auth/signup/confirm').send({ token });
    expect(late.status).toBe(400);
    expect(await h.models.User.count({ where: { email } })).toBe(0);
  });

  it('answers 422 with a message per field', async () => {
    const res = await h
      .http()
      .post('/api/v1/auth/signup')
      .send({ email: 'nope', password: 'é'.repeat(37) });
    expect(res.status).toBe(422);
    expect(res.body.code).toBe('validation_error');
    expect(Object.keys(res.body.details).sort()).toEqual(['email', 'firmName', 'name', 'password']);
    expect(res.body.details.password).toMatch(/72 bytes/);
  });
});

describe('POST /auth/login', () => {
  it('signs in with the right password and records the time', async () => {
    const firm = await signUpFirm(h, 'login');
    const res = await login(h, ` ${firm.email.toUpperCase()} `, TEST_PASSWORD);
    expect(res.status).toBe(200);
    expect(res.body.user.id).toBe(firm.user.id);
    expect(res.body.firm.id).toBe(firm.firm.id);
    const claims = claimsOf(res.body.token);
    expect(claims).toMatchObject({ sub: firm.user.id, iss: 'basinwright', aud: 'basinwright-app' });
    expect((claims.exp ?? 0) - (claims.iat ?? 0)).toBe(3600); // JWT_TTL=1h
    expect((await h.models.User.findByPk(firm.user.id))?.lastLoginAt).toBeInstanceOf(Date);
  });

  it('gives the same 401 message for a wrong password, an unknown e-mail and a deactivated member', async () => {
    const firm = await signUpFirm(h, 'wrongpw');
    const wrong = await login(h, firm.email, 'not the password');
    const unknown = await login(h, uniqueEmail('ghost'), TEST_PASSWORD);
    const inactive = await addMember(h, firm.firm.id, 'viewer', { active: false });
    const deactivated = await login(h, inactive.email, TEST_PASSWORD);
    for (const res of [wrong, unknown, deactivated]) {
      expect(res.status).toBe(401);
      expect(res.body).toEqual({ code: 'unauthorized', message: 'Incorrect e-mail or password.' });
    }
  });
});

describe('tokens', () => {
  let firm: Awaited<ReturnType<typeof signUpFirm>>;
  beforeAll(async () => {
    firm = await signUpFirm(h, 'tokens');
  });
  const me = (token: string) => h.http().get('/api/v1/auth/me').set(bearer(token));
  const sign = (payload: object, options: jwt.SignOptions = {}) =>
    jwt.sign(payload, TEST_JWT_SECRET, {
      algorithm: 'HS256',
      issuer: 'basinwright',
      audience: 'basinwright-app',
      ...options,
    });

  it('refuses a missing or malformed Authorization header', async () => {
    expect((await h.http().get('/api/v1/auth/me')).status).toBe(401);
    expect(
      (await h.http().get('/api/v1/auth/me').set('Authorization', `Token ${firm.token}`)).status,
    ).toBe(401);
    expect((await me('not.a.jwt')).status).toBe(401);
  });

  it('refuses an expired token', async () => {
    const expired = sign(
      { fid: firm.firm.id, tv: 0, exp: Math.floor(Date.now() / 1000) - 10 },
      { subject: firm.user.id },
    );
    const res = await me(expired);
    expect(res.status).toBe(401);
    expect(res.body).toEqual({
      code: 'unauthorized',
      message: 'Your session has expired. Sign in again.',
    });
  });

  it('refuses a tampered token (payload changed, signature kept)', async () => {
    const other = await addMember(h, firm.firm.id, 'viewer');
    const [header, , signature] = firm.token.split('.');
    const payload = { ...claimsOf(firm.token), sub: other.id };
    const res = await me(`${header}.${b64(payload)}.${signature}`);
    expect(res.status).toBe(401);
    expect(res.body.code).toBe('unauthorized');
  });

  it('refuses alg:none, another HMAC algorithm, another secret, issuer or audience', async () => {
    const claims = claimsOf(firm.token);
    const none = `${b64({ alg: 'none', typ: 'JWT' })}.${b64(claims)}.`;
    const hs512 = sign({ fid: firm.firm.id, tv: 0 }, { subject: firm.user.id, algorithm: 'HS512' });
    const otherSecret = jwt.sign(
      { fid: firm.firm.id, tv: 0 },
      'another-secret-0123456789abcdef0123456789',
      {
        algorithm: 'HS256',
        subject: firm.user.id,
        issuer: 'basinwright',
        audience: 'basinwright-app',
      },
    );
    const otherIssuer = sign(
      { fid: firm.firm.id, tv: 0 },
      { subject: firm.user.id, issuer: 'someone-else' },
    );
    const otherAudience = sign(
      { fid: firm.firm.id, tv: 0 },
      { subject: firm.user.id, audience: 'other-app' },
    );
    for (const token of [none, hs512, otherSecret, otherIssuer, otherAudience]) {
      const res = await me(token);
      expect(res.status).toBe(401);
      expect(res.body.code).toBe('unauthorized');
    }
    // The same claims properly signed are accepted, so the refusals above are about the flaw only.
    expect(
      (await me(sign({ fid: firm.firm.id, tv: claims.tv as number }, { subject: firm.user.id })))
        .status,
    ).toBe(200);
  });

  it('refuses a token whose firm claim does not match the member', async () => {
    const elsewhere = await signUpFirm(h, 'elsewhere');
    const res = await me(sign({ fid: elsewhere.firm.id, tv: 0 }, { subject: firm.user.id }));
    expect(res.status).toBe(401);
  });
});

describe('POST /auth/logout', () => {
  it('revokes the token (and every other token of the member)', async () => {
    const firm = await signUpFirm(h, 'logout');
    const second = await login(h, firm.email, TEST_PASSWORD);
    expect((await h.http().get('/api/v1/auth/me').set(bearer(firm.token))).status).toBe(200);
    const out = await h.http().post('/api/v1/auth/logout').set(bearer(firm.token));
    expect(out.status).toBe(204);
    expect(out.text).toBe('');
    for (const token of [firm.token, second.body.token as string]) {
      const res = await h.http().get('/api/v1/auth/me').set(bearer(token));
      expect(res.status).toBe(401);
      expect(res.body.code).toBe('unauthorized');
    }
    // Signing in again works and gives a fresh, valid token.
    const again = await login(h, firm.email, TEST_PASSWORD);
    expect((await h.http().get('/api/v1/auth/me').set(bearer(again.body.token))).status).toBe(200);
  });
});

describe('login rate limits (counters in PostgreSQL)', () => {
  it('per client address: the 31st attempt in 15 minutes gets 429 with Retry-After', async () => {
    const agent = h.http(); // one address for every request
    for (let i = 0; i < 30; i += 1) {
      const res = await agent
        .post('/api/v1/auth/login')
        .send({ email: uniqueEmail('ipflood'), password: 'wrong password' });
      expect(res.status).toBe(401);
    }
    const blocked = await agent
      .post('/api/v1/auth/login')
      .send({ email: uniqueEmail('ipflood'), password: 'wrong password' });
    expect(blocked.status).toBe(429);
    expect(blocked.body.code).toBe('rate_limited');
    const retryAfter = Number(blocked.headers['retry-after']);
    expect(Number.isInteger(retryAfter)).toBe(true);
    expect(retryAfter).toBeGreaterThan(0);
    expect(retryAfter).toBeLessThanOrEqual(15 * 60);
    // Another address is not affected.
    const fresh = await login(h, uniqueEmail('ipflood'), 'wrong password');
    expect(fresh.status).toBe(401);
  });

  it('10 wrong passwords from one address never lock out the owner signing in from another', async () => {
    const firm = await signUpFirm(h, 'nolockout');
    const attacker = h.http(); // one address for every guess
    const statuses: number[] = [];
    for (let i = 0; i < 10; i += 1) {
      const res = await attacker
        .post('/api/v1/auth/login')
        .send({ email: firm.email, password: `wrong ${i}` });
      statuses.push(res.status);
    }
    // The first FREE_FAILURES + 1 guesses are answered; after that this address may have to
    // wait (429 with Retry-After) — never anything else.
    expect(statuses.slice(0, FREE_FAILURES + 1)).toEqual(Array(FREE_FAILURES + 1).fill(401));
    for (const status of statuses) expect([401, 429]).toContain(status);
    // The owner, from elsewhere, signs in at once.
    const owner = await login(h, firm.email, TEST_PASSWORD);
    expect(owner.status).toBe(200);
    expect(owner.body.token).toEqual(expect.any(String));
  });

  it('waits grow with each failure of one account from one address: 1 s after the 4th, doubling to 15 min', async () => {
    // The published schedule (issue 8: progressive delay), restated independently here.
    const expected = [0, 0, 0, 1, 2, 4, 8, 16, 32, 64, 128, 256, 512, 900, 900];
    expect(expected.map((_, i) => waitAfterFailure(i + 1))).toEqual(expected);
    expect(MAX_WAIT_S).toBe(15 * 60);
    const email = uniqueEmail('progressive');
    const address = randomClientIp();
    for (let i = 0; i < 12; i += 1) await loginFailed(email, address);
    // Checked before any password: even the right one waits out the 256 s of the 12th failure.
    const blocked = await h
      .http()
      .post('/api/v1/auth/login')
      .set('X-Forwarded-For', address)
      .send({ email, password: TEST_PASSWORD });
    expect(blocked.status).toBe(429);
    expect(blocked.body.code).toBe('rate_limited');
    const retryAfter = Number(blocked.headers['retry-after']);
    expect(retryAfter).toBeGreaterThan(0);
    expect(retryAfter).toBeLessThanOrEqual(256);
  });

  it('a right password within the free failures clears them for that address', async () => {
    const firm = await signUpFirm(h, 'clears');
    const agent = h.http();
    const attempt = (password: string) =>
      agent.post('/api/v1/auth/login').send({ email: firm.email, password });
    for (let round = 0; round < 3; round += 1) {
      for (let i = 0; i < FREE_FAILURES; i += 1)
        expect((await attempt(`no ${i}`)).status).toBe(401);
      expect((await attempt(TEST_PASSWORD)).status).toBe(200);
    }
  });

  it(`one address guessing across accounts is refused after ${ADDRESS_FAILURES_PER_DAY} failures a day`, async () => {
    const address = randomClientIp();
    for (let i = 0; i < ADDRESS_FAILURES_PER_DAY; i += 1)
      await loginFailed(uniqueEmail('spray'), address);
    const res = await h
      .http()
      .post('/api/v1/auth/login')
      .set('X-Forwarded-For', address)
      .send({ email: uniqueEmail('spray'), password: 'any password at all' });
    expect(res.status).toBe(429);
    expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
    // The same account from another address is unaffected.
    expect((await login(h, uniqueEmail('spray'), 'any password at all')).status).toBe(401);
  });

  it('successful sign-ins do not count against the account', async () => {
    const firm = await signUpFirm(h, 'acctok');
    for (let i = 0; i < 12; i += 1) {
      const res = await login(h, firm.email, TEST_PASSWORD);
      expect(res.status).toBe(200);
    }
  });

  describe('shared by two API processes on one database', () => {
    let child: ChildProcess | undefined;
    let base = '';
    beforeAll(async () => {
      const root = fileURLToPath(new URL('../..', import.meta.url));
      child = spawn(
        process.execPath,
        ['--import', 'tsx', '--conditions=@basinwright/source', 'api/src/server.ts'],
        {
          cwd: root,
          env: { ...process.env, ...h.env, HOST: '127.0.0.1', PORT: '0' },
          stdio: ['ignore', 'pipe', 'pipe'],
        },
      );
      base = await new Promise<string>((resolve, reject) => {
        let out = '';
        const timer = setTimeout(
          () => reject(new Error(`second API did not start:\n${out}`)),
          20_000,
        );
        const onData = (chunk: Buffer) => {
          out += chunk.toString();
          const match = /listening on (http:\/\/[\d.]+:\d+)/.exec(out);
          if (match?.[1] !== undefined) {
            clearTimeout(timer);
            resolve(match[1]);
          }
        };
        child?.stdout?.on('data', onData);
        child?.stderr?.on('data', onData);
        child?.on('exit', (code) => reject(new Error(`second API exited (${code}):\n${out}`)));
      });
    });
    afterAll(async () => {
      if (child?.pid === undefined || child.exitCode !== null) return;
      const exited = new Promise((resolve) => child?.once('exit', resolve));
      child.kill('SIGTERM');
      await exited;
    });

    it('a wait set by failures is honoured by the other process too (state in PostgreSQL)', async () => {
      const firm = await signUpFirm(h, 'twoproc');
      const address = randomClientIp();
      const viaOther = (password: string, from = address) =>
        fetch(`${base}/api/v1/auth/login`, {
          method: 'POST',
          headers: { 'content-type': 'application/json', 'x-forwarded-for': from },
          body: JSON.stringify({ email: firm.email, password }),
        });
      // Failures through the other process, then more recorded here: one count for the pair.
      for (let i = 0; i < FREE_FAILURES; i += 1)
        expect((await viaOther(`bad other ${i}`)).status).toBe(401);
      for (let i = 0; i < 9; i += 1) await loginFailed(firm.email, address);
      const blockedThere = await viaOther(TEST_PASSWORD);
      expect(blockedThere.status).toBe(429);
      expect(Number(blockedThere.headers.get('retry-after'))).toBeGreaterThan(0);
      expect(((await blockedThere.json()) as { code: string }).code).toBe('rate_limited');
      const blockedHere = await h
        .http()
        .post('/api/v1/auth/login')
        .set('X-Forwarded-For', address)
        .send({ email: firm.email, password: TEST_PASSWORD });
      expect(blockedHere.status).toBe(429);
      // The owner from another address, through either process, is let in.
      expect((await viaOther(TEST_PASSWORD, randomClientIp())).status).toBe(200);
      expect((await login(h, firm.email, TEST_PASSWORD)).status).toBe(200);
    });

    it('the other process stops cleanly on SIGTERM', async () => {
      expect(child?.exitCode).toBeNull();
      const exited = new Promise<number | null>((resolve) =>
        child?.once('exit', (code) => resolve(code)),
      );
      child?.kill('SIGTERM');
      expect(await exited).toBe(0);
    });
  });
});

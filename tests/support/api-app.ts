import { randomBytes, randomUUID } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import type { Express } from 'express';
import { SMTPServer } from 'smtp-server';
import request from 'supertest';
import { afterAll, beforeAll } from 'vitest';
import type { Plan, Role } from '@basinwright/common';

type AppModule = typeof import('../../api/src/app');
type ModelsModule = typeof import('../../api/src/models');
type TokensModule = typeof import('../../api/src/modules/auth/auth.tokens');

export interface CapturedMail {
  to: string[];
  raw: string;
  /** Body with quoted-printable soft breaks and escapes undone. */
  text: string;
}

/** A test signing secret, long enough for env.ts. Never used outside tests. */
export const TEST_JWT_SECRET = 'test-only-secret-0123456789abcdef0123456789abcdef';
export const TEST_APP_URL = 'http://127.0.0.1:5999';
export const TEST_PASSWORD = 'correct horse battery';

function decodeQuotedPrintable(raw: string): string {
  return raw
    .replace(/=\r?\n/g, '')
    .replace(/=([0-9A-F]{2})/g, (_match, hex: string) => String.fromCharCode(parseInt(hex, 16)));
}

/** An SMTP server on a free loopback port that keeps every message it receives. */
export async function startMailCapture(): Promise<{
  port: number;
  messages: CapturedMail[];
  close(): Promise<void>;
}> {
  const messages: CapturedMail[] = [];
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('end', () => {
        const raw = Buffer.concat(chunks).toString('utf8');
        messages.push({
          to: session.envelope.rcptTo.map((a) => a.address.toLowerCase()),
          raw,
          text: decodeQuotedPrintable(raw),
        });
        callback();
      });
    },
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.server.address() as AddressInfo;
  return {
    port,
    messages,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

export interface ApiHarness {
  app: Express;
  createApp: AppModule['createApp'];
  models: ModelsModule;
  issueToken: TokensModule['issueToken'];
  mail: CapturedMail[];
  /** The environment the app was built with (for a second API process). */
  env: Record<string, string>;
  /** supertest agent whose requests come from their own client address (X-Forwarded-For). */
  http(app?: Express): request.Agent;
  waitForMail(to: string, timeoutMs?: number): Promise<CapturedMail>;
  close(): Promise<void>;
}

/**
 * The API harness of one test file: started before its tests (then `setUp`, e.g. sign-ups),
 * closed after them (after `tearDown`). The object returned stands for the harness from the
 * first test on; reading it at module level, before the tests run, is an error.
 */
export function apiForFile(
  setUp?: () => Promise<void>,
  tearDown?: () => Promise<void>,
): ApiHarness {
  let current: ApiHarness | undefined;
  beforeAll(async () => {
    current = await startApi();
    await setUp?.();
  });
  afterAll(async () => {
    await tearDown?.();
    await current?.close();
  });
  return new Proxy({} as ApiHarness, {
    get(_target, key) {
      if (current === undefined)
        throw new Error('The API harness starts in beforeAll: use it inside hooks and tests.');
      const value: unknown = Reflect.get(current, key);
      return typeof value === 'function' ? value.bind(current) : value;
    },
  });
}

/** A random private IPv4 address, so each agent gets its own per-IP rate-limit bucket. */
export function randomClientIp(): string {
  const b = randomBytes(3);
  return `10.${b[0]}.${b[1]}.${b[2]}`;
}

/**
 * Sets the environment (test secret, bcrypt cost 10, SMTP to an in-process capture server)
 * and only then imports the app, so env.ts validates exactly this configuration.
 */
export async function startApi(): Promise<ApiHarness> {
  const databaseUrl = process.env.DATABASE_URL;
  if (databaseUrl === undefined || databaseUrl === '')
    throw new Error('DATABASE_URL must be set for the API tests.');
  const capture = await startMailCapture();
  const env: Record<string, string> = {
    NODE_ENV: 'test',
    DATABASE_URL: databaseUrl,
    JWT_SECRET: TEST_JWT_SECRET,
    JWT_TTL: '1h',
    BCRYPT_COST: '10',
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(capture.port),
    MAIL_FROM: 'Basinwright tests <tests@basinwright.example>',
    APP_URL: TEST_APP_URL,
    LOG_LEVEL: 'silent',
    TRUST_PROXY: 'loopback',
    WEB_DIST: '',
  };
  Object.assign(process.env, env);
  delete process.env.JWT_SECRET_FILE;

  const { createApp } = await import('../../api/src/app');
  const models = await import('../../api/src/models');
  const { issueToken } = await import('../../api/src/modules/auth/auth.tokens');
  const { closeMail } = await import('../../api/src/mail');
  const { stopJobs } = await import('../../api/src/jobs');
  const { closeComputePool } = await import('../../api/src/modules/calc/calc.pool');
  const app = createApp();

  return {
    app,
    createApp,
    models,
    issueToken,
    mail: capture.messages,
    env,
    http: (target = app) => request.agent(target).set('X-Forwarded-For', randomClientIp()),
    async waitForMail(to, timeoutMs = 5000) {
      const address = to.toLowerCase();
      const deadline = Date.now() + timeoutMs;
      for (;;) {
        const found = capture.messages.find((m) => m.to.includes(address));
        if (found !== undefined) return found;
        if (Date.now() > deadline) throw new Error(`no e-mail to ${to} within ${timeoutMs} ms`);
        await new Promise((resolve) => setTimeout(resolve, 25));
      }
    },
    async close() {
      await stopJobs();
      closeMail();
      await closeComputePool();
      await capture.close();
      await models.sequelize.close();
    },
  };
}

/** The token of the first `/path?token=` link in a captured e-mail. */
export function tokenFromMail(
  mail: CapturedMail,
  path: '/reset-password' | '/accept-invitation' | '/confirm-sign-up',
): string {
  const match = new RegExp(
    `${TEST_APP_URL.replace(/[.]/g, '\\.')}${path}\\?token=([A-Za-z0-9_-]+)`,
  ).exec(mail.text);
  if (match?.[1] === undefined) throw new Error(`no ${path} link in the e-mail:\n${mail.text}`);
  return match[1];
}

export function uniqueEmail(label = 'user'): string {
  return `${label}-${randomUUID().slice(0, 12)}@test.example`;
}

export interface SignedUp {
  token: string;
  email: string;
  password: string;
  user: { id: string; name: string; email: string; role: Role; active: boolean; createdAt: string };
  firm: { id: string; name: string; plan: Plan; seats: number };
}

/**
 * Signs up a brand-new firm through the API (Concept plan, one owner): the sign-up, its e-mailed
 * link, and the confirmation that creates the firm and signs the owner in.
 */
export async function signUpFirm(h: ApiHarness, label = 'firm'): Promise<SignedUp> {
  const email = uniqueEmail(`${label}-owner`);
  const asked = await h
    .http()
    .post('/api/v1/auth/signup')
    .send({
      firmName: `${label} ${randomUUID().slice(0, 6)} Ltd`,
      name: `Owner of ${label}`,
      email,
      password: TEST_PASSWORD,
    });
  if (asked.status !== 202)
    throw new Error(`signup failed: ${asked.status} ${JSON.stringify(asked.body)}`);
  const link = await h.waitForMail(email);
  const token = tokenFromMail(link, '/confirm-sign-up');
  // Consumed here, so a test's next waitForMail(email) finds the mail it is about.
  h.mail.splice(h.mail.indexOf(link), 1);
  const res = await h.http().post('/api/v1/auth/signup/confirm').send({ token });
  if (res.status !== 201)
    throw new Error(`signup confirmation failed: ${res.status} ${JSON.stringify(res.body)}`);
  const body = res.body as Omit<SignedUp, 'email' | 'password'>;
  return { ...body, email, password: TEST_PASSWORD };
}

/** Moves a firm to another plan (billing is not part of the foundation). */
export async function setPlan(
  h: ApiHarness,
  firmId: string,
  plan: Plan,
  seats: number,
): Promise<void> {
  await h.models.Firm.update({ plan, seats }, { where: { id: firmId } });
}

let cachedHash: Promise<string> | undefined;

/** Adds a member straight into the database (password TEST_PASSWORD) and returns a token for them. */
export async function addMember(
  h: ApiHarness,
  firmId: string,
  role: Role,
  options: { active?: boolean } = {},
): Promise<{ id: string; email: string; token: string }> {
  const { hashPassword } = await import('../../api/src/security');
  cachedHash ??= hashPassword(TEST_PASSWORD);
  const email = uniqueEmail(role);
  const user = await h.models.User.create({
    firmId,
    name: `${role} ${email.slice(0, 12)}`,
    email,
    passwordHash: await cachedHash,
    role,
    active: options.active ?? true,
  });
  return { id: user.id, email, token: h.issueToken(user) };
}

/** POST /auth/login through a fresh client. */
export function login(h: ApiHarness, email: string, password: string) {
  return h.http().post('/api/v1/auth/login').send({ email, password });
}

export const bearer = (token: string) => ({ Authorization: `Bearer ${token}` });

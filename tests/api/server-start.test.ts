// The server's start-up in production: it refuses to run without its secrets and settings,
// saying which, and it reports the database's durability settings as it starts.
import { QueryTypes, Sequelize } from 'sequelize';
import { describe, expect, it } from 'vitest';
import { loadConfig } from '../../api/src/config/env';
import { runApiProcessToExit, serverEnv, startApiProcess } from '../support/api-process';

const databaseUrl = () => {
  const url = process.env.DATABASE_URL;
  if (url === undefined || url === '') throw new Error('DATABASE_URL must be set');
  return url;
};

describe('configuration in production', () => {
  const complete = () => serverEnv('postgres://u:p@127.0.0.1:5432/db');

  it('accepts a complete production environment', () => {
    const config = loadConfig(complete());
    expect(config.nodeEnv).toBe('production');
    expect(config.databasePoolMax).toBe(10);
  });

  it.each([
    ['JWT_SECRET', /JWT_SECRET or JWT_SECRET_FILE is required/],
    ['DATABASE_URL', /DATABASE_URL is required/],
    ['SMTP_HOST', /SMTP_HOST is required in production/],
    ['SMTP_PORT', /SMTP_PORT is required in production/],
    ['APP_URL', /APP_URL is required in production/],
    ['STRIPE_SECRET_KEY', /STRIPE_SECRET_KEY is required in production/],
    ['STRIPE_WEBHOOK_SECRET', /STRIPE_WEBHOOK_SECRET is required in production/],
  ])('refuses a production environment without %s', (name, message) => {
    const env: Record<string, string | undefined> = complete();
    delete env[name];
    expect(() => loadConfig(env)).toThrow(message);
  });

  it('still defaults mail and address in development', () => {
    const env: Record<string, string | undefined> = { ...complete(), NODE_ENV: 'development' };
    for (const name of ['SMTP_HOST', 'SMTP_PORT', 'APP_URL']) delete env[name];
    expect(loadConfig(env).smtpHost).toBe('127.0.0.1');
  });

  it('reads DATABASE_POOL_MAX as a whole number from 1 to 100', () => {
    expect(loadConfig({ ...complete(), DATABASE_POOL_MAX: '1' }).databasePoolMax).toBe(1);
    expect(() => loadConfig({ ...complete(), DATABASE_POOL_MAX: '0' })).toThrow(
      /DATABASE_POOL_MAX must be a whole number from 1 to 100/,
    );
    expect(() => loadConfig({ ...complete(), DATABASE_POOL_MAX: 'many' })).toThrow(
      /DATABASE_POOL_MAX/,
    );
  });
});

describe('the server process', () => {
  it('refuses to start in production without its secrets, naming each, and exits 1', async () => {
    const { code, output } = await runApiProcessToExit({ NODE_ENV: 'production' });
    expect(code).toBe(1);
    expect(output).toMatch(/Invalid configuration/);
    for (const message of [
      /JWT_SECRET or JWT_SECRET_FILE is required: there is no default signing secret/,
      /DATABASE_URL is required/,
      /SMTP_HOST is required in production/,
      /SMTP_PORT is required in production/,
      /APP_URL is required in production/,
      /STRIPE_SECRET_KEY is required in production/,
      /STRIPE_WEBHOOK_SECRET is required in production/,
    ])
      expect(output).toMatch(message);
    expect(output).not.toMatch(/listening on/);
  });

  it('refuses a signing secret that is too short', async () => {
    const env = { ...serverEnv(databaseUrl()), JWT_SECRET: 'short' };
    const { code, output } = await runApiProcessToExit(env);
    expect(code).toBe(1);
    expect(output).toMatch(/The JWT secret must be at least 32 characters long/);
  });

  it("logs the database's durability settings at start, as the database reports them", async () => {
    // The same settings asked of the database directly, without the server's code.
    const direct = new Sequelize(databaseUrl(), { dialect: 'postgres', logging: false });
    const expected: Record<string, string> = {};
    try {
      for (const name of ['fsync', 'synchronous_commit', 'full_page_writes']) {
        const rows = await direct.query<Record<string, string>>(`SHOW ${name}`, {
          type: QueryTypes.SELECT,
        });
        expected[name] = rows[0]?.[name] ?? 'missing';
      }
    } finally {
      await direct.close();
    }

    const api = await startApiProcess(serverEnv(databaseUrl()));
    try {
      const lines = api
        .output()
        .split('\n')
        .filter((line) => line.startsWith('{'))
        .map((line) => JSON.parse(line) as { msg?: string; durability?: Record<string, string> });
      const logged = lines.find((line) => line.msg?.startsWith('database durability settings'));
      expect(logged?.durability).toEqual(expected);
    } finally {
      await api.stop();
    }
  });
});

// A real API process (api/src/server.ts under tsx), for the proofs that need one: start-up
// checks, the database stop-and-restart drill. Listens on a free loopback port.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { TEST_APP_URL, TEST_JWT_SECRET } from './api-app';

export const ROOT = fileURLToPath(new URL('../..', import.meta.url));
const NODE_TSX = ['--import', 'tsx', '--conditions=@basinwright/source'];

/** What a server process needs besides its database, as the tests give it. */
export function serverEnv(databaseUrl: string): Record<string, string> {
  return {
    NODE_ENV: 'production',
    HOST: '127.0.0.1',
    PORT: '0',
    DATABASE_URL: databaseUrl,
    JWT_SECRET: TEST_JWT_SECRET,
    BCRYPT_COST: '10',
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: '1',
    APP_URL: TEST_APP_URL,
    LOG_LEVEL: 'info',
    WEB_DIST: '',
    // Required in production; these processes never call the payment service, and if one did it
    // would meet a closed loopback port, never the outside world.
    STRIPE_SECRET_KEY: 'sk_test_process',
    STRIPE_WEBHOOK_SECRET: 'whsec_test_process',
    STRIPE_API_BASE: 'http://127.0.0.1:9',
  };
}

/** process.env without the variables the server reads, so a test says exactly what it sets. */
function cleanEnv(): NodeJS.ProcessEnv {
  const env = { ...process.env };
  for (const key of Object.keys(env)) {
    if (
      /^(NODE_ENV|HOST|PORT|DATABASE_|JWT_|BCRYPT_|SMTP_|MAIL_|APP_URL|LOG_LEVEL|WEB_DIST|TRUST_PROXY|MIGRATE_|STRIPE_|BILLING_)/.test(
        key,
      )
    )
      delete env[key];
  }
  return env;
}

/** Runs a TypeScript entry point to completion (e.g. the migration CLI). */
export function runTsSync(file: string, env: Record<string, string>) {
  return spawnSync(process.execPath, [...NODE_TSX, file], {
    cwd: ROOT,
    env: { ...cleanEnv(), ...env },
    encoding: 'utf8',
  });
}

/** The server process with its stdout and stderr gathered into one text. */
function spawnServer(env: Record<string, string>): { child: ChildProcess; output(): string } {
  const child = spawn(process.execPath, [...NODE_TSX, 'api/src/server.ts'], {
    cwd: ROOT,
    env: { ...cleanEnv(), ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let out = '';
  child.stdout?.on('data', (chunk: Buffer) => (out += chunk.toString('utf8')));
  child.stderr?.on('data', (chunk: Buffer) => (out += chunk.toString('utf8')));
  return { child, output: () => out };
}

export interface ApiProcess {
  child: ChildProcess;
  /** http://127.0.0.1:PORT once it listens */
  url: string;
  /** everything written to stdout and stderr so far */
  output(): string;
  stop(): Promise<void>;
}

/** Starts the server and waits until it says where it listens (or exits first). */
export async function startApiProcess(
  env: Record<string, string>,
  timeoutMs = 60_000,
): Promise<ApiProcess> {
  const { child, output } = spawnServer(env);
  const stop = async () => {
    if (child.exitCode !== null || child.signalCode !== null) return;
    const exited = new Promise((resolve) => child.once('exit', resolve));
    // The server shuts down on SIGTERM (server.ts); if it ever did not, the calling hook's own
    // timeout reports it rather than a kill that would hide the fault.
    child.kill('SIGTERM');
    await exited;
  };
  const url = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => {
      void stop();
      reject(new Error(`the API did not start within ${timeoutMs} ms:\n${output()}`));
    }, timeoutMs);
    const onData = () => {
      const match = /listening on (http:\/\/127\.0\.0\.1:\d+)\//.exec(output());
      if (match?.[1] === undefined) return;
      clearTimeout(timer);
      child.stdout?.off('data', onData);
      resolve(match[1]);
    };
    child.stdout?.on('data', onData);
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`the API exited (${code}) before listening:\n${output()}`));
    });
  });
  return { child, url, output, stop };
}

/** Runs the server until it exits by itself (start-up refusals); its exit code and output. */
export async function runApiProcessToExit(
  env: Record<string, string>,
  timeoutMs = 60_000,
): Promise<{ code: number | null; output: string }> {
  const { child, output } = spawnServer(env);
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => {
      child.kill('SIGKILL');
      reject(new Error(`the API kept running for ${timeoutMs} ms:\n${output()}`));
    }, timeoutMs);
    child.once('close', (code) => {
      clearTimeout(timer);
      resolve({ code, output: output() });
    });
  });
}

/** Polls `probe` until it returns true; throws after `capMs` (a cap, not a timing check). */
export async function waitUntil(
  what: string,
  probe: () => Promise<boolean> | boolean,
  capMs = 60_000,
): Promise<void> {
  const deadline = Date.now() + capMs;
  for (;;) {
    if (await probe()) return;
    if (Date.now() > deadline) throw new Error(`gave up waiting for ${what} after ${capMs} ms`);
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}

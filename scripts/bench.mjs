// `npm run bench`: speed targets, measured (never asserted in tests). Starts a throwaway
// PostgreSQL like `npm test`, then runs the engine and HTTP benchmarks, then the browser one
// (the built app on a seeded database, in Chromium) in one go. `npm run bench -- engine` (or
// http, browser) runs only the ones named.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import {
  PrivateCluster,
  ROOT,
  buildWeb,
  ensureChromium,
  ensureNodeModules,
  ensurePostgres,
  freePort,
  log,
  runTs,
  startTs,
  stopChild,
  waitForHttp,
} from './lib.mjs';

const only = process.argv.slice(2);
const wanted = (name) => only.length === 0 || only.includes(name);
ensureNodeModules();
const bin = ensurePostgres();
const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'basinwright-bench-'));
fs.chmodSync(tmp, 0o755); // the postgres user must reach its folders
const cluster = new PrivateCluster({ dir: path.join(tmp, 'pg'), port: await freePort(), bin });
let code = 0;
let app;
try {
  await cluster.start();
  cluster.ensureDatabase('bw_bench');
  const env = {
    NODE_ENV: 'production',
    DATABASE_URL: cluster.url('bw_bench'),
    JWT_SECRET: `bench-only-${Date.now()}-${Math.random().toString(36).slice(2)}-secret`,
    BCRYPT_COST: '10',
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: '1',
    APP_URL: 'http://127.0.0.1',
    LOG_LEVEL: 'silent',
  };
  runTs('api/src/db/migrate.ts', env, { quiet: true });
  if (wanted('engine')) {
    log('engine benchmark');
    runTs('scripts/bench-engine.ts', env);
  }
  if (wanted('http')) {
    log('HTTP benchmark');
    runTs('scripts/bench-http.ts', env);
  }
  if (wanted('browser')) {
    log('browser benchmark (Chromium, CPU 4× slower)');
    const chromium = ensureChromium();
    runTs('seed/run.ts', env, { quiet: true });
    buildWeb();
    const appPort = await freePort();
    const appEnv = {
      ...env,
      HOST: '127.0.0.1',
      PORT: String(appPort),
      APP_URL: `http://127.0.0.1:${appPort}`,
      WEB_DIST: path.join(ROOT, 'web', 'dist'),
    };
    app = startTs('api (bench)', 'api/src/server.ts', appEnv);
    await waitForHttp(`http://127.0.0.1:${appPort}/api/v1/health`, 60000);
    runTs('scripts/bench-browser.ts', {
      ...appEnv,
      E2E_BASE_URL: `http://127.0.0.1:${appPort}`,
      CHROMIUM_PATH: chromium,
    });
  }
} catch (err) {
  code = 1;
  process.stderr.write(`bench failed: ${err instanceof Error ? err.message : String(err)}\n`);
} finally {
  await stopChild(app);
  cluster.stop();
  fs.rmSync(tmp, { recursive: true, force: true });
}
process.exit(code);

// `npm run bench`: speed targets, measured (never asserted in tests). Starts a throwaway
// PostgreSQL like `npm test`, then runs the engine and HTTP benchmarks in one go.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { PrivateCluster, ensureNodeModules, ensurePostgres, freePort, log, runTs } from './lib.mjs';

ensureNodeModules();
const bin = ensurePostgres();
const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'basinwright-bench-'));
fs.chmodSync(tmp, 0o755); // the postgres user must reach its folders
const cluster = new PrivateCluster({ dir: path.join(tmp, 'pg'), port: await freePort(), bin });
let code = 0;
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
  log('engine benchmark');
  runTs('scripts/bench-engine.ts', env);
  log('HTTP benchmark');
  runTs('scripts/bench-http.ts', env);
  log('project list benchmark (100,000 projects across 200 firms)');
  runTs('scripts/bench-list.ts', env);
} catch (err) {
  code = 1;
  process.stderr.write(`bench failed: ${err instanceof Error ? err.message : String(err)}\n`);
} finally {
  cluster.stop();
  fs.rmSync(tmp, { recursive: true, force: true });
}
process.exit(code);

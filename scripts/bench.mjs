// `npm run bench`: speed targets, measured (never asserted in tests). Starts a throwaway
// PostgreSQL like `npm test`, then runs the engine and HTTP benchmarks, then the browser one
// (the built app on a seeded database, in Chromium) in one go. Each script records its figures
// (scripts/bench-results.ts); at the end this prints every ratio against its target and writes
// all figures to .bench/latest.json (and a dated copy) to compare runs. `npm run bench --
// engine` (or http, proposal, browser, firstload, list) runs only the ones named.
import { execFileSync } from 'node:child_process';
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

/** Prints the ratios against their targets and writes every figure to .bench/. */
function report(resultsFile) {
  const text = fs.existsSync(resultsFile) ? fs.readFileSync(resultsFile, 'utf8') : '';
  const measurements = text
    .split('\n')
    .filter((l) => l.trim() !== '')
    .map((l) => JSON.parse(l));
  log('');
  log('summary (ratios, and every figure with a target, from this run):');
  for (const m of measurements.filter((x) => x.unit === 'ratio' || x.target)) {
    const met = m.target
      ? (m.target.op === '>=' ? m.value >= m.target.value : m.value <= m.target.value)
        ? 'MET'
        : 'NOT MET'
      : '';
    const goal = m.target ? `target ${m.target.op === '>=' ? '≥' : '≤'} ${m.target.value}` : '';
    const value = m.unit === 'ratio' ? m.value.toFixed(3) : `${m.value.toFixed(1)} ${m.unit}`;
    log(`  ${m.label.padEnd(52)} ${value.padStart(10)}  ${goal} ${met}`);
  }
  let commit = null;
  try {
    commit = execFileSync('git', ['rev-parse', 'HEAD'], { cwd: ROOT, encoding: 'utf8' }).trim();
  } catch {
    // not a git checkout
  }
  const out = {
    date: new Date().toISOString(),
    commit,
    node: process.version,
    cpus: os.cpus().length,
    loadAverage: os.loadavg(),
    measurements,
  };
  const dir = path.join(ROOT, '.bench');
  fs.mkdirSync(dir, { recursive: true });
  const json = `${JSON.stringify(out, null, 2)}\n`;
  fs.writeFileSync(path.join(dir, 'latest.json'), json);
  fs.writeFileSync(path.join(dir, `${out.date.replace(/[:.]/g, '-')}.json`), json);
  log(`all figures written to ${path.relative(ROOT, path.join(dir, 'latest.json'))}`);
}

const only = process.argv.slice(2);
const wanted = (name) => only.length === 0 || only.includes(name);
ensureNodeModules();
const bin = ensurePostgres();
const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'basinwright-bench-'));
fs.chmodSync(tmp, 0o755); // the postgres user must reach its folders
const cluster = new PrivateCluster({ dir: path.join(tmp, 'pg'), port: await freePort(), bin });
const resultsFile = path.join(tmp, 'results.jsonl');
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
    // Required in production; the benchmarks never reach billing (a closed loopback port if so).
    STRIPE_SECRET_KEY: 'sk_test_bench',
    STRIPE_WEBHOOK_SECRET: 'whsec_test_bench',
    STRIPE_API_BASE: 'http://127.0.0.1:9',
    BENCH_RESULTS: resultsFile,
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
  if (wanted('proposal')) {
    log('proposal benchmark (render time, /health while five proposals render)');
    runTs('scripts/bench-proposal.ts', env);
  }
  if (wanted('browser') || wanted('firstload')) {
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
    const browserEnv = {
      ...appEnv,
      E2E_BASE_URL: `http://127.0.0.1:${appPort}`,
      CHROMIUM_PATH: chromium,
    };
    if (wanted('browser')) {
      log('browser benchmark (Chromium, CPU 4× slower)');
      runTs('scripts/bench-browser.ts', browserEnv);
    }
    if (wanted('firstload')) {
      log(
        'first-load benchmark (Chromium: scripts loaded; CPU 4× slower: long tasks, time to results)',
      );
      runTs('scripts/bench-first-load.ts', browserEnv);
    }
  }
  if (wanted('list')) {
    log('project list benchmark (100,000 projects across 200 firms)');
    runTs('scripts/bench-list.ts', env);
  }
  report(resultsFile);
} catch (err) {
  code = 1;
  process.stderr.write(`bench failed: ${err instanceof Error ? err.message : String(err)}\n`);
} finally {
  await stopChild(app);
  cluster.stop();
  fs.rmSync(tmp, { recursive: true, force: true });
}
process.exit(code);

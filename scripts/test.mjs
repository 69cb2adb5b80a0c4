// `npm test`: the same set-up as `npm start` on a throwaway PostgreSQL cluster (temporary
// folder, free port), then every test — type-checks, unit, API and end-to-end — and one closing
// line `N passed, N failed`. Cleans up even when tests fail. Extra arguments go to vitest
// (e.g. `npm test -- --project common`).
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
  ensurePoppler,
  freePort,
  log,
  run,
  runTs,
  startChild,
  startFakeStripe,
  startMaildev,
  startTs,
  stopChild,
  waitForHttp,
} from './lib.mjs';

const extra = process.argv.slice(2);
const partial = extra.length > 0;
const children = [];
let cluster;
let tmp;
let passed = 0;
let failed = 0;

async function cleanup() {
  for (const c of children.reverse()) await stopChild(c);
  cluster?.stop();
  if (tmp) fs.rmSync(tmp, { recursive: true, force: true });
}

let interrupted = false;
for (const sig of ['SIGINT', 'SIGTERM']) {
  process.on(sig, async () => {
    if (interrupted) return;
    interrupted = true;
    await cleanup();
    process.exit(130);
  });
}

/** A check outside vitest (a type-check) counts as one test. */
function check(name, cmd, args) {
  log(`check: ${name}`);
  const res = run(cmd, args, { quiet: true, allowFail: true });
  if (res.status === 0) {
    passed += 1;
  } else {
    failed += 1;
    process.stdout.write(`FAILED ${name}\n${res.stdout}${res.stderr}\n`);
  }
}

function readVitestJson(file) {
  if (!fs.existsSync(file)) return null;
  const report = JSON.parse(fs.readFileSync(file, 'utf8'));
  let p = report.numPassedTests ?? 0;
  let f = report.numFailedTests ?? 0;
  // A test file that failed to load has no assertion results; the totals leave it out.
  for (const tr of report.testResults ?? []) {
    if (tr.status === 'failed' && (tr.assertionResults ?? []).length === 0) {
      f += 1;
      process.stdout.write(
        `FAILED to load: ${path.relative(ROOT, tr.name)}\n${tr.message ?? ''}\n`,
      );
    }
  }
  return { passed: p, failed: f };
}

async function main() {
  ensureNodeModules();
  const bin = ensurePostgres();
  ensureChromium();
  ensurePoppler();

  if (!partial) {
    check('type-check common', 'npx', ['tsc', '--noEmit', '-p', 'common']);
    check('type-check api', 'npx', ['tsc', '--noEmit', '-p', 'api']);
    check('type-check tests', 'npx', ['tsc', '--noEmit', '-p', 'tests']);
    check('type-check web', 'npx', ['vue-tsc', '--noEmit', '-p', 'web']);
    check('type-check web tests', 'npx', ['vue-tsc', '--noEmit', '-p', 'tests/web']);
    check('lint', 'npx', ['eslint', '.']);
    check('format (prettier --check)', 'npx', ['prettier', '--check', '.']);
  }

  tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'basinwright-test-'));
  fs.chmodSync(tmp, 0o755); // the postgres user must reach its folders
  cluster = new PrivateCluster({ dir: path.join(tmp, 'pg'), port: await freePort(), bin });
  await cluster.start();
  cluster.ensureDatabase('bw_api');
  cluster.ensureDatabase('bw_e2e');

  const smtpPort = await freePort();
  // Two API processes on one database; the browser reaches them through a proxy that sends
  // each request to the next one in turn (tests/e2e/two-processes.test.ts checks both served).
  const appPort = await freePort();
  const apiPorts = { first: await freePort(), second: await freePort() };
  // The payment service's stand-in, its events sent through the proxy like the browser's requests.
  const payments = await startFakeStripe({
    port: await freePort(),
    webhookUrl: `http://127.0.0.1:${appPort}/api/v1/billing/webhook`,
  });
  children.push(payments.child);
  const e2eEnv = {
    NODE_ENV: 'production',
    HOST: '127.0.0.1',
    DATABASE_URL: cluster.url('bw_e2e'),
    JWT_SECRET: `test-only-${Date.now()}-${Math.random().toString(36).slice(2)}-e2e-secret`,
    BCRYPT_COST: '10',
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(smtpPort),
    APP_URL: `http://127.0.0.1:${appPort}`,
    WEB_DIST: path.join(ROOT, 'web', 'dist'),
    LOG_LEVEL: 'warn',
    ...payments.settings,
  };
  runTs('api/src/db/migrate.ts', e2eEnv, { quiet: true });
  runTs('seed/run.ts', e2eEnv, { quiet: true });
  buildWeb();
  // Its web port serves the REST API the end-to-end tests read sign-up links from.
  const mailWebPort = await freePort();
  children.push(startMaildev({ smtpPort, webPort: mailWebPort, mailDir: null }));
  for (const [name, port] of Object.entries(apiPorts)) {
    children.push(
      startTs(`api (e2e, ${name})`, 'api/src/server.ts', { ...e2eEnv, PORT: String(port) }),
    );
  }
  children.push(
    startChild('proxy (e2e)', process.execPath, [
      'scripts/alternate-proxy.mjs',
      String(appPort),
      ...Object.entries(apiPorts).map(([name, port]) => `${name}=${port}`),
    ]),
  );
  for (const port of [...Object.values(apiPorts), appPort])
    await waitForHttp(`http://127.0.0.1:${port}/api/v1/health`, 60000);

  const jsonFile = path.join(tmp, 'vitest.json');
  log('running vitest (common, api, web, e2e)…');
  const res = run(
    'npx',
    [
      'vitest',
      'run',
      '--reporter=default',
      '--reporter=json',
      `--outputFile.json=${jsonFile}`,
      ...extra,
    ],
    {
      allowFail: true,
      env: {
        DATABASE_URL: cluster.url('bw_api'),
        // The whole API suite on one connection: no request may need two at once.
        DATABASE_POOL_MAX: '1',
        E2E_BASE_URL: `http://127.0.0.1:${appPort}`,
        E2E_MAIL_URL: `http://127.0.0.1:${mailWebPort}`,
        CHROMIUM_PATH: '/usr/bin/chromium',
        LOG_LEVEL: 'silent',
      },
    },
  );
  const counts = readVitestJson(jsonFile);
  if (counts) {
    passed += counts.passed;
    failed += counts.failed;
    if (res.status !== 0 && counts.failed === 0) failed += 1; // vitest failed for another reason
  } else {
    failed += 1;
    process.stdout.write('FAILED vitest produced no report\n');
  }
}

try {
  await main();
} catch (err) {
  failed += 1;
  process.stdout.write(`FAILED set-up: ${err instanceof Error ? err.message : String(err)}\n`);
} finally {
  await cleanup();
  process.stdout.write(`${passed} passed, ${failed} failed\n`);
  process.exit(failed > 0 ? 1 : 0);
}

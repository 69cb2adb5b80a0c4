// `npm start`: installs what is missing, starts a private PostgreSQL under .data/, migrates,
// seeds the demo, builds the web app and serves app + API (and the mail capture) on 127.0.0.1.
// `npm run dev` does the same but serves the web app from Vite with hot reload.
import path from 'node:path';
import {
  PrivateCluster,
  ROOT,
  buildWeb,
  ensureNodeModules,
  ensurePostgres,
  freePort,
  loadDotEnv,
  log,
  portIsFree,
  runTs,
  secretFile,
  startChild,
  startFakeStripe,
  startMaildev,
  startTs,
  stopChild,
  Supervisor,
  waitForHttp,
} from './lib.mjs';

const dev = process.argv.includes('--dev');
const children = [];
let cluster;
let api;
let stopping = false;

async function shutdown(code = 0) {
  if (stopping) return;
  stopping = true;
  log('stopping…');
  await api?.stop();
  for (const c of children.reverse()) await stopChild(c);
  cluster?.stop();
  process.exit(code);
}
process.on('SIGINT', () => void shutdown(0));
process.on('SIGTERM', () => void shutdown(0));

/**
 * PostgreSQL is kept running too: checked every few seconds and started again, saying so, if
 * it stopped (the API answers 503 meanwhile and reconnects by itself). A failed restart waits
 * twice as long before the next try, up to a minute.
 */
function watchPostgres() {
  let wait = 5000;
  const check = async () => {
    if (stopping) return;
    if (!cluster.isRunning()) {
      log(
        `PostgreSQL is not running (see ${path.relative(ROOT, cluster.logDir)}/server.log); starting it again`,
      );
      try {
        await cluster.start();
        wait = 5000;
      } catch (err) {
        wait = Math.min(60_000, wait * 2);
        log(
          `PostgreSQL did not start (${err instanceof Error ? err.message : String(err)}); next try in ${wait / 1000} s`,
        );
      }
    }
    setTimeout(() => void check(), wait).unref();
  };
  setTimeout(() => void check(), wait).unref();
}

async function pickPort(preferred) {
  return (await portIsFree(preferred)) ? preferred : freePort();
}

async function main() {
  loadDotEnv();
  const port = Number(process.env.PORT ?? 8080);
  const pgPort = Number(process.env.PGPORT ?? 54329);
  const dataDir = path.join(ROOT, '.data');

  ensureNodeModules();
  const bin = ensurePostgres();

  cluster = new PrivateCluster({ dir: path.join(dataDir, 'pg'), port: pgPort, bin });
  await cluster.start();
  cluster.ensureDatabase('basinwright');

  const smtpPort = await pickPort(Number(process.env.SMTP_PORT ?? 1025));
  const mailWebPort = await pickPort(Number(process.env.MAIL_WEB_PORT ?? 1080));
  const payPort = await pickPort(Number(process.env.FAKE_STRIPE_PORT ?? 12111));
  // The payment service: the local stand-in unless a real key is configured. Its state is kept
  // beside the database (the customers and subscriptions the firms refer to).
  let payments = null;
  if (!process.env.STRIPE_SECRET_KEY) {
    payments = await startFakeStripe({
      port: payPort,
      webhookUrl: `http://127.0.0.1:${port}/api/v1/billing/webhook`,
      stateFile: path.join(dataDir, 'fake-stripe.json'),
    });
    children.push(payments.child);
  }
  const env = {
    NODE_ENV: dev ? 'development' : 'production',
    HOST: '127.0.0.1',
    PORT: String(port),
    DATABASE_URL: process.env.DATABASE_URL ?? cluster.url('basinwright'),
    ...(process.env.JWT_SECRET ? {} : { JWT_SECRET_FILE: path.join(dataDir, 'jwt-secret') }),
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(smtpPort),
    MAIL_FROM: process.env.MAIL_FROM ?? 'Basinwright <no-reply@basinwright.invalid>',
    APP_URL: process.env.APP_URL ?? `http://127.0.0.1:${dev ? 5173 : port}`,
    ...(dev ? {} : { WEB_DIST: path.join(ROOT, 'web', 'dist') }),
    ...(payments ? payments.settings : {}),
  };
  if (!process.env.JWT_SECRET) secretFile(env.JWT_SECRET_FILE);

  log('migrating the database…');
  runTs('api/src/db/migrate.ts', env);
  log('loading the demo data…');
  runTs('seed/run.ts', env);

  if (!dev) buildWeb();

  children.push(
    startMaildev({ smtpPort, webPort: mailWebPort, mailDir: path.join(dataDir, 'mail') }),
  );
  // The API is kept up: if it ever exits unexpectedly it is started again (with a growing
  // pause if it keeps failing) while PostgreSQL and the mail capture run on.
  api = new Supervisor('the API', () =>
    startTs('api', 'api/src/server.ts', env, { supervised: true }),
  );
  api.run();
  await waitForHttp(`http://127.0.0.1:${port}/api/v1/health`, 60000);

  let url = `http://127.0.0.1:${port}/`;
  if (dev) {
    const vite = startChild(
      'vite',
      'npm',
      ['run', 'dev', '-w', 'web', '--', '--port', '5173', '--strictPort'],
      {
        API_PORT: String(port),
      },
    );
    children.push(vite);
    url = 'http://127.0.0.1:5173/';
  }

  watchPostgres();

  log('');
  log(`Basinwright is running at ${url}`);
  log(`Sent e-mail (password resets, invitations): http://127.0.0.1:${mailWebPort}/`);
  if (payments) log(`Payments: a local stand-in on http://127.0.0.1:${payPort}/ (no money moves)`);
  log('Demo sign-ins (password for all: basinwright-demo):');
  for (const role of ['owner', 'admin', 'engineer', 'estimator', 'viewer']) {
    log(`  ${role.padEnd(9)} ${role}@harrow-lune.example`);
  }
  log('Press Ctrl-C to stop (PostgreSQL included). Data is kept in .data/.');
}

main().catch(async (err) => {
  process.stderr.write(
    `[basinwright] start failed: ${err instanceof Error ? err.message : String(err)}\n`,
  );
  await shutdown(1);
});

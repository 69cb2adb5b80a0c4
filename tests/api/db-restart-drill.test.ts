// The database stop-and-restart drill, kept in the suite: an API process writes projects
// without pause into a PostgreSQL cluster this test owns; the cluster is stopped
// (pg_ctl -m fast) and started again. While it is down the API answers 503 and stays up;
// afterwards writes succeed again, and every write the API acknowledged (201) is in the
// database. No timing is asserted: each wait is for a condition, with a generous cap.
import { mkdtempSync, rmSync, chmodSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import bcrypt from 'bcryptjs';
import { QueryTypes, Sequelize } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PrivateCluster, ensurePostgres, freePort } from '../../scripts/lib.mjs';
import { TEST_PASSWORD, uniqueEmail } from '../support/api-app';
import {
  runTsSync,
  serverEnv,
  startApiProcess,
  waitUntil,
  type ApiProcess,
} from '../support/api-process';

const WRITERS = 4;
const DRILL_DB = 'bw_drill';

let dir = '';
let cluster: PrivateCluster | undefined;
let api: ApiProcess | undefined;

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'basinwright-drill-'));
  chmodSync(dir, 0o755); // the postgres user must reach its folders
  cluster = new PrivateCluster({
    dir: join(dir, 'pg'),
    port: await freePort(),
    bin: ensurePostgres(),
  });
  await cluster.start();
  cluster.ensureDatabase(DRILL_DB);
  const env = serverEnv(cluster.url(DRILL_DB));
  const migrated = runTsSync('api/src/db/migrate.ts', env);
  if (migrated.status !== 0)
    throw new Error(`migration failed:\n${migrated.stdout}${migrated.stderr}`);
  api = await startApiProcess({ ...env, LOG_LEVEL: 'warn' });
}, 120_000);

afterAll(async () => {
  await api?.stop();
  cluster?.stop();
  if (dir !== '') rmSync(dir, { recursive: true, force: true });
});

interface Tally {
  acknowledged: string[];
  statuses: Map<number, number>;
  /** requests the API did not answer at all (connection refused or reset) */
  unanswered: number;
}

describe('PostgreSQL stopped and restarted under writes', () => {
  it(
    'answers 503 while the database is down, stays up, recovers, and loses no acknowledged write',
    { timeout: 240_000 },
    async () => {
      if (api === undefined || cluster === undefined) throw new Error('set-up did not finish');
      const base = api.url;

      // Sign-up finishes through an e-mailed link (auth.test.ts covers it); the drill's API has
      // no mail capture, so its firm (on the Firm plan: the drill writes many projects) and owner
      // are written straight into its database, and the owner signs in through the API.
      const email = uniqueEmail('drill');
      const db = new Sequelize(cluster.url(DRILL_DB), { dialect: 'postgres', logging: false });
      try {
        const passwordHash = await bcrypt.hash(TEST_PASSWORD, 4);
        await db.query(
          `WITH f AS (INSERT INTO firms (id, name, plan, seats) VALUES (gen_random_uuid(), 'Drill firm', 'firm', 5) RETURNING id)
           INSERT INTO users (id, firm_id, name, email, password_hash, role)
           SELECT gen_random_uuid(), f.id, 'Drill owner', :email, :passwordHash, 'owner' FROM f`,
          { replacements: { email, passwordHash } },
        );
      } finally {
        await db.close();
      }
      const login = await fetch(`${base}/api/v1/auth/login`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ email, password: TEST_PASSWORD }),
      });
      expect(login.status).toBe(200);
      const { token, firm } = (await login.json()) as { token: string; firm: { id: string } };

      const tally: Tally = { acknowledged: [], statuses: new Map(), unanswered: 0 };
      let writing = true;
      let sequence = 0;
      const writer = async () => {
        while (writing) {
          sequence += 1;
          try {
            const res = await fetch(`${base}/api/v1/projects`, {
              method: 'POST',
              headers: { 'content-type': 'application/json', authorization: `Bearer ${token}` },
              body: JSON.stringify({ name: `Drill write ${sequence}`, units: 'SI' }),
            });
            tally.statuses.set(res.status, (tally.statuses.get(res.status) ?? 0) + 1);
            const body = (await res.json()) as { id?: string };
            if (res.status === 201 && typeof body.id === 'string') tally.acknowledged.push(body.id);
          } catch {
            tally.unanswered += 1;
            await new Promise((resolve) => setTimeout(resolve, 20));
          }
        }
      };
      const count = (status: number) => tally.statuses.get(status) ?? 0;
      const health = async () => (await fetch(`${base}/api/v1/health`)).status;

      const writers = Array.from({ length: WRITERS }, writer);
      try {
        await waitUntil('writes before the stop', () => tally.acknowledged.length >= 40);

        cluster.stop(); // pg_ctl -m fast -w stop: returns once the server is down
        const ackedBeforeDown = tally.acknowledged.length;
        const refusedBefore = count(503);
        await waitUntil(
          '503 answers while the database is down',
          () => count(503) >= refusedBefore + 20,
        );
        expect(await health()).toBe(503);
        expect(api.child.exitCode).toBeNull();

        await cluster.start();
        const ackedAtRestart = tally.acknowledged.length;
        // Writes recover: a generous cap, and no claim about how fast.
        await waitUntil(
          'writes after the restart',
          () => tally.acknowledged.length >= ackedAtRestart + 40,
          90_000,
        );
        expect(await health()).toBe(200);
        expect(ackedAtRestart - ackedBeforeDown).toBeLessThanOrEqual(WRITERS); // only writes in flight at the stop
      } finally {
        writing = false;
        await Promise.all(writers);
      }

      // Only created and "database unavailable" answers, and the process never stopped answering.
      // On failure, show what the API logged for answers other than 503.
      const otherFailures = api
        .output()
        .split('\n')
        .filter((line) => line.includes('"request failed"') && !line.includes('ConnectionRefused'))
        .map((line) => line.slice(0, 1500))
        .join('\n');
      expect([...tally.statuses.keys()].sort(), otherFailures).toEqual([201, 503]);
      expect(tally.unanswered).toBe(0);
      expect(api.child.exitCode).toBeNull();

      // Nothing acknowledged is lost.
      const check = new Sequelize(cluster.url(DRILL_DB), { dialect: 'postgres', logging: false });
      try {
        const rows = await check.query<{ id: string }>(
          'SELECT id FROM projects WHERE firm_id = :firm',
          {
            replacements: { firm: firm.id },
            type: QueryTypes.SELECT,
          },
        );
        const stored = new Set(rows.map((row) => row.id));
        const lost = tally.acknowledged.filter((id) => !stored.has(id));
        expect(tally.acknowledged.length).toBeGreaterThanOrEqual(80);
        expect(lost).toEqual([]);
      } finally {
        await check.close();
      }
    },
  );
});

// The connection pool holds at most DATABASE_POOL_MAX connections. `npm test` runs the whole
// API suite with DATABASE_POOL_MAX=1, which proves no request needs two connections at once
// (a transaction that also queried outside itself would wait for itself and fail).
import pg from 'pg';
import { QueryTypes } from 'sequelize';
import { expect, it } from 'vitest';
import { getConfig } from '../../api/src/config/env';
import { apiForFile } from '../support/api-app';
import { waitUntil } from '../support/api-process';

const h = apiForFile();
const LOCK = 7_421_001; // an advisory lock key of this test's own

it('opens no more connections than DATABASE_POOL_MAX, however many queries wait', async () => {
  const max = getConfig().databasePoolMax;
  expect(max).toBe(Number(process.env.DATABASE_POOL_MAX ?? 10));
  // A connection outside the pool holds the lock, so every pooled query blocks on it and keeps
  // its connection: the pool is saturated for as long as the test needs, with no timing.
  const holder = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await holder.connect();
  const blocked = async (): Promise<number> => {
    const { rows } = await holder.query<{ n: string }>(
      `SELECT count(*) AS n FROM pg_locks WHERE locktype = 'advisory' AND objid = $1 AND NOT granted`,
      [LOCK],
    );
    return Number(rows[0]?.n ?? 0);
  };
  try {
    await holder.query('SELECT pg_advisory_lock($1)', [LOCK]);
    // Twice as many queries as the pool allows, each reporting its server process.
    const queries = Promise.all(
      Array.from({ length: 2 * max + 2 }, () =>
        h.models.sequelize.query<{ pid: number }>(
          'SELECT pg_backend_pid() AS pid, pg_advisory_xact_lock_shared(:lock)',
          { type: QueryTypes.SELECT, replacements: { lock: LOCK } },
        ),
      ),
    );
    await waitUntil(
      `${max} pooled queries waiting on the lock`,
      async () => (await blocked()) >= max,
    );
    // Saturated: exactly the pool's connections wait; the other queries wait for a connection.
    expect(await blocked()).toBe(max);
    await holder.query('SELECT pg_advisory_unlock($1)', [LOCK]);
    const rows = await queries;
    const backends = new Set(rows.map((r) => r[0]?.pid));
    expect(backends.size).toBeGreaterThanOrEqual(1);
    expect(backends.size).toBeLessThanOrEqual(max);
  } finally {
    await holder.end();
  }
});

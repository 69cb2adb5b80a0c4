// The connection pool holds at most DATABASE_POOL_MAX connections. `npm test` runs the whole
// API suite with DATABASE_POOL_MAX=1, which proves no request needs two connections at once
// (a transaction that also queried outside itself would wait for itself and fail).
import { QueryTypes } from 'sequelize';
import { expect, it } from 'vitest';
import { getConfig } from '../../api/src/config/env';
import { apiForFile } from '../support/api-app';

const h = apiForFile();

it('opens no more connections than DATABASE_POOL_MAX, however many queries wait', async () => {
  const max = getConfig().databasePoolMax;
  expect(max).toBe(Number(process.env.DATABASE_POOL_MAX ?? 10));
  // Twice as many overlapping queries as the pool allows, each reporting its server process.
  const rows = await Promise.all(
    Array.from({ length: 2 * max + 2 }, () =>
      h.models.sequelize.query<{ pid: number }>(
        'SELECT pg_backend_pid() AS pid FROM pg_sleep(0.02)',
        { type: QueryTypes.SELECT },
      ),
    ),
  );
  const backends = new Set(rows.map((r) => r[0]?.pid));
  expect(backends.size).toBeGreaterThanOrEqual(1);
  expect(backends.size).toBeLessThanOrEqual(max);
});

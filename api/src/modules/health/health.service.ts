import type { Sequelize } from 'sequelize';

export interface Health {
  status: 'ok' | 'degraded';
  db: 'ok' | 'down';
}

const TIMEOUT_MS = 3_000;

/** Runs `SELECT 1` on the database, giving up after 3 s. */
export async function checkHealth(sequelize: Sequelize): Promise<Health> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<never>((_resolve, reject) => {
    timer = setTimeout(() => reject(new Error('database check timed out')), TIMEOUT_MS);
  });
  try {
    await Promise.race([sequelize.query('SELECT 1'), timeout]);
    return { status: 'ok', db: 'ok' };
  } catch {
    return { status: 'degraded', db: 'down' };
  } finally {
    clearTimeout(timer);
  }
}

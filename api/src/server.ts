// Entry point: connect, optionally migrate, listen; shut down cleanly on SIGTERM/SIGINT.
//   node --import tsx --conditions=@basinwright/source api/src/server.ts
import type { AddressInfo } from 'node:net';
import { ConfigError, getConfig } from './config/env';

async function main(): Promise<void> {
  let config;
  try {
    config = getConfig();
  } catch (error) {
    console.error(error instanceof ConfigError ? error.message : error);
    process.exit(1);
  }

  const { sequelize } = await import('./models');
  const { createApp } = await import('./app');
  const { createMigrator } = await import('./db/umzug');
  const { closeMail } = await import('./mail');
  const { startMailWorker, startProposalWorker, stopJobs } = await import('./jobs');
  const { closeComputePool, computePool } = await import('./modules/calc/calc.pool');
  const { logger } = await import('./logger');
  const { readDurability, weakDurability } = await import('./db/durability');
  const log = logger();

  try {
    await sequelize.authenticate();
  } catch (error) {
    console.error(
      `server: cannot reach the database — ${error instanceof Error ? error.message : String(error)}`,
    );
    process.exit(1);
  }
  // What a committed write survives is the database's business; say at start what it is.
  const durability = await readDurability(sequelize);
  const weak = weakDurability(durability);
  if (weak.length === 0) log.info({ durability }, 'database durability settings');
  else
    log.warn(
      { durability },
      `database durability settings: ${weak.join(', ')} off — acknowledged writes can be lost in a crash`,
    );
  if (config.migrateOnStart) {
    const applied = await createMigrator(sequelize).up();
    for (const migration of applied) log.info({ migration: migration.name }, 'migration applied');
  }

  // Mail queued by any API process (password resets, account notices) is sent by whichever
  // worker takes it; a failure here leaves the jobs queued for another process or a restart.
  startMailWorker().catch((error: unknown) => log.error({ err: error }, 'mail worker not started'));
  // Proposals queued by any process are drawn by whichever worker takes them (one at a time).
  startProposalWorker().catch((error: unknown) =>
    log.error({ err: error }, 'proposal worker not started'),
  );

  const app = createApp();
  computePool(); // start the engine's worker threads now, not on the first calculation
  const server = app.listen(config.port, config.host);
  server.on('error', (error) => {
    console.error(`server: cannot listen on ${config.host}:${config.port} — ${error.message}`);
    process.exit(1);
  });
  server.on('listening', () => {
    const { port } = server.address() as AddressInfo;
    console.log(`Basinwright API listening on http://${config.host}:${port}/ (API at /api/v1)`);
  });

  let stopping = false;
  const shutdown = (signal: string) => {
    if (stopping) return;
    stopping = true;
    log.info({ signal }, 'shutting down');
    // Give in-flight requests a moment; then stop regardless.
    const force = setTimeout(() => process.exit(1), 10_000);
    force.unref();
    server.close(() => {
      closeMail();
      Promise.all([closeComputePool(), stopJobs().catch(() => undefined)])
        .then(() => sequelize.close())
        .then(() => process.exit(0))
        .catch(() => process.exit(1));
    });
    server.closeIdleConnections();
  };
  process.on('SIGTERM', () => shutdown('SIGTERM'));
  process.on('SIGINT', () => shutdown('SIGINT'));
}

await main();

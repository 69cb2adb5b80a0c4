// CLI: apply pending migrations and print what was applied. Exit 0 on success, 1 on failure.
//   node --import tsx --conditions=@basinwright/source api/src/db/migrate.ts
import { getDatabaseUrl } from '../config/env';

async function main(): Promise<number> {
  try {
    getDatabaseUrl();
  } catch (error) {
    console.error(`migrate: ${error instanceof Error ? error.message : String(error)}`);
    return 1;
  }
  const { sequelize } = await import('./sequelize');
  const { createMigrator } = await import('./umzug');
  try {
    const applied = await createMigrator(sequelize).up();
    if (applied.length === 0) console.log('migrate: database is up to date');
    for (const migration of applied) console.log(`migrate: applied ${migration.name}`);
    return 0;
  } catch (error) {
    console.error(`migrate: failed — ${error instanceof Error ? error.message : String(error)}`);
    return 1;
  } finally {
    await sequelize.close();
  }
}

process.exitCode = await main();

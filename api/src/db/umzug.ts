import { fileURLToPath, pathToFileURL } from 'node:url';
import path from 'node:path';
import { Umzug, SequelizeStorage } from 'umzug';
import type { QueryInterface, Sequelize } from 'sequelize';

export interface MigrationParams {
  context: QueryInterface;
}

interface MigrationModule {
  up(params: MigrationParams): Promise<void>;
  down?(params: MigrationParams): Promise<void>;
}

const migrationsDir = path.join(path.dirname(fileURLToPath(import.meta.url)), 'migrations');

/**
 * The migrator for one database. Migrations are the files in ./migrations, applied in name
 * order and recorded in the `migrations` table; names drop the extension so a compiled
 * `.js` build recognises what the `.ts` sources applied.
 */
export function createMigrator(sequelize: Sequelize) {
  return new Umzug<QueryInterface>({
    migrations: {
      glob: ['*.{ts,js}', { cwd: migrationsDir, ignore: ['*.d.ts'] }],
      resolve: ({ name, path: filePath, context }) => {
        if (filePath === undefined) throw new Error(`Migration ${name} has no file.`);
        const load = async (): Promise<MigrationModule> =>
          (await import(pathToFileURL(filePath).href)) as MigrationModule;
        return {
          name: name.replace(/\.(ts|js)$/, ''),
          up: async () => (await load()).up({ context }),
          down: async () => {
            const migration = await load();
            if (migration.down === undefined)
              throw new Error(`Migration ${name} cannot be undone.`);
            await migration.down({ context });
          },
        };
      },
    },
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'migrations' }),
    // The CLI prints what it applied; umzug's own event log would only repeat it.
    logger: undefined,
  });
}

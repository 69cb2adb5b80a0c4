import { QueryTypes, type Sequelize } from 'sequelize';

/** The server settings that decide whether a committed write survives a crash. */
export const DURABILITY_SETTINGS = ['fsync', 'synchronous_commit', 'full_page_writes'] as const;
export type DurabilitySetting = (typeof DURABILITY_SETTINGS)[number];
export type Durability = Record<DurabilitySetting, string>;

/** Reads fsync, synchronous_commit and full_page_writes from the connected server. */
export async function readDurability(sequelize: Sequelize): Promise<Durability> {
  const rows = await sequelize.query<{ name: string; setting: string }>(
    'SELECT name, setting FROM pg_settings WHERE name IN (:names)',
    { replacements: { names: [...DURABILITY_SETTINGS] }, type: QueryTypes.SELECT },
  );
  const found = new Map(rows.map((row) => [row.name, row.setting]));
  return Object.fromEntries(
    DURABILITY_SETTINGS.map((name) => [name, found.get(name) ?? 'unknown']),
  ) as Durability;
}

/**
 * The settings that are off, i.e. where an acknowledged write can be lost in a crash
 * (synchronous_commit = off loses the last moments; fsync or full_page_writes = off can
 * corrupt the cluster). `local`, `remote_write`, `remote_apply` and `on` all flush locally.
 */
export function weakDurability(durability: Durability): DurabilitySetting[] {
  return DURABILITY_SETTINGS.filter((name) => durability[name] === 'off');
}

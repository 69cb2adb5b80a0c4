// The project list reads an index in the order it shows, for every sort and direction: the
// plan PostgreSQL makes for the exact statement the service sends has no sort step and scans one
// of the firm-led indexes (migration project-list-indexes). That is what keeps the first page
// as cheap with 100,000 projects as with ten (`npm run bench` measures it).
import { randomUUID } from 'node:crypto';
import { PROJECT_SORTS, projectListQuerySchema } from '@basinwright/common';
import { QueryTypes } from 'sequelize';
import { describe, expect, it } from 'vitest';
import { listStatement } from '../../api/src/modules/projects/projects.service';
import { apiForFile } from '../support/api-app';

const h = apiForFile();

/** The plan of the list statement for one firm and query string, as PostgreSQL would run it. */
async function planFor(raw: Record<string, string>): Promise<string> {
  const query = projectListQuerySchema.validateSync(raw);
  const { sql, bind } = listStatement(randomUUID(), query);
  const { sequelize } = h.models;
  return sequelize.transaction(async (transaction) => {
    // Sequential and bitmap scans and sorting priced out of reach: on the small test table
    // the planner would otherwise rightly prefer them. What remains shows whether an index
    // can give the order by itself.
    for (const setting of ['enable_seqscan', 'enable_bitmapscan', 'enable_sort'])
      await sequelize.query(`SET LOCAL ${setting} = off`, { transaction });
    const rows = await sequelize.query<{ 'QUERY PLAN': string }>(`EXPLAIN ${sql}`, {
      bind,
      transaction,
      type: QueryTypes.SELECT,
    });
    return rows.map((row) => row['QUERY PLAN']).join('\n');
  });
}

describe('project list query plans', () => {
  const cases = PROJECT_SORTS.flatMap((sort) =>
    (['asc', 'desc'] as const).map((order) => [sort, order] as const),
  );

  // The index each sort must read (migration project-list-indexes; updated_at's since the foundation).
  const INDEX = {
    updatedAt: 'projects_firm_updated_idx',
    createdAt: 'projects_firm_created_idx',
    name: 'projects_firm_name_idx',
    client: 'projects_firm_client_idx',
    status: 'projects_firm_status_idx',
  };

  it.each(cases)('sort %s %s: an index range scan, no sort step', async (sort, order) => {
    const plan = await planFor({ sort, order });
    expect(plan).toMatch(new RegExp(`Index Scan (Backward )?using ${INDEX[sort]} on projects p`));
    expect(plan).not.toMatch(/Sort/);
  });

  it('a search keeps the index order and filters within the firm', async () => {
    const plan = await planFor({ search: 'outlet', sort: 'name', order: 'asc' });
    expect(plan).toMatch(/Index Scan (Backward )?using projects_firm_name_idx on projects p/);
    expect(plan).not.toMatch(/Sort/);
  });
});

import type { MigrationParams } from '../umzug';

// One index per sort of the project list, each led by firm_id and ended by id (the tie-break),
// so the first page of any sort is an index range scan of pageSize rows, whatever the size of
// the table or the firm. A b-tree reads both ways: one index serves ascending and descending.
// (The default sort, updated_at, has had projects_firm_updated_idx since the foundation.)
// CONCURRENTLY: building them does not block writes to a live table; hence no transaction.
// The status rank is the list's workflow order; it must read exactly as the expression in
// projects.service.ts for the planner to use it (tests/api/project-list-plan.test.ts checks).

const INDEXES: Record<string, string> = {
  projects_firm_created_idx: '(firm_id, created_at DESC, id DESC)',
  projects_firm_name_idx: '(firm_id, lower(name), id)',
  projects_firm_client_idx: '(firm_id, lower(client), id)',
  projects_firm_status_idx: `(firm_id, (CASE status WHEN 'draft' THEN 0 WHEN 'in review' THEN 1 WHEN 'issued' THEN 2 WHEN 'archived' THEN 3 END), id)`,
};

export async function up({ context: qi }: MigrationParams): Promise<void> {
  for (const [name, columns] of Object.entries(INDEXES)) {
    // A build interrupted earlier leaves an invalid index of that name: drop it and build again.
    await qi.sequelize.query(`DROP INDEX CONCURRENTLY IF EXISTS ${name}`);
    await qi.sequelize.query(`CREATE INDEX CONCURRENTLY ${name} ON projects ${columns}`);
  }
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  for (const name of Object.keys(INDEXES))
    await qi.sequelize.query(`DROP INDEX CONCURRENTLY IF EXISTS ${name}`);
}

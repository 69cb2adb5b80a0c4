import {
  PROJECT_STATUSES,
  type ProjectCreateInput,
  type ProjectListQuery,
  type ProjectUpdateInput,
} from '@basinwright/common';
import { Op, QueryTypes, type WhereOptions } from 'sequelize';
import { notFound } from '../../errors';
import { Project, sequelize, User } from '../../models';
import { isUuid } from '../../security';
import { lockFirm } from '../members/members.service';
import { requireBelowLimit } from '../plans/plans.service';
import type { ProjectRecord } from './projects.presenter';

const createdBy = { model: User, as: 'createdBy', attributes: ['id', 'name'] };
const NOT_FOUND = 'No such project.';

/** LIKE pattern for a literal substring: %, _ and \ typed by the user match themselves. */
function containsPattern(search: string): string {
  return `%${search.replace(/[\\%_]/g, (ch) => `\\${ch}`)}%`;
}

// Workflow order for status, not alphabetical. The index projects_firm_status_idx holds this
// very expression (migration project-list-indexes); the two must read alike.
const STATUS_RANK = `CASE p.status ${PROJECT_STATUSES.map((status, rank) => `WHEN '${status}' THEN ${rank}`).join(' ')} END`;

// Each sort's leading key; every one has a firm-led index ending in id.
const SORT_KEY: Record<ProjectListQuery['sort'], string> = {
  updatedAt: 'p.updated_at',
  createdAt: 'p.created_at',
  name: 'lower(p.name)',
  client: 'lower(p.client)',
  status: STATUS_RANK,
};

export interface ProjectPage {
  items: ProjectRecord[];
  total: number;
  page: number;
  pageSize: number;
}

/**
 * The one statement behind a page of the firm's projects: scoped by firm, filtered by a
 * substring of name, client or location, in one of the sorts that each has its own index (so
 * a page is an index range scan of pageSize rows), with id breaking ties so pages never
 * overlap or skip rows. The total rides along as a scalar subquery counted once, so a page
 * costs one round trip. Values are bound, never spliced in.
 */
export function listStatement(
  firmId: string,
  query: ProjectListQuery,
): { sql: string; bind: (string | number)[] } {
  const bind: (string | number)[] = [firmId];
  let filter = (alias: string) => `${alias}.firm_id = $1`;
  if (query.search !== '') {
    bind.push(containsPattern(query.search));
    filter = (alias) =>
      `${alias}.firm_id = $1 AND (${alias}.name ILIKE $2 OR ${alias}.client ILIKE $2 OR ${alias}.location ILIKE $2)`;
  }
  const dir = query.order === 'asc' ? 'ASC' : 'DESC';
  bind.push(query.pageSize, (query.page - 1) * query.pageSize);
  const sql = `SELECT p.id, p.name, p.client, p.location, p.units, p.status, p.notes,
      p.created_at AS "createdAt", p.updated_at AS "updatedAt",
      u.id AS "createdById", u.name AS "createdByName",
      (SELECT count(*) FROM projects c WHERE ${filter('c')})::int AS total
    FROM projects p LEFT JOIN users u ON u.id = p.created_by_id
    WHERE ${filter('p')}
    ORDER BY ${SORT_KEY[query.sort]} ${dir}, p.id ${dir}
    LIMIT $${bind.length - 1} OFFSET $${bind.length}`;
  return { sql, bind };
}

interface ListRow {
  id: string;
  name: string;
  client: string;
  location: string;
  units: ProjectRecord['units'];
  status: ProjectRecord['status'];
  notes: string;
  createdAt: Date;
  updatedAt: Date;
  createdById: string | null;
  createdByName: string | null;
  total: number;
}

/** One page of the firm's projects and how many there are, in one round trip. */
export async function listProjects(firmId: string, query: ProjectListQuery): Promise<ProjectPage> {
  const { sql, bind } = listStatement(firmId, query);
  const rows = await sequelize.query<ListRow>(sql, { bind, type: QueryTypes.SELECT });
  // Past the last page there is no row to carry the total: count on its own.
  const total =
    rows[0]?.total ??
    (query.page === 1
      ? 0
      : await Project.count({ where: { firmId, ...searchWhere(query.search) } }));
  const items = rows.map(
    ({ createdById, createdByName, total: _total, ...project }): ProjectRecord => ({
      ...project,
      createdBy: createdById === null ? null : { id: createdById, name: createdByName ?? '' },
    }),
  );
  return { items, total, page: query.page, pageSize: query.pageSize };
}

/** The search filter as a Sequelize condition (same meaning as in listStatement). */
function searchWhere(search: string): WhereOptions<Project> {
  if (search === '') return {};
  const pattern = containsPattern(search);
  return {
    [Op.or]: [
      { name: { [Op.iLike]: pattern } },
      { client: { [Op.iLike]: pattern } },
      { location: { [Op.iLike]: pattern } },
    ],
  };
}

/** The firm's project; another firm's id is answered exactly like a missing one. */
export async function getProject(firmId: string, id: string): Promise<Project> {
  if (!isUuid(id)) throw notFound(NOT_FOUND);
  const project = await Project.findOne({ where: { id, firmId }, include: [createdBy] });
  if (project === null) throw notFound(NOT_FOUND);
  return project;
}

/** Creates a project within the plan's project cap (counted under the firm's row lock). */
export async function createProject(actor: User, input: ProjectCreateInput): Promise<Project> {
  const id = await sequelize.transaction(async (transaction) => {
    const firm = await lockFirm(actor.firmId, transaction);
    requireBelowLimit(
      firm,
      'projects',
      await Project.count({ where: { firmId: firm.id }, transaction }),
    );
    const project = await Project.create(
      { ...input, firmId: firm.id, createdById: actor.id },
      { transaction },
    );
    return project.id;
  });
  return getProject(actor.firmId, id);
}

export async function updateProject(
  firmId: string,
  id: string,
  input: ProjectUpdateInput,
): Promise<Project> {
  const project = await getProject(firmId, id);
  const changes = Object.fromEntries(
    Object.entries(input).filter(([, value]) => value !== undefined),
  );
  await project.update(changes);
  return project;
}

export async function deleteProject(firmId: string, id: string): Promise<void> {
  if (!isUuid(id)) throw notFound(NOT_FOUND);
  const removed = await Project.destroy({ where: { id, firmId } });
  if (removed === 0) throw notFound(NOT_FOUND);
}

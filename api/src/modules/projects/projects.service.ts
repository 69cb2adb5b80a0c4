import {
  PLAN_LIMITS,
  PROJECT_STATUSES,
  type Plan,
  type ProjectCreateInput,
  type ProjectListQuery,
  type ProjectUpdateInput,
} from '@basinwright/common';
import { Op, type FindOptions, type Order, type WhereOptions } from 'sequelize';
import { notFound, planLimit } from '../../errors';
import { Project, sequelize, User } from '../../models';
import { isUuid } from '../../security';
import { lockFirm } from '../members/members.service';

const createdBy = { model: User, as: 'createdBy', attributes: ['id', 'name'] };
const NOT_FOUND = 'No such project.';

/** LIKE pattern for a literal substring: %, _ and \ typed by the user match themselves. */
function containsPattern(search: string): string {
  return `%${search.replace(/[\\%_]/g, (ch) => `\\${ch}`)}%`;
}

// Workflow order for status, not alphabetical.
const statusRank = sequelize.literal(
  `CASE "Project"."status" ${PROJECT_STATUSES.map((status, rank) => `WHEN '${status}' THEN ${rank}`).join(' ')} END`,
);

function orderFor(query: ProjectListQuery): Order {
  const dir = query.order === 'asc' ? 'ASC' : 'DESC';
  const lower = (column: string) => sequelize.fn('lower', sequelize.col(`Project.${column}`));
  const first = {
    updatedAt: ['updatedAt', dir],
    createdAt: ['createdAt', dir],
    name: [lower('name'), dir],
    client: [lower('client'), dir],
    status: [statusRank, dir],
  }[query.sort];
  // id breaks ties so pages never overlap or skip rows.
  return [first, ['id', dir]] as Order;
}

export interface ProjectPage {
  items: Project[];
  total: number;
  page: number;
  pageSize: number;
}

/**
 * What one page of the firm's projects asks of the database: scoped by firm, filtered by a
 * substring of name, client or location, in one of the sorts that each has its own index
 * (migration project-list-indexes), so a page is an index range scan.
 */
export function listQuery(
  firmId: string,
  query: ProjectListQuery,
): FindOptions<Project> & { where: WhereOptions<Project>; limit: number; offset: number } {
  const where: WhereOptions<Project> = { firmId };
  if (query.search !== '') {
    const pattern = containsPattern(query.search);
    Object.assign(where, {
      [Op.or]: [
        { name: { [Op.iLike]: pattern } },
        { client: { [Op.iLike]: pattern } },
        { location: { [Op.iLike]: pattern } },
      ],
    });
  }
  return {
    where,
    include: [createdBy],
    order: orderFor(query),
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  };
}

/**
 * One page of the firm's projects and how many there are. The count is only asked of the
 * database when the page itself cannot tell it: a page that is not full (and not past the
 * end) is the last one, so the total is what came before it plus what is on it. Counting needs
 * no join (the member who created a project only matters for the rows shown).
 */
export async function listProjects(firmId: string, query: ProjectListQuery): Promise<ProjectPage> {
  const options = listQuery(firmId, query);
  const { where, limit, offset } = options;
  const items = await Project.findAll(options);
  const lastPage = items.length < limit && (items.length > 0 || offset === 0);
  const total = lastPage ? offset + items.length : await Project.count({ where });
  return { items, total, page: query.page, pageSize: query.pageSize };
}

/** The firm's project; another firm's id is answered exactly like a missing one. */
export async function getProject(firmId: string, id: string): Promise<Project> {
  if (!isUuid(id)) throw notFound(NOT_FOUND);
  const project = await Project.findOne({ where: { id, firmId }, include: [createdBy] });
  if (project === null) throw notFound(NOT_FOUND);
  return project;
}

/** Creates a project; the Concept plan holds at most 3 (counted under the firm's row lock). */
export async function createProject(actor: User, input: ProjectCreateInput): Promise<Project> {
  const id = await sequelize.transaction(async (transaction) => {
    const firm = await lockFirm(actor.firmId, transaction);
    const max = PLAN_LIMITS[firm.plan as Plan].maxProjects;
    if (max !== null && (await Project.count({ where: { firmId: firm.id }, transaction })) >= max) {
      throw planLimit(
        `The Concept plan holds up to ${max} projects. Upgrade, or delete a project first.`,
      );
    }
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

import type { Request, Response } from 'express';
import type { ProjectCreateInput, ProjectListQuery, ProjectUpdateInput } from '@basinwright/common';
import { authOf } from '../../middlewares/auth';
import { presentProject } from './projects.presenter';
import * as projects from './projects.service';
import type { Firm, Project } from '../../models';
import { readOnlyReasons, requireProjectWritable } from '../plans/plans.service';
import { latestVersions } from '../versions/versions.service';

export async function list(req: Request, res: Response): Promise<void> {
  const { firm } = authOf(req);
  // Cast by validate(projectListQuerySchema, 'query').
  const page = await projects.listProjects(firm.id, res.locals.query as ProjectListQuery);
  const ids = page.items.map((item) => item.id);
  const reasons = await readOnlyReasons(firm, ids);
  const latest = await latestVersions(firm.id, ids);
  res.json({
    ...page,
    items: page.items.map((item) =>
      presentProject(item, reasons.get(item.id) ?? null, latest.get(item.id) ?? null),
    ),
  });
}

/** One project with its read-only reason (plan's project cap, billing) and latest issued version. */
async function presentOne(firm: Firm, project: Project) {
  const reasons = await readOnlyReasons(firm, [project.id]);
  const latest = await latestVersions(firm.id, [project.id]);
  return presentProject(project, reasons.get(project.id) ?? null, latest.get(project.id) ?? null);
}

export async function create(req: Request, res: Response): Promise<void> {
  const { user, firm } = authOf(req);
  const project = await projects.createProject(user, req.body as ProjectCreateInput);
  res.status(201).json(await presentOne(firm, project));
}

export async function read(req: Request<{ id: string }>, res: Response): Promise<void> {
  const { firm } = authOf(req);
  res.json(await presentOne(firm, await projects.getProject(firm.id, req.params.id)));
}

export async function update(req: Request<{ id: string }>, res: Response): Promise<void> {
  const { firm } = authOf(req);
  await requireProjectWritable(firm, req.params.id);
  const project = await projects.updateProject(
    firm.id,
    req.params.id,
    req.body as ProjectUpdateInput,
  );
  res.json(await presentOne(firm, project));
}

export async function remove(req: Request<{ id: string }>, res: Response): Promise<void> {
  await projects.deleteProject(authOf(req).firm.id, req.params.id);
  res.status(204).end();
}

import type { Request, Response } from 'express';
import type { ProjectCreateInput, ProjectListQuery, ProjectUpdateInput } from '@basinwright/common';
import { authOf } from '../../middlewares/auth';
import { presentProject } from './projects.presenter';
import * as projects from './projects.service';
import { latestVersions } from '../versions/versions.service';

export async function list(req: Request, res: Response): Promise<void> {
  // Cast by validate(projectListQuerySchema, 'query').
  const page = await projects.listProjects(
    authOf(req).firm.id,
    res.locals.query as ProjectListQuery,
  );
  const latest = await latestVersions(
    authOf(req).firm.id,
    page.items.map((p) => p.id),
  );
  res.json({ ...page, items: page.items.map((p) => presentProject(p, latest.get(p.id) ?? null)) });
}

export async function create(req: Request, res: Response): Promise<void> {
  const project = await projects.createProject(authOf(req).user, req.body as ProjectCreateInput);
  res.status(201).json(presentProject(project));
}

export async function read(req: Request<{ id: string }>, res: Response): Promise<void> {
  const firmId = authOf(req).firm.id;
  const project = await projects.getProject(firmId, req.params.id);
  const latest = await latestVersions(firmId, [project.id]);
  res.json(presentProject(project, latest.get(project.id) ?? null));
}

export async function update(req: Request<{ id: string }>, res: Response): Promise<void> {
  const firmId = authOf(req).firm.id;
  const project = await projects.updateProject(
    firmId,
    req.params.id,
    req.body as ProjectUpdateInput,
  );
  const latest = await latestVersions(firmId, [project.id]);
  res.json(presentProject(project, latest.get(project.id) ?? null));
}

export async function remove(req: Request<{ id: string }>, res: Response): Promise<void> {
  await projects.deleteProject(authOf(req).firm.id, req.params.id);
  res.status(204).end();
}

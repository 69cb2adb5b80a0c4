import type { Request, Response } from 'express';
import type { ProjectCreateInput, ProjectListQuery, ProjectUpdateInput } from '@basinwright/common';
import { authOf } from '../../middlewares/auth';
import { presentProject } from './projects.presenter';
import * as projects from './projects.service';

export async function list(req: Request, res: Response): Promise<void> {
  // Cast by validate(projectListQuerySchema, 'query').
  const page = await projects.listProjects(
    authOf(req).firm.id,
    res.locals.query as ProjectListQuery,
  );
  res.json({ ...page, items: page.items.map(presentProject) });
}

export async function create(req: Request, res: Response): Promise<void> {
  const project = await projects.createProject(authOf(req).user, req.body as ProjectCreateInput);
  res.status(201).json(presentProject(project));
}

export async function read(req: Request<{ id: string }>, res: Response): Promise<void> {
  res.json(presentProject(await projects.getProject(authOf(req).firm.id, req.params.id)));
}

export async function update(req: Request<{ id: string }>, res: Response): Promise<void> {
  const project = await projects.updateProject(
    authOf(req).firm.id,
    req.params.id,
    req.body as ProjectUpdateInput,
  );
  res.json(presentProject(project));
}

export async function remove(req: Request<{ id: string }>, res: Response): Promise<void> {
  await projects.deleteProject(authOf(req).firm.id, req.params.id);
  res.status(204).end();
}

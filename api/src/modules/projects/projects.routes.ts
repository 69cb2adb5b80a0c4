import { Router } from 'express';
import { projectCreateSchema, projectListQuerySchema, projectUpdateSchema } from '@basinwright/common';
import { authenticate, authorize } from '../../middlewares/auth';
import { validate } from '../../middlewares/validate';
import * as controller from './projects.controller';

export function projectsRouter(): Router {
  const router = Router();
  router.use(authenticate);
  router.get('/', authorize('projects.list'), validate(projectListQuerySchema, 'query'), controller.list);
  router.post('/', authorize('projects.create'), validate(projectCreateSchema), controller.create);
  router.get('/:id', authorize('projects.read'), controller.read);
  router.patch('/:id', authorize('projects.update'), validate(projectUpdateSchema), controller.update);
  router.delete('/:id', authorize('projects.delete'), controller.remove);
  return router;
}

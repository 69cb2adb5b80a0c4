import { Router } from 'express';
import {
  projectCreateSchema,
  projectListQuerySchema,
  projectUpdateSchema,
} from '@basinwright/common';
import { guard } from '../../middlewares/auth';
import { validate } from '../../middlewares/validate';
import * as controller from './projects.controller';

export function projectsRouter(): Router {
  const router = Router();
  router.get(
    '/',
    guard('projects.list'),
    validate(projectListQuerySchema, 'query'),
    controller.list,
  );
  router.post('/', guard('projects.create'), validate(projectCreateSchema), controller.create);
  router.get('/:id', guard('projects.read'), controller.read);
  router.patch('/:id', guard('projects.update'), validate(projectUpdateSchema), controller.update);
  router.delete('/:id', guard('projects.delete'), controller.remove);
  return router;
}

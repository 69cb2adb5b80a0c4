import { Router } from 'express';
import { designSaveSchema } from '@basinwright/common';
import { guard } from '../../middlewares/auth';
import { validate } from '../../middlewares/validate';
import * as controller from './designs.controller';

/** A project's design, under /projects/:id/design. */
export function designsRouter(): Router {
  const router = Router();
  router.get('/:id/design', guard('designs.read'), controller.read);
  router.put('/:id/design', guard('designs.write'), validate(designSaveSchema), controller.save);
  return router;
}

import { Router } from 'express';
import { jumpRequestSchema, studyInputSchema } from '@basinwright/common';
import { authenticate } from '../../middlewares/auth';
import { validate } from '../../middlewares/validate';
import * as controller from './calc.controller';

/** Engine calculations for any signed-in member (no data is stored, so no role check). */
export function calcRouter(): Router {
  const router = Router();
  router.use(authenticate);
  router.post('/jump', validate(jumpRequestSchema), controller.jump);
  router.post('/study', validate(studyInputSchema), controller.study);
  return router;
}

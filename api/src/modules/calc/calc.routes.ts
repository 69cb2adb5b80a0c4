import { Router } from 'express';
import { jumpRequestSchema, jumpSituationSchema, studyInputSchema } from '@basinwright/common';
import { authenticateToken } from '../../middlewares/auth';
import { validate } from '../../middlewares/validate';
import * as controller from './calc.controller';

/**
 * Engine calculations for any signed-in member: nothing is read or stored, so no role check and
 * no database round trip (a valid, unexpired token suffices; see authenticateToken).
 */
export function calcRouter(): Router {
  const router = Router();
  router.use(authenticateToken);
  router.post('/jump', validate(jumpRequestSchema), controller.jump);
  router.post('/study', validate(studyInputSchema), controller.study);
  router.post('/jump-position', validate(jumpSituationSchema), controller.jumpPosition);
  return router;
}

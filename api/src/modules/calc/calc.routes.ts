import { Router, type RequestHandler } from 'express';
import {
  cheapestRequestSchema,
  jumpRequestSchema,
  jumpSituationSchema,
  studyInputSchema,
} from '@basinwright/common';
import { authenticateSession } from '../../middlewares/auth';
import { validate } from '../../middlewares/validate';
import * as controller from './calc.controller';

/**
 * Engine calculations for any signed-in member: nothing is read or stored, so no role check; the
 * token must still be current (sign-out, password change and deactivation revoke it; see
 * authenticateSession). Only the benchmark passes another `auth`, to measure what the check costs.
 */
export function calcRouter(auth: RequestHandler = authenticateSession): Router {
  const router = Router();
  router.use(auth);
  router.post('/jump', validate(jumpRequestSchema), controller.jump);
  router.post('/study', validate(studyInputSchema), controller.study);
  router.post('/jump-position', validate(jumpSituationSchema), controller.jumpPosition);
  router.post('/cheapest', validate(cheapestRequestSchema), controller.cheapest);
  return router;
}

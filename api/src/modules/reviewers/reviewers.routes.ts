import { Router } from 'express';
import { reviewerMarkSchema } from '@basinwright/common';
import { guard } from '../../middlewares/auth';
import { validate } from '../../middlewares/validate';
import * as controller from './reviewers.controller';

/** A member's reviewer mark, under /members/:id/reviewer. */
export function reviewersRouter(): Router {
  const router = Router();
  router.put(
    '/:id/reviewer',
    guard('reviewers.mark'),
    validate(reviewerMarkSchema),
    controller.mark,
  );
  router.delete('/:id/reviewer', guard('reviewers.unmark'), controller.unmark);
  return router;
}

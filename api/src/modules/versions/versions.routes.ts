import { Router } from 'express';
import { reviewApproveSchema, reviewReturnSchema, versionIssueSchema } from '@basinwright/common';
import { guard } from '../../middlewares/auth';
import { validate } from '../../middlewares/validate';
import * as controller from './versions.controller';

/** A project's issued versions and their review, under /projects/:id/versions. */
export function versionsRouter(): Router {
  const router = Router();
  router.get('/:id/versions', guard('versions.list'), controller.list);
  router.post(
    '/:id/versions',
    guard('versions.issue'),
    validate(versionIssueSchema),
    controller.issue,
  );
  router.get('/:id/versions/:versionId', guard('versions.read'), controller.read);
  // An issued version never changes: every attempt answers 409 (404 when there is none).
  router.put('/:id/versions/:versionId', guard('versions.change'), controller.refuseChange);
  router.delete('/:id/versions/:versionId', guard('versions.delete'), controller.refuseChange);
  router.post('/:id/versions/:versionId/send', guard('versions.send'), controller.send);
  router.post(
    '/:id/versions/:versionId/approve',
    guard('versions.approve'),
    validate(reviewApproveSchema),
    controller.approve,
  );
  router.post(
    '/:id/versions/:versionId/return',
    guard('versions.return'),
    validate(reviewReturnSchema),
    controller.giveBack,
  );
  return router;
}

import { Router } from 'express';
import { proposalCreateSchema, proposalSendSchema } from '@basinwright/common';
import { guard } from '../../middlewares/auth';
import { validate } from '../../middlewares/validate';
import * as controller from './proposals.controller';

/** A project's proposals, under /projects/:id/proposals. */
export function proposalsRouter(): Router {
  const router = Router();
  router.get('/:id/proposals', guard('proposals.list'), controller.list);
  router.post(
    '/:id/proposals',
    guard('proposals.create'),
    validate(proposalCreateSchema),
    controller.create,
  );
  router.get('/:id/proposals/:proposalId', guard('proposals.read'), controller.read);
  router.get('/:id/proposals/:proposalId/pdf', guard('proposals.download'), controller.pdf);
  router.post(
    '/:id/proposals/:proposalId/send',
    guard('proposals.send'),
    validate(proposalSendSchema),
    controller.send,
  );
  return router;
}

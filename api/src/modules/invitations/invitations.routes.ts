import { Router } from 'express';
import { acceptInvitationSchema, invitationCreateSchema } from '@basinwright/common';
import { guard } from '../../middlewares/auth';
import type { RateLimits } from '../../middlewares/rate-limit';
import { validate } from '../../middlewares/validate';
import * as controller from './invitations.controller';

/** /members/invitations: the firm's side (each route authenticates itself). */
export function memberInvitationsRouter(): Router {
  const router = Router();
  router.get('/', guard('invitations.list'), controller.list);
  router.post(
    '/',
    guard('invitations.create'),
    validate(invitationCreateSchema),
    controller.create,
  );
  router.delete('/:id', guard('invitations.revoke'), controller.revoke);
  return router;
}

/** /invitations: the invitee's side, reached from the e-mailed link (no sign-in). */
export function invitationsRouter(limits: RateLimits): Router {
  const router = Router();
  router.post('/accept', limits.tokenByIp, validate(acceptInvitationSchema), controller.accept);
  router.get('/:token', limits.tokenByIp, controller.preview);
  return router;
}

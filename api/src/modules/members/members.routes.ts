import { Router } from 'express';
import { memberUpdateSchema } from '@basinwright/common';
import { guard } from '../../middlewares/auth';
import { validate } from '../../middlewares/validate';
import { memberInvitationsRouter } from '../invitations/invitations.routes';
import * as controller from './members.controller';

export function membersRouter(): Router {
  const router = Router();
  // Before /:id so "invitations" is never read as a member id.
  router.use('/invitations', memberInvitationsRouter());
  router.get('/', guard('members.list'), controller.list);
  router.patch('/:id', guard('members.update'), validate(memberUpdateSchema), controller.update);
  return router;
}

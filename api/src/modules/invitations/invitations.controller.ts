import type { Request, Response } from 'express';
import type { AcceptInvitationInput, InvitationCreateInput } from '@basinwright/common';
import { authOf } from '../../middlewares/auth';
import { presentSession } from '../auth/auth.presenter';
import { presentInvitation, presentInvitationPreview } from './invitations.presenter';
import * as invitations from './invitations.service';

export async function list(req: Request, res: Response): Promise<void> {
  const items = await invitations.listInvitations(authOf(req).firm.id);
  res.json({ items: items.map(presentInvitation) });
}

export async function create(req: Request, res: Response): Promise<void> {
  const invitation = await invitations.createInvitation(
    authOf(req).user,
    req.body as InvitationCreateInput,
  );
  res.status(201).json(presentInvitation(invitation));
}

export async function revoke(req: Request<{ id: string }>, res: Response): Promise<void> {
  await invitations.revokeInvitation(authOf(req).firm.id, req.params.id);
  res.status(204).end();
}

export async function preview(req: Request<{ token: string }>, res: Response): Promise<void> {
  const { invitation, firmName } = await invitations.previewInvitation(req.params.token);
  res.json(presentInvitationPreview(invitation, firmName));
}

export async function accept(req: Request, res: Response): Promise<void> {
  const session = await invitations.acceptInvitation(req.body as AcceptInvitationInput);
  res.status(201).json(presentSession(session.token, session.user, session.firm));
}

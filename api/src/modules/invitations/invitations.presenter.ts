import type { InvitableRole } from '@basinwright/common';
import type { Invitation } from '../../models';

export interface InvitationView {
  id: string;
  email: string;
  role: InvitableRole;
  expiresAt: string;
  invitedBy: { id: string; name: string } | null;
  createdAt: string;
}

export function presentInvitation(invitation: Invitation): InvitationView {
  const by = invitation.invitedBy ?? null;
  return {
    id: invitation.id,
    email: invitation.email,
    role: invitation.role,
    expiresAt: invitation.expiresAt.toISOString(),
    invitedBy: by === null ? null : { id: by.id, name: by.name },
    createdAt: invitation.createdAt.toISOString(),
  };
}

/** What the invitee sees before accepting: no ids, nothing about the firm beyond its name. */
export function presentInvitationPreview(invitation: Invitation, firmName: string) {
  return { email: invitation.email, role: invitation.role, firmName };
}

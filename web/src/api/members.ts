import { request } from './client';
import type { Invitation, ItemList, Member, ReviewerMark, Role, User } from './types';

export const membersApi = {
  list: () => request<ItemList<Member>>('/members'),
  update: (id: string, body: { role?: Role; active?: boolean }) =>
    request<User>(`/members/${encodeURIComponent(id)}`, { method: 'PATCH', body }),
  invitations: () => request<ItemList<Invitation>>('/members/invitations'),
  invite: (body: { email: string; role: Role }) =>
    request<Invitation>('/members/invitations', { method: 'POST', body }),
  markReviewer: (id: string, body: ReviewerMark) =>
    request<ReviewerMark>(`/members/${encodeURIComponent(id)}/reviewer`, { method: 'PUT', body }),
  unmarkReviewer: (id: string) =>
    request<void>(`/members/${encodeURIComponent(id)}/reviewer`, { method: 'DELETE' }),
  revokeInvitation: (id: string) =>
    request<void>(`/members/invitations/${encodeURIComponent(id)}`, { method: 'DELETE' }),
};

import { request } from './client';
import type { Invitation, ItemList, Role, User } from './types';

export const membersApi = {
  list: () => request<ItemList<User>>('/members'),
  update: (id: string, body: { role?: Role; active?: boolean }) =>
    request<User>(`/members/${encodeURIComponent(id)}`, { method: 'PATCH', body }),
  invitations: () => request<ItemList<Invitation>>('/members/invitations'),
  invite: (body: { email: string; role: Role }) =>
    request<Invitation>('/members/invitations', { method: 'POST', body }),
  revokeInvitation: (id: string) =>
    request<void>(`/members/invitations/${encodeURIComponent(id)}`, { method: 'DELETE' }),
};

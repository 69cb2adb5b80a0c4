import { request } from './client';
import type { Firm, Role, Session, User } from './types';

export interface SignUpBody {
  firmName: string;
  name: string;
  email: string;
  password: string;
}

export interface InvitationPreview {
  email: string;
  role: Role;
  firmName: string;
}

export const authApi = {
  signUp: (body: SignUpBody) =>
    request<{ message: string }>('/auth/signup', { method: 'POST', body }),
  confirmSignUp: (body: { token: string }) =>
    request<Session>('/auth/signup/confirm', { method: 'POST', body }),
  signIn: (body: { email: string; password: string }) =>
    request<Session>('/auth/login', { method: 'POST', body }),
  signOut: () => request<void>('/auth/logout', { method: 'POST' }),
  me: () => request<{ user: User; firm: Firm }>('/auth/me'),
  forgotPassword: (body: { email: string }) =>
    request<{ message: string }>('/auth/forgot-password', { method: 'POST', body }),
  resetPassword: (body: { token: string; password: string }) =>
    request<Session>('/auth/reset-password', { method: 'POST', body }),
  updateProfile: (body: { name: string }) =>
    request<{ user: User; firm: Firm }>('/auth/me', { method: 'PATCH', body }),
  changePassword: (body: { currentPassword: string; newPassword: string }) =>
    request<Session>('/auth/change-password', { method: 'POST', body }),
  previewInvitation: (token: string) =>
    request<InvitationPreview>(`/invitations/${encodeURIComponent(token)}`),
  acceptInvitation: (body: { token: string; name: string; password: string }) =>
    request<Session>('/invitations/accept', { method: 'POST', body }),
};

import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { createPinia, setActivePinia } from 'pinia';
import { ApiError, request } from '../../web/src/api/client';
import { TOKEN_KEY, useAuthStore } from '../../web/src/stores/auth';
import { demoFirm, demoUser, stubApi } from './fetch-stub';

beforeEach(() => {
  localStorage.clear();
  setActivePinia(createPinia());
});

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('useAuthStore', () => {
  it('starts signed out when nothing is stored', () => {
    const auth = useAuthStore();
    expect(auth.isSignedIn).toBe(false);
    expect(auth.user).toBeNull();
    expect(auth.can('projects.read')).toBe(false);
  });

  it('signs in: keeps the token in localStorage and sends it on later requests', async () => {
    const { calls } = stubApi({
      'POST /auth/login': {
        status: 200,
        body: { token: 'tok-eng', user: demoUser('engineer'), firm: demoFirm },
      },
      'GET /projects': { status: 200, body: { items: [], total: 0, page: 1, pageSize: 20 } },
    });
    const auth = useAuthStore();
    await auth.signIn('engineer@harrow-lune.example', 'basinwright-demo');

    expect(JSON.parse(String(calls[0]!.init.body))).toEqual({
      email: 'engineer@harrow-lune.example',
      password: 'basinwright-demo',
    });
    expect(auth.isSignedIn).toBe(true);
    expect(auth.role).toBe('engineer');
    expect(auth.firm?.name).toBe('Harrow & Lune Engineering');
    expect(localStorage.getItem(TOKEN_KEY)).toBe('tok-eng');

    await request('/projects');
    const headers = calls[1]!.init.headers as Record<string, string>;
    expect(headers.Authorization).toBe('Bearer tok-eng');
  });

  it('leaves the session empty when sign-in fails', async () => {
    stubApi({
      'POST /auth/login': {
        status: 401,
        body: { code: 'unauthorized', message: 'Incorrect e-mail or password.' },
      },
    });
    const auth = useAuthStore();
    await expect(auth.signIn('x@example.com', 'wrong-password')).rejects.toBeInstanceOf(ApiError);
    expect(auth.isSignedIn).toBe(false);
    expect(localStorage.getItem(TOKEN_KEY)).toBeNull();
  });

  it('restores a stored token and loads the person and firm once', async () => {
    localStorage.setItem(TOKEN_KEY, 'tok-kept');
    const { calls } = stubApi({
      'GET /auth/me': { status: 200, body: { user: demoUser('viewer'), firm: demoFirm } },
    });
    const auth = useAuthStore();
    expect(auth.isSignedIn).toBe(true);
    expect(auth.isLoaded).toBe(false);
    await Promise.all([auth.ensureLoaded(), auth.ensureLoaded()]);
    await auth.ensureLoaded();
    expect(calls.filter((c) => c.path === '/auth/me')).toHaveLength(1);
    expect(auth.user?.email).toBe('viewer@harrow-lune.example');
  });

  it('drops a stored token the server rejects', async () => {
    localStorage.setItem(TOKEN_KEY, 'tok-revoked');
    stubApi({
      'GET /auth/me': {
        status: 401,
        body: { code: 'unauthorized', message: 'Please sign in again.' },
      },
    });
    const auth = useAuthStore();
    await expect(auth.ensureLoaded()).rejects.toBeInstanceOf(ApiError);
    expect(auth.isSignedIn).toBe(false);
    expect(localStorage.getItem(TOKEN_KEY)).toBeNull();
  });

  it('signs out locally even when the server call fails', async () => {
    stubApi({
      'POST /auth/login': {
        status: 200,
        body: { token: 'tok-o', user: demoUser('owner'), firm: demoFirm },
      },
      'POST /auth/logout': { status: 500, body: { code: 'internal_error', message: 'Boom' } },
    });
    const auth = useAuthStore();
    await auth.signIn('owner@harrow-lune.example', 'basinwright-demo');
    await auth.signOut();
    expect(auth.isSignedIn).toBe(false);
    expect(auth.user).toBeNull();
    expect(localStorage.getItem(TOKEN_KEY)).toBeNull();
  });

  it.each([
    ['owner', { 'projects.create': true, 'members.list': true, 'invitations.create': true }],
    ['admin', { 'projects.create': true, 'members.list': true, 'invitations.create': true }],
    ['engineer', { 'projects.create': true, 'members.list': false, 'invitations.create': false }],
    ['estimator', { 'projects.create': false, 'members.list': false, 'invitations.create': false }],
    ['viewer', { 'projects.create': false, 'members.list': false, 'invitations.create': false }],
  ] as const)('applies the shared policy for a %s', async (role, expected) => {
    stubApi({
      'POST /auth/login': {
        status: 200,
        body: { token: 't', user: demoUser(role), firm: demoFirm },
      },
    });
    const auth = useAuthStore();
    await auth.signIn(`${role}@harrow-lune.example`, 'basinwright-demo');
    for (const [action, allowed] of Object.entries(expected)) {
      expect(auth.can(action as keyof typeof expected), `${role} → ${action}`).toBe(allowed);
    }
    expect(auth.can('projects.read')).toBe(true);
  });
});

import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { createPinia, setActivePinia } from 'pinia';
import { createMemoryHistory, type Router } from 'vue-router';
import { createAppRouter, installUnauthorizedHandler, safeRedirect } from '../../web/src/router';
import { request } from '../../web/src/api/client';
import { TOKEN_KEY, useAuthStore } from '../../web/src/stores/auth';
import { demoFirm, demoUser, stubApi } from './fetch-stub';

type Role = 'owner' | 'admin' | 'engineer' | 'estimator' | 'viewer';

let router: Router;

beforeEach(() => {
  localStorage.clear();
  setActivePinia(createPinia());
  router = createAppRouter(createMemoryHistory());
});

afterEach(() => {
  vi.unstubAllGlobals();
});

function signedInAs(role: Role): void {
  localStorage.setItem(TOKEN_KEY, `tok-${role}`);
  setActivePinia(createPinia());
  router = createAppRouter(createMemoryHistory());
  stubApi({
    'GET /auth/me': { status: 200, body: { user: demoUser(role), firm: demoFirm } },
    'GET /projects': { status: 200, body: { items: [], total: 0, page: 1, pageSize: 20 } },
  });
}

async function land(path: string): Promise<string> {
  await router.push(path);
  return router.currentRoute.value.fullPath;
}

describe('router guards', () => {
  it('sends a signed-out visitor to sign-in, remembering where they were going', async () => {
    expect(await land('/projects/abc')).toBe('/sign-in?redirect=/projects/abc');
    expect(router.currentRoute.value.name).toBe('sign-in');
    expect(router.currentRoute.value.query.redirect).toBe('/projects/abc');
  });

  it('lets a signed-out visitor reach the sign-up, password and invitation pages', async () => {
    expect(router.resolve('/sign-up').name).toBe('sign-up');
    expect(await land('/sign-up')).toBe('/sign-up');
    expect(await land('/forgot-password')).toBe('/forgot-password');
    expect(await land('/reset-password?token=abc')).toBe('/reset-password?token=abc');
    expect(await land('/accept-invitation?token=abc')).toBe('/accept-invitation?token=abc');
    expect(await land('/confirm-sign-up?token=abc')).toBe('/confirm-sign-up?token=abc');
  });

  it('keeps signed-in people off the guest-only pages', async () => {
    signedInAs('engineer');
    expect(await land('/sign-in')).toBe('/projects');
    expect(await land('/sign-in?redirect=/account')).toBe('/account');
    expect(await land('/sign-up')).toBe('/projects');
  });

  it.each([
    ['owner', '/team'],
    ['admin', '/team'],
    ['engineer', '/projects'],
    ['estimator', '/projects'],
    ['viewer', '/projects'],
  ] as const)('team page for a %s lands on %s', async (role, expected) => {
    signedInAs(role);
    expect(await land('/team')).toBe(expected);
  });

  it.each([
    ['owner', '/projects/new'],
    ['admin', '/projects/new'],
    ['engineer', '/projects/new'],
    ['estimator', '/projects'],
    ['viewer', '/projects'],
  ] as const)('new-project page for a %s lands on %s', async (role, expected) => {
    signedInAs(role);
    expect(await land('/projects/new')).toBe(expected);
  });

  it('shows every role its account page and project pages', async () => {
    for (const role of ['owner', 'admin', 'engineer', 'estimator', 'viewer'] as const) {
      signedInAs(role);
      expect(await land('/account')).toBe('/account');
      expect(await land('/projects/p-1')).toBe('/projects/p-1');
    }
  });

  it('opens the jump position tool for every signed-in role (a calculator needs sign-in only)', async () => {
    expect(router.resolve('/tools/jump-position').name).toBe('jump-position');
    for (const role of ['owner', 'admin', 'engineer', 'estimator', 'viewer'] as const) {
      signedInAs(role);
      expect(await land('/tools/jump-position')).toBe('/tools/jump-position');
    }
  });

  it('sends a signed-out visitor from the jump position tool to sign-in and back', async () => {
    expect(await land('/tools/jump-position')).toBe('/sign-in?redirect=/tools/jump-position');
  });

  it('drops a rejected stored token and asks to sign in', async () => {
    localStorage.setItem(TOKEN_KEY, 'tok-revoked');
    setActivePinia(createPinia());
    router = createAppRouter(createMemoryHistory());
    stubApi({
      'GET /auth/me': {
        status: 401,
        body: { code: 'unauthorized', message: 'Please sign in again.' },
      },
    });
    expect(await land('/team')).toBe('/sign-in?redirect=/team');
    expect(localStorage.getItem(TOKEN_KEY)).toBeNull();
  });

  it('sends unknown addresses to the not-found page', async () => {
    expect(await land('/no/such/page')).toBe('/no/such/page');
    expect(router.currentRoute.value.name).toBe('not-found');
  });

  it('on a 401 mid-session, clears the session and returns to sign-in with the way back', async () => {
    signedInAs('engineer');
    installUnauthorizedHandler(router);
    expect(await land('/projects?search=mill')).toBe('/projects?search=mill');
    stubApi({
      'GET /projects': { status: 401, body: { code: 'unauthorized', message: 'Session ended.' } },
    });
    await expect(request('/projects')).rejects.toMatchObject({ status: 401 });
    await vi.waitFor(() => expect(router.currentRoute.value.name).toBe('sign-in'));
    expect(router.currentRoute.value.query.redirect).toBe('/projects?search=mill');
    expect(useAuthStore().isSignedIn).toBe(false);
  });
});

describe('safeRedirect', () => {
  it('accepts paths inside the app only', () => {
    expect(safeRedirect('/projects/p1?tab=notes')).toBe('/projects/p1?tab=notes');
    expect(safeRedirect('//evil.example/x')).toBe('/projects');
    expect(safeRedirect('https://evil.example')).toBe('/projects');
    expect(safeRedirect(undefined)).toBe('/projects');
  });
});

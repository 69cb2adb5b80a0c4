// A tiny fake of the API for web tests: routes "METHOD /path" to a status and JSON body.
import { vi } from 'vitest';

export type Reply = { status: number; body?: unknown };
export type Routes = Record<string, Reply | ((init: RequestInit) => Reply)>;

export function stubApi(routes: Routes) {
  const calls: { method: string; path: string; init: RequestInit }[] = [];
  const fetchMock = vi.fn(async (input: string, init: RequestInit = {}) => {
    const method = init.method ?? 'GET';
    const path = input.replace(/^\/api\/v1/, '').split('?')[0] ?? '';
    calls.push({ method, path, init });
    const route = routes[`${method} ${path}`];
    if (!route)
      return new Response(JSON.stringify({ code: 'not_found', message: 'No such route.' }), {
        status: 404,
      });
    const reply = typeof route === 'function' ? route(init) : route;
    if (reply.status === 204) return new Response(null, { status: 204 });
    return new Response(JSON.stringify(reply.body ?? {}), {
      status: reply.status,
      headers: { 'Content-Type': 'application/json' },
    });
  });
  vi.stubGlobal('fetch', fetchMock);
  return { calls, fetchMock };
}

export const demoFirm = {
  id: 'f1',
  name: 'Harrow & Lune Engineering',
  plan: 'firm' as const,
  seats: 5,
  billingStatus: 'active' as const,
  graceEndsAt: null,
};

export function demoUser(role: 'owner' | 'admin' | 'engineer' | 'estimator' | 'viewer') {
  return {
    id: `u-${role}`,
    name: `Demo ${role}`,
    email: `${role}@harrow-lune.example`,
    role,
    active: true,
    createdAt: '2025-01-01T00:00:00.000Z',
  };
}

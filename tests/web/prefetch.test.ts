// Reads the router starts while a view's code loads (web/src/api/prefetch.ts): the design
// workspace's project and design are asked for as the route is entered, the view takes those
// answers once instead of asking again, and a read left untaken is dropped, never served stale.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { createPinia, setActivePinia } from 'pinia';
import { createMemoryHistory } from 'vue-router';
import { prefetch, takePrefetched } from '../../web/src/api/prefetch';
import { createAppRouter } from '../../web/src/router';
import { TOKEN_KEY } from '../../web/src/stores/auth';
import { demoFirm, demoUser, stubApi } from './fetch-stub';

afterEach(() => vi.unstubAllGlobals());

describe('prefetch', () => {
  it('a started read is taken once, while fresh; a second start while fresh asks nothing more', async () => {
    const load = vi.fn(async () => 42);
    prefetch('k', load, 1000);
    prefetch('k', load, 2000);
    expect(load).toHaveBeenCalledTimes(1);
    await expect(takePrefetched<number>('k', 3000)).resolves.toBe(42);
    expect(takePrefetched('k', 3000)).toBeUndefined();
  });

  it('a read older than five seconds is not served (the view asks again)', () => {
    prefetch('old', async () => 1, 1000);
    expect(takePrefetched('old', 6000)).toBeUndefined();
    expect(takePrefetched('old', 6000)).toBeUndefined();
  });

  it('a failed read nobody takes raises no unhandled rejection; taken, its failure reaches the view', async () => {
    prefetch('lost', () => Promise.reject(new Error('gone')), 0);
    prefetch('kept', () => Promise.reject(new Error('refused')), 0);
    await expect(takePrefetched('kept', 1)).rejects.toThrow('refused');
    // vitest fails the run on an unhandled rejection: let the untaken one settle.
    await new Promise((resolve) => setTimeout(resolve, 0));
  });
});

describe('the design route', () => {
  it('asks for the project and its design as it is entered, before the view mounts', async () => {
    localStorage.setItem(TOKEN_KEY, 'tok-engineer');
    setActivePinia(createPinia());
    const project = { id: 'p9', name: 'P', units: 'SI' };
    const design = { projectId: 'p9', input: null, revision: null };
    const api = stubApi({
      'GET /auth/me': { status: 200, body: { user: demoUser('engineer'), firm: demoFirm } },
      'GET /projects/p9': { status: 200, body: project },
      'GET /projects/p9/design': { status: 200, body: design },
    });
    const router = createAppRouter(createMemoryHistory());
    await router.push('/projects/p9/design');
    expect(router.currentRoute.value.name).toBe('project-design');
    const asked = api.calls.map((c) => `${c.method} ${c.path}`);
    expect(asked).toContain('GET /projects/p9');
    expect(asked).toContain('GET /projects/p9/design');
    await expect(takePrefetched('project:p9')).resolves.toEqual(project);
    await expect(takePrefetched('design:p9')).resolves.toEqual(design);
    // Another page of the app starts no such read.
    api.calls.length = 0;
    await router.push('/projects');
    expect(api.calls.some((c) => c.path.endsWith('/design'))).toBe(false);
  });
});

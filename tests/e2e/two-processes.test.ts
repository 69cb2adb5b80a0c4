// Two API processes on one database: `npm test` starts both against the end-to-end database
// and puts a proxy in front that sends each request to the next process in turn
// (scripts/alternate-proxy.mjs, which names the process in `X-Served-By`). Every end-to-end
// test runs through it; this one shows that both processes answered a signed-in session,
// and that a token and the data written through one process are good on the other.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { e2eBaseUrl, signIn, startBrowser, type E2eBrowser } from '../support/e2e';

const DEMO_PROJECT = 'Fenwick Mill Pond — auxiliary spillway outlet';
const PROCESSES = ['first', 'second'];

let browser: E2eBrowser | undefined;

beforeAll(async () => {
  browser = await startBrowser('two-processes');
});
afterAll(async () => {
  await browser?.close();
});

describe('two API processes on one database, alternately', () => {
  it('serves one browser session from both processes without a failed request', async () => {
    if (browser === undefined) throw new Error('the browser did not start');
    const { page, baseUrl } = browser;
    const answers: { by: string | undefined; status: number; url: string }[] = [];
    page.on('response', (response) => {
      if (!response.url().startsWith(`${baseUrl}/api/v1/`)) return;
      answers.push({
        by: response.headers()['x-served-by'],
        status: response.status(),
        url: response.url(),
      });
    });

    await signIn(page, baseUrl, 'engineer@harrow-lune.example', 'basinwright-demo');
    const demo = page.locator('[data-test="project-table"] tbody tr', { hasText: DEMO_PROJECT });
    await demo.waitFor();
    await demo.getByRole('link', { name: DEMO_PROJECT }).click();
    await expect.poll(() => page.locator('h1').textContent()).toContain(DEMO_PROJECT);
    await page.goBack();
    await demo.waitFor();

    expect(answers.filter((answer) => answer.status >= 400)).toEqual([]);
    expect(new Set(answers.map((answer) => answer.by))).toEqual(new Set(PROCESSES));
    expect(browser.pageErrors).toEqual([]);
  });

  it('takes a token from one process and data written through one on the other', async () => {
    const base = e2eBaseUrl();
    const login = await fetch(`${base}/api/v1/auth/login`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: 'engineer@harrow-lune.example', password: 'basinwright-demo' }),
    });
    expect(login.status).toBe(200);
    const { token } = (await login.json()) as { token: string };
    const auth = { authorization: `Bearer ${token}`, 'content-type': 'application/json' };

    const name = `Two processes ${Date.now().toString(36)}`;
    const created = await fetch(`${base}/api/v1/projects`, {
      method: 'POST',
      headers: auth,
      body: JSON.stringify({ name, units: 'SI' }),
    });
    expect(created.status).toBe(201);
    const { id } = (await created.json()) as { id: string };

    // Read it back until both processes have answered (the proxy alternates, so two reads
    // normally suffice; others' requests may interleave, hence the loop with a cap).
    const readers = new Set<string>();
    for (let attempt = 0; attempt < 20 && readers.size < PROCESSES.length; attempt += 1) {
      const read = await fetch(`${base}/api/v1/projects/${id}`, { headers: auth });
      expect(read.status).toBe(200);
      expect(((await read.json()) as { name: string }).name).toBe(name);
      readers.add(read.headers.get('x-served-by') ?? 'unnamed');
    }
    expect(readers).toEqual(new Set(PROCESSES));

    const removed = await fetch(`${base}/api/v1/projects/${id}`, {
      method: 'DELETE',
      headers: auth,
    });
    expect(removed.status).toBe(204);
  });
});

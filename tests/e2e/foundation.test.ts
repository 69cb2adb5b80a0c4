// Foundation flow in a real browser against the built app and a migrated, seeded database.
// The lead's test script starts the server and sets E2E_BASE_URL.
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { startBrowser, type E2eBrowser } from '../support/e2e';

const BASE_URL = process.env.E2E_BASE_URL?.replace(/\/$/, '');
const SHOTS = fileURLToPath(new URL('./screenshots/', import.meta.url));
const DEMO_PROJECT = 'Fenwick Mill Pond — auxiliary spillway outlet';

let page: Page;
let browser: E2eBrowser | undefined;
let pageErrors: string[] = [];

const stamp = `${Date.now().toString(36)}${Math.floor(Math.random() * 1e6).toString(36)}`;
const newFirm = {
  firmName: `Tarnside Water Design ${stamp}`,
  name: 'Ada Marsh',
  email: `ada.${stamp}@tarnside.example`,
  password: 'correct horse battery',
};
const newProject = `Holloway weir outlet ${stamp}`;

async function shot(name: string): Promise<void> {
  await page.screenshot({ path: join(SHOTS, `${name}.png`), fullPage: true });
}

function url(path: string): string {
  return `${BASE_URL}${path}`;
}

/** The token of the sign-up link e-mailed to `to`, polled from maildev (E2E_MAIL_URL). */
async function signUpToken(to: string): Promise<string> {
  const mailUrl = process.env.E2E_MAIL_URL?.replace(/\/$/, '');
  if (mailUrl === undefined) throw new Error('E2E_MAIL_URL is not set (`npm test` sets it).');
  let token: string | undefined;
  await expect
    .poll(
      async () => {
        const mails = (await (await fetch(`${mailUrl}/api/email`)).json()) as {
          to: { address: string }[];
          text?: string;
        }[];
        const mail = mails.find((m) => m.to.some((a) => a.address.toLowerCase() === to));
        token = /\/confirm-sign-up\?token=([A-Za-z0-9_-]+)/.exec(mail?.text ?? '')?.[1];
        return token !== undefined;
      },
      { timeout: 30_000 },
    )
    .toBe(true);
  return token ?? '';
}

describe('foundation: sign up, create and find a project, sign in as the demo engineer', () => {
  beforeAll(async () => {
    browser = await startBrowser('foundation', {
      viewport: { width: 1366, height: 860 },
      timeoutMs: 15_000,
    });
    ({ page, pageErrors } = browser);
  });

  afterAll(async () => {
    await browser?.close();
  });

  it('signs up a new firm and lands on an empty project list', async () => {
    await page.goto(url('/sign-up'));
    await page.getByLabel('Firm name').fill(newFirm.firmName);
    await page.getByLabel('Your name').fill(newFirm.name);
    await page.getByLabel('Work e-mail').fill(newFirm.email);
    await page.getByLabel('Password').fill(newFirm.password);
    await shot('01-sign-up-filled');
    await page.getByRole('button', { name: 'Create account' }).click();
    await page.locator('[data-test="sign-up-sent"]').waitFor();

    // The e-mailed link finishes the sign-up (read from the local mail catcher's REST API).
    await page.goto(url(`/confirm-sign-up?token=${await signUpToken(newFirm.email)}`));
    await page.waitForURL(/\/projects$/);
    await expect
      .poll(() => page.locator('[data-test="firm-name"]').textContent())
      .toBe(newFirm.firmName);
    await page.locator('[data-test="empty-first-run"]').waitFor();
    await shot('02-signed-up-empty-list');
  });

  it('creates a project', async () => {
    await page.locator('[data-test="new-project"]').click();
    await page.waitForURL(/\/projects\/new$/);
    await page.getByLabel('Project name').fill(newProject);
    await page.getByLabel('Client').fill('Holloway Parish Council');
    await page.getByLabel('Location').fill('Holloway, upper reach');
    await page.getByText('US customary (ft, cfs)').click();
    await shot('03-new-project-filled');
    await page.getByRole('button', { name: 'Create project' }).click();

    await page.waitForURL(/\/projects\/(?!new)[^/]+$/);
    await expect.poll(() => page.locator('h1').textContent()).toContain(newProject);
    await expect
      .poll(() => page.getByText('US customary', { exact: true }).count())
      .toBeGreaterThan(0);
    await shot('04-project-created');
  });

  it('finds the project in the list by searching', async () => {
    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Projects', exact: true })
      .click();
    await page.waitForURL(/\/projects(\?.*)?$/);
    await page.locator('[data-test="project-search"]').fill(stamp);
    await page.waitForURL(new RegExp(`search=${stamp}`));
    const row = page.locator('[data-test="project-table"] tbody tr', { hasText: newProject });
    await row.waitFor();
    expect(await row.count()).toBe(1);
    expect(await row.textContent()).toContain('US');
    expect(await row.textContent()).toContain('Draft');

    await page.locator('[data-test="project-search"]').fill(`no-such-${stamp}`);
    await page.locator('[data-test="empty-search"]').waitFor();
    await page.locator('[data-test="project-search"]').fill(stamp);
    await row.waitFor();
    await shot('05-project-found-by-search');
  });

  it('signs out', async () => {
    await page.locator('[data-test="sign-out"]').click();
    await page.waitForURL(/\/sign-in/);
    await page.getByRole('button', { name: 'Sign in' }).waitFor();
    // A signed-out visitor is sent back to sign-in from inside the app.
    await page.goto(url('/projects'));
    await page.waitForURL(/\/sign-in\?redirect=/);
    await shot('06-signed-out');
  });

  it('signs in as the demo engineer and sees the demo project', async () => {
    await page.getByLabel('E-mail').fill('engineer@harrow-lune.example');
    await page.getByLabel('Password').fill('basinwright-demo');
    await page.getByRole('button', { name: 'Sign in' }).click();

    await page.waitForURL(/\/projects$/);
    await expect
      .poll(() => page.locator('[data-test="firm-name"]').textContent())
      .toBe('Harrow & Lune Engineering');
    const demo = page.locator('[data-test="project-table"] tbody tr', { hasText: DEMO_PROJECT });
    await demo.waitFor();
    // The new firm's project belongs to another tenant and must not show here.
    expect(await page.getByText(newProject).count()).toBe(0);
    // An engineer sees no Team entry.
    expect(
      await page
        .getByRole('navigation', { name: 'Main' })
        .getByRole('link', { name: 'Team', exact: true })
        .count(),
    ).toBe(0);
    await shot('07-demo-engineer-projects');

    await demo.getByRole('link', { name: DEMO_PROJECT }).click();
    await expect.poll(() => page.locator('h1').textContent()).toContain(DEMO_PROJECT);
    await shot('08-demo-project-overview');
  });

  it('raised no uncaught errors in the page', () => {
    expect(pageErrors).toEqual([]);
  });
});

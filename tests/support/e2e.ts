// Shared set-up of the end-to-end tests: Debian's Chromium through playwright-core against the
// app that `npm test` starts (E2E_BASE_URL), with a throwaway profile and screenshots kept in
// tests/e2e/screenshots/ for a person to look at.
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

export const SHOTS = fileURLToPath(new URL('../e2e/screenshots/', import.meta.url));

export interface E2eBrowser {
  baseUrl: string;
  context: BrowserContext;
  page: Page;
  /** uncaught errors of the page, for a test to assert there were none */
  pageErrors: string[];
  /** a full-page screenshot as tests/e2e/screenshots/<name>.png */
  shot(name: string): Promise<void>;
  close(): Promise<void>;
}

/** The app under test; fails with a clear message when the run did not start one. */
export function e2eBaseUrl(): string {
  const base = process.env.E2E_BASE_URL?.replace(/\/$/, '');
  if (!base) {
    throw new Error(
      'E2E_BASE_URL is not set. Start the built app against a migrated, seeded database and set ' +
        'E2E_BASE_URL (e.g. http://127.0.0.1:8090); `npm test` does this for you.',
    );
  }
  return base;
}

export async function startBrowser(
  label: string,
  options: {
    viewport?: { width: number; height: number };
    timeoutMs?: number;
    /** let a test inject a script (axe-core) past the app's Content-Security-Policy */
    bypassCSP?: boolean;
  } = {},
): Promise<E2eBrowser> {
  const baseUrl = e2eBaseUrl();
  mkdirSync(SHOTS, { recursive: true });
  const profileDir = mkdtempSync(join(tmpdir(), `basinwright-e2e-${label}-`));
  const context = await chromium.launchPersistentContext(profileDir, {
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    viewport: options.viewport ?? { width: 1366, height: 900 },
    bypassCSP: options.bypassCSP ?? false,
    // Without the networking flags Chromium tries hosts this machine cannot reach.
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  const page = context.pages()[0] ?? (await context.newPage());
  page.setDefaultTimeout(options.timeoutMs ?? 20_000);
  const pageErrors: string[] = [];
  page.on('pageerror', (error) => pageErrors.push(error.message));
  return {
    baseUrl,
    context,
    page,
    pageErrors,
    shot: async (name) => {
      await page.screenshot({ path: join(SHOTS, `${name}.png`), fullPage: true });
    },
    close: async () => {
      await context.close();
      rmSync(profileDir, { recursive: true, force: true });
    },
  };
}

/** Signs in through the sign-in page and waits for the project list. */
export async function signIn(
  page: Page,
  baseUrl: string,
  email: string,
  password: string,
): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  // The first page of a fresh browser: on a machine busy with the other test files its scripts
  // and styles can take longer than one action's usual wait.
  await page.getByLabel('E-mail').waitFor({ timeout: 60_000 });
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(/\/projects$/);
}

/** The demo engineer's SI demo design, opened at a step of the workspace (its URL kept). */
export const DEMO_SI_PROJECT = 'Fenwick Mill Pond — auxiliary spillway outlet';
export async function openDemoDesignStep(
  page: Page,
  baseUrl: string,
  step: string,
): Promise<string> {
  await signIn(page, baseUrl, 'engineer@harrow-lune.example', 'basinwright-demo');
  const row = page.locator('[data-test="project-table"] tbody tr', { hasText: DEMO_SI_PROJECT });
  await row.getByRole('link', { name: DEMO_SI_PROJECT }).click();
  await page.locator('[data-test="open-design"]').click();
  await page.waitForURL(/\/projects\/[^/]+\/design/);
  const designUrl = page.url().split('?')[0]!;
  await page.goto(`${designUrl}?step=${step}`);
  return designUrl;
}

/** A number shown with its unit, e.g. "87.64 m" → 87.64. */
export function numberIn(text: string | null): number {
  const m = /-?[\d,]+(\.\d+)?/.exec(text ?? '');
  if (!m) throw new Error(`no number in ${JSON.stringify(text)}`);
  return Number(m[0].replace(/,/g, ''));
}

// Every page of the app and every step of the design workspace, as each demo role reaches them:
// shared by the accessibility and narrow-screen end-to-end tests (tests/e2e/a11y.test.ts,
// tests/e2e/narrow-screen.test.ts).
import type { Page } from 'playwright-core';
import { can, type Action } from '../../common/src/policy';

export const DEMO_PASSWORD = 'basinwright-demo'; // seed/demo.ts
export const DEMO_PROJECT = 'Fenwick Mill Pond — auxiliary spillway outlet'; // seed/demo.ts

export const ROLES = ['owner', 'admin', 'engineer', 'estimator', 'viewer'] as const;
export type DemoRole = (typeof ROLES)[number];
export const demoEmail = (role: DemoRole): string => `${role}@harrow-lune.example`;

/** The workspace's steps by their query key (DesignWorkspaceView.vue's STEPS). */
export const DESIGN_STEPS = [
  'site',
  'flows',
  'inflow',
  'jump',
  'basin',
  'sizing',
  'takeoff',
  'estimate',
  'proposal',
] as const;

/** Pages seen signed out. */
export const SIGNED_OUT_PAGES = [
  '/sign-in',
  '/sign-up',
  '/forgot-password',
  '/reset-password?token=not-a-real-token',
  '/accept-invitation?token=not-a-real-token',
  '/confirm-sign-up?token=not-a-real-token',
  '/no-such-page',
];

/** The signed-in pages a role may open (the router's `can` checks, as in web/src/router). */
export function signedInPages(role: DemoRole, projectPath: string): string[] {
  const gated: [string, Action | null][] = [
    ['/projects', 'projects.read'],
    ['/projects/new', 'projects.create'],
    [projectPath, 'projects.read'],
    ['/tools/jump-position', null],
    ['/price-books', 'priceBooks.list'],
    ['/team', 'members.list'],
    ['/firm/brand', 'brand.read'],
    ['/billing', 'billing.read'],
    ['/account', null],
  ];
  const pages = gated.filter(([, action]) => action === null || can(role, action)).map(([p]) => p);
  for (const step of DESIGN_STEPS) pages.push(`${projectPath}/design?step=${step}`);
  return pages;
}

/** Signs in through the sign-in page and returns the demo project's path (/projects/<id>). */
export async function signInAs(page: Page, baseUrl: string, role: DemoRole): Promise<string> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(demoEmail(role));
  await page.getByLabel('Password', { exact: true }).fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(/\/projects$/);
  const link = page.getByRole('link', { name: DEMO_PROJECT }).first();
  const href = await link.getAttribute('href');
  if (!href) throw new Error('the demo project has no link on the project list');
  return href;
}

/** Opens a page and waits until it has settled: no request in flight, no spinner, no study running. */
export async function openAndSettle(page: Page, url: string): Promise<void> {
  await page.goto(url, { waitUntil: 'networkidle' });
  await page.waitForFunction(
    () =>
      document.querySelector('#app > *') !== null &&
      document.querySelector('.ant-spin-spinning, .ant-skeleton-active, .bw-skeleton') === null &&
      document.querySelector('[data-study="computing"], [data-study="waiting"]') === null,
  );
  // Lazy chunks of a step (charts, the drawing) may ask the network again once mounted.
  await page.waitForLoadState('networkidle');
}

// Versions and review in a real browser against the built app and the seeded database
// (E2E_BASE_URL): the demo engineer issues a version of the Fenwick design with a note and sends
// it for review; the demo owner, seeded as licensed reviewer (seed/demo.ts), approves it; the
// project page then shows the design approved and the audit trail lists each step.
import { afterAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { e2eBaseUrl, signIn, startBrowser, type E2eBrowser } from '../support/e2e';
import { DEMO_PASSWORD } from '../../seed/demo';

const DEMO_PROJECT = 'Fenwick Mill Pond — auxiliary spillway outlet';
const NOTE = `Concept for the trust, ${new Date().toISOString()}`;

let browser: E2eBrowser | undefined;
let projectUrl = '';
let issuedNumber = 0;

afterAll(async () => {
  await browser?.close();
});

async function openDesign(page: Page): Promise<void> {
  const row = page.locator('[data-test="project-table"] tbody tr', { hasText: DEMO_PROJECT });
  await row.getByRole('link', { name: DEMO_PROJECT }).click();
  // The project page's heading: a locator wait (the action timeout), not expect.poll's one
  // second, which a fresh browser on a busy machine once overran.
  await page.locator('h1', { hasText: DEMO_PROJECT }).waitFor();
  projectUrl = page.url().split('?')[0]!;
  await page.locator('[data-test="open-design"]').click();
  await page.waitForURL(/\/projects\/[^/]+\/design/);
  await page.locator('[data-test="history-panel"]').waitFor();
}

/** The history row of the version with this note (newest first, so the first match). */
const rowWithNote = (page: Page) =>
  page.locator('[data-test="version-table"] tbody tr', { hasText: NOTE }).first();

describe('review: the demo engineer issues a version, the demo owner approves it', () => {
  it('the engineer issues a version of the Fenwick design with a note and sends it for review', async () => {
    browser = await startBrowser('review-engineer');
    const { page } = browser;
    await signIn(page, e2eBaseUrl(), 'engineer@harrow-lune.example', DEMO_PASSWORD);
    await openDesign(page);
    await page.locator('[data-test="issue-note"]').fill(NOTE);
    await page.locator('[data-test="issue-version"]').click();
    const row = rowWithNote(page);
    await row.waitFor();
    issuedNumber = Number(/Version (\d+)/.exec((await row.textContent()) ?? '')?.[1]);
    expect(issuedNumber).toBeGreaterThan(0);
    // its key figures: the chosen type, and the cost of the firm's saved estimate of the design
    // at issue (another e2e file may have saved one), "Not priced" when there is none
    expect(await row.textContent()).toContain('USBR Type II basin');
    const cost = (await row.locator(`[data-test="version-cost-${issuedNumber}"]`).textContent())!;
    expect(cost.trim()).toMatch(/^(Not priced|\d{1,3}(,\d{3})*)$/);
    await row.locator(`[data-test="send-${issuedNumber}"]`).click();
    await expect
      .poll(() => row.locator(`[data-test="review-state-${issuedNumber}"]`).textContent())
      .toBe('In review');
    // an engineer who is not a marked reviewer is offered no approval
    expect(await row.locator(`[data-test="approve-${issuedNumber}"]`).count()).toBe(0);
    expect(browser.pageErrors).toEqual([]);
    await browser.close();
    browser = undefined;
  });

  it('the owner, a marked reviewer, approves it; the project page says so and the audit trail lists every step', async () => {
    browser = await startBrowser('review-owner');
    const { page } = browser;
    await signIn(page, e2eBaseUrl(), 'owner@harrow-lune.example', DEMO_PASSWORD);
    await openDesign(page);
    const row = rowWithNote(page);
    await row.waitFor();
    await row.locator(`[data-test="approve-${issuedNumber}"]`).click();
    await page.locator('[data-test="review-comments"]').fill('Suitable for the concept stage.');
    await page.locator('.ant-modal').getByRole('button', { name: 'Approve' }).click();
    await expect
      .poll(() => row.locator(`[data-test="review-state-${issuedNumber}"]`).textContent())
      .toBe('Approved');
    expect(await row.textContent()).toContain('Approved by Morwenna Harrow');

    await page.goto(projectUrl);
    await expect
      .poll(() => page.locator('[data-test="design-status"]').textContent())
      .toContain('Approved');
    expect(await page.locator('[data-test="latest-version"]').textContent()).toContain(
      `Version ${issuedNumber}`,
    );
    const trail = page.locator('[data-test="audit-panel"]');
    await expect
      .poll(() => trail.locator('[data-test="audit-version.approved"]').last().textContent())
      .toContain(`approved version ${issuedNumber}`);
    const steps = await trail.locator('li').allTextContents();
    const ours = steps.filter((s) => s.includes(`version ${issuedNumber}`));
    expect(ours.map((s) => /(issued|sent|approved)/.exec(s)?.[1])).toEqual([
      'issued',
      'sent',
      'approved',
    ]);
    // the project list shows it too
    await page.goto(`${e2eBaseUrl()}/projects`);
    const listed = page.locator('[data-test="project-table"] tbody tr', { hasText: DEMO_PROJECT });
    await expect.poll(() => listed.textContent()).toContain('Approved');
    expect(browser.pageErrors).toEqual([]);
  });
});

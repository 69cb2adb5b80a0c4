// Plans and brand in a real browser (issue 10): the second demo firm, on Concept with 3
// projects, meets the project limit with a prompt naming the plan that lifts it; the demo firm's
// owner sets the firm brand — a logo (a PNG made here) and a footer — and sees them in the preview.
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { e2eBaseUrl, signIn, startBrowser, type E2eBrowser } from '../support/e2e';

let browser: E2eBrowser | undefined;
let page: Page;
let pageErrors: string[] = [];
const stamp = Date.now().toString(36);

describe('plans and the firm brand', () => {
  beforeAll(async () => {
    browser = await startBrowser('plans');
    ({ page, pageErrors } = browser);
  });

  afterAll(async () => {
    await browser?.close();
  });

  it('a Concept firm with 3 projects is offered Professional instead of a fourth project', async () => {
    await signIn(page, e2eBaseUrl(), 'owner@kestrel-bank.example', 'basinwright-demo');
    await expect
      .poll(() => page.locator('[data-test="plan-badge"]').textContent())
      .toContain('Concept plan');
    const prompt = page.locator('[data-test="upgrade-prompt"]');
    await prompt.waitFor();
    expect(await prompt.textContent()).toContain('Professional');
    expect(await prompt.textContent()).toContain('up to 3 projects');
    expect(await page.locator('[data-test="new-project"]').isDisabled()).toBe(true);
    await browser?.shot('plans-1-concept-limit');
    await page.locator('[data-test="sign-out"]').click();
    await page.waitForURL(/\/sign-in/);
  });

  it('the demo owner uploads a logo and sets the proposal footer on the Firm brand page', async () => {
    await signIn(page, e2eBaseUrl(), 'owner@harrow-lune.example', 'basinwright-demo');
    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Firm brand', exact: true })
      .click();
    await page.waitForURL(/\/firm\/brand$/);
    const png = await sharp({
      create: { width: 300, height: 120, channels: 3, background: '#0f6e6e' },
    })
      .png()
      .toBuffer();
    await page
      .locator('[data-test="logo-file"]')
      .setInputFiles({ name: 'harrow-lune.png', mimeType: 'image/png', buffer: png });
    await page.locator('[data-test="logo-image"]').waitFor();

    const footer = `Harrowdale office ${stamp}`;
    await page.locator('[data-test="brand-footer"]').fill(footer);
    await page.locator('[data-test="brand-save"]').click();
    await expect
      .poll(() => page.locator('[data-test="brand-preview"]').textContent())
      .toContain(footer);
    await browser?.shot('plans-2-firm-brand');
    // After a reload the saved brand comes back from the server.
    await page.reload();
    await page.locator('[data-test="logo-image"]').waitFor();
    await expect.poll(() => page.locator('[data-test="brand-footer"]').inputValue()).toBe(footer);
    expect(pageErrors).toEqual([]);
  });
});

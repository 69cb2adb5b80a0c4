// "Where the jump forms" in a real browser against the built app (E2E_BASE_URL): the demo
// engineer opens the tool from the side navigation, reads the distance to the jump toe,
// gives a higher tailwater and sees the jump move, then reads the same case in US units.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { startBrowser, type E2eBrowser, signIn, e2eBaseUrl, numberIn } from '../support/e2e';

let page: Page;
let browser: E2eBrowser | undefined;
let pageErrors: string[] = [];

const distanceText = () => page.locator('[data-test="jump-distance"]').textContent();
let distanceSI = 0;

describe('where the jump forms: the demo engineer uses the jump position tool', () => {
  beforeAll(async () => {
    browser = await startBrowser('jump-position');
    ({ page, pageErrors } = browser);
  });

  afterAll(async () => {
    await browser?.close();
  });

  it('opens the tool from the side navigation and sees a distance with its chart', async () => {
    await signIn(page, e2eBaseUrl(), 'engineer@harrow-lune.example', 'basinwright-demo');
    await page.locator('nav').getByText('Where the jump forms', { exact: true }).click();
    await page.waitForURL(/\/tools\/jump-position$/);
    await expect.poll(() => page.locator('h1').textContent()).toContain('Where the jump forms');
    await expect.poll(distanceText).toMatch(/^[\d,]+\.\d{2} m$/);
    distanceSI = numberIn(await distanceText());
    expect(distanceSI).toBeGreaterThan(0);
    await expect
      .poll(() => page.locator('[data-test="jump-sentence"]').textContent())
      .toContain('downstream of the slope break');
    // The chart is SVG: its axis titles, with units, are text in the page.
    await expect.poll(() => page.getByText('Depth y (m)').count()).toBeGreaterThan(0);
    await expect
      .poll(() => page.getByText('Distance x from the control, downstream positive (m)').count())
      .toBeGreaterThan(0);
    await expect
      .poll(() => page.locator('[data-test="cautions"]').textContent())
      .toContain('Concept level only');
    await browser!.shot('jump-position-1-opened');
  });

  it('a higher tailwater moves the jump upstream, closer to the slope break', async () => {
    // More depth below the jump needs a deeper toe, reached sooner on the rising M3 profile:
    // the jump moves upstream (Chow 1959, §15-4, from memory).
    const tailwater = page.getByLabel('Tailwater depth (m)');
    await tailwater.fill('1.9');
    await tailwater.blur();
    await expect.poll(async () => numberIn(await distanceText())).toBeLessThan(distanceSI);
    expect(await page.locator('[data-test="jump-error"]').count()).toBe(0);
    distanceSI = numberIn(await distanceText());
    await browser!.shot('jump-position-2-higher-tailwater');
  });

  it('the same case in US customary units shows the distance in ft', async () => {
    await page.locator('[data-test="jump-units"]').getByText('US customary').click();
    await expect.poll(distanceText).toMatch(/ ft$/);
    await expect.poll(() => page.getByLabel('Tailwater depth (ft)').inputValue()).not.toBe('');
    const ft = numberIn(await distanceText());
    // 1 ft = 0.3048 m exactly (NIST SP 811); both figures are rounded to 0.01, and the inputs
    // were converted to four significant figures, which may move the distance by up to 0.5 %
    // [tolerance: engineering judgement; the exact figures are checked in tests/web].
    expect(Math.abs(ft * 0.3048 - distanceSI)).toBeLessThanOrEqual(
      0.005 + 0.005 * 0.3048 + 0.005 * distanceSI,
    );
    await browser!.shot('jump-position-3-us-units');
  });

  it('an impossible input gets a clear message and the page carries on', async () => {
    const slope = page.getByLabel('Upstream (steep) slope (rise/run)');
    await slope.fill('0.0001');
    await slope.blur();
    await expect
      .poll(() => page.locator('[data-test="jump-error"]').textContent())
      .toContain('The upstream slope is not steep at this discharge');
    await browser!.shot('jump-position-4-refused');
    await slope.fill('0.05');
    await slope.blur();
    await expect.poll(() => page.locator('[data-test="jump-error"]').count()).toBe(0);
    await expect.poll(distanceText).toMatch(/ ft$/);
  });

  it('raised no uncaught errors in the page', () => {
    expect(pageErrors).toEqual([]);
  });
});

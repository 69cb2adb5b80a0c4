// The assumptions behind the sizing in a real browser (E2E_BASE_URL): the demo engineer changes
// the freeboard coefficient, sees the wall freeboard change as its relation says, meets the
// message of an out-of-bounds value, saves, reloads and finds the override kept; then puts
// the seeded design back.
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { startBrowser, type E2eBrowser, signIn, e2eBaseUrl, numberIn } from '../support/e2e';
import { expectRel } from '../support/tolerance';

const SHOTS = fileURLToPath(new URL('./screenshots/', import.meta.url));
const DEMO_PROJECT = 'Fenwick Mill Pond — auxiliary spillway outlet';

let page: Page;
let browser: E2eBrowser | undefined;
let designUrl = '';
let pageErrors: string[] = [];

async function shot(name: string): Promise<void> {
  await page.screenshot({ path: join(SHOTS, `design-assumptions-${name}.png`), fullPage: true });
}
const freeboard = async (): Promise<number> =>
  numberIn(await page.locator('[data-test="sizing-freeboard"]').textContent());
const numberBox = (key: string) => page.locator(`input[data-test="assumption-${key}"]`);
const coefficient = () => numberBox('freeboardCoefficient');
/** The catalogue's table is folded when nothing in it has been changed: open it. */
async function openTable(): Promise<void> {
  const summary = page.locator('[data-test="assumptions-table-summary"]');
  await summary.waitFor();
  await summary.click();
  await page.locator('[data-test="assumptions-table"]').waitFor();
}

describe('design workspace: the assumptions behind the sizing', () => {
  beforeAll(async () => {
    browser = await startBrowser('assumptions');
    ({ page, pageErrors } = browser);
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('opens the demo design on the Sizing step with every assumption listed', async () => {
    await signIn(page, e2eBaseUrl(), 'engineer@harrow-lune.example', 'basinwright-demo');
    const row = page.locator('[data-test="project-table"] tbody tr', { hasText: DEMO_PROJECT });
    await row.getByRole('link', { name: DEMO_PROJECT }).click();
    await page.locator('[data-test="open-design"]').click();
    await page.waitForURL(/\/projects\/[^/]+\/design/);
    designUrl = page.url().split('?')[0]!;
    await page.goto(`${designUrl}?step=sizing`);
    await page.locator('[data-test="sizing-freeboard"]').waitFor();
    // Nothing changed in the demo: the table is folded, its summary counting what it holds.
    const summary = page.locator('[data-test="assumptions-table-summary"]');
    await summary.waitFor();
    expect(await summary.textContent()).toMatch(/\d+ values, \d+ from memory — verify/);
    expect(await page.locator('[data-test="assumptions-table"]').count()).toBe(0);
    await openTable();
    expect(
      await page.locator('[data-test="assumptions-table"] tbody tr.assumption-row').count(),
    ).toBeGreaterThan(60);
    expect(await page.locator('[data-test="assumptions-table"]').textContent()).toContain(
      'From memory — verify',
    );
    await expect.poll(() => coefficient().inputValue()).toBe('0.1');
  });

  it('a changed freeboard coefficient k changes the wall freeboard as F = k·(V1 + y2) says [from memory: USBR, Design of Small Dams]', async () => {
    const before = await freeboard();
    await coefficient().fill('0.15');
    await coefficient().blur();
    // Linear in k: 0.15/0.1 = 1.5 × the freeboard (shown to 0.01 m).
    await expect.poll(freeboard).not.toBe(before);
    expectRel(await freeboard(), before * 1.5, 0.01 / (before * 1.5) + 1e-9);
    await page.locator('[data-test="assumptions-changed-count"]').waitFor();
    await shot('1-changed');
  });

  it('an out-of-bounds value shows its message on the field and the page keeps working', async () => {
    const sill = numberBox('type2SillHeightRatio');
    await sill.fill('-1');
    await sill.blur();
    const item = page.locator('.assumption-cell', {
      has: page.locator('[data-test="assumption-type2SillHeightRatio"]'),
    });
    await expect.poll(() => item.textContent()).toMatch(/must be a number not below zero/);
    await shot('2-refused');
    await page.locator('[data-test="assumption-reset-type2SillHeightRatio"]').click();
    await expect.poll(() => item.textContent()).not.toMatch(/must be a number/);
    await expect.poll(() => sill.inputValue()).toBe('0.2');
  });

  it('saves, reloads and finds the override kept; then puts the seeded design back', async () => {
    await page.locator('[data-test="save-design"]').click();
    await page.getByText('Design saved.').waitFor();
    await page.goto(`${designUrl}?step=sizing`);
    // A changed value: the table opens by itself.
    await page.locator('[data-test="assumptions-table"]').waitFor();
    await expect.poll(() => coefficient().inputValue()).toBe('0.15');
    await page.locator('[data-test="assumption-reset-freeboardCoefficient"]').waitFor();
    await shot('3-reloaded');
    await page.locator('[data-test="assumption-reset-freeboardCoefficient"]').click();
    await expect.poll(() => coefficient().inputValue()).toBe('0.1');
    await page.keyboard.press('Control+s');
    await page.getByText('Design saved.').first().waitFor();
    await page.goto(`${designUrl}?step=sizing`);
    await openTable();
    await expect.poll(() => coefficient().inputValue()).toBe('0.1');
    expect(await page.locator('[data-test="assumptions-changed-count"]').count()).toBe(0);
  });

  it('raised no uncaught errors in the page', () => {
    expect(pageErrors).toEqual([]);
  });
});

// The Take-off step on a laptop screen (1280 × 800) in a real browser (E2E_BASE_URL): the table
// of what the quantities rest on fits its card — the long sources wrap in their cells rather
// than pushing the table past the card's edge. Narrower screens are tests/e2e/narrow-screen's.
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { SHOTS, startBrowser, type E2eBrowser, e2eBaseUrl } from '../support/e2e';
import { signInAs } from '../support/e2e-pages';

let page: Page;
let browser: E2eBrowser | undefined;
let pageErrors: string[] = [];

describe('Take-off at 1280 × 800: the assumptions table fits its card', () => {
  beforeAll(async () => {
    browser = await startBrowser('takeoff-fit', { viewport: { width: 1280, height: 800 } });
    ({ page, pageErrors } = browser);
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('shows every column inside the card without a sideways scroll', async () => {
    const project = await signInAs(page, e2eBaseUrl(), 'engineer');
    await page.goto(`${e2eBaseUrl()}${project}/design?step=takeoff`);
    const section = page.locator('[data-test="takeoff-assumptions"]');
    const rows = section.locator('tbody tr.ant-table-row');
    await rows.first().waitFor();
    expect(await rows.count()).toBeGreaterThan(3);
    const box = section.locator('.ant-table-content, .ant-table-body').first();
    const sizes = await box.evaluate((el) => ({
      scroll: el.scrollWidth,
      client: el.clientWidth,
    }));
    // the table is no wider than the box it sits in: nothing hides to the right
    expect(sizes.scroll).toBeLessThanOrEqual(sizes.client + 1);
    const card = await page.locator('[data-test="step-panel"]').boundingBox();
    const table = await section.locator('table').first().boundingBox();
    expect(card).not.toBeNull();
    expect(table).not.toBeNull();
    expect(table!.x + table!.width).toBeLessThanOrEqual(card!.x + card!.width);
    // and the page does not scroll sideways
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(
      1280,
    );
    // every source is there in full, wrapped (never cut off with an ellipsis)
    const source = section.locator('td.source-cell').first();
    const cell = await source.evaluate((el) => ({
      scroll: el.scrollWidth,
      client: el.clientWidth,
      text: el.textContent?.trim() ?? '',
    }));
    expect(cell.text.length).toBeGreaterThan(0);
    expect(cell.scroll).toBeLessThanOrEqual(cell.client + 1);
    await section.scrollIntoViewIfNeeded();
    // a screenshot of the viewport (not the whole page) for a person to look at
    await page.screenshot({ path: join(SHOTS, 'takeoff-fit-1280.png') });
    expect(pageErrors).toEqual([]);
  });
});

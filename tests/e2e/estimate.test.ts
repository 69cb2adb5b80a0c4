// Issue 9 done-when, in a real browser (E2E_BASE_URL): the demo estimator opens the Fenwick
// design's take-off, applies the demo price book, changes a quantity with a reason, issues the
// estimate and downloads it as XLSX; the demo viewer reads it but is offered no change.
import { readFileSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { startBrowser, type E2eBrowser, signIn, e2eBaseUrl } from '../support/e2e';

const DEMO_PROJECT = 'Fenwick Mill Pond — auxiliary spillway outlet';
const REASON = 'Slab thickened under the chute blocks (e2e)';
const browsers: E2eBrowser[] = [];
let designUrl = '';

afterAll(async () => {
  for (const b of browsers) await b.close();
});

async function openAs(email: string, label: string): Promise<{ page: Page; b: E2eBrowser }> {
  const b = await startBrowser(label);
  browsers.push(b);
  await signIn(b.page, e2eBaseUrl(), email, 'basinwright-demo');
  return { page: b.page, b };
}

describe('estimate: take-off, price book, changed quantity, issue, download', () => {
  it('the estimator sees the take-off of the saved Fenwick design', async () => {
    const { page } = await openAs('estimator@harrow-lune.example', 'estimate-estimator');
    const row = page.locator('[data-test="project-table"] tbody tr', { hasText: DEMO_PROJECT });
    await row.getByRole('link', { name: DEMO_PROJECT }).click();
    await page.locator('[data-test="open-design"]').click();
    await page.waitForURL(/\/projects\/[^/]+\/design/);
    designUrl = page.url().split('?')[0]!;
    await page.goto(`${designUrl}?step=takeoff`);
    await page.locator('[data-test="takeoff-concrete"]').waitFor();
    const total = await page.locator('[data-test="takeoff-total-concrete"]').textContent();
    expect(Number((total ?? '').replace(/,/g, ''))).toBeGreaterThan(0);
    await page.locator('[data-test="takeoff-assumptions"]').waitFor();

    // Estimate: start a revision (the demo book is applied), change a quantity, issue, download.
    await page.goto(`${designUrl}?step=estimate`);
    await page.locator('[data-test="estimate-step"]').waitFor();
    await page.locator('[data-test="estimate-new"]').click();
    await page.locator('[data-test="estimate-book"]').click();
    await page
      .locator('.ant-select-item-option', { hasText: 'Invented demo rates' })
      .first()
      .click();
    await page.locator('[data-test="estimate-total"]').waitFor();
    const before = await page.locator('[data-test="estimate-total"]').textContent();
    await expect
      .poll(() => page.locator('[data-test="estimate-range"]').textContent())
      .toMatch(/Class 5 range/);

    await page.locator('[data-test="estimate-override-concrete.floorSlab"]').click();
    const quantity = page
      .locator('input[data-test="override-quantity"], [data-test="override-quantity"] input')
      .first();
    await quantity.fill('600');
    await page.locator('textarea[data-test="override-reason"]').fill(REASON);
    await page.getByRole('button', { name: 'Change', exact: true }).click();
    await expect
      .poll(() => page.locator('[data-test="estimate-audit"]').textContent())
      .toContain(REASON);
    await expect
      .poll(() => page.locator('[data-test="estimate-total"]').textContent())
      .not.toBe(before);

    await page.locator('[data-test="estimate-issue"]').click();
    await page.locator('.ant-popover').getByRole('button', { name: 'Issue' }).click();
    await page.locator('[data-test="estimate-issued"]').waitFor();
    expect(await page.locator('[data-test="estimate-issue"]').count()).toBe(0);

    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.locator('[data-test="estimate-download-xlsx"]').click(),
    ]);
    expect(download.suggestedFilename()).toMatch(/^estimate-revision-\d+\.xlsx$/);
    const path = await download.path();
    // An XLSX workbook is a ZIP package: it starts with "PK\x03\x04".
    expect([...readFileSync(path).subarray(0, 4)]).toEqual([0x50, 0x4b, 0x03, 0x04]);
  });

  it('the engineer sees the cheapest passing type and width on the chart', async () => {
    const { page } = await openAs('engineer@harrow-lune.example', 'estimate-engineer');
    await page.goto(`${designUrl}?step=takeoff`);
    await page.locator('[data-test="takeoff-concrete"]').waitFor();
    await page.locator('[data-test="cheapest-run"]').click();
    await page.locator('[data-test="cheapest-chart"]').waitFor();
    await expect
      .poll(() => page.locator('[data-test="cheapest-best"]').textContent())
      .toMatch(/Cheapest that holds the jump at every discharge: .+ at [0-9.]+ m wide/);
  });

  it('the viewer reads the issued estimate and is offered no change', async () => {
    const { page } = await openAs('viewer@harrow-lune.example', 'estimate-viewer');
    await page.goto(`${designUrl}?step=estimate`);
    await page.locator('[data-test="estimate-issued"]').waitFor();
    await page.locator('[data-test="estimate-total"]').waitFor();
    expect(await page.locator('[data-test="estimate-issue"]').count()).toBe(0);
    expect(await page.locator('[data-test="estimate-new"]').count()).toBe(0);
    expect(await page.locator('[data-test^="estimate-override-"]').count()).toBe(0);
    expect(await page.locator('[data-test="estimate-download-xlsx"]').count()).toBe(1);
  });
});

// A brand-new SI project in a real browser against the built app and a seeded database
// (E2E_BASE_URL): the demo engineer creates it, takes the design from its starting values to a
// sized basin and saves; then loads a tailwater rating from a CSV file (a good file applies,
// a bad one lists its row numbers and changes nothing). The project is deleted at the end.
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { startBrowser, type E2eBrowser, signIn, e2eBaseUrl } from '../support/e2e';

const SHOTS = fileURLToPath(new URL('./screenshots/', import.meta.url));
const PROJECT = `Ashby Weir outlet ${Date.now().toString(36)}`; // invented
// Invented rating for the starting values' channel (bed at 100 m, 5–50 m³/s).
const GOOD_CSV =
  'Q (m3/s),Tailwater elevation (m)\n5,100.6\n10,100.9\n20,101.4\n35,101.9\n50,102.4\n';
const BAD_CSV = 'Q,Tailwater elevation\n5,100.6\n10,abc\n-3,101\n20\n';

let page: Page;
let browser: E2eBrowser | undefined;
let designUrl = '';
let projectId = '';
let pageErrors: string[] = [];

async function shot(name: string): Promise<void> {
  await page.screenshot({ path: join(SHOTS, `new-design-${name}.png`), fullPage: true });
}

async function goToStep(title: string): Promise<void> {
  await page
    .locator('[data-test="design-steps"]')
    .getByText(title, { exact: false })
    .first()
    .click();
  await expect
    .poll(() => page.locator('[data-test="step-panel"] .app-card-head').textContent())
    .toBe(title);
}

/** The tailwater rating table's cells, row by row, as the inputs show them. */
async function ratingRows(): Promise<string[][]> {
  const rows = page.locator('[data-test="table-tailwater.rows"] tbody tr');
  const out: string[][] = [];
  for (let i = 0; i < (await rows.count()); i++) {
    const inputs = rows.nth(i).locator('input');
    out.push([await inputs.nth(0).inputValue(), await inputs.nth(1).inputValue()]);
  }
  return out;
}

async function upload(name: string, text: string): Promise<void> {
  await page
    .locator('[data-test="csv-tailwater.rows"]')
    .setInputFiles({ name, mimeType: 'text/csv', buffer: Buffer.from(text, 'utf8') });
}

describe('a new SI project: starting values → sized basin → saved; tailwater from a CSV file', () => {
  beforeAll(async () => {
    browser = await startBrowser('new-design');
    ({ page, pageErrors } = browser);
  });

  afterAll(async () => {
    // Leave the demo firm as seeded: delete the project this run created.
    if (projectId && page) {
      await page.evaluate(async (id) => {
        const token = localStorage.getItem('basinwright.token');
        await fetch(`/api/v1/projects/${id}`, {
          method: 'DELETE',
          headers: { Authorization: `Bearer ${token}` },
        });
      }, projectId);
    }
    await browser?.close();
  });

  it('creates an SI project and opens its design on the starting values', async () => {
    await signIn(page, e2eBaseUrl(), 'engineer@harrow-lune.example', 'basinwright-demo');
    await page.locator('[data-test="new-project"]').click();
    await page.waitForURL(/\/projects\/new$/);
    await page.getByLabel('Project name').fill(PROJECT);
    await page.getByText('SI (m, m³/s)').click();
    await page.getByRole('button', { name: 'Create project' }).click();
    await page.waitForURL(/\/projects\/(?!new)[^/]+$/);
    projectId = new URL(page.url()).pathname.split('/').pop() ?? '';
    expect(projectId).not.toBe('');
    await page.locator('[data-test="open-design"]').click();
    await page.waitForURL(/\/projects\/[^/]+\/design/);
    designUrl = page.url().split('?')[0]!;
    await page.locator('[data-test="starting-values"]').waitFor();
    await expect
      .poll(() => page.getByLabel('Downstream channel bed elevation (m)').inputValue())
      .toBe('100');
    await page.locator('[data-test="summary-floor"]').waitFor();
    await shot('1-starting-values');
  });

  it('walks the steps to a sized basin, dimensioned and drawn, and saves', async () => {
    await goToStep('Flows');
    await goToStep('Inflow');
    await goToStep('Jump check');
    const floor = await page.locator('[data-test="floor-elevation"]').textContent();
    expect(floor).toMatch(/^\d+\.\d{2} m$/);
    expect(await page.locator('[data-test="free-jump-floor"]').textContent()).toMatch(
      /^\d+\.\d{2} m$/,
    );
    await goToStep('Basin choice');
    expect((await page.locator('[data-test="recommended-name"]').textContent())?.trim()).toMatch(
      /^(USBR Type|SAF)/,
    );
    await goToStep('Sizing');
    expect((await page.locator('[data-test="sizing-type"]').textContent())?.trim()).toMatch(
      /^(USBR Type|SAF)/,
    );
    // the design floor on Sizing is the one the Jump check calls the design floor
    expect(await page.locator('[data-test="sizing-floor"]').textContent()).toBe(floor);
    expect(await page.locator('[data-test="sizing-width"]').textContent()).toBe('10.00 m');
    const svg = page.locator('[data-test="design-drawing"] svg');
    await svg.waitFor();
    for (const role of ['basin-length', 'basin-width', 'wall-height', 'riprap-length']) {
      expect(await svg.locator(`[data-role="dim-${role}"]`).count(), role).toBeGreaterThan(0);
    }
    // the scale bar is a round number of metres
    expect(await svg.locator('[data-role="scale-bar"]').getAttribute('data-length')).toMatch(
      /^(1|2|5)0*$/,
    );
    await shot('2-sized');
    await page.locator('[data-test="save-design"]').click();
    await page.getByText('Design saved.').waitFor();
    await page.goto(designUrl);
    await page.locator('[data-test="summary-floor"]').waitFor();
    expect(await page.locator('[data-test="starting-values"]').count()).toBe(0);
    await shot('3-saved');
  });

  it('a good tailwater CSV fills the rating table; a bad one lists its rows and changes nothing', async () => {
    await goToStep('Flows');
    await page.getByText('A rating table (typed or CSV)').click();
    await page.locator('[data-test="table-tailwater.rows"]').waitFor();
    await upload('rating.csv', GOOD_CSV);
    await expect.poll(ratingRows).toEqual([
      ['5', '100.6'],
      ['10', '100.9'],
      ['20', '101.4'],
      ['35', '101.9'],
      ['50', '102.4'],
    ]);
    expect(await page.locator('[data-test="csv-errors"]').count()).toBe(0);
    await page.locator('[data-test="summary-floor"]').waitFor();
    await shot('4-csv-applied');

    await upload('broken.csv', BAD_CSV);
    const alert = page.locator('[data-test="csv-errors"]');
    await alert.waitFor();
    const text = (await alert.textContent()) ?? '';
    expect(text).toContain('Nothing from broken.csv was applied');
    for (const row of ['Row 3', 'Row 4', 'Row 5']) expect(text).toContain(row);
    expect(await ratingRows()).toEqual([
      ['5', '100.6'],
      ['10', '100.9'],
      ['20', '101.4'],
      ['35', '101.9'],
      ['50', '102.4'],
    ]);
    await shot('5-csv-rejected');

    await page.keyboard.press('Control+s');
    await page.getByText('Design saved.').first().waitFor();
    await page.goto(`${designUrl}?step=flows`);
    await page.locator('[data-test="table-tailwater.rows"]').waitFor();
    await expect.poll(ratingRows).toEqual([
      ['5', '100.6'],
      ['10', '100.9'],
      ['20', '101.4'],
      ['35', '101.9'],
      ['50', '102.4'],
    ]);
  });

  it('raised no uncaught errors in the page', () => {
    expect(pageErrors).toEqual([]);
  });
});

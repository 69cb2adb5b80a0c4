// The design workspace in a real browser against the built app and a migrated, seeded
// database (E2E_BASE_URL): the demo engineer walks the steps of the seeded demo design,
// changes a value, saves, reloads and finds it kept.
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { startBrowser, type E2eBrowser, signIn, e2eBaseUrl, numberIn } from '../support/e2e';
import { expectRel } from '../support/tolerance';

const SHOTS = fileURLToPath(new URL('./screenshots/', import.meta.url));
const DEMO_PROJECT = 'Fenwick Mill Pond — auxiliary spillway outlet';
// The demo's downstream channel bed (product.md, demo scenario).
const CHANNEL_BED = 90.0;

let page: Page;
let browser: E2eBrowser | undefined;
let designUrl = '';
let designFloor = NaN;
let pageErrors: string[] = [];

async function shot(name: string): Promise<void> {
  await page.screenshot({ path: join(SHOTS, `design-${name}.png`), fullPage: true });
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

describe('design workspace: the demo engineer checks, sizes and saves the demo design', () => {
  beforeAll(async () => {
    browser = await startBrowser('design');
    ({ page, pageErrors } = browser);
  });

  afterAll(async () => {
    await browser?.close();
  });

  it('signs in as the demo engineer and opens the demo project design', async () => {
    await signIn(page, e2eBaseUrl(), 'engineer@harrow-lune.example', 'basinwright-demo');
    const row = page.locator('[data-test="project-table"] tbody tr', { hasText: DEMO_PROJECT });
    await row.getByRole('link', { name: DEMO_PROJECT }).click();
    await expect.poll(() => page.locator('h1').textContent()).toContain(DEMO_PROJECT);
    await page.locator('[data-test="open-design"]').click();
    await page.waitForURL(/\/projects\/[^/]+\/design/);
    designUrl = page.url().split('?')[0]!;
    // Seeded with the demo input: the site step shows the channel bed at 90.
    const bed = page.getByLabel('Downstream channel bed elevation (m)');
    await expect.poll(() => bed.inputValue()).toBe('90');
    expect(await page.locator('[data-test="starting-values"]').count()).toBe(0);
    await page.locator('[data-test="summary-floor"]').waitFor();
    await shot('1-site');
  });

  it('walks Flows and Inflow with the demo values', async () => {
    await goToStep('Flows');
    await expect.poll(() => page.getByLabel('Design discharge (m³/s)').inputValue()).toBe('85');
    await expect
      .poll(async () => Number(await page.getByLabel("Manning's n").inputValue()))
      .toBe(0.03);
    await shot('2-flows');
    await goToStep('Inflow');
    await expect.poll(() => page.getByLabel('Crest elevation (m)').inputValue()).toBe('102');
    await expect
      .poll(() => page.getByLabel('Weir coefficient C (m^½/s)').inputValue())
      .toBe('2.15');
    await shot('3-inflow');
  });

  it('jump check: the floor is solved below the channel bed, with chart, table and diagrams', async () => {
    await goToStep('Jump check');
    const floor = numberIn(await page.locator('[data-test="floor-elevation"]').textContent());
    expect(floor).toBeLessThan(CHANNEL_BED);
    expect(await page.locator('[data-test="floor-elevation"]').textContent()).toContain('m');
    // the page shows two decimals: within half a centimetre of bed − floor
    expectRel(
      numberIn(await page.locator('[data-test="depth-below-bed"]').textContent()),
      CHANNEL_BED - floor,
      0,
      0.0051,
    );
    // 17 discharges from 5 to 85 m³/s in the seeded input.
    await expect
      .poll(() => page.locator('[data-test="range-table"] tbody tr.ant-table-row').count())
      .toBe(17);
    const headers = await page.locator('[data-test="range-table"] thead th').allTextContents();
    expect(headers).toEqual(
      expect.arrayContaining(['Q (m³/s)', 'y1 (m)', 'V1 (m/s)', 'Fr1', 'y2 (m)']),
    );
    // Charts carry axis titles with units (SVG renderer: the titles are text in the page).
    await expect.poll(() => page.getByText('Discharge Q (m³/s)').count()).toBeGreaterThan(0);
    await expect.poll(() => page.getByText('Specific energy E (m)').count()).toBeGreaterThan(0);
    await expect.poll(() => page.getByText('Momentum function M (m³)').count()).toBeGreaterThan(0);
    await expect
      .poll(() => page.locator('[data-test="cautions"]').textContent())
      .toContain('Concept level only');
    designFloor = floor;
    await shot('4-jump-check');
  });

  it('the table downloads as a CSV file with a header and one line per discharge', async () => {
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.locator('[data-test="download-csv"]').click(),
    ]);
    expect(download.suggestedFilename()).toMatch(
      /^fenwick-mill-pond.*-jump-check-on-the-design-floor\.csv$/,
    );
    const path = await download.path();
    const { readFile } = await import('node:fs/promises');
    const lines = (await readFile(path, 'utf8'))
      .replace(/^\uFEFF/, '')
      .trim()
      .split(/\r\n/);
    // the header (project, design, units, table, the floor, the caution), a blank line, the
    // column headings, then the 17 discharges of the seeded input
    expect(lines[0]).toContain('Fenwick Mill Pond');
    expect(lines[2]).toBe('Units,SI (metric)');
    expect(lines.find((l) => l.startsWith('Note,'))).toContain(
      `Floor elevation ${designFloor.toFixed(2)}`,
    );
    const blank = lines.indexOf('');
    expect(lines[blank + 1]!.split(',').slice(0, 2)).toEqual(['Q (m³/s)', 'y1 (m)']);
    expect(lines).toHaveLength(blank + 2 + 17);
    expect(Number(lines[blank + 2]!.split(',')[0])).toBe(5);
  });

  it('basin choice names the recommended basin with reasons per criterion', async () => {
    await goToStep('Basin choice');
    const name = (await page.locator('[data-test="recommended-name"]').textContent())?.trim() ?? '';
    expect(name).toMatch(/^(USBR Type|SAF)/);
    const card = page.locator('li.verdict-recommended');
    expect(await card.count()).toBe(1);
    expect(await card.textContent()).toContain('Recommended');
    expect(await card.locator('.crit').count()).toBeGreaterThan(2);
    await shot('5-basin-choice');
  });

  it('sizing shows the dimensions and the drawing with dimension text', async () => {
    await goToStep('Sizing');
    const svg = page.locator('[data-test="design-drawing"] svg');
    await svg.waitFor();
    expect(await svg.locator('[data-role^="dim-"]').count()).toBeGreaterThan(3);
    expect(await svg.locator('[data-role="dim-basin-length"] text').first().textContent()).toMatch(
      /^\d+\.\d{2} m$/,
    );
    expect(numberIn(await page.locator('[data-test="sizing-width"]').textContent())).toBe(12);
    // the chosen basin first, beside at least one other sized type
    const alternatives = page.locator('[data-test="alternatives-table"] tbody tr.data-row');
    expect(await alternatives.count()).toBeGreaterThan(1);
    expect(await alternatives.first().textContent()).toContain('Sized above');
    await shot('6-sizing');
  });

  it('the drawing and the sizing come out of the browser as DXF and XLSX (writers loaded on demand)', async () => {
    const { readFile } = await import('node:fs/promises');
    const [dxfFile] = await Promise.all([
      page.waitForEvent('download'),
      page.locator('[data-test="drawing-dxf"]').click(),
    ]);
    expect(dxfFile.suggestedFilename()).toMatch(/-drawing\.dxf$/);
    const DxfParser = (await import('dxf-parser')).default;
    const dxf = new DxfParser().parseSync(await readFile((await dxfFile.path())!, 'utf8'))!;
    // metres: $INSUNITS 6 [AutoCAD DXF reference, header variables]
    expect(dxf.header.$INSUNITS).toBe(6);
    expect(Object.keys(dxf.tables.layer.layers)).toEqual(
      expect.arrayContaining(['OUTLINE', 'BLOCKS', 'WATER', 'DIMENSIONS', 'TEXT']),
    );
    const [xlsxFile] = await Promise.all([
      page.waitForEvent('download'),
      page.locator('[data-test="table-download"] [data-test="download-xlsx"]').first().click(),
    ]);
    expect(xlsxFile.suggestedFilename()).toMatch(/-sizing-of-the-.*\.xlsx$/);
    const ExcelJS = (await import('exceljs')).default;
    const book = new ExcelJS.Workbook();
    const bytes = await readFile((await xlsxFile.path())!);
    await book.xlsx.load(
      bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer,
    );
    const sheet = book.worksheets[0]!;
    expect(sheet.getRow(1).getCell(2).value).toContain('Fenwick Mill Pond');
    expect(sheet.getRow(3).getCell(2).value).toBe('SI (metric)');
  });

  it('changes the basin width, saves, reloads and finds it kept', async () => {
    await goToStep('Site');
    const width = page.getByLabel('Basin width (m)');
    await width.fill('12.5');
    await width.blur();
    await page.locator('[data-test="unsaved"]').waitFor();
    await page.locator('[data-test="save-design"]').click();
    await page.getByText('Design saved.').waitFor();
    await expect.poll(() => page.locator('[data-test="unsaved"]').count()).toBe(0);
    await shot('7-saved');
    await page.goto(designUrl);
    await expect.poll(() => page.getByLabel('Basin width (m)').inputValue()).toBe('12.5');
    // Put the demo back as seeded so a second run starts from the same design.
    await page.getByLabel('Basin width (m)').fill('12');
    await page.getByLabel('Basin width (m)').blur();
    await page.keyboard.press('Control+s');
    await page.getByText('Design saved.').first().waitFor();
    await page.goto(designUrl);
    await expect.poll(() => page.getByLabel('Basin width (m)').inputValue()).toBe('12');
  });

  it("the project page's design at a glance gives the floor the Jump check gave", async () => {
    await page.goto(designUrl.replace(/\/design$/, ''));
    const floor = page.locator('[data-test="project-design-summary"] [data-test="summary-floor"]');
    await floor.waitFor();
    expect(numberIn(await floor.textContent())).toBe(Number(designFloor.toFixed(2)));
    await expect
      .poll(() =>
        page
          .locator('[data-test="project-design-summary"] [data-test="design-drawing"] svg')
          .count(),
      )
      .toBe(1);
    await shot('8-project-summary');
  });

  it('the study runs in a Web Worker: at 5,000 discharges the page answers a click while it computes', async () => {
    await page.goto(`${designUrl}?step=flows`);
    const designQ = page.getByLabel('Design discharge (m³/s)');
    await expect.poll(() => designQ.inputValue()).toBe('85');
    const workspace = page.locator('[data-study]');
    // The workspace started the study worker (a module worker built from study.worker.ts).
    await expect.poll(() => page.workers().some((w) => /study\.worker/.test(w.url()))).toBe(true);
    await page.getByLabel('How many').fill('5000');
    await page.getByLabel('How many').blur();
    await expect.poll(() => workspace.getAttribute('data-study'), { timeout: 90_000 }).toBe('idle');
    const y1Before = await page.locator('[data-test="summary-y1"]').textContent();

    await designQ.fill('80');
    // While the worker computes, a click on the page is handled and drawn at once: with the
    // study on the main thread no script could run until it ended, and "computing" would never
    // be seen from the page at all.
    await page.locator('[data-study="computing"]').waitFor({ timeout: 60_000 });
    const during = await page.evaluate(async () => {
      const state = () => document.querySelector('[data-study]')?.getAttribute('data-study');
      const toggle = document.querySelector<HTMLElement>('[data-test="cautions-toggle"]')!;
      const before = state();
      toggle.click();
      await new Promise((resolve) => requestAnimationFrame(resolve));
      return { before, after: state(), expanded: toggle.getAttribute('aria-expanded') };
    });
    expect(during).toEqual({ before: 'computing', after: 'computing', expanded: 'true' });

    // The worker's answer for the new design discharge arrives and is shown.
    await expect.poll(() => workspace.getAttribute('data-study'), { timeout: 90_000 }).toBe('idle');
    await expect
      .poll(() => page.locator('[data-test="summary-y1"]').textContent())
      .not.toBe(y1Before);
    expect(await page.locator('[data-test="engine-error"]').count()).toBe(0);
  });

  it('raised no uncaught errors in the page', () => {
    expect(pageErrors).toEqual([]);
  });
});

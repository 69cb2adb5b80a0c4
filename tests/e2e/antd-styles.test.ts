// The ant-design-vue components' styles are worked out at build time (web/build/
// antd-static-style.ts, linked from index.html) instead of in the browser as each kind of
// component first renders — that work held the main thread for hundreds of milliseconds while
// the design workspace opened (issue 13, item 3; timed in `npm run bench -- firstload`, never
// here). Checked: the build links the files and their map names the components the workspace
// draws and antd's own icon style under our theme (web/src/theme.ts designTokenValue); in
// Chromium the Sizing step, every deferred part drawn, injects no antd style at run time, and the
// built styles apply (antd's class-name hash in the browser matches the one worked out at build).
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { e2eBaseUrl, openDemoDesignStep, startBrowser, type E2eBrowser } from '../support/e2e';
import { WEB_DIST } from '../support/web-bundle';

/** Components on the Sizing step whose styles must come from the built files. */
const BUILT = ['Button', 'Table', 'Select', 'InputNumber', 'Form', 'Steps', 'Alert'];

const html = readFileSync(join(WEB_DIST, 'index.html'), 'utf8');
const links = [...html.matchAll(/href="\/(assets\/antd-\d+-[^"]+\.css)"/g)].map((m) => m[1]!);

describe('antd styles built ahead of time', () => {
  it('index.html links them before the app’s own styles, the first carrying the map', () => {
    expect(links.length).toBeGreaterThan(1);
    // The app's own stylesheet (one for every view: vite.config.ts cssCodeSplit false).
    const appCss = html.search(/href="\/assets\/style-[^"]+\.css"/);
    expect(appCss).toBeGreaterThan(html.indexOf(links.at(-1)!));
    const first = readFileSync(join(WEB_DIST, links[0]!), 'utf8');
    const map = /\.data-ant-cssinjs-cache-path\{content:"([^"]+)"/.exec(first)?.[1] ?? '';
    const named = new Set(map.split(';').map((entry) => entry.split('|')[1]));
    for (const component of BUILT) expect(named).toContain(component);
    // The icon style is worked out against the theme the components use (one token hash for all).
    const tokens = new Set(map.split(';').map((entry) => entry.split('|')[0]));
    expect(tokens.size).toBe(1);
    expect(map).toMatch(/(^|;)[a-z0-9]+\|ant-design-icons\|anticon:/);
  });

  let browser: E2eBrowser;
  beforeAll(async () => {
    browser = await startBrowser('antd-styles');
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('the Sizing step draws with them and injects no antd style at run time', async () => {
    const { page } = browser;
    await openDemoDesignStep(page, e2eBaseUrl(), 'sizing');
    await page.locator('[data-study="idle"] [data-test="sizing-type"]').waitFor();
    // The last parts to draw (each deferred to a task of its own).
    for (const part of ['alternatives-table', 'assumptions-table-summary', 'history-panel'])
      await page.locator(`[data-test="${part}"]`).first().waitFor();
    // The assumptions table (folded while nothing in it is changed) with its filter and buttons.
    await page.locator('[data-test="assumptions-table-summary"]').click();
    await page.locator('[data-test="assumptions-table"]').waitFor();
    const injected = await page.evaluate(() =>
      [...document.querySelectorAll('style[data-css-hash]')].map((s) => s.textContent ?? ''),
    );
    expect(injected).toEqual([]);
    // The theme's teal (#0f6e6e) edges the primary "Next" button: the built rule applies.
    const edge = await page
      .locator('[data-test="step-next"]')
      .evaluate((el) => getComputedStyle(el).borderTopColor);
    expect(edge).toBe('rgb(15, 110, 110)');
    expect(browser.pageErrors).toEqual([]);
  });
});

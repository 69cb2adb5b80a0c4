// The ant-design-vue components' styles are worked out at build time (web/build/
// antd-static-style.ts, linked from index.html) instead of in the browser as each kind of
// component first renders — that work held the main thread for hundreds of milliseconds while
// the design workspace opened (issue 13, item 3; timed in `npm run bench -- firstload`, never
// here). Checked: the build links the files and their map names the components the workspace
// draws; in Chromium the Sizing step injects none of those styles at run time, and the built
// styles apply (antd's class-name hash in the browser matches the one worked out at build).
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
    const appCss = html.search(/href="\/assets\/index-[^"]+\.css"/);
    expect(appCss).toBeGreaterThan(html.indexOf(links.at(-1)!));
    const first = readFileSync(join(WEB_DIST, links[0]!), 'utf8');
    const map = /\.data-ant-cssinjs-cache-path\{content:"([^"]+)"/.exec(first)?.[1] ?? '';
    const named = new Set(map.split(';').map((entry) => entry.split('|')[1]));
    for (const component of BUILT) expect(named).toContain(component);
  });

  let browser: E2eBrowser;
  beforeAll(async () => {
    browser = await startBrowser('antd-styles');
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('the Sizing step draws with them and injects none of them at run time', async () => {
    const { page } = browser;
    await openDemoDesignStep(page, e2eBaseUrl(), 'sizing');
    await page.locator('[data-study="idle"] [data-test="sizing-type"]').waitFor();
    await page
      .locator('[data-test="alternatives-table"], [data-test="assumptions-table"]')
      .first()
      .waitFor();
    const injected = await page.evaluate(() =>
      [...document.querySelectorAll('style[data-css-hash]')].map((s) => s.textContent ?? ''),
    );
    // Classes that only each component's own style defines.
    for (const cls of [
      'ant-btn-primary',
      'ant-table-thead',
      'ant-steps-item-title',
      'ant-input-number-handler',
    ])
      expect(injected.filter((css) => css.includes(cls))).toEqual([]);
    // The theme's teal (#0f6e6e) edges the primary "Next" button: the built rule applies.
    const edge = await page
      .locator('[data-test="step-next"]')
      .evaluate((el) => getComputedStyle(el).borderTopColor);
    expect(edge).toBe('rgb(15, 110, 110)');
    expect(browser.pageErrors).toEqual([]);
  });
});

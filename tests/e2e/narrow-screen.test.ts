// Narrow screens in a real browser at 390 × 844: every page and every design step, signed out
// and signed in as each demo role, fits the width — the page never scrolls sideways (wide
// tables scroll inside their own box) — and the side navigation folds behind a menu button.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { e2eBaseUrl, startBrowser, type E2eBrowser } from '../support/e2e';
import {
  openAndSettle,
  ROLES,
  SIGNED_OUT_PAGES,
  signedInPages,
  signInAs,
} from '../support/e2e-pages';

const VIEWPORT = { width: 390, height: 844 };

/** Pages wider than the screen, with the widest elements that stick out, as text. */
async function overflowing(page: Page, urls: string[]): Promise<string[]> {
  const problems: string[] = [];
  for (const url of urls) {
    await openAndSettle(page, url);
    const { scrollWidth, clientWidth, culprits } = await page.evaluate(() => {
      const root = document.documentElement;
      const out: string[] = [];
      for (const el of Array.from(document.body.querySelectorAll('*'))) {
        const r = el.getBoundingClientRect();
        if (r.right > root.clientWidth + 1 && r.width > 0) {
          const parent = el.parentElement?.getBoundingClientRect();
          // report the outermost element that sticks out
          if (!parent || parent.right <= root.clientWidth + 1)
            out.push(
              `${el.tagName.toLowerCase()}.${String(el.className).slice(0, 60)} → ${Math.round(r.right)}px`,
            );
        }
      }
      return {
        scrollWidth: root.scrollWidth,
        clientWidth: root.clientWidth,
        culprits: out.slice(0, 6),
      };
    });
    if (scrollWidth > clientWidth)
      problems.push(`${url}: ${scrollWidth}px wide in ${clientWidth}px (${culprits.join('; ')})`);
  }
  return problems;
}

describe('narrow screens: every page fits 390 px without sideways scrolling', () => {
  let browser: E2eBrowser | undefined;

  beforeAll(async () => {
    browser = await startBrowser('narrow', { viewport: VIEWPORT });
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('signed out pages fit', async () => {
    const base = e2eBaseUrl();
    expect(
      await overflowing(
        browser!.page,
        SIGNED_OUT_PAGES.map((p) => base + p),
      ),
    ).toEqual([]);
  });

  for (const role of ROLES) {
    it(`signed in as the ${role}: every page and step fits, and the navigation opens from its menu button`, async () => {
      const base = e2eBaseUrl();
      const { page, context } = browser!;
      await context.clearCookies();
      await page.goto(`${base}/sign-in`);
      await page.evaluate(() => localStorage.clear());
      const projectPath = await signInAs(page, base, role);
      const urls = signedInPages(role, projectPath).map((p) => base + p);
      expect(await overflowing(page, urls)).toEqual([]);
      // The side navigation is folded away behind its menu button, and opens from it.
      await openAndSettle(page, `${base}/projects`);
      const nav = page.getByRole('navigation', { name: 'Main' });
      expect(await nav.isVisible()).toBe(false);
      await page.getByRole('button', { name: 'Menu' }).click();
      await nav.getByRole('link', { name: 'Account' }).click();
      await page.waitForURL(/\/account$/);
      await browser!.shot(`narrow-${role}-account`);
      expect(browser!.pageErrors).toEqual([]);
    }, 600_000);
  }
});

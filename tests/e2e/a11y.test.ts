// Accessibility in a real browser: axe-core (injected from node_modules) checks every page and
// every step of the design workspace, signed out and signed in as each demo role, against
// WCAG 2.0–2.2 A/AA and axe's best practices. No critical or serious violation is allowed, nor
// a page without its main landmark or with headings out of order. A failure prints every
// violation with the elements it found.
import { createRequire } from 'node:module';
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

const AXE_PATH = createRequire(import.meta.url).resolve('axe-core/axe.min.js');
// WCAG 2.2 AA and axe's best practices (landmarks, heading order).
const TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa', 'best-practice'];
// Rules we hold to whatever impact axe gives them (both are "moderate" in axe).
const ALWAYS = new Set(['landmark-one-main', 'heading-order', 'page-has-heading-one']);

interface Violation {
  id: string;
  impact: string | null;
  help: string;
  nodes: { target: unknown[]; failureSummary?: string }[];
}

async function axeViolations(page: Page): Promise<Violation[]> {
  if (!(await page.evaluate(() => 'axe' in window))) await page.addScriptTag({ path: AXE_PATH });
  return page.evaluate(async (tags) => {
    const axe = (window as unknown as { axe: { run: (...a: unknown[]) => Promise<unknown> } }).axe;
    const result = (await axe.run(document, {
      runOnly: { type: 'tag', values: tags },
    })) as { violations: Violation[] };
    return result.violations.map((v) => ({
      id: v.id,
      impact: v.impact,
      help: v.help,
      nodes: v.nodes.map((n) => ({ target: n.target, failureSummary: n.failureSummary })),
    }));
  }, TAGS);
}

function describeViolations(where: string, violations: Violation[]): string {
  return violations
    .map(
      (v) =>
        `${where}: [${v.impact}] ${v.id} — ${v.help}\n` +
        v.nodes
          .slice(0, 8)
          .map(
            (n) => `    ${JSON.stringify(n.target)} ${n.failureSummary?.replace(/\n/g, ' ') ?? ''}`,
          )
          .join('\n'),
    )
    .join('\n');
}

/** Checks each page and returns the blocking violations as text ('' when there are none). */
async function checkPages(page: Page, urls: string[]): Promise<string> {
  const problems: string[] = [];
  for (const url of urls) {
    await openAndSettle(page, url);
    // Folded parts (a closed <details>, such as the assumptions table) are opened so that what
    // they hold is checked too; their content is made when they open.
    await page.evaluate(() =>
      document.querySelectorAll('details').forEach((d) => {
        d.open = true;
      }),
    );
    await page.waitForFunction(() =>
      [...document.querySelectorAll('details')].every((d) => d.children.length > 1),
    );
    const blocking = (await axeViolations(page)).filter(
      (v) => v.impact === 'critical' || v.impact === 'serious' || ALWAYS.has(v.id),
    );
    if (blocking.length > 0)
      problems.push(describeViolations(url.replace(/^https?:\/\/[^/]+/, ''), blocking));
  }
  return problems.join('\n');
}

describe('accessibility: axe finds no critical or serious violation anywhere', () => {
  let browser: E2eBrowser | undefined;

  beforeAll(async () => {
    // The app's CSP forbids inline scripts; axe-core is injected as one.
    browser = await startBrowser('a11y', { bypassCSP: true });
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('signed out: sign-in, sign-up, password, invitation and not-found pages', async () => {
    const base = e2eBaseUrl();
    const report = await checkPages(
      browser!.page,
      SIGNED_OUT_PAGES.map((p) => base + p),
    );
    if (report) console.log(report);
    expect(report).toBe('');
  });

  for (const role of ROLES) {
    it(`signed in as the ${role}: every page and every design step`, async () => {
      const base = e2eBaseUrl();
      const { page, context } = browser!;
      await context.clearCookies();
      await page.goto(`${base}/sign-in`);
      await page.evaluate(() => localStorage.clear());
      const projectPath = await signInAs(page, base, role);
      const report = await checkPages(
        page,
        signedInPages(role, projectPath).map((p) => base + p),
      );
      if (report) console.log(report);
      expect(report).toBe('');
      expect(browser!.pageErrors).toEqual([]);
    }, 600_000);
  }
});

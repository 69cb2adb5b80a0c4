// Billing in a real browser: the demo owner (Concept plan, one seat, five members) upgrades to
// Professional through the payment stand-in's own Checkout page, comes back, adds a seat, and
// the plan badge and the Team page's seat limit follow — every change driven by the stand-in's
// signed webhooks (`npm test` runs it on 127.0.0.1 and sends its events through the proxy).
// At the end the subscription is ended on the stand-in's payment-details page, which puts the
// demo firm back on Concept (nothing deleted) for the other browser tests.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { signIn, startBrowser, type E2eBrowser } from '../support/e2e';

const OWNER = 'owner@harrow-lune.example';
const PASSWORD = 'basinwright-demo';
/** The demo firm's members (seed/demo.ts): the seats in use before any invitation. */
const DEMO_MEMBERS = 5;
/** Webhooks arrive after the page returns: wait for the state, never for a time. */
const CONFIRM_MS = 60_000;

let browser: E2eBrowser;
let page: Page;

const testId = (id: string) => page.locator(`[data-test="${id}"]`);
const text = async (id: string) => (await testId(id).first().textContent())?.trim() ?? '';

describe('billing: the demo owner upgrades, adds a seat, and the plan and limits follow', () => {
  beforeAll(async () => {
    browser = await startBrowser('billing', { viewport: { width: 1366, height: 900 } });
    page = browser.page;
    await signIn(page, browser.baseUrl, OWNER, PASSWORD);
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('starts on Concept with one seat', async () => {
    expect(await text('plan-badge')).toBe('Concept plan');
    await page.goto(`${browser.baseUrl}/team`);
    await testId('seats').waitFor();
    expect(await text('seats')).toMatch(new RegExp(`^${DEMO_MEMBERS} / 1(?!\\d)`));
  });

  it('upgrades through the payment page and comes back Professional', async () => {
    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Billing', exact: true })
      .click();
    await page.waitForURL(/\/billing$/);
    await testId('billing-upgrade').waitFor();
    // One more seat than are in use is offered, so there is room to invite someone.
    const seats = page.locator(
      '[data-test="billing-buy-seats"] input, input[data-test="billing-buy-seats"]',
    );
    expect(await seats.inputValue()).toBe(String(DEMO_MEMBERS + 1));
    await browser.shot('billing-upgrade');
    await testId('billing-checkout').click();
    // The stand-in's page, on its own port.
    await page.waitForURL(/\/pay\/cs_/);
    expect(await page.locator('[data-test="seats"]').textContent()).toBe(String(DEMO_MEMBERS + 1));
    await browser.shot('billing-fake-checkout');
    await page.getByRole('button', { name: 'Pay now' }).click();
    await page.waitForURL(/\/billing/);
    await expect.poll(() => text('plan-badge'), { timeout: CONFIRM_MS }).toBe('Professional plan');
    await expect
      .poll(() => text('billing-seats-paid'), { timeout: CONFIRM_MS })
      .toBe(String(DEMO_MEMBERS + 1));
    await expect.poll(() => text('billing-plan')).toBe('Professional');
  });

  it('adds a seat: prorated, confirmed by the webhook, shown in billing and on the Team page', async () => {
    const seats = page.locator(
      '[data-test="billing-seats-input"] input, input[data-test="billing-seats-input"]',
    );
    await seats.fill(String(DEMO_MEMBERS + 2));
    await testId('billing-change-seats').click();
    await expect
      .poll(() => text('billing-seats-paid'), { timeout: CONFIRM_MS })
      .toBe(String(DEMO_MEMBERS + 2));
    // Two invoices: the first period, and the added seat's proration.
    await page.reload();
    await expect
      .poll(() => page.locator('[data-test="billing-invoices"] tbody tr.ant-table-row').count(), {
        timeout: CONFIRM_MS,
      })
      .toBe(2);
    await testId('billing-next-invoice').waitFor();
    await browser.shot('billing-after-seat');
    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Team', exact: true })
      .click();
    await testId('seats').waitFor();
    expect(await text('seats')).toMatch(
      new RegExp(`^${DEMO_MEMBERS} / ${DEMO_MEMBERS + 2}(?!\\d)`),
    );
    expect(await text('seats')).not.toContain('all taken');
    expect(browser.pageErrors).toEqual([]);
  });

  it('ending the subscription on the payment-details page puts the firm back on Concept', async () => {
    await page.goto(`${browser.baseUrl}/billing`);
    await testId('billing-portal').click();
    await page.waitForURL(/\/portal\/bps_/);
    await page.getByRole('button', { name: 'End the subscription now' }).click();
    await page.getByRole('link', { name: 'Back to Basinwright' }).click();
    await page.waitForURL(/\/billing$/);
    await expect
      .poll(
        async () => {
          await page.reload();
          await testId('billing-plan').waitFor();
          return text('billing-plan');
        },
        { timeout: CONFIRM_MS },
      )
      .toBe('Concept');
    expect(await text('plan-badge')).toBe('Concept plan');
  });
});

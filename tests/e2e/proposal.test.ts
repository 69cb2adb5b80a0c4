// The proposal in a real browser against the built app and the seeded database (E2E_BASE_URL):
// the demo engineer issues a version of the Fenwick design, makes its proposal in the Proposal
// step and follows it to Ready, then e-mails it to the client; the message arrives in the mail
// capture (maildev, E2E_MAIL_URL) with the PDF attached and the firm as the sender's name.
import { afterAll, describe, expect, it } from 'vitest';
import { e2eBaseUrl, signIn, startBrowser, type E2eBrowser } from '../support/e2e';
import { DEMO_PASSWORD, demoFirm } from '../../seed/demo';

const DEMO_PROJECT = 'Fenwick Mill Pond — auxiliary spillway outlet';
const CLIENT = `trust-${Date.now()}@fenwick-trust.example`;

let browser: E2eBrowser | undefined;
afterAll(async () => {
  await browser?.close();
});

interface CapturedEmail {
  to: { address: string }[];
  from: { name: string; address: string }[];
  attachments?: { contentType: string; fileName?: string; generatedFileName?: string }[];
}

describe('proposal: the demo engineer makes the proposal of an issued version and e-mails it', () => {
  it('issues, makes the proposal, sees it Ready, sends it; the capture holds the PDF', async () => {
    const mailUrl = process.env.E2E_MAIL_URL?.replace(/\/$/, '');
    if (mailUrl === undefined) throw new Error('E2E_MAIL_URL is not set (`npm test` sets it).');
    browser = await startBrowser('proposal-engineer');
    const { page } = browser;
    await signIn(page, e2eBaseUrl(), 'engineer@harrow-lune.example', DEMO_PASSWORD);
    const row = page.locator('[data-test="project-table"] tbody tr', { hasText: DEMO_PROJECT });
    await row.getByRole('link', { name: DEMO_PROJECT }).click();
    await page.locator('[data-test="open-design"]').click();
    await page.waitForURL(/\/projects\/[^/]+\/design/);
    await page.locator('[data-test="history-panel"]').waitFor();
    await page.locator('[data-test="issue-note"]').fill('For the proposal e2e');
    await page.locator('[data-test="issue-version"]').click();
    await page
      .locator('[data-test="version-table"] tbody tr', { hasText: 'For the proposal e2e' })
      .first()
      .waitFor();

    // The Proposal step, from the newest issued version.
    await page.goto(`${page.url().split('?')[0]}?step=proposal`);
    await page.locator('[data-test="proposal-preview"]').waitFor();
    expect(await page.locator('[data-test="proposal-preview"]').textContent()).toContain(
      'USBR Type II basin',
    );
    await page.locator('[data-test="proposal-generate"]').click();
    await expect
      .poll(() => page.locator('[data-test="proposal-status"]').textContent(), {
        timeout: 180_000,
      })
      .toBe('Ready');

    await page.locator('[data-test="proposal-send-to"]').fill(CLIENT);
    await page.locator('[data-test="proposal-send-button"]').click();
    await expect
      .poll(() => page.locator('[data-test="proposal-sent"]').textContent(), { timeout: 30_000 })
      .toContain(CLIENT);

    let mail: CapturedEmail | undefined;
    await expect
      .poll(
        async () => {
          const mails = (await (await fetch(`${mailUrl}/api/email`)).json()) as CapturedEmail[];
          mail = mails.find((m) => m.to.some((a) => a.address.toLowerCase() === CLIENT));
          return mail !== undefined;
        },
        { timeout: 30_000 },
      )
      .toBe(true);
    expect(mail?.from[0]?.name).toBe(demoFirm.name);
    expect(mail?.attachments?.map((a) => a.contentType)).toEqual(['application/pdf']);
    expect(browser.pageErrors).toEqual([]);
  }, 300_000);
});

// Browser benchmark (not a test): interaction latency in the design workspace, in Chromium with
// its CPU slowed 4× (CDP Emulation.setCPUThrottlingRate), on the demo design (product.md,
// invented) with 1,000 discharges. Typing in the design-discharge field (each key starts a study
// after the pause in typing) against toggling a trivial switch on the same page (the list of
// cautions, which runs no study); the target is a ratio ≤ 1.5. With the study in a Web Worker,
// typing stays as quick as the switch; the same run without a Worker (the in-thread fallback)
// is printed beside it for comparison.
// Latency of one interaction: from sending the input (CDP) until the page has handled it and
// drawn the next frame, timed from the driver. Needs the built app served at BENCH_BASE_URL on a
// seeded database. Run by `npm run bench`.
import type { Page } from 'playwright-core';
import { e2eBaseUrl, signIn, startBrowser } from '../tests/support/e2e';
import { record } from './bench-results';

const DEMO_PROJECT = 'Fenwick Mill Pond — auxiliary spillway outlet';
const DISCHARGES = 1000;
/** longer than the pause in typing (250 ms): each key's study has started when the next comes */
const GAP_MS = 400;
const SAMPLES = Number(process.env.BENCH_BROWSER_SAMPLES ?? 20);

/** The page's globals used in evaluate callbacks (this script is type-checked without the DOM). */
interface PageGlobals {
  requestAnimationFrame(callback: () => void): number;
  document: {
    querySelector(selector: string): { getAttribute(name: string): string | null } | null;
  };
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const percentile = (xs: number[], p: number): number => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.floor(p * s.length))]!;
};

/** ms from sending the input until the next frame after the page handled it */
async function timed(page: Page, act: () => Promise<void>): Promise<number> {
  const t0 = performance.now();
  await act();
  await page.evaluate(
    () =>
      new Promise<void>((r) =>
        (globalThis as unknown as PageGlobals).requestAnimationFrame(() => setTimeout(r, 0)),
      ),
  );
  return performance.now() - t0;
}

async function idle(page: Page): Promise<void> {
  await page.waitForFunction(
    () =>
      (globalThis as unknown as PageGlobals).document
        .querySelector('[data-study]')
        ?.getAttribute('data-study') === 'idle',
    undefined,
    { timeout: 300_000, polling: 100 },
  );
}

async function measure(withWorker: boolean, samples: number) {
  const browser = await startBrowser(`bench-${withWorker ? 'worker' : 'thread'}`, {
    timeoutMs: 120_000,
  });
  const { page, context } = browser;
  try {
    // Without a Worker the page falls back to running the study in its own thread.
    if (!withWorker)
      await context.addInitScript(() => {
        delete (globalThis as { Worker?: unknown }).Worker;
      });
    await signIn(page, e2eBaseUrl(), 'engineer@harrow-lune.example', 'basinwright-demo');
    const row = page.locator('[data-test="project-table"] tbody tr', { hasText: DEMO_PROJECT });
    await row.getByRole('link', { name: DEMO_PROJECT }).click();
    await page.locator('[data-test="open-design"]').click();
    await page.waitForURL(/\/projects\/[^/]+\/design/);
    await page.goto(`${page.url().split('?')[0]}?step=flows`);
    const designQ = page.getByLabel('Design discharge (m³/s)');
    await designQ.waitFor();
    await page.getByLabel('How many').fill(String(DISCHARGES));
    await page.getByLabel('How many').blur();
    await idle(page);

    const cdp = await context.newCDPSession(page);
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: 4 });

    // The switch: the cautions toggle, clicked where it stands (no study runs).
    const toggle = page.locator('[data-test="cautions-toggle"]');
    await toggle.scrollIntoViewIfNeeded();
    const box = (await toggle.boundingBox())!;
    const [x, y] = [box.x + box.width / 2, box.y + box.height / 2];
    const switchMs: number[] = [];
    for (let i = 0; i < samples; i++) {
      switchMs.push(await timed(page, () => page.mouse.click(x, y)));
      await sleep(GAP_MS);
    }

    // Typing: 85 → 8 → 85 …, each key a new design discharge and a new study.
    await designQ.click();
    await page.keyboard.press('End');
    const typingMs: number[] = [];
    for (let i = 0; i < samples; i++) {
      const key = i % 2 === 0 ? 'Backspace' : '5';
      typingMs.push(await timed(page, () => page.keyboard.press(key)));
      await sleep(GAP_MS);
    }
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: 1 });
    return { switchMs, typingMs };
  } finally {
    await browser.close();
  }
}

function report(label: string, r: { switchMs: number[]; typingMs: number[] }): number {
  const s50 = percentile(r.switchMs, 0.5);
  const s90 = percentile(r.switchMs, 0.9);
  const t50 = percentile(r.typingMs, 0.5);
  const t90 = percentile(r.typingMs, 0.9);
  console.log(
    `${label}: typing median ${t50.toFixed(0)} ms, p90 ${t90.toFixed(0)} ms; switch median ${s50.toFixed(0)} ms, p90 ${s90.toFixed(0)} ms`,
  );
  return t90 / s90;
}

const worker = await measure(true, SAMPLES);
const ratio = report(`Study in a Web Worker (CPU 4× slower, ${DISCHARGES} discharges)`, worker);
record({
  name: 'ratio.browser.typingVsSwitch',
  label: 'typing ÷ switch latency, p90 (Chromium 4× slower)',
  value: ratio,
  unit: 'ratio',
  target: { op: '<=', value: 1.5 },
});
console.log(
  `interaction latency ratio typing / switch (p90): ${ratio.toFixed(2)} (target ≤ 1.5) ${ratio <= 1.5 ? 'OK' : 'OVER TARGET'}`,
);
if (process.env.BENCH_BROWSER_THREAD !== '0') {
  const thread = await measure(false, Math.min(SAMPLES, 8));
  const r2 = report('For comparison, the study in the page thread', thread);
  console.log(`ratio without the worker (p90): ${r2.toFixed(2)}`);
}

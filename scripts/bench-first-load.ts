// Browser benchmark of the first load (issue 13, item 3; not a test), in Chromium on the built
// app (seeded database, served by the API as in production). Figures recorded:
// - JavaScript the browser loads, gzipped (each script it fetched, gzipped at level 9 as the
//   build's .gz files), with an empty cache: the sign-in page (target ≤ 150 kB) and the demo
//   design's workspace at the Sizing step, which shows no chart (target ≤ 400 kB; any echarts
//   code loaded is counted and reported); the study worker's script and the charts (at the
//   Inflow step) beside them, and what actually crossed the wire (brotli).
// - With the CPU slowed 4× (CDP Emulation.setCPUThrottlingRate) and the app's files cached:
//   the longest main-thread task (PerformanceObserver 'longtask') while the Sizing step opens,
//   until its results show and a second after (target ≤ 200 ms), and the time until the
//   results show against the time a trivial page of the same app (Account) takes to show
//   (median of the rounds; target ≤ 1.5).
// Needs E2E_BASE_URL; run by `npm run bench` (or `npm run bench -- firstload`).
import type { BrowserContext, Page, Response } from 'playwright-core';
import { e2eBaseUrl, signIn, startBrowser } from '../tests/support/e2e';
import { LIBRARY_MARKS, gzipBytes } from '../tests/support/web-bundle';
import { record } from './bench-results';

const DEMO_PROJECT = 'Fenwick Mill Pond — auxiliary spillway outlet';
const ROUNDS = Number(process.env.BENCH_FIRST_LOAD_ROUNDS ?? 5);
/** Shown once the Sizing step's results are on screen (the study answered, the type sized). */
const SIZING_SHOWN = '[data-study="idle"] [data-test="sizing-type"]';
/** Shown once the Account page is on screen. */
const ACCOUNT_SHOWN = '[data-test="account-sign-out"]';

interface Probe {
  longTasks: Array<{ start: number; duration: number }>;
  shown: Record<string, number>;
}

/**
 * Installed before any script of every page: collects long tasks and the first moment each
 * watched selector matches (ms since the navigation started). Plain source text: a function
 * passed from here would carry the TypeScript loader's helpers, unknown in the page.
 */
function probeScript(selectors: Record<string, string>): string {
  return `(() => {
    const selectors = ${JSON.stringify(selectors)};
    const probe = { longTasks: [], shown: {} };
    window.__bwProbe = probe;
    new PerformanceObserver((list) => {
      for (const e of list.getEntries())
        probe.longTasks.push({ start: e.startTime, duration: e.duration });
    }).observe({ type: 'longtask', buffered: true });
    new MutationObserver(() => {
      for (const [name, selector] of Object.entries(selectors))
        if (probe.shown[name] === undefined && document.querySelector(selector))
          probe.shown[name] = performance.now();
    }).observe(document, {
      childList: true,
      subtree: true,
      attributes: true,
      attributeFilter: ['data-study'],
    });
  })();`;
}

interface Loaded {
  url: string;
  gzip: number;
  wire: number;
  echarts: boolean;
  worker: boolean;
}

/** Every script fetched while `act` runs, with its gzipped and transferred size. */
async function scriptsDuring(page: Page, act: () => Promise<void>): Promise<Loaded[]> {
  const pending: Array<Promise<Loaded | null>> = [];
  const onResponse = (res: Response): void => {
    const url = new URL(res.url());
    if (!/\.m?js$/.test(url.pathname)) return;
    pending.push(
      (async () => {
        const body = await res.body();
        const sizes = await res.request().sizes();
        return {
          url: url.pathname,
          gzip: gzipBytes(body),
          wire: sizes.responseBodySize,
          echarts: body.includes(LIBRARY_MARKS.echarts),
          worker: /worker/i.test(url.pathname),
        };
      })().catch(() => null),
    );
  };
  page.context().on('response', onResponse);
  try {
    await act();
    await page.waitForLoadState('networkidle');
  } finally {
    page.context().off('response', onResponse);
  }
  return (await Promise.all(pending)).filter((x): x is Loaded => x !== null);
}

const kB = (bytes: number): number => bytes / 1000;
const sum = (xs: Loaded[], f: (x: Loaded) => number): number => xs.reduce((s, x) => s + f(x), 0);
const median = (xs: number[]): number => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)]!;
};

async function emptyCache(context: BrowserContext, page: Page): Promise<void> {
  const cdp = await context.newCDPSession(page);
  await cdp.send('Network.clearBrowserCache');
  await cdp.detach();
}

function describeLoad(label: string, xs: Loaded[]): void {
  // A worker's script has no size on the wire in the browser's accounting.
  const wire = xs.every((x) => x.wire >= 0)
    ? `, ${kB(sum(xs, (x) => x.wire)).toFixed(1)} kB on the wire`
    : '';
  console.log(
    `${label}: ${xs.length} scripts, ${kB(sum(xs, (x) => x.gzip)).toFixed(1)} kB gzipped${wire}`,
  );
}

const base = e2eBaseUrl();
const browser = await startBrowser('bench-first-load', { timeoutMs: 120_000 });
const { page, context } = browser;
try {
  await context.addInitScript({
    content: probeScript({ sizing: SIZING_SHOWN, account: ACCOUNT_SHOWN }),
  });

  // 1. The sign-in page, empty cache.
  await emptyCache(context, page);
  const signInJs = await scriptsDuring(page, async () => {
    await page.goto(`${base}/sign-in`);
    await page.getByRole('button', { name: 'Sign in' }).waitFor();
  });
  describeLoad('sign-in page', signInJs);
  record({
    name: 'firstLoad.signIn.jsGzipKB',
    label: 'sign-in page: JavaScript loaded, kB gzipped',
    value: kB(sum(signInJs, (x) => x.gzip)),
    unit: 'kB',
    target: { op: '<=', value: 150 },
    note: `${signInJs.length} scripts, empty cache; ${kB(sum(signInJs, (x) => x.wire)).toFixed(1)} kB on the wire (brotli)`,
  });

  // 2. The demo design's workspace at the Sizing step, empty cache, signed in.
  await signIn(page, base, 'engineer@harrow-lune.example', 'basinwright-demo');
  const row = page.locator('[data-test="project-table"] tbody tr', { hasText: DEMO_PROJECT });
  await row.getByRole('link', { name: DEMO_PROJECT }).click();
  await page.locator('[data-test="open-design"]').click();
  await page.waitForURL(/\/projects\/[^/]+\/design/);
  const designUrl = page.url().split('?')[0]!;
  await emptyCache(context, page);
  const workspaceAll = await scriptsDuring(page, async () => {
    await page.goto(`${designUrl}?step=sizing`);
    await page.locator(SIZING_SHOWN).waitFor();
  });
  const worker = workspaceAll.filter((x) => x.worker);
  const workspace = workspaceAll.filter((x) => !x.worker);
  const chartsThere = workspace.filter((x) => x.echarts);
  describeLoad('workspace at the Sizing step (page scripts)', workspace);
  describeLoad('  of which carry echarts', chartsThere);
  describeLoad('  the study worker', worker);
  record({
    name: 'firstLoad.workspace.jsGzipKB',
    label: 'design workspace (Sizing step), no chart: JS kB gzip',
    value: kB(sum(workspace, (x) => x.gzip)),
    unit: 'kB',
    target: { op: '<=', value: 400 },
    note: `${workspace.length} scripts of the page, empty cache; echarts among them: ${kB(sum(chartsThere, (x) => x.gzip)).toFixed(1)} kB; ${kB(sum(workspace, (x) => x.wire)).toFixed(1)} kB on the wire`,
  });
  record({
    name: 'firstLoad.studyWorker.jsGzipKB',
    label: 'the study worker script, kB gzipped',
    value: kB(sum(worker, (x) => x.gzip)),
    unit: 'kB',
    note: 'loaded beside the workspace, runs off the main thread',
  });
  const before = new Set(workspaceAll.map((x) => x.url));
  const chartsJs = (
    await scriptsDuring(page, async () => {
      await page.goto(`${designUrl}?step=inflow`);
      await page.locator('[data-test="toe-chart"] svg').first().waitFor();
    })
  ).filter((x) => !before.has(x.url));
  describeLoad('charts added at the Inflow step', chartsJs);
  record({
    name: 'firstLoad.charts.jsGzipKB',
    label: 'the charts, loaded when first shown, kB gzipped',
    value: kB(sum(chartsJs, (x) => x.gzip)),
    unit: 'kB',
    note: 'scripts fetched on moving to the Inflow step after the Sizing step',
  });

  // 3. CPU 4× slower, files cached: long tasks and time to results against a trivial page.
  const cdp = await context.newCDPSession(page);
  await cdp.send('Emulation.setCPUThrottlingRate', { rate: 4 });
  const probe = () =>
    page.evaluate(() => (globalThis as unknown as { __bwProbe: Probe }).__bwProbe);
  const sizingMs: number[] = [];
  const accountMs: number[] = [];
  let longest = 0;
  const tasks: number[] = [];
  for (let i = 0; i < ROUNDS; i++) {
    await page.goto(`${base}/account`);
    await page.locator(ACCOUNT_SHOWN).waitFor();
    accountMs.push((await probe()).shown.account!);

    await page.goto(`${designUrl}?step=sizing`);
    await page.locator(SIZING_SHOWN).waitFor();
    // Tasks right after the results show belong to opening the step too.
    await page.waitForTimeout(1000);
    const p = await probe();
    sizingMs.push(p.shown.sizing!);
    const round = Math.max(0, ...p.longTasks.map((t) => t.duration));
    const worst = [...p.longTasks].sort((a, b) => b.duration - a.duration).slice(0, 4);
    console.log(
      `  round ${i + 1}: results at ${p.shown.sizing!.toFixed(0)} ms; longest tasks ` +
        worst.map((t) => `${t.duration.toFixed(0)} ms from ${t.start.toFixed(0)}`).join(', '),
    );
    longest = Math.max(longest, round);
    tasks.push(round);
  }
  await cdp.send('Emulation.setCPUThrottlingRate', { rate: 1 });
  const ratio = median(sizingMs) / median(accountMs);
  console.log(
    `CPU 4× slower: Sizing results shown at ${sizingMs.map((x) => x.toFixed(0)).join(', ')} ms; ` +
      `Account page at ${accountMs.map((x) => x.toFixed(0)).join(', ')} ms; ` +
      `longest task per round ${tasks.map((x) => x.toFixed(0)).join(', ')} ms`,
  );
  record({
    name: 'firstLoad.sizing.longestTaskMs',
    label: 'longest task opening the Sizing step, ms (CPU 4×)',
    value: longest,
    unit: 'ms',
    target: { op: '<=', value: 200 },
    note: `worst of ${ROUNDS} rounds, files cached`,
  });
  record({
    name: 'ratio.firstLoad.sizingVsTrivialPage',
    label: 'Sizing results shown ÷ Account page shown (CPU 4×)',
    value: ratio,
    unit: 'ratio',
    target: { op: '<=', value: 1.5 },
    note: `medians of ${ROUNDS} rounds: ${median(sizingMs).toFixed(0)} ms ÷ ${median(accountMs).toFixed(0)} ms`,
  });
} finally {
  await browser.close();
}

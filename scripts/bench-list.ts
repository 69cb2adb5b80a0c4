// The project list under load (not a test): 100,000 projects across 200 firms, the first page
// of one firm's list against a bare `SELECT 1` behind the same stack (helmet, request log,
// sign-in check, role check), and the list's p99 against /api/v1/health's in the same run.
// Targets: list ÷ SELECT 1 cost ≤ 3; list p99 ≤ 3 × health p99; no errors at 50 connections.
// Figures go to .bench/list-<time>.json so runs can be compared.
// Run: node --import tsx --conditions=@basinwright/source scripts/bench-list.ts (DATABASE_URL set)
import { execFile } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { promisify } from 'node:util';
import type { Request, Response } from 'express';
import { QueryTypes } from 'sequelize';
import { createApp } from '../api/src/app';
import { guard } from '../api/src/middlewares/auth';
import { sequelize } from '../api/src/models';
import { issueToken } from '../api/src/modules/auth/auth.tokens';
import { listen } from './bench-listen';
import { record } from './bench-results';

const FIRMS = Number(process.env.BENCH_LIST_FIRMS ?? 200);
const PER_FIRM = Number(process.env.BENCH_LIST_PER_FIRM ?? 500);
const SECONDS = Number(process.env.BENCH_SECONDS ?? 5);
const CONCURRENCY = Number(process.env.BENCH_CONCURRENCY ?? 50);
const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 3);

interface LoadResult {
  ok: number;
  bad: number;
  rps: number;
  p50: number | null;
  p99: number | null;
}

const execFileAsync = promisify(execFile);

/** Closed-loop load from a separate process (scripts/bench-load.mjs). */
async function load(url: string, headers: Record<string, string>): Promise<LoadResult> {
  const { stdout } = await execFileAsync(
    process.execPath,
    [
      'scripts/bench-load.mjs',
      url,
      'GET',
      '-',
      JSON.stringify(headers),
      String(SECONDS),
      String(CONCURRENCY),
    ],
    { encoding: 'utf8' },
  );
  return JSON.parse(stdout.trim()) as LoadResult;
}

/** 200 firms of 500 projects each (invented names), one owner each; skipped when present. */
async function seedProjects(): Promise<void> {
  const [{ n } = { n: 0 }] = await sequelize.query<{ n: number }>(
    `SELECT count(*)::int AS n FROM firms WHERE name LIKE 'Bench list firm %'`,
    { type: QueryTypes.SELECT },
  );
  if (n >= FIRMS) return;
  await sequelize.transaction(async (transaction) => {
    const q = (sql: string) => sequelize.query(sql, { transaction });
    await q(`INSERT INTO firms (name, plan, seats)
      SELECT 'Bench list firm ' || g, 'firm', 5 FROM generate_series(1, ${FIRMS}) g`);
    // The hash is never checked: the benchmark signs its own tokens.
    await q(`INSERT INTO users (firm_id, name, email, password_hash, role)
      SELECT id, 'Bench owner', 'owner-' || id || '@bench.example', 'not-a-password-hash', 'owner'
      FROM firms WHERE name LIKE 'Bench list firm %'`);
    await q(`INSERT INTO projects
        (firm_id, name, client, location, units, status, created_by_id, created_at, updated_at)
      SELECT f.id, 'Outlet ' || g, 'Client ' || (g % 37), 'Reach ' || (g % 11),
        CASE WHEN g % 2 = 0 THEN 'SI' ELSE 'US' END,
        (ARRAY['draft', 'in review', 'issued', 'archived'])[1 + g % 4], u.id,
        now() - random() * interval '1000 days', now() - random() * interval '1000 days'
      FROM firms f JOIN users u ON u.firm_id = f.id CROSS JOIN generate_series(1, ${PER_FIRM}) g
      WHERE f.name LIKE 'Bench list firm %'`);
  });
  await sequelize.query('ANALYZE firms, users, projects');
}

/** The app with a bare SELECT 1 behind everything the list route has in front of it. */
function listenWithSelect1() {
  return listen(
    createApp({
      webDist: null,
      extraRoutes: (api) =>
        api.get(
          '/bench-select1',
          ...guard('projects.list'),
          async (_req: Request, res: Response) => {
            await sequelize.query('SELECT 1');
            res.json({ ok: true });
          },
        ),
    }),
  );
}

export async function benchList(): Promise<void> {
  await seedProjects();
  const [owner] = await sequelize.query<{ id: string; firm_id: string; token_version: number }>(
    `SELECT u.id, u.firm_id, u.token_version FROM users u JOIN firms f ON f.id = u.firm_id
     WHERE f.name = 'Bench list firm ${Math.ceil(FIRMS / 2)}'`,
    { type: QueryTypes.SELECT },
  );
  if (owner === undefined) throw new Error('no bench firm owner');
  const auth = {
    authorization: `Bearer ${issueToken({ id: owner.id, firmId: owner.firm_id, tokenVersion: owner.token_version })}`,
  };
  const server = await listenWithSelect1();
  const first = await fetch(`${server.url}/api/v1/projects`, { headers: auth });
  const body = (await first.json()) as { items?: unknown[] };
  if (first.status !== 200 || body.items?.length !== 20)
    throw new Error(`the list answered ${first.status} with ${body.items?.length} items`);

  const targets = {
    health: () => load(`${server.url}/api/v1/health`, {}),
    select1: () => load(`${server.url}/api/v1/bench-select1`, auth),
    list: () => load(`${server.url}/api/v1/projects`, auth),
    listByName: () => load(`${server.url}/api/v1/projects?sort=name&order=asc`, auth),
    listSearch: () => load(`${server.url}/api/v1/projects?search=Outlet%2042`, auth),
  };
  type Name = keyof typeof targets;
  for (const run of Object.values(targets)) await run(); // warm-up
  const results: Record<Name, LoadResult[]> = {
    health: [],
    select1: [],
    list: [],
    listByName: [],
    listSearch: [],
  };
  for (let round = 0; round < ROUNDS; round += 1)
    for (const [name, run] of Object.entries(targets) as [Name, () => Promise<LoadResult>][])
      results[name].push(await run());
  await server.close();

  const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)] ?? NaN;
  // Ratios are taken within each round (same moment on a shared machine), then the median.
  const ratio = (f: (i: number) => number) => median(results.list.map((_r, i) => f(i)));
  const at = (name: Name, i: number) => results[name][i] as LoadResult;
  const costRatio = ratio((i) => at('select1', i).rps / at('list', i).rps);
  const p99Ratio = ratio((i) => (at('list', i).p99 ?? NaN) / (at('health', i).p99 ?? NaN));
  const errors = Object.values(results)
    .flat()
    .reduce((n, r) => n + r.bad, 0);

  const row = (label: string, name: Name) => {
    const rs = results[name];
    console.log(
      `${label.padEnd(44)} ${median(rs.map((r) => r.rps))
        .toFixed(0)
        .padStart(6)} req/s  ` +
        `p50 ${median(rs.map((r) => r.p50 ?? NaN)).toFixed(1)} ms  p99 ${median(rs.map((r) => r.p99 ?? NaN)).toFixed(1)} ms`,
    );
  };
  console.log(`${FIRMS * PER_FIRM} projects across ${FIRMS} firms; one firm's list:`);
  row('GET /api/v1/health (SELECT 1, no sign-in)', 'health');
  row('SELECT 1 behind sign-in and role check', 'select1');
  row('GET /api/v1/projects (first page)', 'list');
  row('GET /api/v1/projects?sort=name&order=asc', 'listByName');
  row('GET /api/v1/projects?search=…', 'listSearch');
  console.log(
    `(medians of ${ROUNDS} alternating rounds of ${SECONDS} s, ${CONCURRENCY} connections; ${errors} errors)`,
  );
  console.log(
    `list first page ÷ SELECT 1 (cost per request) = ${costRatio.toFixed(2)} (target ≤ 3) ${costRatio <= 3 ? 'MET' : 'NOT MET'}`,
  );
  console.log(
    `list p99 ÷ health p99 in the same run        = ${p99Ratio.toFixed(2)} (target ≤ 3) ${p99Ratio <= 3 ? 'MET' : 'NOT MET'}`,
  );
  console.log(`errors on the list at ${CONCURRENCY} connections: ${errors} (target 0)`);
  record({
    name: 'ratio.list.vsSelect1',
    label: 'project list first page ÷ SELECT 1 (100,000 projects)',
    value: costRatio,
    unit: 'ratio',
    target: { op: '<=', value: 3 },
  });
  record({
    name: 'ratio.list.p99VsHealth',
    label: 'project list p99 ÷ /health p99 (50 connections)',
    value: p99Ratio,
    unit: 'ratio',
    target: { op: '<=', value: 3 },
  });
  record({
    name: 'list.errors',
    label: 'errors on the list at 50 connections',
    value: errors,
    unit: 'count',
  });

  mkdirSync('.bench', { recursive: true });
  const file = join('.bench', `list-${new Date().toISOString().replace(/[:.]/g, '-')}.json`);
  writeFileSync(
    file,
    JSON.stringify(
      {
        at: new Date().toISOString(),
        projects: FIRMS * PER_FIRM,
        firms: FIRMS,
        seconds: SECONDS,
        concurrency: CONCURRENCY,
        rounds: ROUNDS,
        results,
        ratios: { listOverSelect1: costRatio, listP99OverHealthP99: p99Ratio },
        errors,
      },
      null,
      2,
    ),
  );
  console.log(`figures written to ${file}`);
}

await benchList();
await sequelize.close();

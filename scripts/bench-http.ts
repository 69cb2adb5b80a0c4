// HTTP throughput of POST /api/v1/calc/jump against a bare JSON route, served from the same
// process in the same run; load comes from a separate process (scripts/bench-load.mjs).
import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import express from 'express';
import { createApp } from '../api/src/app';
import { sequelize } from '../api/src/db/sequelize';
import { listen } from './bench-listen';

const SECONDS = Number(process.env.BENCH_SECONDS ?? 5);
const CONCURRENCY = Number(process.env.BENCH_CONCURRENCY ?? 50);

const execFileAsync = promisify(execFile);

// Asynchronous on purpose: the servers under load run on this process's event loop.
async function load(url: string, method: string, body: unknown, headers: Record<string, string>) {
  const { stdout: out } = await execFileAsync(
    process.execPath,
    [
      'scripts/bench-load.mjs',
      url,
      method,
      body === undefined ? '-' : JSON.stringify(body),
      JSON.stringify(headers),
      String(SECONDS),
      String(CONCURRENCY),
    ],
    { encoding: 'utf8' },
  );
  return JSON.parse(out.trim()) as { ok: number; bad: number; rps: number };
}

const bare = express();
bare.use(express.json());
bare.post('/bare', (req, res) => {
  res.json({ ok: true, echo: req.body });
});

const real = await listen(
  createApp({
    webDist: null,
    // The same app's stack (helmet, request log, JSON parser) with nothing behind it.
    extraRoutes: (api) =>
      api.post('/bench-bare', (req, res) => {
        res.json({ ok: true, echo: req.body as unknown });
      }),
  }),
);
const plain = await listen(bare);

const email = `bench-${Date.now()}@bench.example`;
const signup = await fetch(`${real.url}/api/v1/auth/signup`, {
  method: 'POST',
  headers: { 'content-type': 'application/json' },
  body: JSON.stringify({
    firmName: 'Bench firm',
    name: 'Bench',
    email,
    password: 'bench-password-1',
  }),
});
if (signup.status !== 201)
  throw new Error(`signup failed: ${signup.status} ${await signup.text()}`);
const { token } = (await signup.json()) as { token: string };

// Demo-like jump: 12 m rectangle, 85 m³/s, y1 0.46 m (invented demo values).
const jumpBody = { section: { shape: 'rectangular', width: 12 }, Q: 85, y1: 0.46 };
const auth = { authorization: `Bearer ${token}` };
const check = await fetch(`${real.url}/api/v1/calc/jump`, {
  method: 'POST',
  headers: { 'content-type': 'application/json', ...auth },
  body: JSON.stringify(jumpBody),
});
if (check.status !== 200)
  throw new Error(`calc/jump answered ${check.status}: ${await check.text()}`);

// Alternate the two routes over several rounds and take medians: the machine is shared, so
// a single pair of runs is at the mercy of whatever else runs at that moment.
const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 3);
const targets = {
  plain: () => load(`${plain.url}/bare`, 'POST', jumpBody, {}),
  stack: () => load(`${real.url}/api/v1/bench-bare`, 'POST', jumpBody, {}),
  jump: () => load(`${real.url}/api/v1/calc/jump`, 'POST', jumpBody, auth),
};
for (const run of Object.values(targets)) await run(); // warm-up
const rps: Record<keyof typeof targets, number[]> = { plain: [], stack: [], jump: [] };
const cpuPer: Record<string, number[]> = {};
let errors = 0;
for (let round = 0; round < ROUNDS; round += 1) {
  for (const [name, run] of Object.entries(targets) as [
    keyof typeof targets,
    () => ReturnType<typeof load>,
  ][]) {
    const cpu0 = process.cpuUsage();
    const r = await run();
    const cpu = process.cpuUsage(cpu0);
    (cpuPer[name] ??= []).push((cpu.user + cpu.system) / Math.max(1, r.ok + r.bad));
    rps[name].push(r.rps);
    errors += r.bad;
  }
}
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)] ?? NaN;
const ratioOf = (name: 'plain' | 'stack') =>
  median(rps.jump.map((j, i) => j / (rps[name][i] ?? NaN)));
console.log(
  `bare route, plain Express (nothing else):       ${median(rps.plain).toFixed(0)} req/s`,
);
console.log(
  `bare route behind the app's own stack:          ${median(rps.stack).toFixed(0)} req/s`,
);
console.log(`POST /api/v1/calc/jump (token, schema, engine): ${median(rps.jump).toFixed(0)} req/s`);
console.log(
  `(medians of ${ROUNDS} alternating rounds of ${SECONDS} s, ${CONCURRENCY} connections; ${errors} errors)`,
);
const target = ratioOf('stack');
console.log(
  `calc/jump ÷ bare route in the same app = ${target.toFixed(3)} (target ≥ 0.6) ${target >= 0.6 ? 'MET' : 'NOT MET'}`,
);
console.log(
  `server CPU per request: ${Object.entries(cpuPer)
    .map(([k, v]) => `${k} ${median(v).toFixed(0)} µs`)
    .join(', ')}`,
);
console.log(
  `calc/jump ÷ plain Express route        = ${ratioOf('plain').toFixed(3)} (for reference)`,
);

await real.close();
await plain.close();
await sequelize.close();

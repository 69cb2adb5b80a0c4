// HTTP throughput of POST /api/v1/calc/jump against a bare JSON route, served from the same
// process in the same run, and /health latency while a 5,000-discharge study runs in the
// compute pool against idle; load comes from a separate process (scripts/bench-load.mjs).
// Every figure is recorded (scripts/bench-results.ts) for bench.mjs's summary and JSON file.
import express from 'express';
import { ENGINE_LIMITS, type StudyInput } from '@basinwright/common';
import { createApp } from '../api/src/app';
import { sequelize } from '../api/src/db/sequelize';
import { calcRouter } from '../api/src/modules/calc/calc.routes';
import { closeComputePool, computePool } from '../api/src/modules/calc/calc.pool';
import { fenwickDesign } from '../seed/designs';
import { record } from './bench-results';
import { Firm, User } from '../api/src/models';
import { issueToken } from '../api/src/modules/auth/auth.tokens';
import { hashPassword } from '../api/src/security';
import { listen, load, median, BENCH_SECONDS as SECONDS } from './bench-listen';

const CONCURRENCY = Number(process.env.BENCH_CONCURRENCY ?? 50);

const bare = express();
bare.use(express.json());
bare.post('/bare', (req, res) => {
  res.json({ ok: true, echo: req.body });
});

const real = await listen(
  createApp({
    webDist: null,
    // The same app's stack (helmet, request log, JSON parser) with nothing behind it.
    extraRoutes: (api) => {
      api.post('/bench-bare', (req, res) => {
        res.json({ ok: true, echo: req.body as unknown });
      });
      // The same calc routes with no authentication at all: what the token and revocation
      // check cost is the difference to /calc/jump.
      api.use(
        '/bench-open-calc',
        calcRouter((_req, _res, next) => next()),
      );
    },
  }),
);
const plain = await listen(bare);

// A member made straight in the database (sign-up goes through an e-mailed link).
const firm = await Firm.create({ name: 'Bench firm', plan: 'concept', seats: 1 });
const member = await User.create({
  firmId: firm.id,
  name: 'Bench',
  email: `bench-${Date.now()}@bench.example`,
  passwordHash: await hashPassword('bench-password-1'),
  role: 'owner',
});
const token = issueToken(member);

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
  open: () => load(`${real.url}/api/v1/bench-open-calc/jump`, 'POST', jumpBody, {}),
};
for (const run of Object.values(targets)) await run(); // warm-up
const rps: Record<keyof typeof targets, number[]> = { plain: [], stack: [], jump: [], open: [] };
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
const ratioOf = (name: 'plain' | 'stack' | 'open') =>
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
const authRatio = ratioOf('open');
record({
  name: 'ratio.calc.authVsOpen',
  label: 'calc/jump with token + revocation ÷ unauthenticated',
  value: authRatio,
  unit: 'ratio',
  target: { op: '>=', value: 0.8 },
});
console.log(
  `calc/jump with token + revocation check ÷ the same route unauthenticated = ${authRatio.toFixed(3)} (target ≥ 0.8) ${authRatio >= 0.8 ? 'MET' : 'NOT MET'}`,
);
console.log(
  `server CPU per request: ${Object.entries(cpuPer)
    .map(([k, v]) => `${k} ${median(v).toFixed(0)} µs`)
    .join(', ')}`,
);
console.log(
  `calc/jump ÷ plain Express route        = ${ratioOf('plain').toFixed(3)} (for reference)`,
);
const how = `medians of ${ROUNDS} alternating rounds of ${SECONDS} s, ${CONCURRENCY} connections`;
record({
  name: 'http.bare.plainExpress',
  label: 'bare route, plain Express',
  value: median(rps.plain),
  unit: 'req/s',
  note: how,
});
record({
  name: 'http.bare.appStack',
  label: "bare route behind the app's stack",
  value: median(rps.stack),
  unit: 'req/s',
  note: how,
});
record({
  name: 'http.calcJump',
  label: 'POST /calc/jump',
  value: median(rps.jump),
  unit: 'req/s',
  note: how,
});
record({
  name: 'ratio.calcJump.vsBareRoute',
  label: 'calc/jump ÷ bare route in the same app',
  value: target,
  unit: 'ratio',
  target: { op: '>=', value: 0.6 },
  note: how,
});

// /health while a 5,000-discharge study runs in the compute pool, against /health idle.
// A study is kept running through the whole window (a new one starts as one ends); health is
// loaded by a few connections so the figure is latency, not a saturated queue.
const HEALTH_CONCURRENCY = Number(process.env.BENCH_HEALTH_CONCURRENCY ?? 4);
const longStudy: StudyInput = {
  ...fenwickDesign,
  discharges: { kind: 'range', min: 5, max: 85, count: ENGINE_LIMITS.maxDischarges },
};
const postStudy = async (): Promise<{ status: number; ms: number }> => {
  const t0 = performance.now();
  const res = await fetch(`${real.url}/api/v1/calc/study`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', ...auth },
    body: JSON.stringify(longStudy),
  });
  await res.arrayBuffer();
  return { status: res.status, ms: performance.now() - t0 };
};
const healthLoad = () =>
  load(`${real.url}/api/v1/health`, 'GET', undefined, {}, HEALTH_CONCURRENCY);
const warm = await postStudy(); // starts the worker and warms the engine
if (warm.status !== 200) throw new Error(`the 5,000-discharge study answered ${warm.status}`);
await healthLoad();
const idleP99: number[] = [];
const busyP99: number[] = [];
const studyMs: number[] = [];
for (let round = 0; round < ROUNDS; round += 1) {
  idleP99.push((await healthLoad()).p99);
  let studying = true;
  const loop = (async () => {
    while (studying) {
      const r = await postStudy();
      if (r.status !== 200) throw new Error(`the 5,000-discharge study answered ${r.status}`);
      studyMs.push(r.ms);
    }
  })();
  while (computePool().pending === 0) await new Promise((r) => setTimeout(r, 5));
  const busy = await healthLoad();
  studying = false;
  await loop;
  busyP99.push(busy.p99);
  errors += busy.bad;
}
const healthRatio = median(busyP99.map((b, i) => b / (idleP99[i] ?? NaN)));
const howHealth = `medians of ${ROUNDS} rounds of ${SECONDS} s, ${HEALTH_CONCURRENCY} connections`;
console.log(`/health p99 idle:                              ${median(idleP99).toFixed(2)} ms`);
console.log(`/health p99 while a 5,000-discharge study runs: ${median(busyP99).toFixed(2)} ms`);
console.log(`(one 5,000-discharge study through the API: ${median(studyMs).toFixed(0)} ms)`);
console.log(
  `/health p99 during the study ÷ idle = ${healthRatio.toFixed(3)} (target ≤ 2) ${healthRatio <= 2 ? 'MET' : 'NOT MET'}`,
);
record({
  name: 'http.health.p99.idle',
  label: '/health p99, idle',
  value: median(idleP99),
  unit: 'ms',
  note: howHealth,
});
record({
  name: 'http.health.p99.duringStudy',
  label: '/health p99 while a 5,000-discharge study runs',
  value: median(busyP99),
  unit: 'ms',
  note: howHealth,
});
record({
  name: 'http.study5000',
  label: 'one 5,000-discharge study through the API',
  value: median(studyMs),
  unit: 'ms',
});
record({
  name: 'ratio.healthP99.duringStudy.vsIdle',
  label: '/health p99 during a 5,000-discharge study ÷ idle',
  value: healthRatio,
  unit: 'ratio',
  target: { op: '<=', value: 2 },
  note: howHealth,
});

await closeComputePool();
await real.close();
await plain.close();
await sequelize.close();

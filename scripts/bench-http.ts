// HTTP throughput of POST /api/v1/calc/jump against a bare JSON route, served from the same
// process in the same run; load comes from a separate process (scripts/bench-load.mjs).
import { execFileSync } from 'node:child_process';
import type { AddressInfo } from 'node:net';
import express from 'express';
import { createApp } from '../api/src/app';
import { sequelize } from '../api/src/db/sequelize';

const SECONDS = Number(process.env.BENCH_SECONDS ?? 5);
const CONCURRENCY = Number(process.env.BENCH_CONCURRENCY ?? 50);

function listen(app: express.Express): Promise<{ url: string; close: () => Promise<void> }> {
  return new Promise((resolve) => {
    const server = app.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as AddressInfo;
      resolve({
        url: `http://127.0.0.1:${port}`,
        close: () => new Promise((r) => server.close(() => r())),
      });
    });
  });
}

function load(url: string, method: string, body: unknown, headers: Record<string, string>) {
  const out = execFileSync(
    process.execPath,
    ['scripts/bench-load.mjs', url, method, body === undefined ? '-' : JSON.stringify(body),
      JSON.stringify(headers), String(SECONDS), String(CONCURRENCY)],
    { encoding: 'utf8' },
  );
  return JSON.parse(out.trim()) as { ok: number; bad: number; rps: number };
}

const bare = express();
bare.use(express.json());
bare.post('/bare', (req, res) => {
  res.json({ ok: true, echo: req.body });
});

const real = await listen(createApp());
const plain = await listen(bare);

const email = `bench-${Date.now()}@bench.example`;
const signup = await fetch(`${real.url}/api/v1/auth/signup`, {
  method: 'POST',
  headers: { 'content-type': 'application/json' },
  body: JSON.stringify({ firmName: 'Bench firm', name: 'Bench', email, password: 'bench-password-1' }),
});
if (signup.status !== 201) throw new Error(`signup failed: ${signup.status} ${await signup.text()}`);
const { token } = (await signup.json()) as { token: string };

// Demo-like jump: 12 m rectangle, 85 m³/s, y1 0.46 m (invented demo values).
const jumpBody = { section: { shape: 'rectangular', width: 12 }, Q: 85, y1: 0.46 };
const auth = { authorization: `Bearer ${token}` };
const check = await fetch(`${real.url}/api/v1/calc/jump`, {
  method: 'POST',
  headers: { 'content-type': 'application/json', ...auth },
  body: JSON.stringify(jumpBody),
});
if (check.status !== 200) throw new Error(`calc/jump answered ${check.status}: ${await check.text()}`);

load(`${plain.url}/bare`, 'POST', jumpBody, {}); // warm-up
const b = load(`${plain.url}/bare`, 'POST', jumpBody, {});
load(`${real.url}/api/v1/calc/jump`, 'POST', jumpBody, auth);
const j = load(`${real.url}/api/v1/calc/jump`, 'POST', jumpBody, auth);

const ratio = j.rps / b.rps;
console.log(`bare JSON route:        ${b.rps.toFixed(0)} req/s (${b.bad} errors)`);
console.log(`POST /api/v1/calc/jump: ${j.rps.toFixed(0)} req/s (${j.bad} errors)`);
console.log(`throughput ratio calc/jump ÷ bare = ${ratio.toFixed(3)} (target ≥ 0.6) ${ratio >= 0.6 ? 'MET' : 'NOT MET'}`);

await real.close();
await plain.close();
await sequelize.close();

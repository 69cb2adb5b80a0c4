// A small closed-loop HTTP load generator (keep-alive, fixed concurrency, fixed duration),
// run in its own process so it does not share the server's event loop. Prints one JSON line:
// answers (ok < 300, bad otherwise), requests per second and latency percentiles (ms).
// usage: node scripts/bench-load.mjs URL METHOD BODY_JSON_OR_- HEADERS_JSON SECONDS CONCURRENCY
import http from 'node:http';
import { performance } from 'node:perf_hooks';

const [url, method, body, headersJson, seconds = '5', concurrency = '50'] = process.argv.slice(2);
const agent = new http.Agent({ keepAlive: true, maxSockets: Number(concurrency) });
const headers = { ...JSON.parse(headersJson ?? '{}') };
const payload = body && body !== '-' ? Buffer.from(body) : null;
if (payload) {
  headers['content-type'] = 'application/json';
  headers['content-length'] = String(payload.length);
}
const target = new URL(url);
let ok = 0;
let bad = 0;
const latencies = [];
const end = Date.now() + Number(seconds) * 1000;

function one() {
  return new Promise((resolve) => {
    const t0 = performance.now();
    const req = http.request(
      { host: target.hostname, port: target.port, path: target.pathname, method, headers, agent },
      (res) => {
        res.resume();
        res.on('end', () => {
          latencies.push(performance.now() - t0);
          if (res.statusCode && res.statusCode < 300) ok += 1;
          else bad += 1;
          resolve();
        });
      },
    );
    req.on('error', () => {
      bad += 1;
      resolve();
    });
    if (payload) req.write(payload);
    req.end();
  });
}

async function loop() {
  while (Date.now() < end) await one();
}

const t0 = Date.now();
await Promise.all(Array.from({ length: Number(concurrency) }, loop));
const secs = (Date.now() - t0) / 1000;
latencies.sort((a, b) => a - b);
const pct = (p) =>
  latencies[Math.min(latencies.length - 1, Math.floor((p / 100) * latencies.length))] ?? NaN;
process.stdout.write(
  JSON.stringify({
    ok,
    bad,
    rps: ok / secs,
    p50: pct(50),
    p99: pct(99),
    max: latencies.at(-1) ?? NaN,
  }) + '\n',
);
agent.destroy();

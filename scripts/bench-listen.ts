// Shared by the HTTP benchmarks: an Express app on a free loopback port, and load from a
// separate process (scripts/bench-load.mjs) so the server's event loop is measured alone.
import { execFile } from 'node:child_process';
import type { AddressInfo } from 'node:net';
import { promisify } from 'node:util';
import type express from 'express';

export const BENCH_SECONDS = Number(process.env.BENCH_SECONDS ?? 5);
const CONCURRENCY = Number(process.env.BENCH_CONCURRENCY ?? 50);
const execFileAsync = promisify(execFile);

// Asynchronous on purpose: the servers under load run on this process's event loop.
export interface LoadResult {
  ok: number;
  bad: number;
  rps: number;
  p50: number;
  p99: number;
  max: number;
}
export async function load(
  url: string,
  method: string,
  body: unknown,
  headers: Record<string, string>,
  concurrency = CONCURRENCY,
): Promise<LoadResult> {
  const { stdout: out } = await execFileAsync(
    process.execPath,
    [
      'scripts/bench-load.mjs',
      url,
      method,
      body === undefined ? '-' : JSON.stringify(body),
      JSON.stringify(headers),
      String(BENCH_SECONDS),
      String(concurrency),
    ],
    { encoding: 'utf8' },
  );
  return JSON.parse(out.trim()) as LoadResult;
}

export const median = (xs: number[]) =>
  [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)] ?? NaN;

export function listen(app: express.Express): Promise<{ url: string; close: () => Promise<void> }> {
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

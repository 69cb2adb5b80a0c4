// `npm start` keeps the API up (issue 8): scripts/lib.mjs's Supervisor restarts a child that
// exits unexpectedly, says why, and waits longer after each quick failure so a crash loop
// does not spin. Driven with a child that fails at once; every wait is for a condition.
import { spawn } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { Supervisor, exitReason } from '../../scripts/lib.mjs';

async function until(what: string, ready: () => boolean, timeoutMs = 30_000): Promise<void> {
  const end = Date.now() + timeoutMs;
  while (!ready()) {
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 10));
  }
}

describe('Supervisor', () => {
  it('restarts a child that keeps failing, saying why, with a pause that doubles up to its ceiling', async () => {
    const said: string[] = [];
    let starts = 0;
    const sup = new Supervisor(
      'the crasher',
      () => {
        starts += 1;
        return spawn(process.execPath, ['-e', 'process.exit(3)'], { stdio: 'ignore' });
      },
      { minDelayMs: 10, maxDelayMs: 40, healthyAfterMs: 60_000, log: (m) => said.push(m) },
    );
    sup.run();
    await until('four restarts', () => starts >= 5);
    await sup.stop();
    expect(said[0]).toMatch(
      /^the crasher exited with code 3 .*restarting it in 10 ms \(restart 1\)/,
    );
    // pauses 10, 20, 40, 40 ms: doubled after each quick failure, never above the ceiling
    const pauses = said.slice(0, 4).map((m) => Number(/in (\d+) ms/.exec(m)?.[1]));
    expect(pauses).toEqual([10, 20, 40, 40]);
    expect(sup.delayMs).toBe(40);
  });

  it('stop() ends the child for good: no restart follows', async () => {
    let starts = 0;
    const sup = new Supervisor(
      'the sleeper',
      () => {
        starts += 1;
        return spawn(process.execPath, ['-e', 'setInterval(() => {}, 1000)'], { stdio: 'ignore' });
      },
      { minDelayMs: 10, log: () => undefined },
    );
    const child = sup.run();
    await until('the child to start', () => child.pid !== undefined);
    await sup.stop();
    expect(child.exitCode !== null || child.signalCode !== null).toBe(true);
    expect(starts).toBe(1);
    expect(sup.restarts).toBe(0);
  });

  it('names the cause of an exit in words', () => {
    expect(exitReason(null, 'SIGABRT')).toMatch(/fatal V8 error/);
    expect(exitReason(null, 'SIGKILL')).toMatch(/out-of-memory killer/);
    expect(exitReason(1, null)).toMatch(/exited with code 1/);
  });
});

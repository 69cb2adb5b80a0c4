// One list of measurements for `npm run bench`: each benchmark script records what it
// measured here (one JSON line each, in the file bench.mjs names in BENCH_RESULTS); bench.mjs
// prints the ratios against their targets and writes every figure to .bench/latest.json.
// To add a figure: call record() with a name of your own; a ratio with a target is reported
// MET / NOT MET in the summary.
import { appendFileSync } from 'node:fs';

export interface Measurement {
  /** stable key, e.g. 'calc.jump.vsBareRoute' (compared across runs) */
  name: string;
  /** what it is, in a few words, for the printed summary */
  label: string;
  value: number;
  /** 'ratio', 'req/s', 'ms', 'µs', … */
  unit: string;
  /** for ratios with a goal: value must be ≥ (or ≤) this */
  target?: { op: '>=' | '<='; value: number };
  /** how it was measured (rounds, connections, seconds) */
  note?: string;
}

export function record(m: Measurement): void {
  const file = process.env.BENCH_RESULTS;
  if (file !== undefined && file !== '') appendFileSync(file, `${JSON.stringify(m)}\n`);
}

// Types of the parts of lib.mjs that TypeScript code uses (tests/api/supervise.test.ts).
import type { ChildProcess } from 'node:child_process';

export function exitReason(code: number | null, signal: NodeJS.Signals | null): string;

export interface SupervisorOptions {
  minDelayMs?: number;
  maxDelayMs?: number;
  healthyAfterMs?: number;
  log?: (message: string) => void;
}

export class Supervisor {
  constructor(name: string, start: () => ChildProcess, opts?: SupervisorOptions);
  readonly restarts: number;
  readonly delayMs: number;
  child: ChildProcess | null;
  run(): ChildProcess;
  stop(): Promise<void>;
}

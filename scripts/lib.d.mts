// Types of the parts of lib.mjs that TypeScript code (tests, benchmarks) imports.
import type { ChildProcess } from 'node:child_process';

export const ROOT: string;
export function ensurePostgres(): string;
export function ensurePoppler(): void;
export function freePort(): Promise<number>;
export class PrivateCluster {
  constructor(options: { dir: string; port: number; bin: string });
  readonly dir: string;
  readonly port: number;
  readonly data: string;
  started: boolean;
  get password(): string;
  url(database: string): string;
  start(): Promise<void>;
  ensureDatabase(name: string): void;
  stop(): void;
}

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

// Types for the parts of lib.mjs that TypeScript code (tests, benchmarks) imports.
export const ROOT: string;
export function ensurePostgres(): string;
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

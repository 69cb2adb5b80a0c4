// Proposals are drawn in a child process of their own (proposal.worker.ts), at the lowest CPU
// priority Linux gives, so /api/v1/health and every other request keep answering while
// proposals render: pdfmake and the uncertainty run block for seconds, and a separate process
// keeps their heap, their garbage collection and their threads off the API's event loop and
// out of its process (a worker thread shares both). The jobs (jobs.ts) hand it one proposal at
// a time; the child is started on first use and ends after a minute without work.
import { fork, type ChildProcess } from 'node:child_process';
import os from 'node:os';
import { fileURLToPath } from 'node:url';
import type { RenderReply, RenderTask } from './proposal.worker';

const childFile = fileURLToPath(
  new URL(`./proposal.worker${import.meta.url.endsWith('.ts') ? '.ts' : '.js'}`, import.meta.url),
);
// Under tsx the child loads TypeScript source as the compute pool's workers do (calc.pool.ts).
const tsxArgv = childFile.endsWith('.ts')
  ? ['--import', 'tsx', '--conditions=@basinwright/source']
  : [];

/** The render process's nice value (Linux): the lowest priority, background work nobody waits on. */
export const PROPOSAL_NICE = 19;
/** The render process ends after this long without work (ms). */
const IDLE_MS = 60_000;
/** Heap of the render process (MB): a long results table and the drawing fit well within it. */
const HEAP_MB = 768;

/** A message to the render process and its answer. */
export interface RenderRequest {
  id: number;
  task: RenderTask;
}
export interface RenderAnswer {
  id: number;
  reply: RenderReply;
}

interface Pending {
  resolve: (reply: RenderReply) => void;
  reject: (error: Error) => void;
}

let child: ChildProcess | undefined;
let nextId = 1;
const pending = new Map<number, Pending>();
let idleTimer: NodeJS.Timeout | undefined;

/** The render process, started on first use (structured clone over IPC: Dates and bytes cross). */
function renderProcess(): ChildProcess {
  if (child !== undefined && child.connected) return child;
  const started = fork(childFile, [], {
    execArgv: [...tsxArgv, `--max-old-space-size=${HEAP_MB}`],
    serialization: 'advanced',
    stdio: ['ignore', 'inherit', 'inherit', 'ipc'],
    env: { ...process.env, PROPOSAL_NICE: String(PROPOSAL_NICE) },
  });
  // Its main thread at once; the child lowers its other threads itself (proposal.worker.ts).
  try {
    if (started.pid !== undefined) os.setPriority(started.pid, PROPOSAL_NICE);
  } catch {
    // not permitted here: the child still draws, at the priority it has
  }
  started.on('message', (message: RenderAnswer) => {
    const waiting = pending.get(message.id);
    if (waiting === undefined) return;
    pending.delete(message.id);
    waiting.resolve(message.reply);
    settleIdle();
  });
  started.on('exit', (code, signal) => {
    if (child === started) child = undefined;
    const error = new Error(
      `the proposal render process stopped (${signal ?? `exit code ${String(code)}`})`,
    );
    for (const [id, waiting] of pending) {
      pending.delete(id);
      waiting.reject(error);
    }
    settleIdle();
  });
  started.on('error', () => {
    // an IPC error ends the process; 'exit' rejects what was waiting
  });
  child = started;
  return started;
}

/** Keeps the parent alive only while a render is waited on; ends an idle child after IDLE_MS. */
function settleIdle(): void {
  clearTimeout(idleTimer);
  idleTimer = undefined;
  const current = child;
  if (current === undefined) return;
  if (pending.size > 0) {
    current.ref();
    current.channel?.ref();
    return;
  }
  current.unref();
  current.channel?.unref();
  idleTimer = setTimeout(() => {
    if (child === current && pending.size === 0) {
      child = undefined;
      current.kill();
    }
  }, IDLE_MS);
  idleTimer.unref();
}

/** Draws one proposal in the render process. */
export function renderInWorker(task: RenderTask): Promise<RenderReply> {
  const proc = renderProcess();
  const id = nextId++;
  return new Promise<RenderReply>((resolve, reject) => {
    pending.set(id, { resolve, reject });
    settleIdle();
    const request: RenderRequest = { id, task };
    proc.send(request, (error) => {
      if (error == null) return;
      pending.delete(id);
      settleIdle();
      reject(error);
    });
  });
}

/** Stops the render process (shutdown, end of a test file). */
export async function closeProposalPool(): Promise<void> {
  clearTimeout(idleTimer);
  idleTimer = undefined;
  const current = child;
  child = undefined;
  if (current === undefined || current.exitCode !== null || current.signalCode !== null) return;
  await new Promise<void>((resolve) => {
    current.once('exit', () => resolve());
    current.kill();
  });
}

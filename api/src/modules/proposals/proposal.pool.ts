// One worker thread draws proposals, at a lower priority than request handling, so
// /api/v1/health and every other request keep answering while proposals render. The jobs
// (jobs.ts) hand it one proposal at a time.
import { fileURLToPath } from 'node:url';
import { Piscina } from 'piscina';
import type { RenderReply, RenderTask } from './proposal.worker';

const workerFile = fileURLToPath(
  new URL(`./proposal.worker${import.meta.url.endsWith('.ts') ? '.ts' : '.js'}`, import.meta.url),
);
// Under tsx the worker loads TypeScript source as the compute pool's does (calc.pool.ts).
const workerExecArgv = workerFile.endsWith('.ts')
  ? ['--import', 'tsx', '--conditions=@basinwright/source']
  : [];

/** The render thread's nice increment (Linux, via piscina). */
export const PROPOSAL_NICE = 19;

let pool: Piscina<RenderTask, RenderReply> | undefined;

/** Draws one proposal in the worker thread. */
export function renderInWorker(task: RenderTask): Promise<RenderReply> {
  pool ??= new Piscina<RenderTask, RenderReply>({
    filename: workerFile,
    execArgv: workerExecArgv,
    minThreads: 0,
    maxThreads: 1,
    idleTimeout: 60_000,
    resourceLimits: { maxOldGenerationSizeMb: 768 },
    // Background work nobody waits on in a request: the lowest priority Linux gives (19), so
    // request handling and the engine's calculations (CALC_NICE) win the CPU over a render.
    niceIncrement: PROPOSAL_NICE,
  });
  return pool.run(task);
}

/** Stops the worker (shutdown, end of a test file). */
export async function closeProposalPool(): Promise<void> {
  const current = pool;
  pool = undefined;
  await current?.destroy();
}

// The child process that draws proposals (started by proposal.pool.ts): pdfmake and the
// uncertainty run block for the whole render, so they never run in the process that answers
// requests. It lowers every one of its threads to the nice value it is given (Linux keeps a
// priority per thread, and V8's helper threads exist before the parent can lower the process),
// then answers each request with its reply.
import { readdirSync } from 'node:fs';
import os from 'node:os';
import { PageCapError, renderProposal } from './proposal.render';
import type { ProposalSource } from './proposal.document';
import type { RenderAnswer, RenderRequest } from './proposal.pool';

export interface RenderTask {
  source: ProposalSource;
  maxPages: number;
}

export type RenderReply =
  | { ok: true; pdf: Uint8Array; pages: number }
  | { ok: false; pageCap: { pages: number; cap: number } | null; message: string };

/** Draws one proposal; a refusal (the page cap) or an error comes back as data. */
export async function render(task: RenderTask): Promise<RenderReply> {
  // Bytes cross the process boundary as a plain Uint8Array: make the logo a Buffer again.
  const brand = task.source.firm.brand;
  if (brand?.logo) brand.logo = { ...brand.logo, data: Buffer.from(brand.logo.data) };
  try {
    const { pdf, pages } = await renderProposal(task.source, task.maxPages);
    return { ok: true, pdf, pages };
  } catch (error) {
    if (error instanceof PageCapError)
      return {
        ok: false,
        pageCap: { pages: error.pages, cap: error.cap },
        message: error.message,
      };
    return {
      ok: false,
      pageCap: null,
      message: error instanceof Error ? error.message : String(error),
    };
  }
}

/** Every thread of this process to `nice` (Linux: /proc lists them); elsewhere nothing. */
function lowerEveryThread(nice: number): void {
  let tids: string[];
  try {
    tids = readdirSync('/proc/self/task');
  } catch {
    return;
  }
  for (const tid of tids) {
    try {
      os.setPriority(Number(tid), nice);
    } catch {
      // a thread that has ended, or not permitted: the others still go down
    }
  }
}

if (process.send !== undefined) {
  const nice = Number(process.env.PROPOSAL_NICE ?? 0);
  if (nice > 0) lowerEveryThread(nice);
  process.on('message', (message: RenderRequest) => {
    void render(message.task).then((reply) => {
      const answer: RenderAnswer = { id: message.id, reply };
      process.send?.(answer);
    });
  });
  // the API process went away: nothing left to draw for
  process.on('disconnect', () => process.exit(0));
}

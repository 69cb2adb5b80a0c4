// The worker thread that draws proposals (proposal.pool.ts): pdfmake blocks for the whole
// render, so it never runs on the thread that answers requests.
import { PageCapError, renderProposal } from './proposal.render';
import type { ProposalSource } from './proposal.document';

export interface RenderTask {
  source: ProposalSource;
  maxPages: number;
}

export type RenderReply =
  | { ok: true; pdf: Uint8Array; pages: number }
  | { ok: false; pageCap: { pages: number; cap: number } | null; message: string };

export default async function render(task: RenderTask): Promise<RenderReply> {
  // A Buffer crosses the thread boundary as a plain Uint8Array: make the logo a Buffer again.
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

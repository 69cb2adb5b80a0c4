import type { ProposalStatus } from '@basinwright/common';
import type { Proposal } from '../../models';

export interface ProposalView {
  id: string;
  projectId: string;
  versionId: string;
  status: ProposalStatus;
  /** why it could not be made (status 'failed'), else null */
  error: string | null;
  pages: number | null;
  byteSize: number | null;
  createdAt: string;
  renderedAt: string | null;
  /** the path of the PDF under /api/v1 once ready */
  download: string | null;
  /** every time it was e-mailed, oldest first */
  sent: { to: string; by: string; at: string }[];
}

export function presentProposal(p: Proposal): ProposalView {
  return {
    id: p.id,
    projectId: p.projectId,
    versionId: p.versionId,
    status: p.status,
    error: p.error,
    pages: p.pages,
    byteSize: p.byteSize,
    createdAt: p.createdAt.toISOString(),
    renderedAt: p.renderedAt?.toISOString() ?? null,
    download: p.status === 'done' ? `/projects/${p.projectId}/proposals/${p.id}/pdf` : null,
    sent: (p.emails ?? []).map((e) => ({
      to: e.recipient,
      by: e.sentByName,
      at: e.sentAt.toISOString(),
    })),
  };
}

// The proposal PDFs of a project: made from an issued version by a background job (poll one
// until it is done or failed), downloaded, and e-mailed to the client.
import type { ProposalStatus } from '@basinwright/common';
import { request, requestFile } from './client';

export interface Proposal {
  id: string;
  projectId: string;
  versionId: string;
  status: ProposalStatus;
  /** why it could not be made */
  error: string | null;
  pages: number | null;
  byteSize: number | null;
  createdAt: string;
  renderedAt: string | null;
  /** path of the PDF under /api/v1 once ready */
  download: string | null;
  sent: { to: string; by: string; at: string }[];
}

const base = (projectId: string) => `/projects/${encodeURIComponent(projectId)}/proposals`;
const one = (projectId: string, id: string) => `${base(projectId)}/${encodeURIComponent(id)}`;

export const proposalsApi = {
  list: (projectId: string, signal?: AbortSignal) =>
    request<{ items: Proposal[] }>(base(projectId), { signal }),
  get: (projectId: string, id: string, signal?: AbortSignal) =>
    request<Proposal>(one(projectId, id), { signal }),
  create: (projectId: string, versionId: string) =>
    request<Proposal>(base(projectId), { method: 'POST', body: { versionId } }),
  send: (projectId: string, id: string, body: { to: string; message: string }) =>
    request<Proposal>(`${one(projectId, id)}/send`, { method: 'POST', body }),
  pdf: (projectId: string, id: string) => requestFile(`${one(projectId, id)}/pdf`),
};

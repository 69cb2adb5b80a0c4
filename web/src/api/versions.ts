// Issued versions of a project's design, their review, and the audit trail.
import type {
  DesignStatus,
  ReviewState,
  StudyInput,
  StudyResult,
  VersionFigures,
} from '@basinwright/common';
import { request } from './client';
import type { ItemList } from './types';

export interface VersionSummary {
  id: string;
  projectId: string;
  number: number;
  designRevision: number;
  engineVersion: string;
  figures: VersionFigures;
  note: string;
  issuedBy: { id: string | null; name: string };
  issuedAt: string;
  reviewState: ReviewState;
  sentBy: { id: string } | null;
  sentAt: string | null;
  review: {
    by: { id: string | null; name: string };
    at: string;
    licenceNumber: string | null;
    jurisdiction: string | null;
    statement: string | null;
    comments: string | null;
  } | null;
  superseded: boolean;
  supersededBy: number | null;
}

export interface Version extends VersionSummary {
  input: StudyInput;
  options: Record<string, unknown> | null;
  result: StudyResult;
  computedAt: string;
}

export interface VersionList {
  items: VersionSummary[];
  status: DesignStatus;
  /** the signed-in member is marked as licensed reviewer */
  reviewer: boolean;
}

export interface AuditEvent {
  id: string;
  projectId: string | null;
  versionId: string | null;
  actor: { id: string | null; name: string };
  action: string;
  summary: string;
  detail: Record<string, unknown> | null;
  at: string;
}

const base = (projectId: string) => `/projects/${encodeURIComponent(projectId)}/versions`;
const one = (projectId: string, versionId: string) =>
  `${base(projectId)}/${encodeURIComponent(versionId)}`;

export const versionsApi = {
  list: (projectId: string, signal?: AbortSignal) =>
    request<VersionList>(base(projectId), { signal }),
  get: (projectId: string, versionId: string, signal?: AbortSignal) =>
    request<Version>(one(projectId, versionId), { signal }),
  issue: (projectId: string, body: { revision: number; note: string }) =>
    request<Version>(base(projectId), { method: 'POST', body }),
  send: (projectId: string, versionId: string) =>
    request<Version>(`${one(projectId, versionId)}/send`, { method: 'POST', body: {} }),
  approve: (projectId: string, versionId: string, comments: string) =>
    request<Version>(`${one(projectId, versionId)}/approve`, {
      method: 'POST',
      body: { comments },
    }),
  giveBack: (projectId: string, versionId: string, comments: string) =>
    request<Version>(`${one(projectId, versionId)}/return`, {
      method: 'POST',
      body: { comments },
    }),
  audit: (projectId: string, signal?: AbortSignal) =>
    request<ItemList<AuditEvent>>(`/projects/${encodeURIComponent(projectId)}/audit`, { signal }),
};

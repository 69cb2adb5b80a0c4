// The design of a project (one a project): GET loads it, PUT replaces it. The input is in
// the project's units, as the user typed it; the server runs the study on toSI(input) and keeps
// the result beside it, with the engine version that computed it.
import type { DissipatorTypeId, StudyInput, StudyResult } from '@basinwright/common';
import { ApiError, download, request } from './client';
import type { PersonRef } from './types';

/** What the workspace keeps beside the study input. */
export interface DesignOptions {
  /** the basin type the engineer chose instead of the recommended one */
  chosenType?: DissipatorTypeId;
}

export interface Design {
  projectId: string;
  /** in the units it names (the project's); the server converts with toSI */
  input: StudyInput | null;
  options: DesignOptions | null;
  updatedAt: string | null;
  /** the draft's revision: sent back with the next save (null before the first save) */
  revision: number | null;
  updatedBy: PersonRef | null;
  /** the study result the server computed on the last save (SI); null before results were kept */
  result: StudyResult | null;
  /** the engine version that computed `result` (ENGINE_VERSION) */
  engineVersion: string | null;
  /** when `result` was computed (ISO 8601) */
  computedAt: string | null;
}

export interface DesignBody {
  input: StudyInput;
  options?: DesignOptions;
  /** the revision this copy was based on; a stale one is refused (StaleDesignError) */
  revision: number | null;
}

/** The server's current copy when a save or an issue was based on a stale revision (409). */
export function staleCopyOf(error: unknown): Design | null {
  if (!(error instanceof ApiError) || error.status !== 409) return null;
  const body = error.body as { current?: Design } | undefined;
  return body?.current ?? null;
}

const path = (projectId: string) => `/projects/${encodeURIComponent(projectId)}/design`;

export const designsApi = {
  get: (projectId: string, signal?: AbortSignal) => request<Design>(path(projectId), { signal }),
  save: (projectId: string, body: DesignBody) =>
    request<Design>(path(projectId), { method: 'PUT', body }),
  /** The sized types of the SAVED design side by side, as a file (Firm plan; else plan_limit). */
  exportAlternatives: (projectId: string, format: 'csv' | 'xlsx') =>
    download(
      `/projects/${encodeURIComponent(projectId)}/alternatives/export`,
      { format },
      `alternatives.${format}`,
    ),
};

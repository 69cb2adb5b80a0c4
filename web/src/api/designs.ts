// The design of a project (one a project): GET loads it, PUT replaces it. The input is in
// the project's units, as the user typed it; the server runs the study on toSI(input).
import type { DissipatorTypeId, StudyInput } from '@basinwright/common';
import { request } from './client';
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
  updatedBy: PersonRef | null;
}

export interface DesignBody {
  input: StudyInput;
  options?: DesignOptions;
}

const path = (projectId: string) => `/projects/${encodeURIComponent(projectId)}/design`;

export const designsApi = {
  get: (projectId: string) => request<Design>(path(projectId)),
  save: (projectId: string, body: DesignBody) =>
    request<Design>(path(projectId), { method: 'PUT', body }),
};

import type { StudyInput, StudyResult } from '@basinwright/common';
import type { Design } from '../../models';

export interface DesignView {
  projectId: string;
  input: StudyInput | null;
  options: Record<string, unknown> | null;
  updatedAt: string | null;
  /** the draft's revision: send it back with the next save (null before the first save) */
  revision: number | null;
  updatedBy: { id: string; name: string } | null;
  /** the study result computed on the last save (SI); null before the first save or for a design saved before results were kept */
  result: StudyResult | null;
  /** the engine version that computed `result` */
  engineVersion: string | null;
  /** when `result` was computed (ISO 8601) */
  computedAt: string | null;
}

/** A project's design; a project without one yet answers with nulls. */
export function presentDesign(projectId: string, design: Design | null): DesignView {
  if (design === null) {
    return {
      projectId,
      input: null,
      options: null,
      updatedAt: null,
      revision: null,
      updatedBy: null,
      result: null,
      engineVersion: null,
      computedAt: null,
    };
  }
  const by = design.updatedBy ?? null;
  return {
    projectId,
    input: design.input,
    options: design.options,
    updatedAt: design.updatedAt.toISOString(),
    revision: design.revision,
    updatedBy: by === null ? null : { id: by.id, name: by.name },
    result: design.result ?? null,
    engineVersion: design.engineVersion ?? null,
    computedAt: design.computedAt?.toISOString() ?? null,
  };
}

import type { StudyInput } from '@basinwright/common';
import type { Design } from '../../models';

export interface DesignView {
  projectId: string;
  input: StudyInput | null;
  options: Record<string, unknown> | null;
  updatedAt: string | null;
  updatedBy: { id: string; name: string } | null;
}

/** A project's design; a project without one yet answers with nulls. */
export function presentDesign(projectId: string, design: Design | null): DesignView {
  if (design === null) {
    return { projectId, input: null, options: null, updatedAt: null, updatedBy: null };
  }
  const by = design.updatedBy ?? null;
  return {
    projectId,
    input: design.input,
    options: design.options,
    updatedAt: design.updatedAt.toISOString(),
    updatedBy: by === null ? null : { id: by.id, name: by.name },
  };
}

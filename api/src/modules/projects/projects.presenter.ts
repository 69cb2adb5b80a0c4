import type { ProjectStatus, ProjectUnits } from '@basinwright/common';
import type { Project } from '../../models';

export interface ProjectView {
  id: string;
  name: string;
  client: string;
  location: string;
  units: ProjectUnits;
  status: ProjectStatus;
  notes: string;
  createdBy: { id: string; name: string } | null;
  createdAt: string;
  updatedAt: string;
  /** Why the project cannot be changed now (plan's project cap after a downgrade, billing); null: editable. */
  readOnly: { reason: 'billing' | 'project_over_limit'; message: string } | null;
}

/** What the presenter reads of a project: a model instance or a row of the list query. */
export type ProjectRecord = Pick<
  Project,
  'id' | 'name' | 'client' | 'location' | 'units' | 'status' | 'notes' | 'createdAt' | 'updatedAt'
> & { createdBy?: { id: string; name: string } | null };

export function presentProject(
  project: ProjectRecord,
  readOnly: ProjectView['readOnly'] = null,
): ProjectView {
  const by = project.createdBy ?? null;
  return {
    id: project.id,
    name: project.name,
    client: project.client,
    location: project.location,
    units: project.units,
    status: project.status,
    notes: project.notes,
    createdBy: by === null ? null : { id: by.id, name: by.name },
    createdAt: project.createdAt.toISOString(),
    updatedAt: project.updatedAt.toISOString(),
    readOnly: readOnly === null ? null : { reason: readOnly.reason, message: readOnly.message },
  };
}

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
}

export function presentProject(project: Project): ProjectView {
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
  };
}

import {
  designStatusOf,
  type DesignStatus,
  type ProjectStatus,
  type ProjectUnits,
  type ReviewState,
} from '@basinwright/common';
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
  /** the design's review status: its latest issued version's (draft when none is issued or sent) */
  designStatus: DesignStatus;
  latestVersion: { id: string; number: number; reviewState: ReviewState; issuedAt: string } | null;
}

/** The latest issued version of a project, as the list and the project page show it. */
export interface LatestVersionRecord {
  id: string;
  number: number;
  reviewState: ReviewState;
  issuedAt: Date;
}

/** What the presenter reads of a project: a model instance or a row of the list query. */
export type ProjectRecord = Pick<
  Project,
  'id' | 'name' | 'client' | 'location' | 'units' | 'status' | 'notes' | 'createdAt' | 'updatedAt'
> & { createdBy?: { id: string; name: string } | null };

export function presentProject(
  project: ProjectRecord,
  latest: LatestVersionRecord | null = null,
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
    designStatus: designStatusOf(latest?.reviewState ?? null),
    latestVersion:
      latest === null
        ? null
        : {
            id: latest.id,
            number: latest.number,
            reviewState: latest.reviewState,
            issuedAt: latest.issuedAt.toISOString(),
          },
  };
}

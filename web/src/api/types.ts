// Response shapes of the API (see the API contract). Request bodies come from the shared
// yup schemas in @basinwright/common.

import type {
  DesignStatus,
  Plan,
  ProjectStatus,
  ProjectUnits,
  ReviewState,
  Role,
} from '@basinwright/common';

export type { Plan, ProjectStatus, Role };
export type Units = ProjectUnits;

export interface PersonRef {
  id: string;
  name: string;
}

export interface User {
  id: string;
  name: string;
  email: string;
  role: Role;
  active: boolean;
  createdAt: string;
}

export interface Firm {
  id: string;
  name: string;
  plan: Plan;
  seats: number;
}

export interface Session {
  token: string;
  user: User;
  firm: Firm;
}

export interface Project {
  id: string;
  name: string;
  client: string | null;
  location: string | null;
  units: Units;
  status: ProjectStatus;
  notes: string | null;
  createdBy: PersonRef | null;
  createdAt: string;
  updatedAt: string;
  /** the design's review status (its latest issued version's) */
  designStatus: DesignStatus;
  latestVersion: { id: string; number: number; reviewState: ReviewState; issuedAt: string } | null;
}

/** A member marked as licensed reviewer: what is printed with their signature. */
export interface ReviewerMark {
  licenceNumber: string;
  jurisdiction: string;
  statement: string;
}

/** A member on the Team page. */
export interface Member extends User {
  reviewer: ReviewerMark | null;
}

export interface Invitation {
  id: string;
  email: string;
  role: Role;
  expiresAt: string;
  invitedBy: PersonRef | null;
  createdAt: string;
}

export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}

export interface ItemList<T> {
  items: T[];
}

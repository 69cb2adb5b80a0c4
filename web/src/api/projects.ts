import { request } from './client';
import type { Page, Project, ProjectStatus, Units } from './types';

export type ProjectSort = 'updatedAt' | 'createdAt' | 'name' | 'client' | 'status';
export type SortOrder = 'asc' | 'desc';

export interface ProjectQuery {
  search?: string;
  sort?: ProjectSort;
  order?: SortOrder;
  page?: number;
  pageSize?: number;
}

export interface ProjectBody {
  name: string;
  units: Units;
  client?: string | null;
  location?: string | null;
  status?: ProjectStatus;
  notes?: string | null;
}

const path = (id: string) => `/projects/${encodeURIComponent(id)}`;

export const projectsApi = {
  list: (query: ProjectQuery = {}, signal?: AbortSignal) =>
    request<Page<Project>>('/projects', { query: { ...query }, signal }),
  get: (id: string, signal?: AbortSignal) => request<Project>(path(id), { signal }),
  create: (body: ProjectBody) => request<Project>('/projects', { method: 'POST', body }),
  update: (id: string, body: Partial<ProjectBody>) =>
    request<Project>(path(id), { method: 'PATCH', body }),
  remove: (id: string) => request<void>(path(id), { method: 'DELETE' }),
};

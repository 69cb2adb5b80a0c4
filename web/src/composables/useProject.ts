import { ref, shallowRef, watch, type Ref } from 'vue';
import { ApiError } from '@/api/client';
import { projectsApi, type ProjectBody } from '@/api/projects';
import type { Project } from '@/api/types';

/** One project: load, save changes, delete. */
export function useProject(id: Ref<string>) {
  const project = shallowRef<Project | null>(null);
  const busy = ref(false);
  const saving = ref(false);
  const error = shallowRef<ApiError | null>(null);

  async function reload(): Promise<void> {
    busy.value = true;
    error.value = null;
    try {
      project.value = await projectsApi.get(id.value);
    } catch (e) {
      project.value = null;
      error.value =
        e instanceof ApiError ? e : new ApiError(0, 'unknown', 'Could not load the project.');
    } finally {
      busy.value = false;
    }
  }

  /** Saves changes; throws ApiError so the form can show field errors. */
  async function save(body: Partial<ProjectBody>): Promise<Project> {
    saving.value = true;
    try {
      const updated = await projectsApi.update(id.value, body);
      project.value = updated;
      return updated;
    } finally {
      saving.value = false;
    }
  }

  async function remove(): Promise<void> {
    saving.value = true;
    try {
      await projectsApi.remove(id.value);
    } finally {
      saving.value = false;
    }
  }

  watch(id, () => void reload(), { immediate: true });

  return { project, busy, saving, error, reload, save, remove };
}

import { ref, watch, type Ref } from 'vue';
import { projectsApi, type ProjectBody } from '@/api/projects';
import type { Project } from '@/api/types';
import { useResource } from '@/composables/useResource';

/** One project: load, save changes, delete. */
export function useProject(id: Ref<string>) {
  const {
    data: project,
    busy,
    error,
    reload,
  } = useResource<Project | null>((signal) => projectsApi.get(id.value, signal), {
    initial: null,
    what: 'the project',
  });
  const saving = ref(false);

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

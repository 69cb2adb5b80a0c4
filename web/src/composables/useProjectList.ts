import { computed, watch, type Ref } from 'vue';
import { projectsApi, type ProjectQuery } from '@/api/projects';
import type { Page, Project } from '@/api/types';
import { useResource } from '@/composables/useResource';

/** The project list page's data: one page of projects for the given query, refetched on change. */
export function useProjectList(query: Ref<ProjectQuery>) {
  // A newer query wins: useResource aborts the request still in flight.
  const { data, busy, error, reload } = useResource<Page<Project> | null>(
    (signal) => projectsApi.list(query.value, signal),
    { initial: null, what: 'projects' },
  );
  const items = computed(() => data.value?.items ?? []);
  const total = computed(() => data.value?.total ?? 0);

  watch(query, () => void reload(), { deep: true, immediate: true });

  return { items, total, busy, error, reload };
}

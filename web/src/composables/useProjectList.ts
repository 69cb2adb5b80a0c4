import { ref, shallowRef, watch, type Ref } from 'vue';
import { ApiError } from '@/api/client';
import { projectsApi, type ProjectQuery } from '@/api/projects';
import type { Project } from '@/api/types';

/** The project list page's data: one page of projects for the given query, refetched on change. */
export function useProjectList(query: Ref<ProjectQuery>) {
  const items = shallowRef<Project[]>([]);
  const total = ref(0);
  const busy = ref(false);
  const error = shallowRef<ApiError | null>(null);
  let controller: AbortController | null = null;

  async function reload(): Promise<void> {
    // A newer query wins: abort the request still in flight.
    controller?.abort();
    const own = new AbortController();
    controller = own;
    busy.value = true;
    error.value = null;
    try {
      const page = await projectsApi.list(query.value, own.signal);
      items.value = page.items;
      total.value = page.total;
    } catch (e) {
      if (own.signal.aborted) return;
      error.value =
        e instanceof ApiError ? e : new ApiError(0, 'unknown', 'Could not load projects.');
    } finally {
      if (controller === own) busy.value = false;
    }
  }

  watch(query, () => void reload(), { deep: true, immediate: true });

  return { items, total, busy, error, reload };
}

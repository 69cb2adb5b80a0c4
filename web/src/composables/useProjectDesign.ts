// The project page's view of its design: the result the server stored when the design was last
// saved. Nothing is recomputed here: a result from an earlier engine (or a design saved before
// results were kept) is reported as such, and the engineer opens the design to recompute.
import { computed, watch, type Ref } from 'vue';
import { ENGINE_VERSION, type StudyResult } from '@basinwright/common';
import { designsApi, type Design } from '@/api/designs';
import { useResource } from '@/composables/useResource';

/**
 * What the stored result is to this page: none saved yet; current (computed by the engine this
 * page carries); from an earlier engine (its figures and even its shape may differ from what
 * the engine gives now); or missing (saved before results were kept).
 */
export type StoredResultState = 'no-design' | 'current' | 'earlier-engine' | 'not-stored';

export function storedResultState(design: Design | null): StoredResultState {
  if (!design?.input) return 'no-design';
  if (!design.result) return 'not-stored';
  return design.engineVersion === ENGINE_VERSION ? 'current' : 'earlier-engine';
}

export function useProjectDesign(projectId: Ref<string>) {
  const {
    data: design,
    busy,
    error,
    reload,
  } = useResource<Design | null>((signal) => designsApi.get(projectId.value, signal), {
    initial: null,
    what: 'the design',
  });
  watch(projectId, () => void reload(), { immediate: true });

  const state = computed(() => storedResultState(design.value));
  /** the stored result, only when this page's engine computed it (older shapes are not read) */
  const result = computed<StudyResult | null>(() =>
    state.value === 'current' ? (design.value?.result ?? null) : null,
  );
  return { design, busy, error, reload, state, result };
}

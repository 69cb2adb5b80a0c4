// One resource read from the API: its data, whether a load is under way, and why it failed.
// The load/busy/error block every page's composable needs, written once.
import { ref, shallowRef, type Ref, type ShallowRef } from 'vue';
import { ApiError } from '@/api/client';

export interface Resource<T> {
  /** what the last load gave; `initial` before the first answer and after a failure */
  data: ShallowRef<T>;
  /** a load is under way */
  busy: Ref<boolean>;
  /** why the last load failed (an ApiError; status 0 when the server gave no answer) */
  error: ShallowRef<ApiError | null>;
  /** loads again; a newer call wins (the older request is aborted and its answer dropped) */
  reload: () => Promise<void>;
}

/**
 * `load` fetches the data (pass `signal` on to the API module so a superseded request is
 * aborted); `what` names it in the message of a failure that is not an ApiError ("the project").
 * The caller decides when to load (e.g. `watch(id, reload, { immediate: true })`).
 */
export function useResource<T>(
  load: (signal: AbortSignal) => Promise<T>,
  options: { initial: T; what: string },
): Resource<T> {
  const data = shallowRef<T>(options.initial) as ShallowRef<T>;
  const busy = ref(false);
  const error = shallowRef<ApiError | null>(null);
  let current: AbortController | null = null;

  async function reload(): Promise<void> {
    current?.abort();
    const own = new AbortController();
    current = own;
    busy.value = true;
    error.value = null;
    try {
      const value = await load(own.signal);
      if (current === own) data.value = value;
    } catch (e) {
      if (current !== own) return;
      data.value = options.initial;
      error.value =
        e instanceof ApiError ? e : new ApiError(0, 'unknown', `Could not load ${options.what}.`);
    } finally {
      if (current === own) busy.value = false;
    }
  }

  return { data, busy, error, reload };
}

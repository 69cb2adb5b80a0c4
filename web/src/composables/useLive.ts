// Results that follow the input as the user types: evaluate after a pause, keep the last good
// answer (marked stale) while the input is incomplete or refused, so a page never blanks.
import { onBeforeUnmount, ref, shallowRef, type Ref, type ShallowRef } from 'vue';

/** One evaluation: the answer, or why there is none. */
export interface LiveOutcome<T> {
  value: T | null;
  /** readable message when the engine refused the input */
  engineError: string | null;
  /** schema messages while the input is not complete */
  inputProblems: string[];
}

export interface LiveResult<T> {
  value: ShallowRef<T | null>;
  engineError: Ref<string | null>;
  inputProblems: Ref<string[]>;
  /** the value shown is from an earlier input */
  stale: Ref<boolean>;
  /** a change waits for the pause in typing */
  pending: Ref<boolean>;
  runNow: () => void;
  schedule: () => void;
}

/** `evaluate` never throws (it turns failures into messages); the caller decides what triggers it. */
export function useLiveResult<T>(
  evaluate: () => LiveOutcome<T>,
  debounceMs: number,
): LiveResult<T> {
  const value = shallowRef<T | null>(null);
  const engineError = ref<string | null>(null);
  const inputProblems = ref<string[]>([]);
  const stale = ref(false);
  const pending = ref(false);
  let timer: ReturnType<typeof setTimeout> | undefined;

  function runNow(): void {
    clearTimeout(timer);
    pending.value = false;
    const out = evaluate();
    engineError.value = out.engineError;
    inputProblems.value = out.inputProblems;
    if (out.value !== null) {
      value.value = out.value;
      stale.value = false;
    } else stale.value = value.value !== null;
  }

  function schedule(): void {
    clearTimeout(timer);
    pending.value = true;
    timer = setTimeout(runNow, debounceMs);
  }

  onBeforeUnmount(() => clearTimeout(timer));
  return { value, engineError, inputProblems, stale, pending, runNow, schedule };
}

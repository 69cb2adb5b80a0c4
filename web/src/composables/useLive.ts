// Results that follow the input as the user types: evaluate after a pause, keep the last good
// answer (marked stale) while the input is incomplete or refused, so a page never blanks. An
// evaluation may answer later (a promise, e.g. from a worker): only the newest one is applied.
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
  /** a change waits for the pause in typing, or for its answer */
  pending: Ref<boolean>;
  /** an evaluation has started and its answer has not come yet (asynchronous ones only) */
  computing: Ref<boolean>;
  runNow: () => void;
  schedule: () => void;
  /**
   * Shows a value already known for the current input (e.g. kept with the saved design), with
   * nothing pending. With `same`, the input is then evaluated quietly: the answer replaces the
   * value only when `same` says it differs (or when it fails).
   */
  adopt: (known: T, same?: (fresh: T, known: T) => boolean) => void;
}

/**
 * `evaluate` never throws (it turns failures into messages); it answers at once, or with a
 * promise that resolves to the outcome, or to null when the evaluation was abandoned. The caller
 * decides what triggers it.
 */
export function useLiveResult<T>(
  evaluate: () => LiveOutcome<T> | Promise<LiveOutcome<T> | null>,
  debounceMs: number,
  /** abandons an evaluation under way, called when the input changes again */
  cancel: () => void = () => {},
): LiveResult<T> {
  const value = shallowRef<T | null>(null);
  const engineError = ref<string | null>(null);
  const inputProblems = ref<string[]>([]);
  const stale = ref(false);
  const pending = ref(false);
  const computing = ref(false);
  let timer: ReturnType<typeof setTimeout> | undefined;
  /** the newest evaluation; an answer to an older one is dropped */
  let latest = 0;

  function runNow(): void {
    clearTimeout(timer);
    const own = ++latest;
    const out = evaluate();
    if (out instanceof Promise) {
      pending.value = true;
      computing.value = true;
      void out.then((answer) => {
        if (own !== latest) return;
        computing.value = false;
        pending.value = false;
        if (answer) apply(answer);
      });
      return;
    }
    computing.value = false;
    pending.value = false;
    apply(out);
  }

  function apply(out: LiveOutcome<T>): void {
    engineError.value = out.engineError;
    inputProblems.value = out.inputProblems;
    if (out.value !== null) {
      value.value = out.value;
      stale.value = false;
    } else stale.value = value.value !== null;
  }

  function schedule(): void {
    clearTimeout(timer);
    // The input changed: an answer still to come is for an older one. Drop it and stop its work.
    if (computing.value) {
      latest++;
      computing.value = false;
      cancel();
    }
    pending.value = true;
    timer = setTimeout(runNow, debounceMs);
  }

  function adopt(known: T, same?: (fresh: T, known: T) => boolean): void {
    clearTimeout(timer);
    if (computing.value) cancel();
    const own = ++latest;
    computing.value = false;
    pending.value = false;
    apply({ value: known, engineError: null, inputProblems: [] });
    if (!same) return;
    // The quiet check starts in a task of its own, after the known value is drawn: handing the
    // input to the worker (a plain copy, the worker's start) was part of the page's longest task.
    timer = setTimeout(() => {
      if (own !== latest) return;
      void Promise.resolve(evaluate()).then((answer) => {
        if (own !== latest || !answer) return;
        if (answer.value !== null && same(answer.value, known)) return;
        apply(answer);
      });
    }, 0);
  }

  onBeforeUnmount(() => {
    clearTimeout(timer);
    latest++;
  });
  return { value, engineError, inputProblems, stale, pending, computing, runNow, schedule, adopt };
}

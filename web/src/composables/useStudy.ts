// Live results: the engine runs in the browser on the form's input as the user types.
import { onBeforeUnmount, ref, watch, type Ref } from 'vue';
import {
  engineFailure,
  engineFailureText,
  type EngineFailure,
  type DissipatorTypeId,
  type StudyResult,
  type UnitSystem,
} from '@basinwright/common';
import { useLiveResult, type LiveOutcome } from '@/composables/useLive';
import { createStudyClient, type StudyPort } from '@/composables/studyWorker';

/** How long typing must pause before the study runs again, ms. */
export const STUDY_DEBOUNCE_MS = 250;

/** The lead of a study's refusal on the page. */
export const STUDY_FAILURE_LEAD = 'The study cannot be computed with these inputs.';

/**
 * An engine failure (data, as it crosses the worker's boundary) as a sentence for the page, in
 * the project's units: a coded refusal is phrased by common/messages from its code, field and
 * SI quantities; nothing here reads the engine's own text.
 */
export function failureText(
  failure: EngineFailure | null,
  units: UnitSystem = 'SI',
  lead = STUDY_FAILURE_LEAD,
): string | null {
  return failure ? `${lead} ${engineFailureText(failure, units)}` : null;
}

export interface StudyOutcome {
  result: StudyResult | null;
  /** why the engine gave no result, as data (phrased on the page by failureText) */
  failure: EngineFailure | null;
  /** schema messages when the form is not complete yet */
  inputProblems: string[];
}

/** The in-thread study, once loaded: the first fallback fetches it, later ones run at once. */
let inThread: typeof import('@/composables/studyInThread') | null = null;

/**
 * The study in this thread, for when the worker cannot be used (no Worker, or it failed): the
 * engine is imported on first need, so the page never loads it while the worker does the work.
 * Answers at once when the engine is already here, else with a promise. Never rejects: an
 * engine that cannot be fetched is a failure like any other.
 */
export function evaluateInThread(
  raw: unknown,
  chosenType?: DissipatorTypeId | null,
): StudyOutcome | Promise<StudyOutcome> {
  if (inThread) return inThread.evaluateStudy(raw, chosenType);
  return import('@/composables/studyInThread').then(
    (m) => {
      inThread = m;
      return m.evaluateStudy(raw, chosenType);
    },
    (e: unknown) => ({ result: null, failure: engineFailure(e), inputProblems: [] }),
  );
}

/** The unit system a raw form value declares, SI unless it says US. */
export function unitsOf(raw: unknown): UnitSystem {
  return raw !== null && typeof raw === 'object' && (raw as { units?: unknown }).units === 'US'
    ? 'US'
    : 'SI';
}

/** The study worker of this browser, or null where there is no Worker (jsdom in unit tests). */
export function spawnStudyWorker(): (() => StudyPort) | null {
  if (typeof Worker === 'undefined') return null;
  return () =>
    new Worker(new URL('../workers/study.worker.ts', import.meta.url), {
      type: 'module',
    }) as StudyPort;
}

const live = (out: StudyOutcome, units: UnitSystem): LiveOutcome<StudyResult> => ({
  value: out.result,
  engineError: failureText(out.failure, units),
  inputProblems: out.inputProblems,
});

/**
 * Runs the study on `source` whenever it changes, after a pause in typing, in a Web Worker
 * where the browser has one (the page never freezes, whatever the discharge count) and in the
 * thread otherwise (evaluateInThread: the engine fetched on first need). Only the newest input's answer is shown; a run superseded while busy is
 * ended. Keeps the last good result (marked stale) while the input is incomplete or refused, so
 * the page never blanks.
 */
export function useStudy(
  source: Ref<unknown>,
  chosenType: Ref<DissipatorTypeId | null | undefined> = ref(null),
  debounceMs = STUDY_DEBOUNCE_MS,
  spawn: (() => StudyPort) | null = spawnStudyWorker(),
) {
  const client = createStudyClient({
    spawn,
    evaluate: (request) => evaluateInThread(request.raw, request.chosenType),
  });
  const state = useLiveResult<StudyResult>(
    () => {
      const raw = source.value;
      const units = unitsOf(raw);
      const out = client.run({ raw, chosenType: chosenType.value ?? null });
      return out instanceof Promise ? out.then((o) => o && live(o, units)) : live(out, units);
    },
    debounceMs,
    () => client.cancel(),
  );
  onBeforeUnmount(() => client.dispose());
  watch(source, state.schedule, { deep: true });
  watch(chosenType, state.runNow);
  const {
    value: result,
    engineError,
    inputProblems,
    stale,
    pending,
    computing,
    runNow,
    adopt,
  } = state;
  return { result, engineError, inputProblems, stale, pending, computing, runNow, adopt };
}

/** Numbers in the user's units, for tables, labels and the drawing (shared with the PDF). */
export { unitFormat, type UnitFormat } from '@basinwright/common';

/** The floor the chosen basin is designed on, beside the free-jump floor the Jump check solves. */
export interface GoverningFloor {
  /** the chosen basin's own floor (top of slab or apron invert), m; null for a sloping apron */
  elevation: number | null;
  /** the chosen type's name, e.g. "USBR Type II basin" */
  basin: string;
  /** the chosen type's tailwater factor at the design discharge (jump basins only) */
  factor: number | null;
  governingQ: number | null;
  /** chosen floor − free-jump floor, m (negative: the basin sits lower) */
  difference: number | null;
}

export function governingFloor(result: StudyResult | null): GoverningFloor | null {
  const entry = result?.design;
  if (!result || !entry) return null;
  const d = entry.design;
  const elevation =
    d.family === 'jump-basin' || d.family === 'impact-basin'
      ? d.floorElevation
      : d.family === 'riprap-apron'
        ? d.invertElevation
        : null;
  return {
    elevation,
    basin: d.name,
    factor: d.family === 'jump-basin' ? d.sizing.tailwaterFactor : null,
    governingQ: d.family === 'jump-basin' ? d.governingQ : null,
    difference: elevation === null ? null : elevation - result.floor.elevation,
  };
}

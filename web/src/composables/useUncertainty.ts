// The Uncertainty panel's run: sensitivity and the seeded risk of sweep-out on the design as
// typed (common/src/uncertainty), in the study worker's script but in a worker of its own, so
// typing (whose live study supersedes its own worker) never ends it and it never blocks typing.
// Progress comes back as messages; cancelling ends the worker.
import { onBeforeUnmount, ref, shallowRef } from 'vue';
import { ValidationError } from 'yup';
import {
  defaultUncertainInputs,
  engineFailure,
  type EngineFailure,
  runUncertainty,
  studyInputSchema,
  uncertaintyFromSI,
  uncertaintyToSI,
  type StudyInput,
  type UncertainInput,
  type UncertaintyRequest,
  type UncertaintyResult,
  type UnitSystem,
} from '@basinwright/common';
import { inputForEngine } from '@/composables/useDesign';
import { failureText, unitsOf } from '@/composables/useStudy';
import {
  createUncertaintyClient,
  type UncertaintyClient,
  type UncertaintyPort,
} from '@/composables/studyWorker';

export interface UncertaintyOutcome {
  result: UncertaintyResult | null;
  /** the form is incomplete (a sentence of ours) */
  incomplete: string | null;
  /** the engine refused or failed, as data (phrased on the page by failureText) */
  failure: EngineFailure | null;
}

/** The lead of an uncertainty run's refusal on the page. */
export const UNCERTAINTY_FAILURE_LEAD = 'The uncertainty run cannot be made with these inputs.';

const INCOMPLETE = 'Complete the design first: the study needs every input.';

/** The form's values as the engine's SI input, or why they cannot be one yet. */
function engineInput(
  raw: unknown,
): { input: StudyInput; units: UnitSystem } | Omit<UncertaintyOutcome, 'result'> {
  try {
    const input = studyInputSchema.validateSync(raw, { abortEarly: false, stripUnknown: true });
    return { input: inputForEngine(input), units: input.units };
  } catch (e) {
    if (e instanceof ValidationError) return { incomplete: INCOMPLETE, failure: null };
    return { incomplete: null, failure: engineFailure(e) };
  }
}

/** An outcome's message for the panel, in the units of the design as typed. */
export function uncertaintyMessage(out: UncertaintyOutcome, raw: unknown): string | null {
  return out.incomplete ?? failureText(out.failure, unitsOf(raw), UNCERTAINTY_FAILURE_LEAD);
}

/**
 * One run, never throwing: the form's values (in their units) and the spreads (depths in the
 * same units) → SI → runUncertainty, with progress reported as it goes.
 */
export function evaluateUncertainty(
  raw: unknown,
  spec: UncertaintyRequest,
  onProgress?: (done: number, total: number) => void,
): UncertaintyOutcome {
  const at = engineInput(raw);
  if (!('input' in at)) return { result: null, ...at };
  try {
    const result = runUncertainty(at.input, uncertaintyToSI(spec, at.units), {
      onProgress,
      progressEvery: Math.max(1, Math.round(spec.samples / 50)),
    });
    return { result, incomplete: null, failure: null };
  } catch (e) {
    return { result: null, incomplete: null, failure: engineFailure(e) };
  }
}

/** The default spreads for the design as typed, depths in its units; null until it is complete. */
export function defaultSpreads(raw: unknown): UncertainInput[] | null {
  const at = engineInput(raw);
  if (!('input' in at)) return null;
  try {
    const inputs = defaultUncertainInputs(at.input);
    return uncertaintyFromSI({ inputs, samples: 1, seed: '', confidence: 0.9 }, at.units).inputs;
  } catch {
    return null;
  }
}

/** The uncertainty worker of this browser, or null where there is no Worker (jsdom). */
export function spawnUncertaintyWorker(): (() => UncertaintyPort) | null {
  if (typeof Worker === 'undefined') return null;
  return () =>
    new Worker(new URL('../workers/study.worker.ts', import.meta.url), {
      type: 'module',
    }) as UncertaintyPort;
}

/** State of the panel's run: busy, progress (0–1), the last result, its error; run and cancel. */
export function useUncertainty(spawn: (() => UncertaintyPort) | null = spawnUncertaintyWorker()) {
  const client: UncertaintyClient = createUncertaintyClient({
    spawn,
    evaluate: evaluateUncertainty,
  });
  const busy = ref(false);
  const progress = ref(0);
  const result = shallowRef<UncertaintyResult | null>(null);
  const error = ref<string | null>(null);
  async function run(raw: unknown, spec: UncertaintyRequest): Promise<void> {
    busy.value = true;
    progress.value = 0;
    error.value = null;
    const out = await client.run(raw, spec, (done, total) => {
      progress.value = done / total;
    });
    if (out === null) return; // cancelled or superseded: the newer call decides
    busy.value = false;
    result.value = out.result;
    error.value = uncertaintyMessage(out, raw);
  }
  function cancel(): void {
    client.cancel();
    busy.value = false;
    progress.value = 0;
  }
  onBeforeUnmount(() => client.dispose());
  return { busy, progress, result, error, run, cancel };
}

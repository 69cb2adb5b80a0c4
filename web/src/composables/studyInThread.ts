// The study itself, on whichever thread imports this module: the study worker
// (workers/study.worker.ts) runs it as the normal path; the page imports it dynamically only
// when it cannot use the worker (useStudy's fallback), so the engine never loads with the page.
import { ValidationError } from 'yup';
import {
  engineFailure,
  runStudy,
  studyInputSchema,
  type DissipatorTypeId,
  type StudyInput,
} from '@basinwright/common';
import { inputForEngine } from '@/composables/useDesign';
import type { StudyOutcome } from '@/composables/useStudy';

/**
 * One evaluation, without debounce: schema (in the user's units) → SI → runStudy. Never
 * throws: every failure becomes a message.
 */
export function evaluateStudy(raw: unknown, chosenType?: DissipatorTypeId | null): StudyOutcome {
  let input: StudyInput;
  try {
    input = studyInputSchema.validateSync(raw, { abortEarly: false, stripUnknown: true });
  } catch (e) {
    if (e instanceof ValidationError)
      return { result: null, failure: null, inputProblems: [...new Set(e.errors)] };
    return { result: null, failure: engineFailure(e), inputProblems: [] };
  }
  try {
    const si = inputForEngine(input);
    // A choice passed beside the input wins over the one stored in it; the rest of the
    // dissipator options (overrides, flotation, debris, culvert) always go with the input.
    const result = runStudy(
      chosenType ? { ...si, dissipators: { ...(si.dissipators ?? {}), chosenType } } : si,
    );
    return { result, failure: null, inputProblems: [] };
  } catch (e) {
    return { result: null, failure: engineFailure(e), inputProblems: [] };
  }
}

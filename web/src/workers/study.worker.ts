// The study worker: runs the engine on the form's values off the page's main thread and posts
// the outcome back with the id of the request it answers (composables/studyWorker.ts).
// evaluateStudy never throws: a refused input comes back as data in the outcome (`failure`:
// code, field, SI values), phrased by the page in the project's units. The same
// script runs the cheapest-design search (a call carrying `search`; evaluateSearch) and the
// Uncertainty panel's run (in a worker of its own): progress messages while it runs, then the
// outcome (composables/useUncertainty.ts).
import { evaluateStudy } from '@/composables/studyInThread';
import { evaluateSearch } from '@/composables/cheapestSearch';
import { evaluateUncertainty } from '@/composables/useUncertainty';
import type {
  SearchAnswer,
  SearchCall,
  StudyAnswer,
  StudyCall,
  UncertaintyCall,
  UncertaintyMessage,
} from '@/composables/studyWorker';

addEventListener('message', (event: MessageEvent<StudyCall | SearchCall | UncertaintyCall>) => {
  const call = event.data;
  if ('search' in call) {
    const answer: SearchAnswer = { id: call.id, search: evaluateSearch(call.search) };
    postMessage(answer);
    return;
  }
  if ('kind' in call && call.kind === 'uncertainty') {
    const outcome = evaluateUncertainty(call.raw, call.spec, (done, total) => {
      const progress: UncertaintyMessage = { id: call.id, progress: { done, total } };
      postMessage(progress);
    });
    const answer: UncertaintyMessage = { id: call.id, outcome };
    postMessage(answer);
    return;
  }
  const { id, request } = call as StudyCall;
  const answer: StudyAnswer = { id, outcome: evaluateStudy(request.raw, request.chosenType) };
  postMessage(answer);
});

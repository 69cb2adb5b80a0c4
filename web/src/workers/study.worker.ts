// The study worker: runs the engine on the form's values off the page's main thread and posts
// the outcome back with the id of the request it answers (composables/studyWorker.ts).
// evaluateStudy never throws: a refused input comes back as a message in the outcome.
import { evaluateStudy } from '@/composables/useStudy';
import type { StudyAnswer, StudyCall } from '@/composables/studyWorker';

addEventListener('message', (event: MessageEvent<StudyCall>) => {
  const { id, request } = event.data;
  const answer: StudyAnswer = { id, outcome: evaluateStudy(request.raw, request.chosenType) };
  postMessage(answer);
});

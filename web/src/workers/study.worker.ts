// The study worker: runs the engine on the form's values off the page's main thread and posts
// the outcome back with the id of the request it answers (composables/studyWorker.ts).
// evaluateStudy never throws: a refused input comes back as a message in the outcome. The same
// script runs the cheapest-design search (a call carrying `search`; evaluateSearch).
import { evaluateStudy } from '@/composables/useStudy';
import { evaluateSearch } from '@/composables/cheapestSearch';
import type { SearchAnswer, SearchCall, StudyAnswer, StudyCall } from '@/composables/studyWorker';

addEventListener('message', (event: MessageEvent<StudyCall | SearchCall>) => {
  const data = event.data;
  if ('search' in data) {
    const answer: SearchAnswer = { id: data.id, search: evaluateSearch(data.search) };
    postMessage(answer);
    return;
  }
  const { id, request } = data;
  const answer: StudyAnswer = { id, outcome: evaluateStudy(request.raw, request.chosenType) };
  postMessage(answer);
});

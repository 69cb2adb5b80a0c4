// The cheapest-design search off the main thread: the client posts a plain copy, takes the
// answer to its own request, ends the worker once answered, drops a superseded run (null), and
// runs in the thread where there is no Worker or the worker failed. A fake worker stands in
// for the browser's (jsdom has none). The outcome is the engine's own search (cheapestDesign).
import { describe, expect, it } from 'vitest';
import { reactive } from 'vue';
import { cheapestDesign, type StudyInput } from '@basinwright/common';
import {
  createSearchClient,
  type SearchAnswer,
  type SearchCall,
  type SearchOutcome,
  type SearchPort,
} from '../../web/src/composables/studyWorker';
import { evaluateSearch } from '../../web/src/composables/cheapestSearch';
import { expectRel } from '../support/tolerance';
import { fenwickDesign } from '../../seed/designs';

class FakeWorker implements SearchPort {
  posted: SearchCall[] = [];
  terminated = false;
  onmessage: ((event: MessageEvent<SearchAnswer>) => void) | null = null;
  onerror: ((event: Event) => void) | null = null;
  postMessage(call: SearchCall): void {
    this.posted.push(structuredClone(call)); // a proxy would throw here
  }
  terminate(): void {
    this.terminated = true;
  }
  answerLast(): void {
    const call = this.posted[this.posted.length - 1]!;
    const data: SearchAnswer = { id: call.id, search: evaluateSearch(call.search) };
    this.onmessage?.(new MessageEvent('message', { data }));
  }
  fail(): void {
    this.onerror?.(new Event('error'));
  }
}

// Invented unit rates (test data only).
const rates = { byKind: { concrete: 300, reinforcement: 2, excavation: 15 } };
const demo = {
  ...fenwickDesign,
  discharges: { kind: 'range', min: 5, max: 85, count: 5 },
} as StudyInput;
const body = { input: demo, width: { min: 10, max: 16, steps: 3 }, rates };

describe('search client', () => {
  it('answers through the worker with the engine search, then ends the worker', async () => {
    const made: FakeWorker[] = [];
    const client = createSearchClient({
      spawn: () => {
        const w = new FakeWorker();
        made.push(w);
        return w;
      },
      evaluate: evaluateSearch,
    });
    const run = client.run({ body: reactive(structuredClone(body)) });
    expect(made.length).toBe(1);
    made[0]!.answerLast();
    const out = (await run) as SearchOutcome;
    const local = cheapestDesign({ study: demo, width: { min: 10, max: 16, steps: 3 }, rates });
    expect(out.result!.best!.type).toBe(local.best!.type);
    expectRel(out.result!.best!.cost, local.best!.cost, 1e-12);
    expect(made[0]!.terminated).toBe(true);
  });
  it('a newer run supersedes one under way (null) and a failed worker falls back to the thread', async () => {
    const made: FakeWorker[] = [];
    const client = createSearchClient({
      spawn: () => {
        const w = new FakeWorker();
        made.push(w);
        return w;
      },
      evaluate: evaluateSearch,
    });
    const first = client.run({ body });
    const second = client.run({ body });
    expect(await first).toBeNull();
    expect(made[0]!.terminated).toBe(true);
    made[1]!.fail();
    const out = await second;
    expect(out!.result!.best).not.toBeNull();
  });
  it('runs in the thread without a Worker and phrases bad input', async () => {
    const client = createSearchClient({ spawn: null, evaluate: evaluateSearch });
    const out = await client.run({ body: { ...body, width: { min: 20, max: 10 } } });
    expect(out!.result).toBeNull();
    expect(out!.inputProblems.join(' ')).toMatch(/largest width/);
  });
});

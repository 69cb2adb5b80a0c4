// The study off the main thread: the client of the study worker answers only the newest
// request, ends a worker still busy with a superseded one (so long runs never queue), drops late
// answers, and runs in the thread where there is no Worker or the worker itself failed (the
// engine then imported on first need, never with the page). A fake worker stands in for the
// browser's here (jsdom has none); the e2e test drives the real one.
import { describe, expect, it, vi } from 'vitest';
import { defineComponent, h, nextTick, reactive, ref } from 'vue';
import { mount } from '@vue/test-utils';
import type { StudyInput } from '@basinwright/common';
import {
  createStudyClient,
  plainCopy,
  type StudyAnswer,
  type StudyCall,
  type StudyPort,
  type StudyRequest,
} from '../../web/src/composables/studyWorker';
import { evaluateInThread, useStudy, type StudyOutcome } from '../../web/src/composables/useStudy';
import { evaluateStudy } from '../../web/src/composables/studyInThread';
import { fenwickDesign } from '../../seed/designs';

/** A stand-in for a Worker: records what it is sent, answers when the test says. */
class FakeWorker implements StudyPort {
  posted: StudyCall[] = [];
  terminated = false;
  onmessage: ((event: MessageEvent<StudyAnswer>) => void) | null = null;
  onerror: ((event: Event) => void) | null = null;
  postMessage(call: StudyCall): void {
    // what crosses to a real worker is a structured clone: a proxy would throw here
    this.posted.push(structuredClone(call));
  }
  terminate(): void {
    this.terminated = true;
  }
  answer(id: number, outcome: StudyOutcome): void {
    this.onmessage?.(new MessageEvent('message', { data: { id, outcome } }));
  }
  /** answers its last request with the real study, as the worker script does */
  answerLast(): void {
    const call = this.posted[this.posted.length - 1]!;
    this.answer(call.id, evaluateStudy(call.request.raw, call.request.chosenType));
  }
  fail(): void {
    this.onerror?.(new Event('error'));
  }
}

function fakes() {
  const made: FakeWorker[] = [];
  const spawn = (): StudyPort => {
    const w = new FakeWorker();
    made.push(w);
    return w;
  };
  return { made, spawn };
}

// an outcome told apart by its (internal, never shown) failure detail
const outcome = (detail: string): StudyOutcome => ({
  result: null,
  failure: { kind: 'internal', detail },
  inputProblems: [],
});
const req = (raw: unknown): StudyRequest => ({ raw, chosenType: null });
const inThread = (r: StudyRequest): StudyOutcome => outcome(`in thread: ${JSON.stringify(r.raw)}`);

describe('the study worker client', () => {
  it('without a Worker runs in the thread and answers at once', () => {
    const client = createStudyClient({ spawn: null, evaluate: inThread });
    expect(client.mode).toBe('thread');
    expect(client.run(req(1))).toEqual(outcome('in thread: 1'));
  });

  it('posts a plain copy of reactive values with an id, and resolves with the answer to that id', async () => {
    const { made, spawn } = fakes();
    const client = createStudyClient({ spawn, evaluate: inThread });
    expect(client.mode).toBe('worker');
    const values = reactive({ basinWidth: 12, discharges: { kind: 'list', values: [5, 10] } });
    const p = client.run(req(values));
    expect(p).toBeInstanceOf(Promise);
    const [call] = made[0]!.posted;
    expect(call!.request.raw).toEqual({
      basinWidth: 12,
      discharges: { kind: 'list', values: [5, 10] },
    });
    made[0]!.answer(call!.id, outcome('first'));
    expect(await p).toEqual(outcome('first'));
  });

  it('keeps an idle worker for the next request', async () => {
    const { made, spawn } = fakes();
    const client = createStudyClient({ spawn, evaluate: inThread });
    const a = client.run(req('a'));
    made[0]!.answer(made[0]!.posted[0]!.id, outcome('a'));
    await a;
    const b = client.run(req('b'));
    expect(made).toHaveLength(1);
    expect(made[0]!.posted.map((c) => c.request.raw)).toEqual(['a', 'b']);
    made[0]!.answer(made[0]!.posted[1]!.id, outcome('b'));
    expect(await b).toEqual(outcome('b'));
  });

  it('a newer request ends a busy worker: the older resolves null, its late answer is dropped', async () => {
    const { made, spawn } = fakes();
    const client = createStudyClient({ spawn, evaluate: inThread });
    const older = client.run(req('older'));
    const newer = client.run(req('newer'));
    expect(await older).toBeNull();
    expect(made).toHaveLength(2);
    expect(made[0]!.terminated).toBe(true);
    expect(made[0]!.posted.map((c) => c.request.raw)).toEqual(['older']);
    expect(made[1]!.posted.map((c) => c.request.raw)).toEqual(['newer']);
    // the ended worker's answer arrives late: nothing takes it
    let settled = false;
    void (newer as Promise<unknown>).then(() => (settled = true));
    made[0]!.answer(made[0]!.posted[0]!.id, outcome('older'));
    // an answer on the live worker to another id is dropped too
    made[1]!.answer(made[0]!.posted[0]!.id, outcome('wrong id'));
    await Promise.resolve();
    expect(settled).toBe(false);
    made[1]!.answer(made[1]!.posted[0]!.id, outcome('newer'));
    expect(await newer).toEqual(outcome('newer'));
  });

  it('when the worker itself fails, the waiting run and every later one run in the thread', async () => {
    const { made, spawn } = fakes();
    const client = createStudyClient({ spawn, evaluate: inThread });
    const p = client.run(req('x'));
    made[0]!.fail();
    expect(await p).toEqual(outcome('in thread: "x"'));
    expect(made[0]!.terminated).toBe(true);
    expect(client.mode).toBe('thread');
    expect(client.run(req('y'))).toEqual(outcome('in thread: "y"'));
    expect(made).toHaveLength(1);
  });

  it('cancel ends a busy worker only; the next run starts a fresh one', async () => {
    const { made, spawn } = fakes();
    const client = createStudyClient({ spawn, evaluate: inThread });
    client.cancel(); // idle: nothing to end
    const p = client.run(req('x'));
    client.cancel();
    expect(await p).toBeNull();
    expect(made[0]!.terminated).toBe(true);
    const q = client.run(req('y'));
    expect(made).toHaveLength(2);
    made[1]!.answer(made[1]!.posted[0]!.id, outcome('y'));
    expect(await q).toEqual(outcome('y'));
  });

  it('dispose ends the worker and resolves the waiting run with null', async () => {
    const { made, spawn } = fakes();
    const client = createStudyClient({ spawn, evaluate: inThread });
    const p = client.run(req('x'));
    client.dispose();
    expect(await p).toBeNull();
    expect(made[0]!.terminated).toBe(true);
  });

  it('plainCopy keeps numbers a JSON copy would lose', () => {
    expect(plainCopy(reactive({ a: [NaN, Infinity], b: { c: undefined } }))).toEqual({
      a: [NaN, Infinity],
      b: { c: undefined },
    });
  });
});

/** useStudy on the demo design in a component, with the given worker and pause in typing. */
function mountStudy(spawn: () => StudyPort, debounceMs: number) {
  const source = ref<unknown>(fenwickDesign);
  let api!: ReturnType<typeof useStudy>;
  const Host = defineComponent({
    setup() {
      api = useStudy(source, ref(null), debounceMs, spawn);
      return () => h('div');
    },
  });
  const wrapper = mount(Host);
  return { source, api, wrapper };
}

describe('useStudy through a worker', () => {
  it('shows only the newest input’s result; computing while the worker works', async () => {
    const { made, spawn } = fakes();
    const { source, api, wrapper } = mountStudy(spawn, 0);
    api.runNow();
    expect(api.computing.value).toBe(true);
    expect(api.pending.value).toBe(true);
    // a newer input (basin width 13 m) supersedes the first while it is still computing
    source.value = { ...fenwickDesign, basinWidth: 13 } satisfies StudyInput;
    await vi.waitFor(() => expect(made).toHaveLength(2)); // after the (here 0 ms) pause
    made[0]!.answerLast(); // the ended worker answers anyway: dropped
    await nextTick();
    expect(api.result.value).toBeNull();
    expect(api.computing.value).toBe(true);
    made[1]!.answerLast();
    await vi.waitFor(() => expect(api.result.value?.input.basinWidth).toBe(13));
    expect(api.computing.value).toBe(false);
    expect(api.pending.value).toBe(false);
    wrapper.unmount();
    expect(made[1]!.terminated).toBe(true);
  });

  it('typing again while the worker computes drops that run at once and keeps the last result', async () => {
    const { made, spawn } = fakes();
    const { source, api, wrapper } = mountStudy(spawn, 60_000);
    api.runNow();
    made[0]!.answerLast();
    await vi.waitFor(() => expect(api.result.value?.input.basinWidth).toBe(12));
    source.value = { ...fenwickDesign, basinWidth: 13 } satisfies StudyInput;
    api.runNow();
    expect(api.computing.value).toBe(true);
    // a further change while the 13 m run computes: that run is ended before the pause is over
    source.value = { ...fenwickDesign, basinWidth: 14 } satisfies StudyInput;
    await nextTick();
    expect(made).toHaveLength(1); // the idle worker took the 13 m run …
    expect(made[0]!.terminated).toBe(true); // … and was ended when the input changed again
    expect(api.computing.value).toBe(false);
    expect(api.pending.value).toBe(true);
    made[0]!.answerLast(); // too late: dropped
    await nextTick();
    expect(api.result.value?.input.basinWidth).toBe(12);
    wrapper.unmount();
  });
});

describe('the study in the thread, when the worker cannot be used', () => {
  it('imports the engine on first need and answers with the study; later runs answer at once', async () => {
    const first = evaluateInThread(fenwickDesign, null);
    // the engine is not part of the page: the first fallback fetches it
    expect(first).toBeInstanceOf(Promise);
    const out = await first;
    expect(out.failure).toBeNull();
    expect(out.inputProblems).toEqual([]);
    // the same answer as the worker's script gives (it runs evaluateStudy on the same values)
    expect(out.result).toEqual(evaluateStudy(fenwickDesign, null).result);
    const again = evaluateInThread({ ...fenwickDesign, basinWidth: 13 }, 'usbr-2');
    expect(again).not.toBeInstanceOf(Promise);
    const later = again as StudyOutcome;
    expect(later.result?.input.basinWidth).toBe(13);
    expect(later.result?.design?.type).toBe('usbr-2');
  });

  it('a worker that fails hands its run to the thread, and the page still gets the study', async () => {
    const { made, spawn } = fakes();
    const { api, wrapper } = mountStudy(spawn, 0);
    api.runNow();
    expect(api.computing.value).toBe(true);
    made[0]!.fail();
    await vi.waitFor(() => expect(api.result.value).not.toBeNull());
    expect(api.result.value).toEqual(evaluateStudy(fenwickDesign, null).result);
    expect(api.computing.value).toBe(false);
    expect(made[0]!.terminated).toBe(true);
    wrapper.unmount();
  });
});

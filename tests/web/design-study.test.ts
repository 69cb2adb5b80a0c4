// Live results: the engine runs after a pause in typing, and an input the engine refuses
// (a RangeError) becomes a message on the page, never an exception.
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { defineComponent, h, nextTick, ref, type Ref } from 'vue';
import { mount } from '@vue/test-utils';
import { InputError, INTERNAL_FAILURE_TEXT, type StudyInput } from '@basinwright/common';
import { STUDY_DEBOUNCE_MS, failureText, useStudy } from '../../web/src/composables/useStudy';
import { evaluateStudy } from '../../web/src/composables/studyInThread';
import { fenwickDesign } from '../../seed/designs';

// the demo design of product.md (invented scenario), as seeded
const demo: StudyInput = fenwickDesign;
// Toe depth 2 m at 1 m/s: Fr1 = 1/√(9.80665·2) ≈ 0.23 < 1, subcritical — no jump can form
// (Chow 1959: a jump needs supercritical inflow). The schema lets it through; the engine refuses.
const subcritical: StudyInput = { ...demo, inflow: { kind: 'known', toe: { y1: 2, v1: 1 } } };

function mountStudy(input: unknown) {
  const source = ref<unknown>(input);
  let api!: ReturnType<typeof useStudy>;
  const Host = defineComponent({
    setup() {
      api = useStudy(source, ref(null));
      return () => h('div');
    },
  });
  const wrapper = mount(Host);
  return { wrapper, source: source as Ref<unknown>, api };
}

describe('evaluateStudy', () => {
  it('carries the refusal of a subcritical toe as data (code, field, SI values) and phrases it on the page', () => {
    const out = evaluateStudy(subcritical);
    expect(out.result).toBeNull();
    // what crosses the worker's boundary: plain data, unchanged by structured cloning
    const failure = structuredClone(out.failure);
    expect(failure).toEqual({
      kind: 'refusal',
      refusal: {
        field: 'inflow.toe',
        code: 'not-supercritical',
        values: { fr1: expect.any(Number) },
      },
    });
    // Fr1 = 1/√(9.80665·2) = 0.2258 [Chow 1959, Fr = V/√(g·y)]
    expect(failureText(failure, 'SI')).toBe(
      'The study cannot be computed with these inputs. With the toe conditions as given the Froude number is 0.226: the flow is not supercritical and no jump forms.',
    );
    expect(out.inputProblems).toEqual([]);
  });

  it('reports schema problems (in the shared schema words) without running the engine', () => {
    const out = evaluateStudy({ ...demo, basinWidth: -3 });
    expect(out.result).toBeNull();
    expect(out.failure).toBeNull();
    expect(out.inputProblems).toContain('The basin width must be greater than zero.');
  });

  it('phrases a coded refusal from its code in the project units, and never shows an internal text', () => {
    const refusal = (e: InputError) => ({
      kind: 'refusal' as const,
      refusal: { field: e.field, code: e.code, values: { ...e.values } },
    });
    const zero = new InputError('basinWidth', 'not-positive', 'basinWidth must be > 0', {});
    expect(failureText(refusal(zero))).toBe(
      'The study cannot be computed with these inputs. The basin width must be greater than zero.',
    );
    // 121.92 m / 0.3048 m/ft = 400.00 ft [NIST SP 811]; lengths to the hundredth (formatQuantity)
    const floor = new InputError('floorElevation', 'above-energy-line', 'x', {
      floorElevation: 121.92,
    });
    expect(failureText(refusal(floor), 'US')).toContain('The floor at 400.00 ft lies above');
    // an uncoded guard or a bug: a plain sentence, never the engine's own text
    const internal = failureText({ kind: 'internal', detail: 'RangeError: brent: no root' }, 'US');
    expect(internal).toBe(
      `The study cannot be computed with these inputs. ${INTERNAL_FAILURE_TEXT}`,
    );
    expect(internal).not.toContain('brent');
    expect(failureText(null)).toBeNull();
  });
});

describe('useStudy', () => {
  beforeEach(() => vi.useFakeTimers());
  afterEach(() => vi.useRealTimers());

  it('runs only after the pause in typing, then shows the engine message and keeps the last result', async () => {
    const { wrapper, source, api } = mountStudy(demo);
    api.runNow();
    // no Worker here: the first run fetches the engine into the thread; later runs answer at once
    await vi.waitFor(() => expect(api.result.value).not.toBeNull());
    expect(api.result.value?.floor.elevation).toBeLessThan(90);
    const good = api.result.value;

    source.value = subcritical;
    await nextTick();
    vi.advanceTimersByTime(STUDY_DEBOUNCE_MS - 10);
    expect(api.engineError.value).toBeNull();
    expect(api.pending.value).toBe(true);
    vi.advanceTimersByTime(20);
    expect(api.pending.value).toBe(false);
    expect(api.engineError.value).toContain('not supercritical');
    expect(api.result.value).toBe(good);
    expect(api.stale.value).toBe(true);

    source.value = { ...demo, basinWidth: 12.5 };
    await nextTick();
    vi.advanceTimersByTime(STUDY_DEBOUNCE_MS);
    expect(api.engineError.value).toBeNull();
    expect(api.stale.value).toBe(false);
    expect(api.result.value?.input.basinWidth).toBe(12.5);
    wrapper.unmount();
  });
});

// Live results: the engine runs after a pause in typing, and an input the engine refuses
// (a RangeError) becomes a message on the page, never an exception.
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { defineComponent, h, nextTick, ref, type Ref } from 'vue';
import { mount } from '@vue/test-utils';
import type { StudyInput } from '@basinwright/common';
import {
  STUDY_DEBOUNCE_MS,
  evaluateStudy,
  readableEngineError,
  useStudy,
} from '../../web/src/composables/useStudy';
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
  it('turns the engine RangeError for a subcritical toe into a readable message', () => {
    const out = evaluateStudy(subcritical);
    expect(out.result).toBeNull();
    expect(out.engineError).toMatch(
      /^The study cannot be computed with these inputs\. The toe conditions give Froude number 0\.22\d: the flow is not supercritical and no jump forms\.$/,
    );
    expect(out.inputProblems).toEqual([]);
  });

  it('reports schema problems (in the shared schema words) without running the engine', () => {
    const out = evaluateStudy({ ...demo, basinWidth: -3 });
    expect(out.result).toBeNull();
    expect(out.engineError).toBeNull();
    expect(out.inputProblems).toContain('The basin width must be greater than zero.');
  });

  it('names the field in words for a top-level argument', () => {
    expect(
      readableEngineError(new RangeError('basinWidth must be greater than zero (got 0)')),
    ).toContain('Basin width must be greater than zero');
    expect(readableEngineError(new TypeError('x is undefined'))).toBe(
      'The calculation failed unexpectedly: x is undefined',
    );
    // On a US project the engine's metres are put in feet (1 ft = 0.3048 m exactly, NIST SP 811);
    // a bare SI number is said to be SI.
    const us = readableEngineError(
      new RangeError('floorElevation 121.92 m lies above the outlet’s energy line'),
      'US',
    );
    // lengths to the hundredth: the one display-rounding rule (formatQuantity)
    expect(us).toContain('Floor elevation 400.00 ft lies above');
    expect(us).not.toContain('SI');
    expect(
      readableEngineError(
        new RangeError('basinWidth must be greater than zero (got -1.524)'),
        'US',
      ),
    ).toContain('(The value quoted is in SI units.)');
  });
});

describe('useStudy', () => {
  beforeEach(() => vi.useFakeTimers());
  afterEach(() => vi.useRealTimers());

  it('runs only after the pause in typing, then shows the engine message and keeps the last result', async () => {
    const { wrapper, source, api } = mountStudy(demo);
    api.runNow();
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

// The Uncertainty panel (Jump check step): default spreads from the engine, a run (in the thread
// here: jsdom has no Worker; a fake worker proves the progress messages and cancelling), the
// tornado ordered largest first, the probability with its standard error, the histogram with the
// chosen floor marked, and "lower the floor to the 90 % level" emitting the engine's own floor.
// Expected figures come from runUncertainty, itself checked in tests/common/uncertainty.test.ts.
import { describe, expect, it } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import VChart from 'vue-echarts';
import { defaultUncertainInputs, runUncertainty, inputFromSI } from '@basinwright/common';
import DesignUncertaintyPanel from '../../web/src/components/DesignUncertaintyPanel.vue';
import {
  createUncertaintyClient,
  type UncertaintyCall,
  type UncertaintyMessage,
  type UncertaintyPort,
} from '../../web/src/composables/studyWorker';
import { evaluateUncertainty } from '../../web/src/composables/useUncertainty';
import { UNCERTAIN_INPUT_SHORT } from '../../web/src/labels';
import { fenwickDesign } from '../../seed/designs';

const mountPanel = (readOnly = false) =>
  mount(DesignUncertaintyPanel, {
    props: { raw: fenwickDesign, units: 'SI', readOnly, spawn: null },
    global: { stubs: { VChart: true } },
  });

/** The panel's sample count field (antd may put the test id on the input or around it). */
async function setSamples(w: ReturnType<typeof mountPanel>, n: number): Promise<void> {
  const host = w.find('[data-test="uncertainty-samples"]');
  const input = host.element.tagName === 'INPUT' ? host : host.find('input');
  await input.setValue(String(n));
  await input.trigger('blur');
}

describe('DesignUncertaintyPanel', () => {
  it('runs on the design and shows the engine’s figures; one click lowers the floor to the 90 % level', async () => {
    const w = mountPanel();
    // the default spreads of the demo: downstream n, bed lowering, chute loss, weir C, design Q
    const keys = defaultUncertainInputs(fenwickDesign).map((u) => u.key);
    for (const k of keys) expect(w.find(`[data-test="spread-${k}"]`).exists()).toBe(true);
    expect(w.find('[data-test="spread-bedLowering"]').text()).toContain('sediment');

    await setSamples(w, 500);
    await w.find('[data-test="uncertainty-run"]').trigger('click');
    await flushPromises();
    const local = runUncertainty(fenwickDesign, {
      inputs: defaultUncertainInputs(fenwickDesign),
      samples: 500,
      seed: 'basinwright',
      confidence: 0.9,
    });
    const text = w.find('[data-test="uncertainty-probability"]').text();
    expect(text).toContain(`${(local.monteCarlo.probability * 100).toFixed(1)} %`);
    expect(text).toContain(`standard error ${(local.monteCarlo.standardError * 100).toFixed(1)} %`);
    expect(text).toContain('500 samples');

    const charts = w.findAllComponents(VChart);
    expect(charts.length).toBe(2);
    const tornado = charts[0]!.props('option') as { yAxis: { data: string[] } };
    // echarts draws categories bottom-up: the largest swing is the last category (on top)
    expect(tornado.yAxis.data[tornado.yAxis.data.length - 1]).toBe(
      UNCERTAIN_INPUT_SHORT[local.sensitivity[0]!.key],
    );
    const hist = charts[1]!.props('option') as {
      series: Array<{ data: number[][]; markLine: { data: Array<{ xAxis: number }> } }>;
    };
    expect(hist.series[0]!.data.reduce((a, p) => a + p[1]!, 0)).toBe(500);
    expect(hist.series[0]!.markLine.data[0]!.xAxis).toBe(local.chosenFloor);

    await w.find('[data-test="uncertainty-lower-floor"]').trigger('click');
    const z90 = local.monteCarlo.floorAtConfidence!.elevation;
    expect(w.emitted('setFloor')).toEqual([[Math.floor(z90 * 100) / 100]]);
    w.unmount();
  });

  it('read only: the result shows but the floor cannot be changed', async () => {
    const w = mountPanel(true);
    await setSamples(w, 50);
    await w.find('[data-test="uncertainty-run"]').trigger('click');
    await flushPromises();
    expect(w.find('[data-test="uncertainty-probability"]').text()).toContain('50 samples');
    expect(w.find('[data-test="uncertainty-lower-floor"]').attributes('disabled')).toBeDefined();
    w.unmount();
  });

  it('a value out of range stays as typed, is explained under its field, and the run waits', async () => {
    const w = mountPanel();
    const box = (test: string) => {
      const host = w.find(`[data-test="${test}"]`);
      return host.element.tagName === 'INPUT' ? host : host.find('input');
    };
    const under = (test: string) =>
      box(test).element.closest('.ant-form-item')?.querySelector('.ant-form-item-explain-error')
        ?.textContent ?? null;
    await setSamples(w, 0);
    const confidence = box('uncertainty-confidence');
    await confidence.setValue('120');
    await confidence.trigger('blur');
    const key = defaultUncertainInputs(fenwickDesign)[0]!.key;
    const low = box(`spread-${key}-low`);
    const high = box(`spread-${key}-high`);
    await high.setValue(String(Number((low.element as HTMLInputElement).value) - 1));
    await high.trigger('blur');
    await flushPromises();
    // the shared schema's bounds (UNCERTAINTY_LIMITS): at least one sample, confidence ≤ 0.99
    expect(under('uncertainty-samples')).toBe('Draw at least one sample.');
    expect(under('uncertainty-confidence')).toBe('The confidence must not exceed 0.99 (99 %).');
    expect(under(`spread-${key}-high`)).toBe('The high value must not be below the low value.');
    expect((box('uncertainty-samples').element as HTMLInputElement).value).toBe('0');
    expect((confidence.element as HTMLInputElement).value).toBe('120');
    expect(w.find('[data-test="uncertainty-waiting"]').text()).toContain('3 to fix');
    expect(w.find('[data-test="uncertainty-run"]').attributes('disabled')).toBeDefined();
    await w.find('[data-test="uncertainty-run"]').trigger('click');
    await flushPromises();
    expect(w.find('[data-test="uncertainty-probability"]').exists()).toBe(false);
    w.unmount();
  });

  it('an incomplete design: no defaults, a sentence saying why', () => {
    const w = mount(DesignUncertaintyPanel, {
      props: { raw: { units: 'SI' }, units: 'SI', readOnly: false, spawn: null },
      global: { stubs: { VChart: true } },
    });
    expect(w.find('[data-test="uncertainty-incomplete"]').exists()).toBe(true);
    w.unmount();
  });

  it('in US units the depths are in feet, and the answer is the SI design’s', () => {
    const us = inputFromSI(fenwickDesign, 'US');
    const inputs = defaultUncertainInputs(fenwickDesign);
    const spec = { inputs, samples: 100, seed: 's', confidence: 0.9 };
    const si = evaluateUncertainty(fenwickDesign, spec).result!;
    const feet = evaluateUncertainty(us, {
      ...spec,
      inputs: inputs.map((u) =>
        u.key === 'bedLowering'
          ? { ...u, distribution: { kind: 'triangular', low: 0, mode: 0, high: 0.5 / 0.3048 } }
          : u,
      ),
    }).result!;
    // 1 ft = 0.3048 m exactly [NIST]: the same design and spreads give the same probability
    expect(feet.monteCarlo.sweepOutCount).toBe(si.monteCarlo.sweepOutCount);
  });
});

describe('the uncertainty worker client', () => {
  class FakeWorker implements UncertaintyPort {
    posted: UncertaintyCall[] = [];
    terminated = false;
    onmessage: ((event: MessageEvent<UncertaintyMessage>) => void) | null = null;
    onerror: ((event: Event) => void) | null = null;
    postMessage(call: UncertaintyCall): void {
      this.posted.push(structuredClone(call));
    }
    terminate(): void {
      this.terminated = true;
    }
    send(data: UncertaintyMessage): void {
      this.onmessage?.(new MessageEvent('message', { data }));
    }
  }

  it('passes progress messages on, resolves with the outcome, and cancelling ends the worker', async () => {
    const made: FakeWorker[] = [];
    const client = createUncertaintyClient({
      spawn: () => {
        const f = new FakeWorker();
        made.push(f);
        return f;
      },
      evaluate: () => {
        throw new Error('not in the thread');
      },
    });
    const seen: number[] = [];
    const spec = { inputs: [], samples: 10, seed: 'x', confidence: 0.9 };
    const first = client.run(fenwickDesign, spec, (d) => seen.push(d));
    const w = made[0]!;
    const id = w.posted[0]!.id;
    w.send({ id, progress: { done: 5, total: 10 } });
    expect(seen).toEqual([5]);
    client.cancel();
    expect(w.terminated).toBe(true);
    expect(await first).toBeNull();

    const second = client.run(fenwickDesign, spec, (d) => seen.push(d));
    const w2 = made[1]!;
    const outcome = { result: null, incomplete: 'not complete', failure: null };
    w2.send({ id: w2.posted[0]!.id, outcome });
    expect(await second).toEqual(outcome);
  });
});

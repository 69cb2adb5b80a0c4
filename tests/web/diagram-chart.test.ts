// The E–y and M–y diagrams: the head loss ΔE = E1 − E2 and the equal momentum of the two depths
// are written beside the charts, and the chart marks both points, E1/E2 (or M1 = M2) and the
// tailwater. Checked against the relations computed here for a rectangular basin.
import { describe, expect, it } from 'vitest';
import { mount } from '@vue/test-utils';
import { jumpDiagrams } from '@basinwright/common';
import VChart from 'vue-echarts';
import DesignDiagramChart from '../../web/src/components/DesignDiagramChart.vue';
import { expectRel } from '../support/tolerance';

const g = 9.80665; // standard gravity [NIST SP 330]
// A 12 m rectangular basin at 85 m³/s with y1 = 0.42 m (invented case, of the demo's size)
const b = 12;
const Q = 85;
const y1 = 0.42;
const fr1 = Q / (b * y1) / Math.sqrt(g * y1);
const y2 = 0.5 * y1 * (Math.sqrt(1 + 8 * fr1 * fr1) - 1); // Bélanger [Chow 1959, §15-2]
const E = (y: number) => y + (Q * Q) / (2 * g * b * b * y * y); // [Chow 1959, §3-1]
const M = (y: number) => (b * y * y) / 2 + (Q * Q) / (g * b * y); // [Chow 1959, §3-6]
const diagrams = jumpDiagrams({ shape: 'rectangular', width: b }, Q, y1, y2, 4.99);

interface Option {
  series: Array<{
    markLine?: {
      data: Array<{
        xAxis?: number;
        yAxis?: number;
        label: { formatter: string; position?: string };
      }>;
    };
    data: number[][];
  }>;
}
function chartOption(w: ReturnType<typeof mount>): Option {
  return w.findComponent(VChart).props('option') as unknown as Option;
}

describe('DesignDiagramChart', () => {
  it('writes the y2 and tailwater labels on the sides of their lines away from each other', () => {
    const position = (dg: typeof diagrams, starts: string) => {
      const w = mount(DesignDiagramChart, {
        props: { diagrams: dg, which: 'energy', units: 'SI' },
        global: { stubs: { VChart: true } },
      });
      const p = chartOption(w).series[0]!.markLine!.data.find((m) =>
        m.label.formatter.startsWith(starts),
      )!.label.position;
      w.unmount();
      return p;
    };
    // tailwater above y2 (here 4.99 m): y2 written under its line, the tailwater over its own
    expect(position(diagrams, 'y2')).toBe('insideEndBottom');
    expect(position(diagrams, 'Tailwater')).toBe('insideStartTop');
    // tailwater below y2 (a basin with C < 1): the other way round
    const low = jumpDiagrams({ shape: 'rectangular', width: b }, Q, y1, y2, y2 - 0.2);
    expect(position(low, 'y2')).toBe('insideEndTop');
    expect(position(low, 'Tailwater')).toBe('insideStartBottom');
  });

  it('energy: ΔE = E1 − E2 in words, E1 and E2 and the tailwater marked', () => {
    expectRel(diagrams.specificEnergy.E1, E(y1), 1e-9);
    expectRel(diagrams.specificEnergy.E2, E(y2), 1e-9);
    const w = mount(DesignDiagramChart, {
      props: { diagrams, which: 'energy', units: 'SI' },
      global: { stubs: { VChart: true } },
    });
    const dE = E(y1) - E(y2);
    expect(w.find('[data-test="diagram-note"]').text()).toContain(
      `ΔE = E1 − E2 = ${dE.toFixed(2)} m (${((dE / E(y1)) * 100).toFixed(0)} % of E1)`,
    );
    const marks = chartOption(w).series[0]!.markLine!.data.map((m) => m.label.formatter);
    expect(marks).toContain(`E1 = ${E(y1).toFixed(2)} m`);
    expect(marks).toContain(`E2 = ${E(y2).toFixed(2)} m`);
    expect(marks).toContain('Tailwater = 4.99 m');
    // both sides of the jump drawn as points on the curve
    expect(chartOption(w).series[1]!.data).toEqual([
      [diagrams.specificEnergy.E1, y1],
      [diagrams.specificEnergy.E2, diagrams.y2],
    ]);
    w.unmount();
  });

  it('momentum: the two depths carry one momentum, M1 = M2; US units in ft³', () => {
    expectRel(M(y1), M(y2), 1e-9); // the jump conserves momentum [Chow 1959, §15-2]
    const w = mount(DesignDiagramChart, {
      props: { diagrams, which: 'momentum', units: 'US' },
      global: { stubs: { VChart: true } },
    });
    const ft3 = M(y1) / 0.3048 ** 3; // 1 ft = 0.3048 m exactly [NIST SP 811]
    expect(w.find('[data-test="diagram-note"]').text()).toContain(
      `M1 = M2 = ${ft3.toLocaleString('en-GB', { minimumFractionDigits: 1, maximumFractionDigits: 1 })} ft³`,
    );
    w.unmount();
  });
});

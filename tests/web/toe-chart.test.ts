// The Inflow step's chart of the toe over the range: Fr1 and V1 at every discharge on the floor
// the design uses, over bands of the jump classes. The bands are checked against the engine's
// classifyJump, whose limits are the USBR classification via Chow 1959, §15-2.
import { describe, expect, it } from 'vitest';
import { mount } from '@vue/test-utils';
import VChart from 'vue-echarts';
import { classifyJump, runStudy } from '@basinwright/common';
import DesignToeChart from '../../web/src/components/DesignToeChart.vue';
import { JUMP_CLASS_BANDS } from '../../web/src/labels';
import { fenwickDesign } from '../../seed/designs';

interface Option {
  series: Array<{ data: number[][] }>;
}
const optionOf = (w: ReturnType<typeof mount>) =>
  w.findComponent(VChart).props('option') as unknown as Option;

describe('the jump-class bands', () => {
  it('follow the classification: each band holds its class, and the classes change at its edges', () => {
    for (const b of JUMP_CLASS_BANDS) {
      const top = b.to ?? b.from + 10;
      expect(classifyJump((b.from + top) / 2)).toBe(b.jumpClass);
      // Fr 1.7, 2.5 and 4.5 open the next class; 9 still belongs to the steady jump
      if (b.to !== null) expect(classifyJump(b.to + 1e-9)).not.toBe(b.jumpClass);
    }
    expect(JUMP_CLASS_BANDS.map((b) => b.from)).toEqual([1, 1.7, 2.5, 4.5, 9]);
  });
});

describe('DesignToeChart', () => {
  it('on the chosen jump basin’s floor: its rows, Fr1 and V1 in the user’s units', () => {
    const result = runStudy(fenwickDesign);
    const d = result.design!.design;
    if (d.family !== 'jump-basin') throw new Error('jump basin expected');
    const w = mount(DesignToeChart, {
      props: { result, units: 'US' },
      global: { stubs: { VChart: true } },
    });
    expect(w.text()).toContain(`on the ${d.name}'s floor`);
    const [fr, v] = optionOf(w).series;
    expect(fr!.data.map((p) => p[1])).toEqual(d.rows.map((r) => r.fr1));
    // V1 in ft/s: 1 ft = 0.3048 m exactly [NIST SP 811]
    v!.data.forEach((p, i) => expect(Math.abs(p[1]! - d.rows[i]!.v1 / 0.3048)).toBeLessThan(1e-9));
    expect(w.find('[data-test="toe-bands"]').text()).toContain('oscillating 2.5–4.5');
    w.unmount();
  });

  it('with a type that holds no jump chosen: the study’s rows on the free-jump floor', () => {
    const result = runStudy({ ...fenwickDesign, dissipators: { chosenType: 'usbr-6' } });
    const w = mount(DesignToeChart, {
      props: { result, units: 'SI' },
      global: { stubs: { VChart: true } },
    });
    expect(w.text()).toContain('on the free-jump floor');
    expect(optionOf(w).series[0]!.data.map((p) => p[1])).toEqual(result.rows.map((r) => r.fr1));
    w.unmount();
  });
});

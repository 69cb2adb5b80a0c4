// The Flows step's tailwater rating chart: the curve is the engine's rating, checked here against
// Manning's equation computed independently; a rating table's points are shown with a note for
// the discharges that lie beyond it.
import { describe, expect, it } from 'vitest';
import { mount } from '@vue/test-utils';
import { runStudy, type StudyInput } from '@basinwright/common';
import DesignTailwaterChart from '../../web/src/components/DesignTailwaterChart.vue';
import { ratingPoints } from '../../web/src/composables/tailwaterRating';
import { expectRel } from '../support/tolerance';
import { fenwickDesign } from '../../seed/designs';

describe('tailwater rating points', () => {
  it('Manning channel: every curve point carries its discharge at normal depth [Chow 1959, §5-6]', () => {
    const result = runStudy(fenwickDesign);
    const p = ratingPoints(result)!;
    const tw = fenwickDesign.tailwater;
    if (tw.kind !== 'manning' || tw.section.shape !== 'trapezoidal')
      throw new Error('demo tailwater is a trapezoidal Manning channel');
    const { bottomWidth: b, sideSlope: z } = tw.section;
    expect(p.curve.length).toBeGreaterThan(50);
    for (const pt of p.curve) {
      const y = pt.elevation - fenwickDesign.channelBedElevation;
      const A = (b + z * y) * y;
      const P = b + 2 * y * Math.sqrt(1 + z * z);
      // Q = (1/n)·A·R^(2/3)·S^(1/2), SI
      expectRel((1 / tw.manningN) * A * Math.pow(A / P, 2 / 3) * Math.sqrt(tw.slope), pt.Q, 1e-6);
    }
    // the curve rises with Q (a rating is monotone) and spans the discharges checked
    for (let i = 1; i < p.curve.length; i++)
      expect(p.curve[i]!.elevation).toBeGreaterThan(p.curve[i - 1]!.elevation);
    expect(p.checked.map((c) => c.elevation)).toEqual(result.rows.map((r) => r.tailwaterElevation));
    expect(p.outside).toEqual([]);
    expect(p.bed).toBe(90);
  });

  it('rating table: its points are kept and the discharges beyond it are named', () => {
    const input: StudyInput = {
      ...fenwickDesign,
      tailwater: {
        kind: 'table',
        rows: [
          { Q: 5, elevation: 91.2 },
          { Q: 40, elevation: 92.9 },
          { Q: 60, elevation: 93.6 },
        ],
      },
    };
    const result = runStudy(input);
    const p = ratingPoints(result)!;
    expect(p.table).toEqual([
      { Q: 5, elevation: 91.2 },
      { Q: 40, elevation: 92.9 },
      { Q: 60, elevation: 93.6 },
    ]);
    // the study checks 5–85 m³/s in 5 m³/s steps: 65 … 85 lie above the table
    expect(p.outside).toEqual([65, 70, 75, 80, 85]);
    // the curve passes through the table's points (monotone interpolation keeps the data) [Fritsch & Carlson 1980]
    const at = (Q: number) =>
      p.curve.reduce((a, c) => (Math.abs(c.Q - Q) < Math.abs(a.Q - Q) ? c : a));
    expect(at(5).elevation).toBe(91.2);
    const w = mount(DesignTailwaterChart, {
      props: { result, units: 'SI' },
      global: { stubs: { VChart: true } },
    });
    expect(w.find('[data-test="tailwater-outside"]').text()).toContain(
      '5 discharge(s) lie outside the rating table',
    );
    w.unmount();
  });

  it('shows nothing before there is a result', () => {
    const w = mount(DesignTailwaterChart, {
      props: { result: null, units: 'SI' },
      global: { stubs: { VChart: true } },
    });
    expect(w.find('[data-test="tailwater-chart"]').exists()).toBe(false);
    w.unmount();
  });
});

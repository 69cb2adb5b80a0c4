// A chart's text alternative (AppChartTable): the numbers the chart draws, read back from the
// same echarts option, behind a "Show as table" toggle. The expected cells are the points given.
import { describe, expect, it } from 'vitest';
import { mount } from '@vue/test-utils';
import AppChartTable from '../../web/src/components/AppChartTable.vue';

const cells = (wrapper: ReturnType<typeof mount>) =>
  wrapper.findAll('tbody tr').map((tr) => tr.findAll('th, td').map((c) => c.text()));

describe('AppChartTable', () => {
  it('puts [x, y] series side by side, one row per x, a dash where a series has no point', () => {
    const wrapper = mount(AppChartTable, {
      props: {
        caption: 'Tailwater against discharge',
        option: {
          xAxis: { type: 'value', name: 'Discharge Q (m³/s)' },
          yAxis: { type: 'value', name: 'Depth (m)' },
          series: [
            {
              name: 'Tailwater',
              data: [
                [10, 1.2],
                [20, 1.85],
              ],
            },
            {
              name: 'Required',
              data: [
                [20, 2.1],
                [5, 0.7],
              ],
            },
            { name: 'Marker only', data: [], markLine: { data: [{ yAxis: 3 }] } },
          ],
        },
      },
    });
    expect(wrapper.find('summary').text()).toBe('Show as table');
    expect(wrapper.find('caption').text()).toContain('Tailwater against discharge');
    expect(wrapper.findAll('thead th').map((t) => t.text())).toEqual([
      'Discharge Q (m³/s)',
      'Tailwater',
      'Required',
    ]);
    expect(cells(wrapper)).toEqual([
      ['5', '—', '0.7'],
      ['10', '1.2', '—'],
      ['20', '1.85', '2.1'],
    ]);
  });

  it('gives a bar chart on a category axis a row per category', () => {
    const wrapper = mount(AppChartTable, {
      props: {
        caption: 'Change in the floor',
        option: {
          xAxis: { type: 'value', name: 'Change (m)' },
          yAxis: { type: 'category', data: ['Downstream n', 'Rating shift'] },
          series: [
            { name: 'At 5 %', type: 'bar', data: [-0.25, { value: 0.1 }] },
            { name: 'At 95 %', type: 'bar', data: [0.3, -0.05] },
          ],
        },
      },
    });
    expect(cells(wrapper)).toEqual([
      ['Downstream n', '-0.25', '0.3'],
      ['Rating shift', '0.1', '-0.05'],
    ]);
  });

  it('draws nothing for a chart with no points', () => {
    const wrapper = mount(AppChartTable, {
      props: { caption: 'Empty', option: { series: [{ name: 'a', data: [] }] } },
    });
    expect(wrapper.find('details').exists()).toBe(false);
  });
});

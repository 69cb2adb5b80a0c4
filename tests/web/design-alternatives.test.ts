// The Sizing step's side-by-side table: the chosen basin first, then every other sized type on
// its own floor, with the figures the engine gives; the table bears out the trade's expectations
// for the demo (a larger tailwater factor needs a lower floor; blocks and a sill shorten a basin).
import { describe, expect, it } from 'vitest';
import { mount } from '@vue/test-utils';
import { runStudy } from '@basinwright/common';
import DesignAlternativesTable from '../../web/src/components/DesignAlternativesTable.vue';
import { fenwickDesign } from '../../seed/designs';

// The SI demo study of product.md (invented scenario): USBR Type II chosen, Type I an alternative
const result = runStudy(fenwickDesign);

function tableRows(w: ReturnType<typeof mount>): Array<Record<string, string>> {
  const heads = w.findAll('thead th').map((th) => th.text());
  return w
    .findAll('tbody tr.data-row')
    .map((tr) => Object.fromEntries(tr.findAll('td').map((td, i) => [heads[i] ?? '', td.text()])));
}

describe('the chosen basin beside the other sized types', () => {
  it('lists the chosen design first, then the alternatives, with their own figures', () => {
    const w = mount(DesignAlternativesTable, { props: { result, units: 'SI' } });
    const rows = tableRows(w);
    const entries = [result.design!, ...result.alternatives];
    expect(rows).toHaveLength(entries.length);
    expect(entries.length).toBeGreaterThan(1);
    expect(rows[0]!['Type']).toContain('Sized above');
    entries.forEach((e, i) => {
      expect(rows[i]!['Type']).toContain(e.design.name);
      expect(rows[i]!['Length (m)']).toBe(e.design.length.toFixed(2));
      expect(rows[i]!['Concrete (m³)']).toBe(
        Math.round(e.design.concrete.total).toLocaleString('en-GB'),
      );
    });
    w.unmount();
  });

  it('Type II (C = 1.05) sits lower than Type I (C = 1.00) and is shorter [relation: hydraulics.md §3; lengths from memory: EM-25]', () => {
    const t2 = [result.design!, ...result.alternatives].find((e) => e.type === 'usbr-2')!.design;
    const t1 = result.alternatives.find((e) => e.type === 'usbr-1')!.design;
    if (t2.family !== 'jump-basin' || t1.family !== 'jump-basin')
      throw new Error('both are jump basins');
    expect(t2.floorElevation).toBeLessThan(t1.floorElevation);
    expect(t2.length).toBeLessThan(t1.length);
    const w = mount(DesignAlternativesTable, { props: { result, units: 'SI' } });
    const rows = tableRows(w);
    const byName = (n: string) => rows.find((r) => r['Type']!.includes(n))!;
    expect(Number(byName(t2.name)['Floor elevation (m)'])).toBeLessThan(
      Number(byName(t1.name)['Floor elevation (m)']),
    );
    w.unmount();
  });

  it('is not shown when only one type is sized', () => {
    const w = mount(DesignAlternativesTable, {
      props: { result: { ...result, alternatives: [] }, units: 'SI' },
    });
    expect(w.find('[data-test="alternatives"]').exists()).toBe(false);
    w.unmount();
  });
});

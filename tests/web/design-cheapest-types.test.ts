// "Types side by side" of the cheapest-design search (issue 9): each type that passes, at its
// cheapest width, with its cost, length, floor and quantities, from the engine's own search of
// the seeded demo design (the invented scenario of product.md).
import { describe, expect, it } from 'vitest';
import { mount } from '@vue/test-utils';
import { cheapestDesign, type CheapestSearchResult, type SearchPoint } from '@basinwright/common';
import DesignCheapestTypes from '../../web/src/components/DesignCheapestTypes.vue';
import { fenwickDesign } from '../../seed/designs';
import { expectRel } from '../support/tolerance';

// A rate of 1 a cubic metre of concrete and nothing else: the direct cost of each design is then
// its concrete volume (cost = Σ quantity × rate, the arithmetic of any bill of quantities).
const result: CheapestSearchResult = cheapestDesign({
  study: fenwickDesign,
  width: { min: 8, max: 20, steps: 5 },
  rates: { byKind: { concrete: 1 } },
});

/** The cheapest passing point of each type, found here by sorting (the component reduces). */
function cheapestByType(points: SearchPoint[]): Map<string, SearchPoint> {
  const out = new Map<string, SearchPoint>();
  for (const p of [...points].filter((x) => x.passes).sort((a, b) => b.cost - a.cost))
    out.set(p.type, p);
  return out;
}

const cells = (row: Element) => [...row.querySelectorAll('td')].map((td) => td.textContent?.trim());

describe('DesignCheapestTypes', () => {
  it('shows each passing type once, at its cheapest width, cheapest first, the best one marked', () => {
    const expected = cheapestByType(result.points);
    expect(expected.size).toBeGreaterThan(1); // the demo has several passing types to compare
    const w = mount(DesignCheapestTypes, {
      props: { result, units: 'SI', currency: 'USD' },
      attachTo: document.body,
    });
    const rows = [...w.element.querySelectorAll('tbody tr.ant-table-row')];
    expect(rows).toHaveLength(expected.size);
    const costs: number[] = [];
    for (const row of rows) {
      const [name, width, cost, length, floor, , concrete] = cells(row);
      const point = [...expected.values()].find((p) => name?.startsWith(p.name))!;
      expect(point, `row ${name}`).toBeDefined();
      expect(Number(width)).toBe(Number(point.width.toFixed(2)));
      expect(Number(length)).toBe(Number(point.length.toFixed(2)));
      if (point.floorElevation !== null)
        expect(Number(floor)).toBe(Number(point.floorElevation.toFixed(2)));
      // with concrete the only rate (1 a m³), the cost is the concrete volume itself
      expectRel(point.cost, point.concrete, 1e-9);
      expectRel(Number(cost!.replace(/,/g, '')), point.concrete, 0.01);
      expectRel(Number(concrete!.replace(/,/g, '')), point.concrete, 0.01);
      costs.push(point.cost);
      expect(name!.includes('Cheapest')).toBe(
        point.type === result.best!.type && point.width === result.best!.width,
      );
    }
    expect(costs).toEqual([...costs].sort((a, b) => a - b));
    expect(rows[0]!.textContent).toContain('Cheapest');
    w.unmount();
  });

  it('in US units the widths are in ft and the concrete in yd³', () => {
    const w = mount(DesignCheapestTypes, {
      props: { result, units: 'US', currency: 'USD' },
      attachTo: document.body,
    });
    const head = [...w.element.querySelectorAll('thead th')].map((th) => th.textContent?.trim());
    expect(head).toContain('Width (ft)');
    expect(head).toContain('Concrete (yd³)');
    const best = result.best!;
    const row = [...w.element.querySelectorAll('tbody tr.ant-table-row')][0]!;
    const [, width, , , , , concrete] = cells(row);
    // 1 ft = 0.3048 m and 1 yd³ = 0.764554857984 m³ exactly (international yard and pound, 1959)
    expectRel(Number(width), best.width / 0.3048, 0.001);
    expectRel(Number(concrete!.replace(/,/g, '')), best.concrete / 0.764554857984, 0.01);
    w.unmount();
  });
});

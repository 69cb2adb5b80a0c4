// The project page's "Design at a glance": the saved design run through the engine, its figures
// the same as the workspace's, in the project's units; a project without a saved design, or with
// one the engine refuses, says so instead of failing.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { runStudy, toSI, type StudyInput } from '@basinwright/common';
import ProjectDesignSummary from '../../web/src/components/ProjectDesignSummary.vue';
import { caldwellDesign, fenwickDesign } from '../../seed/designs';
import { stubApi } from './fetch-stub';

afterEach(() => vi.unstubAllGlobals());

const saved = (input: StudyInput | null) => ({
  status: 200,
  body: {
    projectId: 'p1',
    input,
    options: null,
    updatedAt: '2025-01-02T00:00:00.000Z',
    updatedBy: { id: 'u1', name: 'Demo engineer' },
  },
});

async function mountWith(input: StudyInput | null, units: 'SI' | 'US' = 'SI') {
  stubApi({ 'GET /projects/p1/design': saved(input) });
  const w = mount(ProjectDesignSummary, {
    props: { projectId: 'p1', units },
    global: { stubs: { DesignDrawing: true } },
  });
  await vi.waitFor(() =>
    expect(
      w
        .find(
          '[data-test="summary-basin"], [data-test="summary-empty"], [data-test="summary-problem"]',
        )
        .exists(),
    ).toBe(true),
  );
  await flushPromises();
  return w;
}

describe('Design at a glance', () => {
  it('SI demo: the chosen basin, its floor and size as the engine gives them', async () => {
    const r = runStudy(fenwickDesign);
    const d = r.design!.design;
    if (d.family !== 'jump-basin') throw new Error('the demo designs a jump basin');
    const w = await mountWith(fenwickDesign);
    expect(w.find('[data-test="summary-basin"]').text()).toBe(d.name);
    expect(w.find('[data-test="summary-floor"]').text()).toBe(`${d.floorElevation.toFixed(2)} m`);
    expect(w.find('[data-test="summary-size"]').text()).toBe(
      `${d.length.toFixed(2)} m × ${d.width.toFixed(2)} m`,
    );
    expect(w.text()).toContain('Concept level only.');
    w.unmount();
  });

  it('US demo: figures in ft (1 ft = 0.3048 m exactly, NIST SP 811)', async () => {
    const r = runStudy(toSI(caldwellDesign));
    const d = r.design!.design;
    if (d.family !== 'jump-basin') throw new Error('the US demo designs a jump basin');
    const w = await mountWith(caldwellDesign, 'US');
    expect(w.find('[data-test="summary-floor"]').text()).toBe(
      `${(d.floorElevation / 0.3048).toFixed(2)} ft`,
    );
    w.unmount();
  });

  it('no saved design, and a design the engine refuses, each say so', async () => {
    const empty = await mountWith(null);
    expect(empty.find('[data-test="summary-empty"]').text()).toContain('No design saved yet');
    empty.unmount();
    // a toe at 3 m and 1 m/s is subcritical: no jump forms (Fr1 = 1/√(9.81·3) ≈ 0.18 < 1)
    const refused = await mountWith({
      ...fenwickDesign,
      inflow: { kind: 'known', toe: { y1: 3, v1: 1 } },
    });
    expect(refused.find('[data-test="summary-problem"]').text()).toContain('not supercritical');
    refused.unmount();
  });
});

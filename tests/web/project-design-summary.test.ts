// The project page's "Design at a glance": the result the server stored on save, its figures
// the same as the workspace's, in the project's units, and nothing computed in the browser; a
// project without a saved design, or whose stored result an earlier engine computed (or none was
// kept), says so and offers to open the design to recompute.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { ENGINE_VERSION, runStudy, toSI, type StudyInput } from '@basinwright/common';
import ProjectDesignSummary from '../../web/src/components/ProjectDesignSummary.vue';
import { caldwellDesign, fenwickDesign } from '../../seed/designs';
import { stubApi } from './fetch-stub';

afterEach(() => vi.unstubAllGlobals());

interface Stored {
  result?: unknown;
  engineVersion?: string | null;
}

/** The API's answer for a design saved with `input`; the stored result as the server computes it. */
const saved = (input: StudyInput | null, stored: Stored = {}) => ({
  status: 200,
  body: {
    projectId: 'p1',
    input,
    options: null,
    updatedAt: '2025-01-02T00:00:00.000Z',
    updatedBy: { id: 'u1', name: 'Demo engineer' },
    result:
      'result' in stored
        ? stored.result
        : input && JSON.parse(JSON.stringify(runStudy(toSI(input)))),
    engineVersion: 'engineVersion' in stored ? stored.engineVersion : input && ENGINE_VERSION,
    computedAt: input ? '2025-01-02T00:00:00.000Z' : null,
  },
});

async function mountWith(
  input: StudyInput | null,
  units: 'SI' | 'US' = 'SI',
  stored: Stored = {},
  canEdit = true,
) {
  const body = saved(input, stored);
  stubApi({ 'GET /projects/p1/design': body });
  const w = mount(ProjectDesignSummary, {
    props: { projectId: 'p1', units, canEdit },
    global: { stubs: { DesignDrawing: true, RouterLink: { template: '<a><slot /></a>' } } },
  });
  await vi.waitFor(() =>
    expect(
      w
        .find(
          '[data-test="summary-basin"], [data-test="summary-empty"], [data-test="summary-recompute"]',
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

  it('shows the stored figures, not figures computed in the browser', async () => {
    const body = saved(fenwickDesign);
    // a stored result that differs from what the engine would give: the page shows the stored one
    const result = structuredClone(body.body.result) as ReturnType<typeof runStudy>;
    const d = result.design!.design;
    if (d.family !== 'jump-basin') throw new Error('the demo designs a jump basin');
    d.floorElevation = 80.5;
    const w = await mountWith(fenwickDesign, 'SI', { result });
    expect(w.find('[data-test="summary-floor"]').text()).toBe('80.50 m');
    w.unmount();
  });

  it('no saved design says so', async () => {
    const empty = await mountWith(null);
    expect(empty.find('[data-test="summary-empty"]').text()).toContain('No design saved yet');
    empty.unmount();
  });

  it('a result from an earlier engine is not read: it says so and offers to open the design', async () => {
    const w = await mountWith(fenwickDesign, 'SI', {
      result: { an: 'older shape' },
      engineVersion: '0.9.0',
    });
    const note = w.find('[data-test="summary-recompute"]');
    expect(note.text()).toContain('computed by an earlier engine');
    expect(note.text()).toContain('engine version 0.9.0');
    expect(note.text()).toContain(`now at version ${ENGINE_VERSION}`);
    expect(w.find('[data-test="summary-open-design"]').text()).toBe('Open the design to recompute');
    expect(w.find('[data-test="summary-floor"]').exists()).toBe(false);
    w.unmount();
    // a design saved before results were kept, seen by a reader who cannot save
    const old = await mountWith(fenwickDesign, 'SI', { result: null, engineVersion: null }, false);
    expect(old.find('[data-test="summary-recompute"]').text()).toContain(
      'saved before its figures were kept',
    );
    expect(old.find('[data-test="summary-open-design"]').text()).toBe('View the design');
    old.unmount();
  });
});

// Result panels: the Jump check names the chosen basin's floor as the governing design value
// (the free-jump floor beside it as a reference), and the notes show each warning once.
import { describe, expect, it } from 'vitest';
import { mount } from '@vue/test-utils';
import { runStudy, type StudyResult } from '@basinwright/common';
import DesignJumpCheckStep from '../../web/src/components/DesignJumpCheckStep.vue';
import DesignResultNotes from '../../web/src/components/DesignResultNotes.vue';
import DesignSizingStep from '../../web/src/components/DesignSizingStep.vue';
import { governingFloor } from '../../web/src/composables/useStudy';
import { fenwickDesign } from '../../seed/designs';

// The assumptions panel needs the workspace's form around it: tested in design-assumptions.test.ts.
const stubs = { DesignRangeChart: true, DesignDiagramChart: true, DesignDrawing: true, DesignAssumptionsPanel: true };
// The demo study of product.md (invented scenario): a USBR Type II basin is recommended.
const result: StudyResult = runStudy(fenwickDesign);

describe('Jump check floor', () => {
  it('shows the chosen basin’s own floor as the design value and the free-jump floor as reference', () => {
    const d = result.design!.design;
    expect(d.family).toBe('jump-basin');
    const zf = d.family === 'jump-basin' ? d.floorElevation : NaN;
    // the two floors differ for this demo (the type's factor is not 1.0), so the panel must tell them apart
    expect(Math.abs(zf - result.floor.elevation)).toBeGreaterThan(0.005);
    const w = mount(DesignJumpCheckStep, { props: { result, units: 'SI' }, global: { stubs } });
    expect(w.find('[data-test="floor-elevation"]').text()).toBe(`${zf.toFixed(2)} m`);
    expect(w.find('[data-test="free-jump-floor"]').text()).toBe(`${result.floor.elevation.toFixed(2)} m`);
    expect(w.text()).toContain(`Design floor — ${d.name}`);
    expect(w.find('[data-test="floor-explained"]').text()).toMatch(/lower|higher/);
    expect(w.find('[data-test="depth-below-bed"]').text()).toBe(`${(fenwickDesign.channelBedElevation - zf).toFixed(2)} m`);
    w.unmount();
  });

  it('governingFloor reports the difference between the two floors', () => {
    const g = governingFloor(result)!;
    const d = result.design!.design;
    expect(g.basin).toBe(d.name);
    expect(g.difference).toBe(g.elevation! - result.floor.elevation);
    expect(governingFloor(null)).toBeNull();
  });
});

describe('warnings are shown once', () => {
  it('drops exact duplicates from the engine and does not repeat them under Sizing', () => {
    const line = 'Check the tailwater rating at low flows.';
    const dup: StudyResult = { ...result, warnings: [line, line, `${line} `], design: { ...result.design!, design: { ...result.design!.design, warnings: [line, 'Only under sizing.', 'Only under sizing.'] } } };
    const notes = mount(DesignResultNotes, { props: { result: dup, engineError: null, inputProblems: [], stale: false } });
    const items = notes.findAll('[data-test="engine-warnings"] li').map((li) => li.text());
    expect(items.filter((t) => t === line)).toHaveLength(1);
    expect(new Set(items).size).toBe(items.length);
    notes.unmount();
    const sizing = mount(DesignSizingStep, { props: { result: dup, units: 'SI' }, global: { stubs } });
    expect(sizing.findAll('[data-test="sizing-warnings"] li').map((li) => li.text())).toEqual(['Only under sizing.']);
    sizing.unmount();
  });
});

// Result panels: the Jump check names the chosen basin's floor as the governing design value
// (the free-jump floor beside it as a reference), and the notes show each warning once.
import { describe, expect, it } from 'vitest';
import { mount } from '@vue/test-utils';
import {
  runStudy,
  studyWarningText,
  type StudyResult,
  type StudyWarning,
} from '@basinwright/common';
import DesignJumpCheckStep from '../../web/src/components/DesignJumpCheckStep.vue';
import DesignResultNotes from '../../web/src/components/DesignResultNotes.vue';
import DesignSizingStep from '../../web/src/components/DesignSizingStep.vue';
import DesignResultSummary from '../../web/src/components/DesignResultSummary.vue';
import { governingFloor } from '../../web/src/composables/useStudy';
import { fenwickDesign } from '../../seed/designs';

// The assumptions panel needs the workspace's form around it: tested in design-assumptions.test.ts.
const stubs = {
  DesignRangeChart: true,
  DesignDiagramChart: true,
  DesignDrawing: true,
  DesignAssumptionsPanel: true,
};
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
    expect(w.find('[data-test="free-jump-floor"]').text()).toBe(
      `${result.floor.elevation.toFixed(2)} m`,
    );
    expect(w.text()).toContain(`Design floor — ${d.name}`);
    expect(w.find('[data-test="floor-explained"]').text()).toMatch(/lower|higher/);
    expect(w.find('[data-test="depth-below-bed"]').text()).toBe(
      `${(fenwickDesign.channelBedElevation - zf).toFixed(2)} m`,
    );
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

describe('warnings are shown once, under the floor they were found on', () => {
  it('groups the chosen basin’s warnings (its floor) before the study’s (free-jump floor), and drops duplicates', () => {
    const gate: StudyWarning = {
      code: 'gate-submerged',
      severity: 'warning',
      values: {},
      kinds: {},
    };
    const weak: StudyWarning = {
      code: 'weak-jump',
      severity: 'caution',
      values: { count: 2 },
      kinds: {},
    };
    const narrow: StudyWarning = {
      code: 'narrow-sill-teeth',
      severity: 'caution',
      values: {},
      kinds: {},
      at: { type: 'usbr-2' },
    };
    const line = studyWarningText(gate, 'SI');
    const onlyStudy = studyWarningText(weak, 'SI');
    const onlySizing = studyWarningText(narrow, 'SI');
    const d = result.design!.design;
    if (d.family !== 'jump-basin') throw new Error('jump basin expected');
    const dup: StudyResult = {
      ...result,
      warnings: [gate, gate, weak],
      design: {
        ...result.design!,
        design: { ...d, warnings: [gate, narrow, narrow] },
      },
    };
    const notes = mount(DesignResultNotes, {
      props: { result: dup, engineError: null, inputProblems: [], stale: false, units: 'SI' },
    });
    const all = notes.findAll('[data-test="engine-warnings"] li').map((li) => li.text());
    expect(all.filter((t) => t === line)).toHaveLength(1);
    expect(new Set(all).size).toBe(all.length);
    // the design's list comes first, headed by its basin and floor; a line in both stays with the design
    expect(notes.find('[data-test="warnings-design"]').text()).toBe(
      `${d.name}, on its floor at ${d.floorElevation.toFixed(2)} m`,
    );
    expect(notes.findAll('[data-test="warnings-design-list"] li').map((li) => li.text())).toEqual([
      line,
      onlySizing,
    ]);
    expect(notes.find('[data-test="warnings-study"]').text()).toBe(
      `The study, on the free-jump floor at ${result.floor.elevation.toFixed(2)} m (reference)`,
    );
    expect(notes.findAll('[data-test="warnings-study-list"] li').map((li) => li.text())).toEqual([
      onlyStudy,
    ]);
    expect(notes.find('[data-test="engine-warnings"]').text()).toContain(
      `Engine warnings (${all.length})`,
    );
    notes.unmount();
    // the Sizing step does not list them a second time
    const sizing = mount(DesignSizingStep, {
      props: { result: dup, units: 'SI' },
      global: { stubs },
    });
    expect(sizing.text()).not.toContain(onlySizing);
    sizing.unmount();
  });

  it('without a chosen design the study’s warnings stand alone, with no floor heading', () => {
    const sweep: StudyWarning = {
      code: 'sweep-out',
      severity: 'warning',
      values: { count: 3, Q: 100 * 0.3048 ** 3 }, // 100 cfs, exactly (1 ft = 0.3048 m, NIST SP 811)
      kinds: { Q: 'discharge' },
    };
    const props = {
      result: { ...result, design: null, warnings: [sweep] },
      engineError: null,
      inputProblems: [],
      stale: false,
    };
    const notes = mount(DesignResultNotes, { props });
    expect(notes.find('[data-test="warnings-study"]').exists()).toBe(false);
    expect(notes.findAll('[data-test="warnings-study-list"] li').map((li) => li.text())).toEqual([
      'Sweep-out: the tailwater is short of the required depth at 3 discharges, from 2.83 m³/s.',
    ]);
    notes.unmount();
    // the project's units phrase the same data: US customary quotes cfs
    const us = mount(DesignResultNotes, { props: { ...props, units: 'US' } });
    expect(us.find('[data-test="warnings-study-list"] li').text()).toContain('from 100 cfs.');
    us.unmount();
  });
});

describe('Live results name one floor and stay on it', () => {
  it('with a jump basin chosen: its floor, and the toe and jump on that floor', () => {
    const d = result.design!.design;
    if (d.family !== 'jump-basin') throw new Error('jump basin expected');
    const w = mount(DesignResultSummary, { props: { result, units: 'SI', pending: false } });
    expect(w.find('[data-test="summary-floor"]').text()).toBe(`${d.floorElevation.toFixed(2)} m`);
    // V1 = Q/(b·y1) and Fr1 = V1/√(g·y1) in the rectangular basin [Chow 1959, §1-9]; g = 9.80665 m/s² [NIST SP 330]
    const y1 = d.water.y1;
    const fr1 = d.water.Q / (d.width * y1) / Math.sqrt(9.80665 * y1);
    expect(w.find('[data-test="summary-y1"]').text()).toBe(`${y1.toFixed(3)} m`);
    expect(w.find('[data-test="summary-fr1"]').text()).toBe(fr1.toFixed(2));
    expect(w.find('[data-test="summary-tailwater"]').text()).toBe(
      `${(d.water.tailwaterElevation - d.floorElevation).toFixed(2)} m`,
    );
    // not the free-jump floor's toe, which differs here
    expect(Math.abs(y1 - result.designJump.jump.y1)).toBeGreaterThan(5e-4);
    w.unmount();
  });
  it('with a type that holds no jump chosen: the study’s jump, and the chosen type named beside the recommended one', () => {
    const res = runStudy({ ...fenwickDesign, dissipators: { chosenType: 'usbr-6' } });
    const w = mount(DesignResultSummary, { props: { result: res, units: 'SI', pending: false } });
    expect(w.find('[data-test="summary-y1"]').text()).toBe(
      `${res.designJump.jump.y1.toFixed(3)} m`,
    );
    expect(w.find('[data-test="summary-chosen"]').text()).toContain(res.design!.design.name);
    w.unmount();
  });
});

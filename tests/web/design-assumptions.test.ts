// The assumptions panel's logic: overrides of the dissipator defaults go into the study input
// (input.dissipators), change the sized result the way the published relation says, reset to
// the default, show in the user's units and reach the engine in SI exactly; out-of-bounds
// values are refused with the shared schema's message, never an exception.
import { describe, expect, it } from 'vitest';
import { nextTick } from 'vue';
import { mount } from '@vue/test-utils';
import {
  BASIN_DEFAULTS,
  toSI,
  type JumpBasinDesign,
  type StudyInput,
  type StudyResult,
} from '@basinwright/common';
import { caldwellDesign, fenwickDesign } from '../../seed/designs';
import { evaluateStudy } from '../../web/src/composables/studyInThread';
import {
  assumptionRows,
  designFormValues,
  overrideProblem,
  provideDesignForm,
  withOverride,
} from '../../web/src/composables/useDesign';
import DesignAssumptionsPanel from '../../web/src/components/DesignAssumptionsPanel.vue';
import { defineComponent, h, reactive, ref } from 'vue';
import { expectRel } from '../support/tolerance';

const FT = 0.3048; // m per ft, exact (NIST SP 811)

function run(input: StudyInput): StudyResult {
  const out = evaluateStudy(input);
  expect(out.inputProblems, out.inputProblems.join('; ')).toEqual([]);
  expect(out.failure).toBeNull();
  return out.result!;
}
function jump(r: StudyResult): JumpBasinDesign {
  const d = r.design?.design;
  if (d?.family !== 'jump-basin') throw new Error(`expected a jump basin, got ${d?.family}`);
  return d;
}
const typeII = (extra: StudyInput['dissipators'] = {}): StudyInput => ({
  ...fenwickDesign,
  dissipators: { chosenType: 'usbr-2', ...extra },
});

describe('an override changes the sizing as its relation says', () => {
  it('freeboard coefficient k: wall freeboard = k·(V1 + y2) in ft and ft/s [from memory: USBR, Design of Small Dams]', () => {
    const base = jump(run(typeII()));
    const k = 0.15;
    const changed = jump(
      run({
        ...typeII(),
        dissipators: withOverride(typeII().dissipators, 'freeboardCoefficient', k),
      }),
    );
    // The relation, worked here in its own units at every discharge; the walls take the largest.
    const expected = (kk: number, d: JumpBasinDesign) =>
      Math.max(...d.rows.map((r) => kk * (r.v1 / FT + r.y2 / FT))) * FT;
    expectRel(base.walls.freeboard, expected(0.1, base), 1e-9);
    expectRel(changed.walls.freeboard, expected(k, changed), 1e-9);
    expect(changed.walls.freeboard).toBeGreaterThan(base.walls.freeboard);
    // The floor and the jump do not depend on k: only the walls rise.
    expect(changed.floorElevation).toBe(base.floorElevation);
  });

  it('Type II dentated sill height = r·y2 at the design discharge [from memory: USBR EM-25, r = 0.2]', () => {
    const base = jump(run(typeII()));
    const changed = jump(run(typeII({ defaults: { type2SillHeightRatio: 0.25 } })));
    expectRel(base.endSill.height, 0.2 * base.sizing.y2, 1e-9);
    expectRel(changed.endSill.height, 0.25 * changed.sizing.y2, 1e-9);
  });

  it('reset restores the default and the result it gives', () => {
    const base = run(typeII());
    const over = withOverride(typeII().dissipators, 'type2SillHeightRatio', 0.3);
    expect(over.defaults).toEqual({ type2SillHeightRatio: 0.3 });
    const back = withOverride(over, 'type2SillHeightRatio', undefined);
    // The key is removed, not left undefined (the schema takes an override as a number).
    expect(back).toEqual({ chosenType: 'usbr-2' });
    const again = run({ ...fenwickDesign, dissipators: back });
    expect(jump(again).endSill.height).toBe(jump(base).endSill.height);
    const row = assumptionRows(back, 'SI', again.dissipators?.assumptions).find(
      (r) => r.key === 'type2SillHeightRatio',
    )!;
    expect(row.overridden).toBe(false);
    expect(row.value).toBe(0.2);
  });

  it('the flotation safety factor and least thickness are edited in the flotation case the engine uses', () => {
    const over = withOverride(
      withOverride(undefined, 'flotationSafetyFactor', 1.5),
      'minSlabThickness',
      0.6,
    );
    expect(over).toEqual({ flotation: { safetyFactor: 1.5, minThickness: 0.6 } });
    const d = jump(run(typeII(over)));
    expect(d.slab.safetyFactorRequired).toBe(1.5);
    expect(d.slab.thickness).toBeGreaterThanOrEqual(0.6);
    const rows = assumptionRows(over, 'SI', null);
    expect(rows.find((r) => r.key === 'flotationSafetyFactor')).toMatchObject({
      value: 1.5,
      overridden: true,
      path: 'dissipators.flotation.safetyFactor',
    });
  });
});

describe('units: shown in the user’s, sent to the engine in SI exactly', () => {
  it('a US override of a length and a velocity converts by 0.3048 m/ft exactly (NIST SP 811)', () => {
    let dis = withOverride(caldwellDesign.dissipators, 'riprapMinThickness', 2); // ft
    dis = withOverride(dis, 'type3VelocityWarn', 40); // ft/s
    const input: StudyInput = { ...caldwellDesign, dissipators: dis };
    const si = toSI(input).dissipators!.defaults!;
    expect(si.riprapMinThickness).toBe(2 * FT);
    expect(si.type3VelocityWarn).toBe(40 * FT);
    const result = run(input);
    const used = result.dissipators!.assumptions.find((a) => a.key === 'riprapMinThickness')!;
    expect(used.value).toBe(2 * FT);
    expect(used.overridden).toBe(true);
    const rows = assumptionRows(dis, 'US', result.dissipators?.assumptions);
    const t = rows.find((r) => r.key === 'riprapMinThickness')!;
    expect(t).toMatchObject({ unit: 'ft', value: 2, overridden: true });
    // The 0.3 m default shown in ft: 0.3 / 0.3048 = 0.984251968… ft.
    expectRel(t.defaultValue, 0.3 / FT, 1e-9);
    const v = rows.find((r) => r.key === 'type3VelocityWarn')!;
    expect(v).toMatchObject({ unit: 'ft/s', value: 40 });
    // The published default as published: 50 ft/s [src: EM-25], not 49.2126 ft/s.
    expect(v.defaultValue).toBe(50);
    // Untouched, the limits read exactly as published: 400 cfs [src: HEC-14], 500 ft²/s
    // [from memory: EM-25]; in SI the exact conversions (400 × 0.3048³, NIST SP 811).
    const kept = assumptionRows(caldwellDesign.dissipators, 'US', result.dissipators?.assumptions);
    expect(kept.find((r) => r.key === 'type6MaxDischarge')).toMatchObject({
      value: 400,
      unit: 'cfs',
    });
    expect(kept.find((r) => r.key === 'type2MaxUnitDischarge')).toMatchObject({ value: 500 });
    const siRows = assumptionRows(undefined, 'SI', null);
    expectRel(siRows.find((r) => r.key === 'type6MaxDischarge')!.value, 400 * FT ** 3, 1e-9);
    expect(rows.find((r) => r.key === 'concreteUnitWeight')!.unit).toBe('lb/ft³');
    expect(rows.find((r) => r.key === 'freeboardCoefficient')!.unit).toBe('');
  });

  it('a culvert size and uplift level typed in ft reach the engine in metres', () => {
    // The demo culvert with its outlet set down at the channel bed (a perched outlet with a
    // culvert size stops the whole screening: see the engine note in the report).
    const inflow =
      caldwellDesign.inflow.kind === 'pipe'
        ? { ...caldwellDesign.inflow, invertElevation: 308 }
        : caldwellDesign.inflow;
    const input: StudyInput = {
      ...caldwellDesign,
      inflow,
      dissipators: {
        culvert: { shape: 'box', rise: 6, span: 6 },
        debris: 'heavy',
        flotation: { upliftElevation: 312, minThickness: 1.5 },
      },
    };
    const result = run(input);
    expect(result.dissipators!.context.culvert).toEqual({
      shape: 'box',
      rise: 6 * FT,
      span: 6 * FT,
    });
    expect(result.dissipators!.context.debris).toBe('heavy');
    const slab = result.design?.design.family === 'jump-basin' ? result.design.design.slab : null;
    expect(slab?.thickness).toBeGreaterThanOrEqual(1.5 * FT - 1e-12);
  });
});

describe('out-of-bounds values', () => {
  it('are refused with the shared schema’s message, and the study reports it instead of throwing', () => {
    expect(overrideProblem('freeboardCoefficient', -0.1)).toMatch(
      /Freeboard = k·\(V1 \+ y2\).*must be a number not below zero/,
    );
    expect(overrideProblem('flotationSafetyFactor', 0.8)).toBe(
      'The flotation safety factor must be at least 1.',
    );
    expect(overrideProblem('minSlabThickness', 0)).toBe(
      'The least slab thickness must be greater than zero.',
    );
    expect(overrideProblem('freeboardCoefficient', 0.12)).toBeNull();
    const out = evaluateStudy(typeII({ defaults: { freeboardCoefficient: -0.1 } }));
    expect(out.result).toBeNull();
    expect(out.inputProblems.join(' ')).toMatch(/must be a number not below zero/);
  });
});

describe('the chosen type lives in input.dissipators', () => {
  it('an older design’s options.chosenType is read into the input; the input’s own wins', () => {
    expect(designFormValues(fenwickDesign, { chosenType: 'saf' }, 'SI').dissipators).toEqual({
      chosenType: 'saf',
    });
    const own = { ...fenwickDesign, dissipators: { chosenType: 'usbr-1' as const } };
    expect(designFormValues(own, { chosenType: 'saf' }, 'SI').dissipators?.chosenType).toBe(
      'usbr-1',
    );
    expect(run(designFormValues(fenwickDesign, { chosenType: 'saf' }, 'SI')).design?.type).toBe(
      'saf',
    );
  });
});

describe('DesignAssumptionsPanel', () => {
  function mountPanel(values: StudyInput, result: StudyResult | null) {
    const form = reactive({ values: structuredClone(values) as StudyInput });
    const errors = ref<Record<string, string | undefined>>({});
    const Host = defineComponent({
      setup() {
        provideDesignForm({
          values: form.values,
          errors,
          setFieldValue: (path, value) => {
            if (path !== 'dissipators') throw new Error(`unexpected path ${path}`);
            form.values.dissipators = value as StudyInput['dissipators'];
          },
          readOnly: ref(false),
          units: ref(values.units),
        });
        return () => h(DesignAssumptionsPanel, { result, units: values.units });
      },
    });
    const wrapper = mount(Host);
    return { wrapper, form };
  }

  // One mount for both checks: the table of every default is the costly part of these tests.
  it('lists every default with its confidence in words, flags and resets an override, and shows the message of an out-of-bounds value on its field', async () => {
    const input = typeII({ defaults: { freeboardCoefficient: 0.15 } });
    const { wrapper, form } = mountPanel(input, run(input));
    // The panel's parts draw in tasks of their own after a frame (AppDeferred).
    while (!wrapper.find('[data-test="assumptions-table"]').exists())
      await new Promise((resolve) => requestAnimationFrame(resolve));
    const rows = wrapper.findAll('[data-test="assumptions-table"] tbody tr.assumption-row');
    expect(rows.length).toBe(Object.keys(BASIN_DEFAULTS).length);
    const text = wrapper.text();
    for (const tag of ['Published', 'From memory — verify', 'Computed', 'Common practice'])
      expect(text).toContain(tag);
    expect(wrapper.find('[data-test="assumptions-changed-count"]').text()).toBe('1 changed');
    await wrapper.find('[data-test="assumption-reset-freeboardCoefficient"]').trigger('click');
    await nextTick();
    expect(form.values.dissipators).toEqual({ chosenType: 'usbr-2' });
    expect(wrapper.find('[data-test="assumption-reset-freeboardCoefficient"]').exists()).toBe(
      false,
    );

    form.values.dissipators = typeII({ defaults: { type2SillHeightRatio: -1 } }).dissipators;
    await nextTick();
    const box = wrapper.find('[data-test="assumption-type2SillHeightRatio"]');
    const cell = box.element.closest('.assumption-cell')!;
    expect(cell.textContent).toMatch(
      /Type II dentated sill height \/ y2 must be a number not below zero/,
    );
    // The message is tied to its box for a screen reader.
    expect(box.attributes('aria-invalid')).toBe('true');
    expect(cell.querySelector(`#${box.attributes('aria-describedby')}`)?.textContent).toMatch(
      /must be a number not below zero/,
    );

    // What is not a number yet stays in its box with a message, and the form keeps its value.
    const before = JSON.parse(JSON.stringify(form.values.dissipators)) as unknown;
    await box.setValue('0.1.2');
    expect((box.element as HTMLInputElement).value).toBe('0.1.2');
    expect(cell.textContent).toMatch(/Type a number/);
    expect(form.values.dissipators).toEqual(before);
    // A number goes to the form at once.
    await box.setValue('0.25');
    expect(form.values.dissipators?.defaults?.type2SillHeightRatio).toBe(0.25);
    expect(cell.textContent).not.toMatch(/Type a number/);
  });

  it('with nothing changed the table is folded, its summary counting what it holds; opening it makes the rows', async () => {
    const input = typeII();
    const { wrapper } = mountPanel(input, run(input));
    while (!wrapper.find('[data-test="assumptions-table-summary"]').exists())
      await new Promise((resolve) => requestAnimationFrame(resolve));
    const all = Object.keys(BASIN_DEFAULTS).length;
    expect(wrapper.find('[data-test="assumptions-table-summary"]').text()).toMatch(
      new RegExp(`${all} values, \\d+ from memory — verify`),
    );
    expect(wrapper.find('[data-test="assumptions-table"]').exists()).toBe(false);
    const details = wrapper.find<HTMLDetailsElement>('[data-test="assumptions-table-panel"]');
    details.element.open = true;
    await details.trigger('toggle');
    expect(wrapper.findAll('[data-test="assumptions-table"] tbody tr.assumption-row')).toHaveLength(
      all,
    );
    wrapper.unmount();
  });
});

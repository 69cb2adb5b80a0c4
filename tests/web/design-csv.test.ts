// The tailwater rating from a CSV file: good files become rows, a bad row names its row number,
// and nothing of a bad file reaches the form.
import { describe, expect, it } from 'vitest';
import { defineComponent, h, reactive, ref } from 'vue';
import { mount } from '@vue/test-utils';
import type { StudyInput } from '@basinwright/common';
import DesignRatingTable from '../../web/src/components/DesignRatingTable.vue';
import { provideDesignForm } from '../../web/src/composables/useDesign';
import { parseTailwaterCsv } from '../../web/src/composables/csvTable';

describe('parseTailwaterCsv', () => {
  it('reads a file with a header row', () => {
    const out = parseTailwaterCsv('Q,elevation\n5,90.46\n45,91.80\n85,92.37\n', 'SI');
    expect(out).toEqual({
      ok: true,
      rows: [
        { Q: 5, elevation: 90.46 },
        { Q: 45, elevation: 91.8 },
        { Q: 85, elevation: 92.37 },
      ],
    });
  });

  it('reads a file without a header, with semicolons and blank lines', () => {
    const out = parseTailwaterCsv('150;296.5\n\n1500;301.2\n', 'US');
    expect(out).toEqual({
      ok: true,
      rows: [
        { Q: 150, elevation: 296.5 },
        { Q: 1500, elevation: 301.2 },
      ],
    });
  });

  it('names every bad row by its line in the file and returns no rows', () => {
    const text = ['Q,elevation', '5,90.46', '10,abc', '-3,90.9', '45', '3,91.7', '85,92.37'].join(
      '\n',
    );
    const out = parseTailwaterCsv(text, 'SI');
    expect(out.ok).toBe(false);
    if (out.ok) return;
    expect(out.errors).toEqual([
      'Row 3: Tailwater elevation (m) “abc” is not a number.',
      'Row 4: Q (m³/s) must be greater than zero (got -3).',
      'Row 5: expected 2 values (Q (m³/s), Tailwater elevation (m)), found 1.',
      'Row 6: Q (m³/s) 3 does not increase from the row before (5).',
    ]);
    expect('rows' in out).toBe(false);
  });

  it('uses the US units in its messages for a US project', () => {
    const out = parseTailwaterCsv('Q,stage\n100,x\n', 'US');
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.errors[0]).toBe('Row 2: Tailwater elevation (ft) “x” is not a number.');
  });

  it('refuses an empty file and a single row', () => {
    expect(parseTailwaterCsv('', 'SI')).toEqual({ ok: false, errors: ['The file holds no rows.'] });
    expect(parseTailwaterCsv('5,90', 'SI')).toEqual({
      ok: false,
      errors: ['A rating table needs at least two rows of numbers.'],
    });
  });
});

describe('DesignRatingTable CSV upload', () => {
  function mountTable() {
    const values = reactive({
      units: 'SI',
      tailwater: {
        kind: 'table',
        rows: [
          { Q: 5, elevation: 90.5 },
          { Q: 85, elevation: 92.4 },
        ],
      },
    }) as unknown as StudyInput;
    const Host = defineComponent({
      setup() {
        provideDesignForm({
          values,
          errors: ref({}),
          setFieldValue: (path, value) => {
            if (path !== 'tailwater.rows') throw new Error(`unexpected path ${path}`);
            (values.tailwater as { rows: unknown }).rows = value;
          },
          readOnly: ref(false),
          units: ref('SI'),
        });
        return () =>
          h(DesignRatingTable, {
            path: 'tailwater.rows',
            caption: 'Tailwater rating',
            increasing: 'Q',
            columns: [
              { key: 'Q', label: 'Q', kind: 'discharge', positive: true },
              { key: 'elevation', label: 'Tailwater elevation', kind: 'length' },
            ],
          });
      },
    });
    return { wrapper: mount(Host, { attachTo: document.body }), values };
  }

  it('applies nothing from a file with a bad row and lists the row numbers', async () => {
    const { wrapper, values } = mountTable();
    const table = wrapper.findComponent(DesignRatingTable);
    (table.vm as unknown as { applyCsv: (t: string, n: string) => void }).applyCsv(
      'Q,z\n10,91\n20,oops\n',
      'rating.csv',
    );
    await wrapper.vm.$nextTick();
    expect(values.tailwater).toEqual({
      kind: 'table',
      rows: [
        { Q: 5, elevation: 90.5 },
        { Q: 85, elevation: 92.4 },
      ],
    });
    const alert = wrapper.find('[data-test="csv-errors"]');
    expect(alert.text()).toContain('Row 3: Tailwater elevation (m) “oops” is not a number.');
    expect(alert.text()).toContain('Nothing from rating.csv was applied');
    wrapper.unmount();
  });

  it('replaces the rows with a good file', async () => {
    const { wrapper, values } = mountTable();
    const table = wrapper.findComponent(DesignRatingTable);
    (table.vm as unknown as { applyCsv: (t: string, n: string) => void }).applyCsv(
      '10,91\n20,91.5\n40,92\n',
      'rating.csv',
    );
    await wrapper.vm.$nextTick();
    expect(values.tailwater).toEqual({
      kind: 'table',
      rows: [
        { Q: 10, elevation: 91 },
        { Q: 20, elevation: 91.5 },
        { Q: 40, elevation: 92 },
      ],
    });
    expect(wrapper.find('[data-test="csv-errors"]').exists()).toBe(false);
    expect(wrapper.findAll('tbody tr')).toHaveLength(3);
    wrapper.unmount();
  });
});

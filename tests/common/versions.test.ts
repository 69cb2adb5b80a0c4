import { describe, expect, it } from 'vitest';
import {
  compareInputs,
  compareVersions,
  designStatusOf,
  figuresOf,
  runStudy,
  toSI,
  type VersionFigures,
} from '@basinwright/common';
import { fenwickDesign } from '../../seed/designs';

// Issued versions: the key figures read from a stored result, the design's status, and the
// comparison of two versions. These are facts of the data, not computed quantities: the figures
// are the chosen design's own fields, and a comparison lists exactly the values that differ.

describe('figuresOf', () => {
  it("reads the chosen design's type, floor, length and concrete; no estimate means not priced", () => {
    const result = runStudy(toSI(fenwickDesign));
    const entry = result.design;
    expect(entry).not.toBeNull();
    const f = figuresOf(result);
    expect(f.type).toBe(entry!.type);
    expect(f.typeName).toBe(entry!.design.name);
    expect(f.length).toBe(entry!.design.length);
    expect(f.concrete).toBe(entry!.design.concrete.total);
    const d = entry!.design;
    expect(f.floorElevation).toBe(
      d.family === 'jump-basin' || d.family === 'impact-basin' ? d.floorElevation : null,
    );
    expect(f.cost).toBeNull();
    expect(f.costStatus).toBe('not_priced');
  });
});

describe('designStatusOf', () => {
  it('is a draft until a version is sent, then follows the latest version', () => {
    expect(designStatusOf(null)).toBe('draft');
    expect(designStatusOf('not_sent')).toBe('draft');
    expect(designStatusOf('in_review')).toBe('in_review');
    expect(designStatusOf('approved')).toBe('approved');
    expect(designStatusOf('returned')).toBe('returned');
  });
});

describe('compareVersions', () => {
  const figures: VersionFigures = {
    floorElevation: 85.5,
    type: 'usbr-2',
    typeName: 'USBR Type II basin',
    length: 20,
    concrete: 400,
    cost: null,
    costStatus: 'not_priced',
  };

  it('lists exactly the inputs and figures that differ, nested paths and array items included', () => {
    const a = { input: fenwickDesign, options: null, figures };
    const b = {
      input: {
        ...fenwickDesign,
        basinWidth: 14,
        discharges: { kind: 'list' as const, values: [5, 40, 85] },
      },
      options: { chosenType: 'usbr-3' },
      figures: { ...figures, length: 22 },
    };
    const diff = compareVersions(a, b);
    const paths = diff.inputs.map((c) => c.path);
    expect(paths).toContain('basinWidth');
    expect(diff.inputs.find((c) => c.path === 'basinWidth')).toEqual({
      path: 'basinWidth',
      before: fenwickDesign.basinWidth,
      after: 14,
    });
    expect(paths).toContain('discharges.values.1');
    expect(paths).toContain('options.chosenType');
    expect(diff.figures).toEqual([{ field: 'length', before: 20, after: 22 }]);
    // the same version beside itself: nothing changed
    expect(compareVersions(a, a)).toEqual({ inputs: [], figures: [] });
  });

  it('a value present on one side only reads undefined on the other', () => {
    const changes = compareInputs(
      { input: { a: 1 }, options: null },
      { input: { a: 1, b: { c: 2 } }, options: null },
    );
    expect(changes).toEqual([{ path: 'b.c', before: undefined, after: 2 }]);
  });
});

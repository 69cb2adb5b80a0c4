// A perched culvert outlet (tailwater below the outlet invert), and the flotation case taking
// the place of its defaults. Expected values from the relations named beside them.
import { describe, expect, it } from 'vitest';
import { reasonText, runStudy, toSI, type StudyInput } from '@basinwright/common';
import { caldwellDesign, fenwickDesign } from '../../seed/designs';
import { expectRel } from '../support/tolerance';

const FT = 0.3048; // exact, by definition of the international foot

describe('perched culvert outlet (invented demo data, seed/designs.ts)', () => {
  const input = toSI({
    ...caldwellDesign,
    dissipators: { culvert: { shape: 'box', rise: 6, span: 6 } },
  } as StudyInput);
  const r = runStudy(input);

  it('the study still screens and designs (the apron does not wipe out the catalogue)', () => {
    expect(r.dissipators).not.toBeNull();
    expect(r.screening.length).toBeGreaterThan(5);
    expect(r.design).not.toBeNull();
  });

  it('tailwater below the invert counts as a free outfall: HEC-14 eq. 10.4 held at TW = 0.4·D', () => {
    const apron = r.screening.find((s) => s.type === 'riprap-apron');
    const tw = apron?.criteria.find((c) => c.criterion === 'tailwater');
    expect(tw?.status).toBe('warn');
    expect(tw?.code).toBe('apron-tailwater-perched');
    expect(reasonText(tw!, 'US')).toMatch(/below the outlet invert/);
    // D50 = 0.2·D·(q/(√g·D^1.5))^(4/3)·(D/TW) for a box, q = Q/span [HEC-14 eq. 10.4; box form from memory]
    const stone = apron?.criteria.find((c) => c.criterion === 'stoneSize');
    const D = 6 * FT;
    const Q = stone?.atQ ?? NaN; // the first discharge where the stone is too large (SI)
    const q = Q / (6 * FT);
    const expected =
      0.2 * D * Math.pow(q / (Math.sqrt(9.80665) * D ** 1.5), 4 / 3) * (D / (0.4 * D));
    expect(stone?.kinds.d50).toBe('length');
    expectRel(stone?.values.d50 ?? NaN, expected, 1e-9); // SI, as computed
  });
});

describe('the flotation case stands in for its defaults in the list of assumptions', () => {
  it('safety factor and least slab thickness are listed as given', () => {
    const input: StudyInput = {
      ...fenwickDesign,
      discharges: { kind: 'range', min: 5, max: 85, count: 5 },
      dissipators: { flotation: { safetyFactor: 1.5, minThickness: 0.6 } },
    };
    const r = runStudy(input);
    const a = r.dissipators?.assumptions ?? [];
    expect(a.find((x) => x.key === 'flotationSafetyFactor')?.value).toBe(1.5);
    expect(a.find((x) => x.key === 'minSlabThickness')?.value).toBe(0.6);
    expect(a.find((x) => x.key === 'flotationSafetyFactor')?.overridden).toBe(true);
  });
});

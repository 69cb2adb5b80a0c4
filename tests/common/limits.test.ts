// Engine limits (ENGINE_LIMITS, common/src/schemas/limits.ts): kept once, read by the schema
// and the engine, and the block-row fit that no longer grows without bound.
import { describe, expect, it } from 'vitest';
import {
  studyWarningText,
  ENGINE_LIMITS,
  fitBlockRow,
  runStudy,
  studyInputSchema,
  studySizes,
  type StudyInput,
} from '@basinwright/common';
import { fenwickDesign } from '../../seed/designs';
import { expectRel } from '../support/tolerance';

const FT = 0.3048; // m per ft, exact [NIST SP 811]

describe('fitBlockRow: the published spacing rule, in constant memory', () => {
  // The rule [USBR EM-25 (Peterka 1958), as hydraulics.md §4 gives it for Type II chute
  // blocks: h = w = s = y1, "half space at the walls"; blocks across a width are a whole
  // number, spaced at least s, the as-built count and spacing reported]. Written out here
  // apart from the engine: n = ⌊W/(w + s)⌋, s′ = W/n − w, wall space s′/2, and then
  // n·w + (n − 1)·s′ + 2·(s′/2) = W.
  it.each([
    // W, w = s (m): demo-like and awkward widths
    [12, 0.5],
    [10, 0.6],
    [7.3, 0.41],
    [40, 0.01],
  ])('W %f m, w = s = %f m', (W, w) => {
    const row = fitBlockRow(W, w, w);
    const n = Math.floor(W / (2 * w) + 1e-9);
    const spacing = W / n - w;
    expect(row.count).toBe(n);
    expectRel(row.spacing, spacing, 1e-12);
    expect(row.spacing).toBeGreaterThanOrEqual(w - 1e-12); // at least the rule's spacing
    expectRel(row.wallSpace, spacing / 2, 1e-12); // half a space at each wall
    expectRel(n * w + (n - 1) * row.spacing + 2 * row.wallSpace, W, 1e-12);
    expect(row.centres).toHaveLength(n);
    expectRel(row.centres[0]! + W / 2, spacing / 2 + w / 2, 1e-9);
  });

  it('W 12, w = s = 0.5 → 12 blocks at 0.5 m, 0.25 m from each wall [rule above, by hand]', () => {
    const row = fitBlockRow(12, 0.5, 0.5);
    expect(row.count).toBe(12);
    expectRel(row.spacing, 0.5, 1e-12);
    expectRel(row.wallSpace, 0.25, 1e-12);
  });

  it(`a row of more than ${ENGINE_LIMITS.maxBlocksPerRow} blocks is refused, naming the basin width, before any block is listed`, () => {
    // 10,000 m of 1 mm blocks would be 5·10⁶ centres: the call that used to stop the process
    expect(() => fitBlockRow(10_000, 0.001, 0.001)).toThrow(RangeError);
    expect(() => fitBlockRow(10_000, 0.001, 0.001)).toThrow(/^basinWidth: a row of 5000000 blocks/);
    // exactly at the limit: 40 m / (0.01 + 0.01) m = 2,000 blocks — still built
    expect(fitBlockRow(40, 0.01, 0.01).count).toBe(ENGINE_LIMITS.maxBlocksPerRow);
    expect(() => fitBlockRow(40.1, 0.01, 0.01)).toThrow(/basinWidth/);
  });
});

describe('the study bounds in the engine (direct callers, SI)', () => {
  it('runStudy refuses the basin width of the request that stopped the API, naming it', () => {
    expect(() => runStudy({ ...fenwickDesign, basinWidth: 10_000 })).toThrow(
      /^basinWidth must not exceed 300 m/,
    );
  });

  it('a wide basin inside the limit is studied; a type whose rows would outgrow the limit is "not sized", naming the basin width', () => {
    const r = runStudy({ ...fenwickDesign, basinWidth: 200 });
    expect(r.rows.length).toBeGreaterThan(0);
    const notes = r.dissipators?.notes ?? [];
    const said = notes
      .filter((n) => n.code === 'type-not-designed')
      .map((n) => studyWarningText(n));
    // the cause is coded (too-many-blocks) and phrased naming the basin width and the limit
    expect(
      notes.some((n) => n.cause?.code === 'too-many-blocks' && n.cause.field === 'basinWidth'),
    ).toBe(true);
    expect(
      said.some((n) =>
        /the basin width would need [\d,]+ blocks, more than the [\d,]+ allowed/i.test(n),
      ),
    ).toBe(true);
  });

  it('runStudy refuses more discharges than the limit, naming the field', () => {
    const input: StudyInput = {
      ...fenwickDesign,
      discharges: { kind: 'range', min: 5, max: 85, count: ENGINE_LIMITS.maxDischarges + 1 },
    };
    expect(() => runStudy(input)).toThrow(/^discharges\.count/);
  });

  it('studySizes names the size nearest its limit first', () => {
    const [top] = studySizes({
      ...fenwickDesign,
      discharges: { kind: 'range', min: 5, max: 85, count: 4000 },
    });
    expect(top).toMatchObject({ field: 'discharges.count', value: 4000 });
    expectRel(top!.share, 0.8, 1e-12);
  });
});

describe('one set of limits for the schema and the engine', () => {
  it('the US limits never exceed the SI ones converted, so the engine never refuses what the schema let through', () => {
    expect(ENGINE_LIMITS.maxBasinWidth.US * FT).toBeLessThanOrEqual(ENGINE_LIMITS.maxBasinWidth.SI);
    // Q = C·L·H^1.5: C in ft^0.5/s × √0.3048 = C in m^0.5/s [dimensional analysis]
    const { SI, US } = ENGINE_LIMITS.weirCoefficient;
    expect(US.min * Math.sqrt(FT)).toBeGreaterThanOrEqual(SI.min);
    expect(US.max * Math.sqrt(FT)).toBeLessThanOrEqual(SI.max);
  });

  it('the schema and the engine refuse a contraction coefficient below the same bound', () => {
    const gate = (Cc: number): StudyInput => ({
      ...fenwickDesign,
      inflow: { kind: 'gate', Cc, opening: 0.6 },
    });
    const below = ENGINE_LIMITS.contractionCoefficient.min - 0.01;
    expect(() => studyInputSchema.validateSync(gate(below))).toThrow(/Cc must be at least 0.5/);
    expect(() => runStudy(gate(below))).toThrow(/^inflow\.Cc must lie between 0\.5 and 1/);
  });

  it("the schema and the engine refuse the same Manning's n for the basin floor", () => {
    const input = { ...fenwickDesign, floorManningN: ENGINE_LIMITS.manningN.max * 1.5 };
    expect(() => studyInputSchema.validateSync(input)).toThrow(/must not exceed 0.2/);
    expect(() => runStudy(input)).toThrow(/^floorManningN must lie between 0\.005 and 0\.2/);
  });
});

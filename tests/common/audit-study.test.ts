// Audit of runStudy, the units edges (toSI / fromSI) and the study schema: SI and US input give
// the same SI result; a US study's dissipator designs round-trip; words in the user's units;
// no code identifiers or repeated cautions in what the user reads. Factors: 1 ft = 0.3048 m,
// 1 cfs = 0.028316846592 m³/s, 1 yd³ = 0.764554858 m³ [standard: NIST SP 811].
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  fromSI,
  inputFromSI,
  resultToSI,
  runStudy,
  studyInputSchema,
  studyWarningText,
  studyCautions,
  reasonText,
  screeningSummaryText,
  toSI,
  type StudyInput,
  type StudyResult,
  type UnitSystem,
} from '@basinwright/common';
import { expectRel } from '../support/tolerance';
import { fenwickDesign } from '../../seed/designs';

const FT = 0.3048;
const CFS = FT ** 3;

// The invented demo of product.md (Fenwick Mill Pond), SI.
function demo(over: Partial<StudyInput> = {}): StudyInput {
  return { ...fenwickDesign, discharges: { kind: 'range', min: 5, max: 85, count: 5 }, ...over };
}
/** The same study typed in US customary units. */
function inUS(si: StudyInput): StudyInput {
  if (
    si.inflow.kind !== 'chute' ||
    si.inflow.headwater.kind !== 'weir' ||
    si.tailwater.kind !== 'manning' ||
    si.tailwater.section.shape !== 'trapezoidal' ||
    si.discharges.kind !== 'range'
  )
    throw new Error('demo shape');
  return {
    ...si,
    units: 'US',
    channelBedElevation: si.channelBedElevation / FT,
    basinWidth: si.basinWidth / FT,
    designDischarge: si.designDischarge / CFS,
    discharges: { ...si.discharges, min: si.discharges.min / CFS, max: si.discharges.max / CFS },
    tailwater: {
      ...si.tailwater,
      section: { ...si.tailwater.section, bottomWidth: si.tailwater.section.bottomWidth / FT },
    },
    inflow: {
      ...si.inflow,
      crestElevation: si.inflow.crestElevation / FT,
      headwater: {
        kind: 'weir',
        C: si.inflow.headwater.C / Math.sqrt(FT),
        L: si.inflow.headwater.L / FT,
      },
    },
    ...(si.dissipators
      ? { dissipators: inputFromSI({ ...si, dissipators: si.dissipators }, 'US').dissipators! }
      : {}),
  };
}

/** Every number of two results, compared; strings (wording) may differ by design. */
function sameNumbers(a: unknown, b: unknown, rel: number, abs: number, path = ''): number {
  if (typeof a === 'number') {
    expect(typeof b, path).toBe('number');
    expect(
      Math.abs(a - (b as number)) <= Math.max(rel * Math.abs(a), abs),
      `${path}: ${a} vs ${String(b)}`,
    ).toBe(true);
    return 1;
  }
  if (Array.isArray(a)) {
    expect(Array.isArray(b) && b.length === a.length, path).toBe(true);
    return a.reduce(
      (n: number, x, i) => n + sameNumbers(x, (b as unknown[])[i], rel, abs, `${path}[${i}]`),
      0,
    );
  }
  if (a !== null && typeof a === 'object') {
    let n = 0;
    for (const [k, v] of Object.entries(a))
      n += sameNumbers(v, (b as Record<string, unknown>)[k], rel, abs, `${path}.${k}`);
    return n;
  }
  return 0;
}
const texts = (r: StudyResult, units: UnitSystem): string[] => [
  ...r.warnings.map((w) => studyWarningText(w, units)),
  ...(r.dissipators?.notes ?? []).map((w) => studyWarningText(w, units)),
  ...r.screening.flatMap((s) => [
    screeningSummaryText(s, r.screening, units),
    ...s.criteria.map((c) => reasonText(c, units)),
    ...s.perDischarge.flatMap((p) => p.criteria.map((c) => reasonText(c, units))),
  ]),
  ...[r.design, ...r.alternatives].flatMap((e) =>
    e ? e.design.warnings.map((w) => studyWarningText(w, units)) : [],
  ),
];

describe('runStudy: SI and US input give the same SI result', () => {
  it('property: random width, discharge, crest and bed (1e-9 relative; 1e-7 m absolute for margins near zero)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 8, max: 20, noNaN: true }),
        fc.double({ min: 40, max: 120, noNaN: true }),
        fc.double({ min: 100, max: 106, noNaN: true }),
        (b, Q, crest) => {
          const si = demo({
            basinWidth: b,
            designDischarge: Q,
            discharges: { kind: 'range', min: 5, max: Q, count: 4 },
            inflow: {
              kind: 'chute',
              crestElevation: crest,
              headwater: { kind: 'weir', C: 2.15, L: 12 },
              lossModel: { kind: 'fraction', value: 0.1 },
            },
          });
          const a = runStudy(si);
          const c = runStudy(toSI(inUS(si)));
          const n = sameNumbers({ ...a, input: null }, { ...c, input: null }, 1e-9, 1e-7);
          expect(n).toBeGreaterThan(500);
        },
      ),
      { numRuns: 4 },
    );
  });
});

describe('fromSI: a US study reads in US units, designs included, and converts back', () => {
  const si = demo({
    dissipators: {
      chosenType: 'usbr-2',
      culvert: { shape: 'box', rise: 1.2, span: 2 },
      flotation: { upliftElevation: 89 },
    },
  });
  const r = runStudy(toSI(inUS(si)));
  const us = fromSI(r, 'US');
  it('input options: culvert rise and uplift elevation travel through toSI / inputFromSI', () => {
    const back = toSI(inUS(si));
    expectRel(back.dissipators!.culvert!.rise, 1.2, 1e-12);
    expectRel(back.dissipators!.flotation!.upliftElevation!, 89, 1e-12);
    expectRel(inputFromSI(back, 'US').dissipators!.culvert!.span!, 2 / FT, 1e-12);
  });
  it('design fields: walls, slab, riprap D50, blocks, sill, water; concrete in yd³; slab loads in lbf/ft', () => {
    const d = r.design!.design;
    const u = us.design!.design;
    if (d.family !== 'jump-basin' || u.family !== 'jump-basin')
      throw new Error('jump basin expected');
    expectRel(u.walls.height, d.walls.height / FT, 1e-12);
    expectRel(u.walls.thickness, d.walls.thickness / FT, 1e-12);
    expectRel(u.walls.freeboard, d.walls.freeboard / FT, 1e-12);
    expectRel(u.slab.thickness, d.slab.thickness / FT, 1e-12);
    expectRel(u.riprap.d50, d.riprap.d50 / FT, 1e-12);
    expectRel(u.riprap.thickness, d.riprap.thickness / FT, 1e-12);
    expectRel(u.chuteBlocks!.spacing, d.chuteBlocks!.spacing / FT, 1e-12);
    expectRel(u.endSill.topElevation, d.endSill.topElevation / FT, 1e-12);
    expectRel(u.sizing.requiredTailwaterDepth, d.sizing.requiredTailwaterDepth / FT, 1e-12);
    expectRel(u.water.jumpLength, d.water.jumpLength / FT, 1e-12);
    expectRel(u.designQ, d.designQ / CFS, 1e-12);
    expectRel(u.concrete.total, d.concrete.total / 0.764554858, 1e-9);
    expectRel(u.slab.resisting, (d.slab.resisting * 1000) / (4.4482216152605 / FT), 1e-9); // 1 lbf = 4.4482216152605 N
    expect(u.chuteBlocks!.count).toBe(d.chuteBlocks!.count);
    expect(u.sizing.fr1).toBe(d.sizing.fr1);
  });
  it('assumptions carry their US value and label (Type III q limit 200 ft²/s as published [from memory: EM-25])', () => {
    const a = us.dissipators!.assumptions.find((x) => x.key === 'type3MaxUnitDischarge')!;
    expect(a.value).toBe(200);
    expect(a.unit).toBe('ft²/s');
  });
  it('the drawing stays SI (converted by its formatter when drawn); resultToSI undoes fromSI', () => {
    expect(us.design!.drawing).toEqual(r.design!.drawing);
    sameNumbers(resultToSI(us, 'US'), r, 1e-12, 1e-12);
  });
});

describe('words in the user units', () => {
  const rUS = runStudy(toSI(inUS(demo())));
  const rSI = runStudy(demo());
  it('a US study quotes ft, ft/s and cfs, never m, m/s or m³/s, in warnings, reasons and summaries', () => {
    const all = texts(rUS, 'US').join('\n');
    expect(all).toMatch(/\d ft\b/);
    expect(all).toMatch(/\d ft\/s/);
    expect(all).toMatch(/\d cfs/);
    expect(all).not.toMatch(/\d m\/s|\d m³\/s|\d m²\/s|\d m\b/);
    expect(studyCautions('US').join(' ')).toMatch(/50 ft\/s/);
  });
  it('an SI study quotes SI; the same result phrased in US quotes US (the words are made at the edge)', () => {
    expect(texts(rSI, 'SI').join('\n')).toMatch(/\d m³\/s/);
    expect(texts(rSI, 'SI').join('\n')).not.toMatch(/\d cfs|ft\/s/);
    expect(texts(rSI, 'US').join('\n')).toMatch(/\d cfs/);
  });
  it('no code identifiers (camelCase words, type ids) in what the user reads; one cavitation caution per design', () => {
    for (const r of [rSI, rUS, runStudy(demo({ dissipators: { chosenType: 'usbr-3' } }))]) {
      for (const t of texts(r, r.input.displayUnits ?? 'SI')) {
        expect(t, t).not.toMatch(/\b[a-z]+[A-Z][A-Za-z]*\b/);
        expect(t, t).not.toMatch(/\busbr-\d\b|riprap-apron|flip-bucket|slotted-bucket/);
      }
      for (const e of [r.design, ...r.alternatives]) {
        if (!e) continue;
        const said = e.design.warnings.map((w) => studyWarningText(w));
        expect(said.filter((w) => /cavitat/i.test(w)).length, e.type).toBeLessThanOrEqual(1);
        expect(new Set(said).size).toBe(said.length);
      }
    }
  });
});

describe('runStudy refusals name the argument', () => {
  it.each([
    ['zero basin width', { basinWidth: 0 }, /basinWidth/],
    ['NaN design discharge', { designDischarge: Number.NaN }, /designDischarge/],
    ['Infinity bed', { channelBedElevation: Infinity }, /channelBedElevation/],
    ['negative discharges', { discharges: { kind: 'list', values: [-1] } }, /discharges/],
  ] as Array<[string, Partial<StudyInput>, RegExp]>)('%s', (_n, over, re) => {
    expect(() => runStudy(demo(over))).toThrow(RangeError);
    expect(() => runStudy(demo(over))).toThrow(re);
  });
});

describe('studyInputSchema', () => {
  const opts = { abortEarly: false, stripUnknown: true } as const;
  it('keeps the dissipator options (chosen type, overrides, culvert, flotation)', () => {
    const v = studyInputSchema.validateSync(
      demo({
        dissipators: {
          chosenType: 'saf',
          debris: 'light',
          defaults: { riprapLengthRatio: 6 },
          culvert: { shape: 'circular', rise: 1.2 },
          flotation: { safetyFactor: 1.5 },
          extraFloorDepth: 0.3,
        },
      }),
      opts,
    );
    expect(v.dissipators).toEqual({
      chosenType: 'saf',
      debris: 'light',
      defaults: { riprapLengthRatio: 6 },
      culvert: { shape: 'circular', rise: 1.2 },
      flotation: { safetyFactor: 1.5 },
      extraFloorDepth: 0.3,
    });
    expect(studyInputSchema.validateSync(demo(), opts).dissipators).toBeUndefined();
  });
  it.each([
    [
      'unknown type',
      { chosenType: 'moat' },
      'dissipators.chosenType',
      /chosen basin type must be one of/,
    ],
    [
      'unknown default',
      { defaults: { colour: 3 } },
      'dissipators.defaults.colour',
      /not a setting/,
    ],
    [
      'negative default',
      { defaults: { riprapLengthRatio: -1 } },
      'dissipators.defaults.riprapLengthRatio',
      /not below zero/,
    ],
    ['box without span', { culvert: { shape: 'box', rise: 1 } }, 'dissipators.culvert', /span/],
    [
      'negative extra depth',
      { extraFloorDepth: -0.5 },
      'dissipators.extraFloorDepth',
      /must not be negative/,
    ],
  ])('rejects %s with a clear message', (_n, dissipators, path, re) => {
    let err: { inner: Array<{ path?: string; message: string }> } | null = null;
    try {
      studyInputSchema.validateSync(
        demo({ dissipators: dissipators as StudyInput['dissipators'] }),
        opts,
      );
    } catch (e) {
      err = e as typeof err;
    }
    expect(err).not.toBeNull();
    const hit = err!.inner.find((i) => i.path === path);
    expect(hit?.message).toMatch(re);
  });
  it('pipe inflow: lossModel optional (the type says so; the engine takes none), still checked when given', () => {
    const pipe = demo({
      inflow: {
        kind: 'pipe',
        invertElevation: 95,
        outlet: {
          kind: 'table',
          rows: [
            { Q: 1, depth: 0.5, velocity: 5 },
            { Q: 100, depth: 2, velocity: 9 },
          ],
        },
      },
    });
    expect(studyInputSchema.validateSync(pipe, opts).inflow).not.toHaveProperty('lossModel');
    const bad = { ...pipe, inflow: { ...pipe.inflow, lossModel: { kind: 'guess' } } };
    expect(() => studyInputSchema.validateSync(bad, opts)).toThrow(/loss allowance must be one of/);
    expect(runStudy(pipe).rows.length).toBeGreaterThan(0);
  });
});

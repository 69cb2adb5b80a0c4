// Every screening reason code has a sentence in both unit systems (common/src/messages/reasons.ts),
// its quantities in the system's units with the one rounding rule, published limits exactly as
// published, and no internal name; the screening itself returns data, never a sentence (issue 7,
// item 1).
import { describe, expect, it } from 'vitest';
import {
  DISSIPATOR_CATALOGUE,
  getDissipator,
  limitEntryText,
  REASON_CODES,
  reasonText,
  runStudy,
  screeningSummaryText,
  toSI,
  type CriterionResult,
  type QuantityKind,
  type ReasonCode,
} from '@basinwright/common';
import { caldwellDesign, fenwickDesign } from '../../seed/designs';

const FT = 0.3048; // 1 ft = 0.3048 m exactly (NIST SP 811)

// Awkward SI quantities (invented) under every name a reason quotes; the pure numbers likewise.
const QUANTITIES: Record<string, [QuantityKind, number]> = {
  need: ['length', 4.56789123],
  tw: ['length', 3.98765432],
  y2: ['length', 4.1234567],
  max: ['length', 0.987654],
  low: ['length', 0.48],
  rise: ['length', 1.2],
  d50: ['length', 0.3123456],
  head: ['length', 12.345678],
  Q: ['discharge', 3.285410275704521],
  q: ['unitDischarge', 4.123456789],
  v1: ['velocity', 16.54321],
  v: ['velocity', 12.3456],
};
const NUMBERS: Record<string, number> = {
  fr1: 6.54321,
  lo: 4.5,
  hi: 17,
  factor: 1.05,
  ratio: 1.2345678,
  heavy: 1,
  fr: 2.71234,
};

/** A criterion of `code` quoting every name (the velocity limit published: 50 ft/s). */
function sample(code: ReasonCode, limitKind: QuantityKind = 'velocity'): CriterionResult {
  const values: Record<string, number> = { ...NUMBERS, limit: 15.24 };
  const kinds: Record<string, QuantityKind> = { limit: limitKind };
  for (const [name, [kind, si]] of Object.entries(QUANTITIES)) {
    values[name] = si;
    kinds[name] = kind;
  }
  return {
    criterion: 'velocity',
    status: 'warn',
    code,
    values,
    kinds,
    published: { limit: 'cavitationVelocity' },
    inflow: 'pipe',
  };
}

describe('screening reason sentences', () => {
  it('every code has a sentence in SI and in US customary, with no internal name, code or gap', () => {
    expect(REASON_CODES.length).toBeGreaterThan(60);
    expect(new Set(REASON_CODES).size).toBe(REASON_CODES.length);
    for (const code of REASON_CODES)
      for (const units of ['SI', 'US'] as const) {
        const text = reasonText(sample(code), units);
        const at = `${code} ${units}: ${text}`;
        expect(text.length, at).toBeGreaterThan(8);
        expect(text, at).not.toMatch(/undefined|NaN|Infinity|\?/);
        expect(text, at).not.toContain(code);
        expect(text, `internal name — ${at}`).not.toMatch(/\b[a-z]+[A-Z]\w*/);
        if (units === 'US') expect(text, at).not.toMatch(/\d m\b|m³|m²|m\/s/);
        else expect(text, at).not.toMatch(/\d ft\b|cfs|ft\/s|ft²/);
      }
  });

  it('a published limit is said exactly as published in its own system, converted in the other', () => {
    const c = sample('piers-cavitation-risk');
    // 50 ft/s = 15.24 m/s exactly [NIST SP 811]; V1 16.54321 m/s = 54.3 ft/s
    expect(reasonText(c, 'US')).toBe(
      'V1 54.3 ft/s is above 50 ft/s: cavitation risk on the baffle piers, model study',
    );
    expect(reasonText(c, 'SI')).toBe(
      'V1 16.5 m/s is above 15.2 m/s: cavitation risk on the baffle piers, model study',
    );
    // an engineer's own value (no published key) is the value in force, converted
    const own: CriterionResult = { ...c, published: {} };
    expect(reasonText(own, 'US')).toContain('above 50 ft/s'); // 15.24 m/s is 50 ft/s to 3 figures
    const near: CriterionResult = { ...c, values: { ...c.values, v1: 15.2401 } };
    // a value just over the limit is said as at the limit, never with figures the limit lacks
    // ("V1 15.2401 m/s is above 15.2 m/s" was the old reading, issue 13)
    expect(reasonText(near, 'SI')).toBe(
      'V1 at the 15.2 m/s limit: cavitation risk on the baffle piers, model study',
    );
  });

  it('the source tag and the count of other discharges follow the sentence', () => {
    const c: CriterionResult = { ...sample('velocity-within'), source: '[src: EM-25]', others: 2 };
    expect(reasonText(c, 'US')).toBe(
      'V1 54.3 ft/s ≤ 50 ft/s [src: EM-25] (and at 2 other discharges)',
    );
    expect(reasonText({ ...c, others: 1 }, 'US')).toMatch(/\(and at 1 other discharge\)$/);
  });
});

describe('the screening of a study is data, phrased at the edge', () => {
  const si = runStudy(fenwickDesign);
  const us = runStudy(toSI(caldwellDesign));
  it('every reason of both demo studies is phrased in its project’s units with no gap', () => {
    for (const [r, units] of [
      [si, 'SI'],
      [us, 'US'],
    ] as const) {
      for (const s of r.screening) {
        const summary = screeningSummaryText(s, r.screening, units);
        expect(summary, s.type).not.toMatch(/undefined|NaN|\?/);
        for (const c of [...s.criteria, ...s.perDischarge.flatMap((p) => p.criteria)]) {
          expect(REASON_CODES).toContain(c.code);
          const text = reasonText(c, units);
          expect(text, `${c.code}: ${text}`).not.toMatch(/undefined|NaN|\?/);
          for (const [name, kind] of Object.entries(c.kinds))
            expect(Number.isFinite(c.values[name]), `${c.code}.${name} (${kind})`).toBe(true);
        }
      }
    }
  });
  it('the result does not depend on the unit system the project reads it in (no words inside)', () => {
    const a = runStudy(fenwickDesign);
    const b = runStudy({ ...fenwickDesign, displayUnits: 'US' });
    expect(b.screening).toEqual(a.screening);
    expect(b.design?.design.warnings).toEqual(a.design?.design.warnings);
    expect(b.dissipators?.notes).toEqual(a.dissipators?.notes);
    expect(JSON.stringify(a.screening)).not.toMatch(/ m³\/s| cfs/);
  });
  it('a 100 cfs discharge reads "100 cfs" in a US reason [exact: 100 × 0.3048³ m³/s]', () => {
    const c: CriterionResult = {
      criterion: 'discharge',
      status: 'pass',
      code: 'discharge-no-limit',
      values: { Q: 100 * FT ** 3 },
      kinds: { Q: 'discharge' },
    };
    expect(reasonText(c, 'US')).toBe('no published limit on total discharge (Q 100 cfs)');
  });
});

describe("the catalogue's limit texts", () => {
  it('read in the project units, published US figures exact, no placeholder or metre left in US', () => {
    for (const m of DISSIPATOR_CATALOGUE)
      for (const entry of m.limits)
        for (const units of ['SI', 'US'] as const) {
          const text = limitEntryText(entry, units);
          expect(text, `${m.id} ${units}`).not.toMatch(/[{}?]|undefined|NaN|\d\.\d{4,}/);
          if (units === 'US')
            expect(text, `${m.id}: metres in US`).not.toMatch(/\d ?(m|m\/s|m²\/s|m³\/s)\b/);
        }
    const said = (id: Parameters<typeof getDissipator>[0], units: 'SI' | 'US') =>
      getDissipator(id).limits.map((e) => limitEntryText(e, units));
    // USBR Type VI: 400 cfs and 50 ft/s as published [USBR EM-25]; SI is their exact conversion,
    // 400 × 0.3048³ = 11.3 m³/s and 50 × 0.3048 = 15.2 m/s (three figures, formatQuantity)
    expect(said('usbr-6', 'US')).toEqual(
      expect.arrayContaining(['Q up to 400 cfs', 'entering velocity up to 50 ft/s']),
    );
    expect(said('usbr-6', 'SI')).toEqual(
      expect.arrayContaining(['Q up to 11.3 m³/s', 'entering velocity up to 15.2 m/s']),
    );
    // Type III baffle piers: care above 50 ft/s, not above 60 ft/s [USBR EM-25]
    expect(said('usbr-3', 'US')).toContain(
      'V1 ≤ 50 ft/s; 50 ft/s to 60 ft/s with care; above 60 ft/s baffle piers cavitate',
    );
    // Type IX: up to 60 cfs/ft of width [USBR, Design of Small Dams]
    expect(said('usbr-9', 'US')).toContain('q ≤ 60 ft²/s');
    // a limit given in SI (the apron's largest culvert rise, 1.5 m [HEC-14]) converts:
    // 1.5 / 0.3048 = 4.92 ft
    expect(said('riprap-apron', 'US')).toContain('culvert rise up to 4.92 ft');
  });
});

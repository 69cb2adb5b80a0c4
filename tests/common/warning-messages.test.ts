// Every study warning code has a sentence in both unit systems (common/src/messages), its
// quantities in the system's units (ft, cfs, ft/s for US) with the one rounding rule, and no
// internal name or raw float; runStudy returns the warnings as data (issue 7, item 4).
import { describe, expect, it } from 'vitest';
import {
  STUDY_WARNING_CODES,
  UNIT_LABELS,
  WARNING_SEVERITY,
  formatQuantity,
  runStudy,
  studyWarningText,
  type QuantityKind,
  type StudyInput,
  type StudyWarning,
  type StudyWarningCode,
} from '@basinwright/common';
import { fenwickDesign } from '../../seed/designs';

const FT = 0.3048; // 1 ft = 0.3048 m exactly (NIST SP 811)

// Awkward SI quantities (invented) for a warning of every code: typed by code, so a new code
// without a sample fails the type-check.
const Q = 3.285410275704521;
const L = 'length' as const;
const V = 'velocity' as const;
const D = 'discharge' as const;
const U = 'unitDischarge' as const;
const SAMPLES: Record<
  StudyWarningCode,
  {
    values: Record<string, number>;
    kinds: Record<string, QuantityKind>;
    at?: StudyWarning['at'];
    types?: StudyWarning['types'];
  }
> = {
  'design-discharge-added': { values: { Q }, kinds: { Q: 'discharge' } },
  'design-discharge-above-range': { values: { Q }, kinds: { Q: 'discharge' } },
  'tailwater-extended': { values: { count: 3, Q }, kinds: { Q: 'discharge' } },
  'headwater-extended': { values: { count: 1 }, kinds: {} },
  'outlet-extended': { values: { count: 2 }, kinds: {} },
  'jet-flare': { values: { tanTheta: 0.0833333333, fr: 4.000000001 }, kinds: {} },
  'known-toe-q-differs': {
    values: { qToe: 4.123456789, qBasin: 3.987654321, v1: 12.3456789 },
    kinds: { qToe: 'unitDischarge', qBasin: 'unitDischarge', v1: 'velocity' },
  },
  'known-toe-velocity-held': { values: {}, kinds: {} },
  'fixed-floor-above-required': {
    values: { floorElevation: 87.63981433379968, requiredElevation: 87.1234567891 },
    kinds: { floorElevation: 'length', requiredElevation: 'length' },
  },
  'fixed-floor-unsolved': {
    values: { floorElevation: 121.92000000001 },
    kinds: { floorElevation: 'length' },
  },
  'sweep-out': { values: { count: 1, Q }, kinds: { Q: 'discharge' } },
  'excess-submergence': { values: { count: 4, excess: 0.2345678, Q }, kinds: { Q: 'discharge' } },
  'high-inflow-velocity': {
    values: { v1: 17.891234567, limit: 15, Q },
    kinds: { v1: 'velocity', limit: 'velocity', Q: 'discharge' },
  },
  'oscillating-jump': { values: { count: 5 }, kinds: {} },
  'weak-jump': { values: { count: 1 }, kinds: {} },
  'froude-above-tested': { values: { count: 2, limit: 17 }, kinds: {} },
  'gate-submerged': { values: {}, kinds: {} },
  'dissipators-not-run': { values: {}, kinds: {} },
  'type-froude-outside': { values: { fr1: 3.98765, lo: 4.5 }, kinds: {} },
  'type-oscillating': { values: { fr1: 3.123456 }, kinds: {} },
  'piers-not-advised': { values: { v1: 19.87654, limit: 18.288 }, kinds: { v1: V, limit: V } },
  'saf-blocks-not-advised': {
    values: { v1: 19.87654, limit: 18.288 },
    kinds: { v1: V, limit: V },
  },
  'blocks-cavitation': { values: { v1: 16.54321, limit: 15.24 }, kinds: { v1: V, limit: V } },
  'type2-unit-discharge': { values: { q: 47.123, limit: 46.4515 }, kinds: { q: U, limit: U } },
  'type3-unit-discharge': { values: { q: 19.123, limit: 18.5806 }, kinds: { q: U, limit: U } },
  'plain-apron-long': { values: { fr1: 9.87654, length: 41.23456 }, kinds: { length: L } },
  'narrow-chute-blocks': { values: {}, kinds: {} },
  'narrow-baffle-blocks': { values: {}, kinds: {} },
  'narrow-sill-teeth': { values: {}, kinds: {} },
  'type6-width-from-memory': { values: {}, kinds: {} },
  'type6-narrower': {
    values: { width: 2.123456, curveWidth: 2.531554 },
    kinds: { width: L, curveWidth: L },
  },
  'type6-discharge-above': {
    values: { Q: 11.33, limit: 11.3267386368 },
    kinds: { Q: D, limit: D },
  },
  'type6-velocity-above': { values: { v: 15.25, limit: 15.24 }, kinds: { v: V, limit: V } },
  'type6-baffle-overtopped': { values: { tw: 1.23456, max: 0.987654 }, kinds: { tw: L, max: L } },
  'type9-unit-discharge': { values: { q: 6.123456, limit: 5.5741824 }, kinds: { q: U, limit: U } },
  'basin-cavitation': {
    values: { v1: 16.54321, Q, limit: 15.24 },
    kinds: { v1: V, Q: D, limit: V },
  },
  'basin-oscillating': { values: { count: 3, Q }, kinds: { Q: D } },
  'basin-froude-outside': { values: { count: 2, fr1: 17.54321, Q }, kinds: { Q: D } },
  'basin-submergence': { values: { count: 7, ratio: 1.2345678, Q }, kinds: { Q: D } },
  'basin-sweep-out': { values: { count: 1, Q }, kinds: { Q: D } },
  'basin-sweep-out-margin': {
    values: { Q, margin: 0.0123456, required: 4.56789 },
    kinds: { Q: D, margin: L, required: L },
  },
  'slab-thick': { values: { need: 1.23456, thickness: 1.25 }, kinds: { need: L, thickness: L } },
  'uplift-below-floor': { values: {}, kinds: {} },
  'apron-tailwater-assumed': { values: {}, kinds: {} },
  'apron-tailwater-held': {
    values: { tw: 2.123456, low: 0.48, rise: 1.2, used: 1.2 },
    kinds: { tw: L, low: L, rise: L, used: L },
  },
  'apron-stone-beyond-classes': {
    values: { d50: 0.6123456, max: 0.55 },
    kinds: { d50: L, max: L },
  },
  'type-not-designed': { values: {}, kinds: {}, at: { type: 'usbr-6' } },
  'specialist-needed': { values: {}, kinds: {}, types: ['flip-bucket', 'slotted-bucket'] },
  'no-catalogue-type': { values: {}, kinds: {} },
  'jet-also-indicated': { values: {}, kinds: {} },
  'chosen-not-designed': { values: {}, kinds: {}, at: { type: 'riprap-apron' } },
};

const sample = (code: StudyWarningCode): StudyWarning => ({
  code,
  severity: WARNING_SEVERITY[code],
  ...SAMPLES[code],
});

const UNITS = ['SI', 'US'] as const;
const escape = (s: string): string => s.replace(/[.*+?^${}()|[\]\\/]/g, '\\$&');

/** A decimal with more than two decimals and more than three significant figures. */
const rawFloat = (n: string): boolean =>
  n.split('.')[1]!.length > 2 && n.replace('.', '').replace(/^0+/, '').length > 3;

/** The checks every sentence passes, whatever its code. */
function expectClean(w: StudyWarning, units: 'SI' | 'US'): string {
  const text = studyWarningText(w, units);
  const at = `${w.code} ${units}: ${text}`;
  expect(text.length, at).toBeGreaterThan(15);
  expect(text, at).not.toMatch(/undefined|NaN|Infinity|\?/);
  for (const n of text.match(/\d+\.\d+/g) ?? [])
    expect(rawFloat(n), `raw float ${n} — ${at}`).toBe(false);
  expect(text, `internal name — ${at}`).not.toMatch(/\b[a-z]+[A-Z]\w*/);
  expect(text, `a code — ${at}`).not.toContain(w.code);
  if (units === 'US') expect(text, `SI unit in US — ${at}`).not.toMatch(/\d m\b|m³|m²|m\/s/);
  else expect(text, `US unit in SI — ${at}`).not.toMatch(/\d ft\b|cfs|ft\/s|ft²/);
  // every quantity it carries is quoted in the system's unit
  for (const kind of new Set(Object.values(w.kinds)))
    expect(text, `${kind} — ${at}`).toMatch(
      new RegExp(`\\d ${escape(UNIT_LABELS[kind][units])}(?![\\w²³/])`),
    );
  return text;
}

describe('study warning sentences', () => {
  it('every code has a sentence in SI and in US customary, in the system’s units, with no internal name or raw float', () => {
    expect(STUDY_WARNING_CODES.length).toBe(Object.keys(SAMPLES).length);
    for (const code of STUDY_WARNING_CODES)
      for (const units of UNITS) {
        const text = expectClean(sample(code), units);
        expect(['info', 'caution', 'warning']).toContain(WARNING_SEVERITY[code]);
        // the two systems say different things when the warning quotes a quantity
        if (Object.keys(SAMPLES[code].kinds).length > 0 && units === 'US')
          expect(text).not.toBe(studyWarningText(sample(code), 'SI'));
      }
  });

  it('a refusal behind a warning is phrased from its code, in the project units', () => {
    const w: StudyWarning = {
      ...sample('fixed-floor-unsolved'),
      cause: { field: 'floorElevation', code: 'no-floor', values: { Q: 100 * FT ** 3, fr1: 3 } },
    };
    // 100 cfs exactly; the no-floor sentence (messages/refusals.ts)
    expect(expectClean(w, 'US')).toContain(
      'No floor elevation holds the jump at 100 cfs: the tailwater stays short',
    );
    expect(expectClean(w, 'SI')).toContain('at 2.83 m³/s');
    const d: StudyWarning = {
      ...sample('dissipators-not-run'),
      cause: { field: 'basinWidth', code: 'not-positive', values: {} },
    };
    expect(expectClean(d, 'SI')).toContain('The basin width must be greater than zero.');
  });

  it('rounding: lengths and elevations to the hundredth, other quantities to three figures', () => {
    // exact conversions (1 ft = 0.3048 m): 302.07 ft, 100 cfs, 50 ft/s, 10 ft²/s
    expect(formatQuantity(302.07 * FT, 'length', 'US')).toBe('302.07 ft');
    expect(formatQuantity(87.63981433379968, 'length', 'SI')).toBe('87.64 m');
    expect(formatQuantity(0.3, 'length', 'SI')).toBe('0.30 m');
    expect(formatQuantity(100 * FT ** 3, 'discharge', 'US')).toBe('100 cfs');
    expect(formatQuantity(105.0000001, 'discharge', 'SI')).toBe('105 m³/s');
    expect(formatQuantity(0.0123456, 'discharge', 'SI')).toBe('0.0123 m³/s');
    expect(formatQuantity(12345.6, 'discharge', 'SI')).toBe('12346 m³/s');
    expect(rawFloat('0.0833')).toBe(false);
    expect(rawFloat('87.6398')).toBe(true);
    expect(formatQuantity(50 * FT, 'velocity', 'US')).toBe('50 ft/s');
    expect(formatQuantity(15.24, 'velocity', 'SI')).toBe('15.2 m/s');
    expect(formatQuantity(10 * FT ** 2, 'unitDischarge', 'US')).toBe('10 ft²/s');
    // the cavitation threshold is quoted as published in each system, not converted (49.2 ft/s)
    const fast = sample('high-inflow-velocity');
    expect(studyWarningText(fast, 'US')).toContain('above 50 ft/s');
    expect(studyWarningText(fast, 'SI')).toContain('above 15 m/s');
    expect(studyWarningText(sample('excess-submergence'), 'SI')).toContain('up to 23 % above');
    expect(studyWarningText(sample('sweep-out'), 'SI')).toContain('at 1 discharge,');
  });
});

describe('runStudy returns its warnings as data', () => {
  const demo = fenwickDesign;
  const cases: [string, StudyInput][] = [
    ['the demo', demo],
    ['a fixed floor too high', { ...demo, floorElevation: runStudy(demo).floor.elevation + 0.6 }],
    ['a fixed floor deep', { ...demo, floorElevation: 80 }],
    [
      'a design discharge above the range',
      { ...demo, discharges: { kind: 'list', values: [5, 10] } },
    ],
  ];
  it.each(cases)(
    '%s: coded, SI values with kinds, severities from the table, clean sentences',
    (_n, input) => {
      const r = runStudy(input);
      expect(r.warnings.length).toBeGreaterThan(0);
      for (const w of r.warnings) {
        expect(STUDY_WARNING_CODES).toContain(w.code);
        expect(w.severity).toBe(WARNING_SEVERITY[w.code]);
        for (const [name, kind] of Object.entries(w.kinds)) {
          expect(Number.isFinite(w.values[name]), `${w.code}.${name}`).toBe(true);
          expect(Object.keys(UNIT_LABELS)).toContain(kind);
        }
        if (w.at?.Q !== undefined) expect(r.rows.map((x) => x.Q)).toContain(w.at.Q);
        for (const units of UNITS) expectClean(w, units);
      }
      // plain data: survives JSON (stored results) unchanged
      expect(JSON.parse(JSON.stringify(r.warnings))).toEqual(r.warnings);
    },
  );
  it('the warnings do not depend on the display units (phrasing happens at the edge)', () => {
    const us = runStudy({ ...demo, displayUnits: 'US' });
    expect(us.warnings).toEqual(runStudy(demo).warnings);
  });
});

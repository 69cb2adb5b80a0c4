// Every engine refusal code has a sentence in both unit systems (common/src/messages), and no
// sentence shows an internal name or a raw float (issue 7, item 4).
import { describe, expect, it } from 'vitest';
import {
  codedRefusalText,
  engineFailure,
  engineFailureText,
  INPUT_ERROR_CODES,
  InputError,
  INTERNAL_FAILURE_TEXT,
  type InputErrorCode,
  JUMP_NOTE_CODES,
  jumpNoteText,
  refusalText,
  runStudy,
} from '@basinwright/common';
import { fenwickDesign } from '../../seed/designs';

// awkward SI quantities of every name the engine quotes (invented)
const VALUES = {
  elevation: 87.63981433379968,
  channelBedElevation: 90,
  span: 1000,
  Q: 3.285410275704521,
  fr: 4.318237465,
  fr1: 1.234567891,
  opening: 0.9144000001,
  upstreamDepth: 2.718281828,
  floorElevation: 121.92000000001,
  min: 0.5,
  max: 2,
  value: 7,
  depth: 1.23456789,
  diameter: 2.4384000001,
  E: 3.33333333,
  eMin: 3.5123456,
  H0: 4.56789123,
  q: 2.87654321,
  capacity: 12.3456789,
  yc: 0.98765432,
  yn: 0.4567891,
  yToe: 0.6789123,
  slope: 0.0123456,
  row: 3,
  count: 2345,
  rows: 60,
  safetyFactor: 1.5,
  unitWeight: 23.5,
};
const FIELDS = ['floorElevation', 'inflow.crestElevation', 'tailwater', 'inflow.opening', 'units'];

describe('refusal sentences', () => {
  it('every code has a sentence in SI and in US customary, with no internal name or raw float', () => {
    expect(INPUT_ERROR_CODES.length).toBeGreaterThan(10);
    for (const code of INPUT_ERROR_CODES)
      for (const field of FIELDS)
        for (const units of ['SI', 'US'] as const) {
          const text = refusalText(new InputError(field, code, 'x', VALUES), units);
          expect(text.length, `${code} ${units}`).toBeGreaterThan(15);
          expect(text, `${code} ${units}`).not.toMatch(/undefined|NaN|Infinity/);
          expect(text, `${code} ${units}: raw float`).not.toMatch(/\d\.\d{4,}/);
          expect(text, `${code} ${units}: internal name`).not.toMatch(/\b(?!kN\/)[a-z]+[A-Z]\w*/);
          expect(text, `${code} ${units}: a code`).not.toContain(code.includes('-') ? code : '\0');
          if (units === 'US') expect(text, `${code}: metres in US`).not.toMatch(/\d m\b|m³\/s/);
        }
  });
  it('a real refusal of the engine reads in the project units', () => {
    try {
      runStudy({ ...fenwickDesign, inflow: { kind: 'gate', Cc: 0.61, opening: 3 } });
      throw new Error('expected a refusal');
    } catch (e) {
      if (!(e instanceof InputError)) throw e;
      // 3 m = 9.84 ft [1 ft = 0.3048 m, NIST SP 811]; 5 m³/s = 177 cfs
      expect(refusalText(e, 'US')).toBe(
        'The gate opening 9.84 ft is too large for 177 cfs: the water would not reach the gate. Give a smaller opening or a pool depth instead.',
      );
      // one rounding rule (formatQuantity): lengths to the hundredth, discharges to three figures
      expect(refusalText(e, 'SI')).toContain('The gate opening 3.00 m is too large for 5 m³/s');
    }
  });
});

describe('jump-position notes', () => {
  it('every note code has a sentence in SI and US customary; a quoted depth reads in the units', () => {
    for (const code of JUMP_NOTE_CODES)
      for (const units of ['SI', 'US'] as const) {
        const text = jumpNoteText({ code, values: { y1: 0.18300000001 } }, units);
        expect(text, `${code} ${units}`).toMatch(/^[A-Z].{15,}\.$/);
        expect(text, `${code} ${units}`).not.toMatch(/undefined|NaN|\d\.\d{4,}/);
      }
    // 0.183 m / 0.3048 m/ft = 0.600 ft [NIST SP 811]
    expect(jumpNoteText({ code: 'from-vena-contracta', values: { y1: 0.183 } }, 'US')).toContain(
      'Cc·a = 0.60 ft',
    );
    expect(jumpNoteText({ code: 'from-vena-contracta', values: { y1: 0.183 } }, 'SI')).toContain(
      'Cc·a = 0.18 m',
    );
  });
});

describe('failures that are not coded refusals', () => {
  it('an internal guard or an unknown code reads as a plain sentence, never its own text', () => {
    expect(refusalText(new RangeError('brent: no solution in the range searched'))).toBe(
      INTERNAL_FAILURE_TEXT,
    );
    expect(refusalText(new TypeError('x is undefined'), 'US')).not.toContain('undefined');
    const unknown = { field: 'Q', code: 'from-a-later-version' as InputErrorCode, values: {} };
    expect(codedRefusalText(unknown, 'US')).toBe(INTERNAL_FAILURE_TEXT);
    // a refusal carried as data (engineFailure) reads as the error it came from
    const e = new InputError('inflow.opening', 'gate-opening-too-large', 'x', { opening: 3, Q: 5 });
    expect(engineFailureText(engineFailure(e), 'US')).toBe(refusalText(e, 'US'));
    expect(engineFailureText(engineFailure(new RangeError('internal')))).toBe(
      INTERNAL_FAILURE_TEXT,
    );
  });
});

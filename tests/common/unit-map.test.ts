// The one unit map (issue 7 item 3): every numeric field of a StudyInput has a kind, toSI and
// inputFromSI convert each by it, and a round trip gives the typed numbers back.
// Factors [NIST SP 811: 1 ft = 0.3048 m exactly; 1 cfs = 0.3048³ m³/s].
import { describe, expect, it } from 'vitest';
import {
  STUDY_INPUT_KINDS,
  fieldKind,
  inputFromSI,
  toSI,
  type KindsOf,
  type StudyInput,
} from '../../common/src';
import { expectRel } from '../support/tolerance';
import { caldwellDesign } from '../../seed/designs';

const FT = 0.3048; // [NIST SP 811]
const FACTOR: Record<string, number> = { length: FT, discharge: FT ** 3 };

// A numeric field added to StudyInput without a kind does not type-check.
type WithNewField = StudyInput & { newDepth: number };
// @ts-expect-error newDepth has no kind in STUDY_INPUT_KINDS
const missingKind: KindsOf<WithNewField> = STUDY_INPUT_KINDS;

// Every mapped field set, in US units (the demo input, with the optional fields given).
const everyField: StudyInput = {
  ...caldwellDesign,
  tailwaterFactor: 1.05,
  floorElevation: 300,
  floorSafetyDepth: 1.5,
  submergenceTolerance: 0.15,
  floorManningN: 0.015,
};

describe('one unit map', () => {
  it('every numeric field of the input has a kind, and the walker reads it', () => {
    expect(Object.keys(missingKind).length).toBeGreaterThan(0);
    for (const [key, kind] of Object.entries(STUDY_INPUT_KINDS)) {
      expect(fieldKind(key)).toBe(kind);
      expect(typeof everyField[key as keyof StudyInput]).toBe('number');
    }
  });
  it('toSI converts each mapped field by its kind (1 ft = 0.3048 m, 1 cfs = 0.3048³ m³/s)', () => {
    const si = toSI(everyField);
    for (const [key, kind] of Object.entries(STUDY_INPUT_KINDS)) {
      const k = key as keyof typeof STUDY_INPUT_KINDS;
      const factor = kind === null ? 1 : FACTOR[kind];
      expect(factor, key).toBeDefined();
      expectRel(si[k]!, everyField[k]! * factor!, 1e-12);
    }
  });
  it('toSI → inputFromSI gives every mapped field back', () => {
    const back = inputFromSI(toSI(everyField), 'US');
    expect(back.units).toBe('US');
    for (const key of Object.keys(STUDY_INPUT_KINDS)) {
      const k = key as keyof typeof STUDY_INPUT_KINDS;
      expectRel(back[k]!, everyField[k]!, 1e-12);
    }
  });
  it('the jump tool’s fields are in the same map (crest height, pool depth, opening, Q)', () => {
    expect(fieldKind('crestHeight')).toBe('length');
    expect(fieldKind('upstreamDepth')).toBe('length');
    expect(fieldKind('opening')).toBe('length');
    expect(fieldKind('Q')).toBe('discharge');
    expect(fieldKind('manningN')).toBeNull();
    expect(fieldKind('toString')).toBeNull();
  });
});

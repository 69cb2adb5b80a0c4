// Unit conversions against the standard factors (NIST SP 811: 1 ft = 0.3048 m exactly;
// 1 lb = 0.45359237 kg exactly; g_n = 9.80665 m/s² exactly) and hydraulics.md §6.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  G,
  JUMP_SITUATION_KINDS,
  UNITS,
  convert,
  convertByKinds,
  type DeepKindsOf,
  type JumpSituation,
  fromSIValue,
  inputFromSI,
  phraseMessage,
  toSI,
  toSIValue,
  type StudyInput,
} from '@basinwright/common';
import { create, all } from 'mathjs';
import { expectRel } from '../support/tolerance';

describe('units', () => {
  it('1 cfs = 0.028316846592 m³/s; 1 ft = 0.3048 m; 1 yd³ = 0.764554858 m³ [standard, hydraulics.md §6]', () => {
    expectRel(convert(1, 'cfs', 'm^3/s'), 0.028316846592, 1e-12);
    expectRel(convert(1, 'ft', 'm'), 0.3048, 1e-15);
    expectRel(convert(1, 'yd^3', 'm^3'), 0.764554858, 1e-9);
  });
  it('ft/s, ft²/s, lb (force and mass), psi [standard: NIST SP 811]', () => {
    expectRel(toSIValue(1, 'velocity', 'US'), 0.3048, 1e-15);
    expectRel(toSIValue(1, 'unitDischarge', 'US'), 0.3048 ** 2, 1e-15);
    expectRel(toSIValue(1, 'mass', 'US'), 0.45359237, 1e-15);
    expectRel(toSIValue(1, 'force', 'US'), 0.45359237 * 9.80665, 1e-12);
    expectRel(toSIValue(1, 'pressure', 'US'), (0.45359237 * 9.80665) / 0.0254 ** 2, 1e-9); // mathjs's psi constant agrees to 6e-11
    expectRel(toSIValue(1, 'earthwork', 'US'), 0.9144 ** 3, 1e-12);
    expect(UNITS.discharge.US).toBe('cfs');
    expect(G).toBe(9.80665);
  });
  it('weir coefficient: C_US = C_SI/√0.3048, so the SI demo C 2.15 is about 3.89 in ft units (common practice)', () => {
    expectRel(fromSIValue(2.15, 'weirCoefficient', 'US'), 2.15 / Math.sqrt(0.3048), 1e-12);
  });
  it('the private mathjs instance leaves the global one without cfs', () => {
    const other = create(all!, {});
    expect(() => other.unit(1, 'cfs')).toThrow();
  });
  it('round trip SI → US → SI returns every number (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-6, max: 1e6, noNaN: true }), (v) => {
        for (const k of Object.keys(UNITS) as Array<keyof typeof UNITS>) {
          expectRel(toSIValue(fromSIValue(v, k, 'US'), k, 'US'), v, 1e-12);
        }
      }),
    );
  });
  it('toSI converts a whole StudyInput by field, leaving n, slopes and coefficients alone', () => {
    const us: StudyInput = {
      units: 'US',
      channelBedElevation: 100,
      basinWidth: 20,
      designDischarge: 420,
      discharges: { kind: 'range', min: 50, max: 420, count: 5 },
      tailwater: {
        kind: 'table',
        rows: [
          { Q: 50, elevation: 101 },
          { Q: 420, elevation: 104 },
        ],
      },
      inflow: { kind: 'gate', Cc: 0.61, opening: 1.5 },
      tailwaterFactor: 1.1,
    };
    const si = toSI(us);
    expect(si.units).toBe('SI'); // the numbers are SI now …
    expect(si.displayUnits).toBe('US'); // … and the user's units travel on for the words
    expect(toSI(si)).toEqual(si); // idempotent: a second conversion changes nothing
    expectRel(si.channelBedElevation, 30.48, 1e-12);
    expectRel(si.designDischarge, 420 * 0.028316846592, 1e-12);
    if (
      si.discharges.kind !== 'range' ||
      si.tailwater.kind !== 'table' ||
      si.inflow.kind !== 'gate'
    )
      throw new Error('shape changed');
    expectRel(si.discharges.min, 50 * 0.028316846592, 1e-12);
    expectRel(si.discharges.max, 420 * 0.028316846592, 1e-12);
    expect(si.discharges.count).toBe(5);
    expectRel(si.tailwater.rows[1]!.elevation, 104 * 0.3048, 1e-12);
    expectRel(si.inflow.opening!, 1.5 * 0.3048, 1e-12);
    expect(si.inflow.Cc).toBe(0.61);
    expect(si.tailwaterFactor).toBe(1.1);
    const back = inputFromSI(si, 'US');
    expectRel(back.basinWidth, 20, 1e-12);
    expect(back.units).toBe('US');
    expect(back.displayUnits).toBeUndefined();
    expect(toSI({ ...us, units: 'SI' })).toEqual({ ...us, units: 'SI' });
  });
});

describe('engine messages in the project units (phraseMessage)', () => {
  // 1 ft = 0.3048 m exactly, so 1 ft³/s = 0.028316846592 m³/s and 1 yd³ = 0.764554857984 m³ [NIST SP 811]
  it('puts each SI quantity of a sentence in US customary', () => {
    expect(phraseMessage('floorElevation 121.92 m lies above the outlet’s energy line', 'US')).toBe(
      'floorElevation 400.00 ft lies above the outlet’s energy line',
    );
    expect(
      phraseMessage('y1 0.3048 m is not supercritical at Q 2.8316846592 m³/s over 3.048 m', 'US'),
    ).toBe('y1 1.00 ft is not supercritical at Q 100 cfs over 10.00 ft');
    expect(phraseMessage('V1 4.572 m/s, q 0.09290304 m²/s, 0.764554857984 m³ of stone', 'US')).toBe(
      'V1 15 ft/s, q 1 ft²/s, 1 yd³ of stone',
    );
    expect(phraseMessage('a drop of -0.6096 m.', 'US')).toBe('a drop of -2.00 ft.');
  });
  it('leaves numbers without a length unit, other words and SI messages alone', () => {
    const text =
      'inflow.toe: Fr1 = 0.167 is not supercritical; 8 members; 5 mm; y1 must be greater than zero (got 0)';
    expect(phraseMessage(text, 'US')).toBe(text);
    expect(phraseMessage('floorElevation 121.92 m lies above', 'SI')).toBe(
      'floorElevation 121.92 m lies above',
    );
  });
});

describe('the jump-position tool on the one unit map (JUMP_SITUATION_KINDS)', () => {
  it('converts every dimensioned number of a US situation to SI and leaves the pure numbers', () => {
    const us: JumpSituation = {
      kind: 'gateMildSlope',
      section: { shape: 'trapezoidal', bottomWidth: 10, sideSlope: 1.5 },
      Q: 100,
      opening: 2,
      Cc: 0.61,
      slope: 0.0008,
      manningN: 0.014,
      tailwaterDepth: 5,
    };
    const si = convertByKinds(us, JUMP_SITUATION_KINDS, 'US', 'toSI');
    // 1 ft = 0.3048 m and 1 cfs = 0.3048³ m³/s exactly [NIST SP 811]
    expect(si).toEqual({
      ...us,
      section: { shape: 'trapezoidal', bottomWidth: expect.any(Number), sideSlope: 1.5 },
      Q: expect.any(Number),
      opening: expect.any(Number),
      tailwaterDepth: expect.any(Number),
    });
    if (si.kind !== 'gateMildSlope' || si.section.shape !== 'trapezoidal') throw new Error('kind');
    expectRel(si.section.bottomWidth, 10 * 0.3048, 1e-12);
    expectRel(si.Q, 100 * 0.3048 ** 3, 1e-12);
    expectRel(si.opening, 2 * 0.3048, 1e-12);
    expectRel(si.tailwaterDepth!, 5 * 0.3048, 1e-12);
    // and back; SI stays as it is
    const back = convertByKinds(si, JUMP_SITUATION_KINDS, 'US', 'fromSI');
    if (back.kind !== 'gateMildSlope' || back.section.shape !== 'trapezoidal')
      throw new Error('kind');
    expectRel(back.Q, 100, 1e-12);
    expectRel(back.section.bottomWidth, 10, 1e-12);
    expect(back.slope).toBe(0.0008);
    expect(convertByKinds(us, JUMP_SITUATION_KINDS, 'SI', 'toSI')).toBe(us);
  });

  it('a numeric field of a situation without a kind fails the type-check', () => {
    const rest = Object.fromEntries(
      Object.entries(JUMP_SITUATION_KINDS).filter(([k]) => k !== 'lossFraction'),
    ) as Omit<typeof JUMP_SITUATION_KINDS, 'lossFraction'>;
    // @ts-expect-error lossFraction is a number of JumpSituation: the map must give it a kind
    const missing: DeepKindsOf<JumpSituation> = rest;
    expect(Object.keys(missing)).not.toContain('lossFraction');
  });
});

// Limits published in US customary units are kept in that unit (issue 7 item 3): the engine
// computes with their exact SI conversion and a US project reads them exactly as published.
// Exact factors [NIST SP 811: 1 ft = 0.3048 m exactly].
import { describe, expect, it } from 'vitest';
import {
  BASIN_DEFAULTS,
  BASIN_DEFAULT_PROVENANCE,
  PUBLISHED_FIGURES,
  limitQuantity,
  publishedSI,
  resolveDefaults,
  type BasinDefaults,
  type PublishedKey,
} from '../../common/src/basins';
import { sayer } from '../../common/src/messages/quote';
import { quote } from '../../common/src/warnings';
import { expectRel } from '../support/tolerance';

const FT = 0.3048; // [NIST SP 811]

/** A limit as a sentence says it: quoted by the engine, said at the edge. */
const limitText = (units: 'SI' | 'US', d: BasinDefaults, key: PublishedKey): string =>
  sayer(quote({ limit: limitQuantity(d, key) }), units)('limit');

// The figures as published, with the confidence hydraulics.md §4 gives them.
const EXPECTED = [
  // key, published figure, SI by the exact factor, the text a US reason shows, confidence
  ['type2MaxUnitDischarge', 500, 500 * FT ** 2, '500 ft²/s', 'mem'], // from memory: EM-25
  ['type3MaxUnitDischarge', 200, 200 * FT ** 2, '200 ft²/s', 'mem'], // from memory: EM-25
  ['type3VelocityWarn', 50, 50 * FT, '50 ft/s', 'src'], // EM-25
  ['type3VelocityFail', 60, 60 * FT, '60 ft/s', 'mem'], // from memory: EM-25
  ['safVelocityFail', 60, 60 * FT, '60 ft/s', 'src'], // Blaisdell 1948
  ['type6MaxDischarge', 400, 400 * FT ** 3, '400 cfs', 'src'], // HEC-14
  ['type6MaxVelocity', 50, 50 * FT, '50 ft/s', 'src'], // HEC-14
  ['type9MaxUnitDischarge', 60, 60 * FT ** 2, '60 ft²/s', 'src'], // Design of Small Dams
  ['cavitationVelocity', 50, 50 * FT, '50 ft/s', 'src'], // EM-25
  ['specialistVelocity', 60, 60 * FT, '60 ft/s', 'mem'], // from memory: EM-25
] as const;

describe('limits published in US units', () => {
  it('every published figure is listed here, in US units, with its confidence', () => {
    expect(Object.keys(PUBLISHED_FIGURES).sort()).toEqual(EXPECTED.map((e) => e[0]).sort());
    for (const [key, value, , , confidence] of EXPECTED) {
      expect(PUBLISHED_FIGURES[key]).toMatchObject({ value, units: 'US' });
      expect(BASIN_DEFAULT_PROVENANCE[key].confidence).toBe(confidence);
    }
  });
  it('the engine computes with the exact SI conversion (50 ft/s = 15.24 m/s, 400 cfs = 11.3267386368 m³/s)', () => {
    for (const [key, , si] of EXPECTED) {
      expectRel(BASIN_DEFAULTS[key], si, 1e-15);
      expectRel(publishedSI(PUBLISHED_FIGURES[key]), si, 1e-15);
    }
    expect(BASIN_DEFAULTS.type3VelocityWarn).toBe(15.24); // 50 × 0.3048 [NIST SP 811]
  });
  it('a US reason shows the figure exactly as published, never 49.2126 ft/s', () => {
    const d = resolveDefaults();
    for (const [key, , , text] of EXPECTED) expect(limitText('US', d, key)).toBe(text);
  });
  it('an SI reason shows the converted value; an override is shown as the value in force', () => {
    const d = resolveDefaults();
    expect(limitText('SI', d, 'type3VelocityWarn')).toBe('15.2 m/s'); // 15.24 m/s, three figures
    expect(limitText('SI', d, 'type6MaxDischarge')).toBe('11.3 m³/s'); // 11.33 m³/s
    const over = resolveDefaults({ type3VelocityWarn: 12 });
    expect(limitText('US', over, 'type3VelocityWarn')).toBe('39.4 ft/s'); // 12 / 0.3048 = 39.37
  });
});

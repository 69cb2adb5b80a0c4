// SI value = US value × factor, one factor per kind of quantity: 1 US unit of the kind (UNITS[k].US)
// in its SI unit, exactly the double mathjs computes for convert(1, UNITS[k].US, UNITS[k].SI)
// (tests/common/units-bundle.test.ts checks every one bit for bit), written out so that the
// conversions by kind need no mathjs in the browser. Definitions: NIST SP 811 (1 ft = 0.3048 m,
// 1 lb = 0.45359237 kg exactly; standard gravity for lbf); the hp as mathjs defines it.
import type { QuantityKind } from './index';

export const US_TO_SI: Readonly<Record<QuantityKind, number>> = {
  length: 0.3048, // ft → m
  area: 0.09290304, // ft² → m²
  volume: 0.028316846592000004, // ft³ → m³
  earthwork: 0.764554857984, // yd³ → m³
  discharge: 0.028316846592000004, // cfs → m³/s
  unitDischarge: 0.09290304, // ft²/s → m²/s
  velocity: 0.3048, // ft/s → m/s
  force: 4.4482216152605, // lbf → N
  pressure: 6894.75729276459, // psi → Pa
  power: 745.6998715386, // hp → W
  mass: 0.45359237, // lb → kg
  weirCoefficient: 0.5520869496736904, // ft^0.5/s → m^0.5/s
  lineLoad: 0.014593902937206362, // lbf/ft → kN/m
  unitWeight: 0.15708746384624617, // lbf/ft³ → kN/m³
};

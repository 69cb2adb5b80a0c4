// The cautions every study result carries, in the wording of a unit system. A module of their
// own (no code imported), so a page that shows them does not load the engine (study.ts) with them.
import type { UnitSystem } from './range/types';

/** The cautions carried by every result (product.md; hydraulics.md §7), SI wording; the edge shows studyCautions(units). */
export const STUDY_CAUTIONS: readonly string[] = [
  'Concept level only: verify with detailed design before construction.',
  'Large or high-hazard structures, inflow velocities above 15 m/s, Froude numbers outside the tested ranges and asymmetric approach flow call for physical or numerical model studies.',
  'Check cavitation on blocks and piers where the inflow velocity is high.',
  'Check sweep-out of the jump at partial flows and excess submergence.',
  'Check uplift and flotation of the floor slab.',
  'Check scour and undermining below the end sill; protect the channel downstream.',
  'Consider debris and ice for the basin type chosen.',
  'The design must be reviewed and sealed by a licensed professional engineer and follow local codes and dam-safety regulations.',
];

/** The cautions in the wording of a unit system (the 15 m/s threshold is about 50 ft/s). */
export function studyCautions(units: UnitSystem = 'SI'): string[] {
  if (units !== 'US') return [...STUDY_CAUTIONS];
  return STUDY_CAUTIONS.map((c) =>
    c.replace('inflow velocities above 15 m/s', 'inflow velocities above about 50 ft/s (15 m/s)'),
  );
}

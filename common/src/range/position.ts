// The one rule for where the jump stands against the tailwater, used by the rows, the warnings,
// the screening, the drawing and the web (which imports it rather than restating it).

/** Where the jump stands at one discharge. */
export type JumpPosition = 'at-toe' | 'swept-out' | 'drowned';

/** Default tolerance of submergence: tailwater more than 10 % above C·y2 drowns the jump. */
export const DEFAULT_SUBMERGENCE_TOLERANCE = 0.1;

/**
 * Where the jump stands: tailwater depth short of the required depth C·y2 sweeps it out;
 * above it by more than `tolerance` (a fraction, default 0.10) drowns it; else it forms at
 * the toe. [hydraulics.md §3; the 10 % is common practice]
 * @example jumpPosition(2.3, 2.0) // 'drowned' (15 % above)
 */
export function jumpPosition(
  tailwaterDepth: number,
  requiredDepth: number,
  tolerance: number = DEFAULT_SUBMERGENCE_TOLERANCE,
): JumpPosition {
  if (tailwaterDepth < requiredDepth * (1 - 1e-9)) return 'swept-out';
  return (tailwaterDepth - requiredDepth) / requiredDepth > tolerance ? 'drowned' : 'at-toe';
}

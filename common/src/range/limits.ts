// Limits of the discharge-range model that are physical sense rather than plan or form limits
// (those live in schemas/limits.ts). SI.

import { ENGINE_LIMITS } from '../schemas/limits';

/** Most discharges one study analyses (ENGINE_LIMITS, the reason there). */
export const MAX_DISCHARGES = ENGINE_LIMITS.maxDischarges;

/**
 * An elevation further than this from the channel bed (m) is a typing slip (a datum mixed up,
 * a digit too many), not a site: refused rather than computed. Common practice: the tallest
 * dams stand about 300 m; 1000 m leaves room for any drop a stilling basin could follow.
 */
export const MAX_ELEVATION_SPAN = 1000;

/**
 * Fr1 a floor must give at every discharge to count as holding a jump. Below 1.7 the jump is
 * undular (hydraulics.md §1, classes by Fr1 [src: USBR via Chow]): a floor so high that the flow
 * arrives barely supercritical "holds" an undular wave, not a jump, so the floor solve ignores
 * such floors. This is what makes the solve well defined when the margin is not monotonic.
 */
export const MIN_FLOOR_FR1 = 1.7;

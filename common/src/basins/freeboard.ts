// Freeboard of stilling-basin walls.
import { reqNonNegative } from './guards';
import { BASIN_DEFAULTS } from './defaults';

import { FOOT as FT } from '../units/constants';

/**
 * Wall freeboard above the water surface, m: F = k·(V1 + y2) with F, y2 in ft and V1 in ft/s,
 * k = 0.1 [mem: USBR, Design of Small Dams — overridable]. The relation is applied in its own
 * units: V1 and y2 are converted to ft/s and ft, the result back to metres.
 * @example freeboard(50 * 0.3048, 15 * 0.3048) // 6.5 ft = 1.9812 m
 */
export function freeboard(
  v1: number,
  y2: number,
  k: number = BASIN_DEFAULTS.freeboardCoefficient,
): number {
  reqNonNegative('v1', v1);
  reqNonNegative('y2', y2);
  reqNonNegative('freeboard coefficient', k);
  const feet = k * (v1 / FT + y2 / FT);
  return feet * FT;
}

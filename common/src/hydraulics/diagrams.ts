// Chart data: specific-energy curve E(y) and momentum curve M(y) at one discharge, with the
// jump's depths marked. Plain numbers (SI) for any charting library.
import { InputError } from '../errors';
import { requirePositive } from './guards';
import { _criticalDepth, _energy, _momentum } from './depths';
import { maxDepth, validateSection, type Section } from './sections';

export interface CurvePoint {
  y: number;
  value: number;
}

export interface JumpDiagrams {
  Q: number;
  criticalDepth: number;
  y1: number;
  y2: number;
  specificEnergy: {
    points: CurvePoint[];
    minimum: number;
    E1: number;
    E2: number;
    /** head loss of the jump E1 − E2, m */
    deltaE: number;
  };
  momentum: {
    points: CurvePoint[];
    minimum: number;
    M1: number;
    M2: number;
  };
  /** optional extra mark (tailwater depth on the floor), m */
  tailwaterDepth: number | null;
}

/**
 * E(y) = y + Q²/(2gA²) and M(y) = Q²/(gA) + A·ȳ from 0.6·y1 to 1.4·max(y2, tailwater), spaced
 * geometrically so the shallow branch is resolved. [Chow 1959, §3-1 and §3-6]
 * @example jumpDiagrams({ shape: 'rectangular', width: 1 }, 3, 0.568, 1.53).specificEnergy.deltaE
 */
export function jumpDiagrams(
  section: Section,
  Q: number,
  y1: number,
  y2: number,
  tailwaterDepth: number | null = null,
  count = 121,
): JumpDiagrams {
  validateSection(section);
  requirePositive('Q', Q);
  requirePositive('y1', y1);
  requirePositive('y2', y2);
  if (!(count >= 3 && count <= 2000 && Number.isInteger(count)))
    throw new InputError('count', 'out-of-range', 'count must be an integer 3–2000', {
      value: count,
      min: 3,
      max: 2000,
    });
  const yc = _criticalDepth(section, Q);
  const lo = 0.6 * Math.min(y1, y2);
  const hi = Math.min(1.4 * Math.max(y1, y2, tailwaterDepth ?? 0), maxDepth(section));
  const ratio = Math.pow(hi / lo, 1 / (count - 1));
  const ePts: CurvePoint[] = [];
  const mPts: CurvePoint[] = [];
  let y = lo;
  for (let i = 0; i < count; i++) {
    const yy = i === count - 1 ? hi : y;
    ePts.push({ y: yy, value: _energy(section, Q, yy) });
    mPts.push({ y: yy, value: _momentum(section, Q, yy) });
    y *= ratio;
  }
  const E1 = _energy(section, Q, y1);
  const E2 = _energy(section, Q, y2);
  return {
    Q,
    criticalDepth: yc,
    y1,
    y2,
    specificEnergy: { points: ePts, minimum: _energy(section, Q, yc), E1, E2, deltaE: E1 - E2 },
    momentum: {
      points: mPts,
      minimum: _momentum(section, Q, yc),
      M1: _momentum(section, Q, y1),
      M2: _momentum(section, Q, y2),
    },
    tailwaterDepth,
  };
}

// Depths and energy/momentum functions for steady flow in a prismatic section. SI units
// (m, m³/s); g = 9.80665 m/s². Sources: Chow 1959, Open-Channel Hydraulics, ch. 3–6.
import { G, MANNING_K_SI } from '../units/constants';
import { InputError } from '../errors';
import { requirePositive } from './guards';
import { geometry, maxDepth, validateSection, type Section } from './sections';
import { brent, goldenMax } from './solve';

/** Smallest depth the solvers try (m): well below any real flow, well above underflow. */
const Y_MIN = 1e-9;

function checkSQ(section: Section, Q: number): void {
  validateSection(section);
  requirePositive('Q', Q);
}

function checkY(section: Section, y: number, name = 'y'): void {
  requirePositive(name, y);
  if (section.shape === 'circular' && y > section.diameter * (1 + 1e-12)) {
    throw new InputError(
      name,
      'conduit-full',
      `${name} ${y} m exceeds the conduit diameter ${section.diameter} m: the conduit would run full`,
      { depth: y, diameter: section.diameter },
    );
  }
}

// Unchecked kernels (validated callers only).
export function _velocity(s: Section, Q: number, y: number): number {
  return Q / geometry(s, y).area;
}
export function _froude(s: Section, Q: number, y: number): number {
  const g = geometry(s, y);
  if (g.topWidth <= 0) return 0; // a full conduit has no free surface: no gravity wave
  return Q / g.area / Math.sqrt((G * g.area) / g.topWidth);
}
// Rectangles take the short path (no geometry object): the whole-range study calls these
// hundreds of thousands of times.
export function _energy(s: Section, Q: number, y: number): number {
  const a = s.shape === 'rectangular' ? s.width * y : geometry(s, y).area;
  return y + (Q * Q) / (2 * G * a * a);
}
export function _momentum(s: Section, Q: number, y: number): number {
  if (s.shape === 'rectangular') return (Q * Q) / (G * s.width * y) + (s.width * y * y) / 2;
  const g = geometry(s, y);
  return (Q * Q) / (G * g.area) + g.centroidMoment;
}

/** Q²T/(gA³) − 1 on a log scale: positive below critical depth, negative above. */
function criticalResidual(s: Section, Q: number, y: number): number {
  const g = geometry(s, y);
  if (g.topWidth <= 0) return -Infinity;
  return Math.log((Q * Q * g.topWidth) / (G * g.area * g.area * g.area));
}

export function _criticalDepth(s: Section, Q: number): number {
  let hi: number;
  if (s.shape === 'circular') {
    hi = s.diameter * (1 - 1e-9);
    if (criticalResidual(s, Q, hi) > 0) {
      throw new InputError(
        'Q',
        'conduit-too-small',
        `Q (discharge) ${Q} m³/s is too large for a ${s.diameter} m conduit: critical depth would reach the crown (the conduit would run full)`,
        { Q, diameter: s.diameter },
      );
    }
  } else {
    // Upper bounds: the rectangle of the bottom width and the triangle of the side slopes each
    // hold less area than the trapezoid at a depth, so each needs a deeper critical depth.
    const b = s.shape === 'rectangular' ? s.width : s.bottomWidth;
    const z = s.shape === 'rectangular' ? 0 : s.sideSlope;
    const rectY = b > 0 ? Math.cbrt((Q * Q) / (G * b * b)) : Infinity;
    const triY = z > 0 ? Math.pow((2 * Q * Q) / (G * z * z), 0.2) : Infinity;
    hi = 1.01 * Math.min(rectY, triY);
    if (!Number.isFinite(hi) || hi <= 0) hi = 1;
    for (let i = 0; i < 200 && criticalResidual(s, Q, hi) > 0; i++) hi *= 2;
  }
  let lo = hi / 2;
  for (let i = 0; i < 400 && criticalResidual(s, Q, lo) < 0; i++) lo /= 2;
  if (lo < Y_MIN && criticalResidual(s, Q, lo) < 0) {
    throw new InputError(
      'Q',
      'too-small',
      'Q (discharge): critical depth below the smallest depth considered',
      { Q },
    );
  }
  return brent((y) => criticalResidual(s, Q, y), lo, hi, 'critical depth');
}

/**
 * Critical depth yc (m): Q²·T/(g·A³) = 1. Rectangle: yc = (q²/g)^(1/3). [Chow 1959, §3-2]
 * @example criticalDepth({ shape: 'trapezoidal', bottomWidth: 3, sideSlope: 2 }, 10) // ≈ 0.856
 */
export function criticalDepth(section: Section, Q: number): number {
  checkSQ(section, Q);
  return _criticalDepth(section, Q);
}

/** Velocity V = Q/A (m/s). */
export function velocity(section: Section, Q: number, y: number): number {
  checkSQ(section, Q);
  checkY(section, y);
  return _velocity(section, Q, y);
}

/**
 * Froude number Fr = V / √(g·A/T) (dimensionless). [Chow 1959, §1-4]
 * @example froudeNumber({ shape: 'rectangular', width: 5 }, 4.43, 0.2) // ≈ 3.16
 */
export function froudeNumber(section: Section, Q: number, y: number): number {
  checkSQ(section, Q);
  checkY(section, y);
  return _froude(section, Q, y);
}

/**
 * Specific energy E = y + Q²/(2g·A²) (m above the bed). [Chow 1959, §3-1]
 * @example specificEnergy({ shape: 'rectangular', width: 1 }, 1, 0.5) // 0.5 + 1/(2·9.80665·0.25)
 */
export function specificEnergy(section: Section, Q: number, y: number): number {
  checkSQ(section, Q);
  checkY(section, y);
  return _energy(section, Q, y);
}

/**
 * Momentum function M = Q²/(g·A) + A·ȳ (m³). Equal on both sides of a jump. [Chow 1959, §3-6]
 * @example momentumFunction({ shape: 'rectangular', width: 1 }, 1, 1) // 1/9.80665 + 0.5
 */
export function momentumFunction(section: Section, Q: number, y: number): number {
  checkSQ(section, Q);
  checkY(section, y);
  return _momentum(section, Q, y);
}

/** Discharge carried at normal depth y by Manning: Q = (k/n)·A·R^(2/3)·√S. */
export function manningDischarge(
  section: Section,
  y: number,
  slope: number,
  manningN: number,
  k: number = MANNING_K_SI,
): number {
  validateSection(section);
  checkY(section, y);
  requirePositive('slope', slope);
  requirePositive('manningN', manningN);
  requirePositive('k (Manning unit factor)', k);
  const g = geometry(section, y);
  return (k / manningN) * g.area * Math.pow(g.hydraulicRadius, 2 / 3) * Math.sqrt(slope);
}

export function _normalDepth(s: Section, Q: number, slope: number, n: number, k: number): number {
  const c = (k / n) * Math.sqrt(slope);
  const qOf = (y: number): number => {
    const g = geometry(s, y);
    return c * g.area * Math.pow(g.hydraulicRadius, 2 / 3);
  };
  let hi: number;
  if (s.shape === 'circular') {
    // A pipe carries most not when full but near 0.94 D: search the rising branch only.
    hi = goldenMax(qOf, 0.5 * s.diameter, s.diameter);
    const qMax = qOf(hi);
    if (Q > qMax) {
      throw new InputError(
        'Q',
        'conduit-capacity',
        `Q (discharge) ${Q} m³/s exceeds the open-channel capacity of the conduit (${qMax.toPrecision(5)} m³/s at normal depth)`,
        { Q, capacity: qMax },
      );
    }
  } else {
    hi = 1;
    for (let i = 0; i < 200 && qOf(hi) < Q; i++) hi *= 2;
  }
  let lo = hi / 2;
  for (let i = 0; i < 400 && qOf(lo) > Q; i++) lo /= 2;
  return brent((y) => qOf(y) / Q - 1, lo, hi, 'normal depth');
}

/**
 * Normal depth yn (m) by Manning: Q = (k/n)·A·R^(2/3)·S^(1/2), k = 1 (SI) or 1.486 (US,
 * with every length in ft and Q in ft³/s). [Chow 1959, §5-6]
 * @example normalDepth({ shape: 'rectangular', width: 3 }, 5, 1 / 500, 0.025) // ≈ 1.215
 */
export function normalDepth(
  section: Section,
  Q: number,
  slope: number,
  manningN: number,
  k: number = MANNING_K_SI,
): number {
  checkSQ(section, Q);
  requirePositive('slope (normal depth needs a downhill bed)', slope);
  requirePositive('manningN', manningN);
  requirePositive('k (Manning unit factor)', k);
  return _normalDepth(section, Q, slope, manningN, k);
}

/** Friction slope Sf = (n·Q)²/(k²·A²·R^(4/3)) (Manning). */
export function _frictionSlope(s: Section, Q: number, y: number, n: number): number {
  if (s.shape === 'rectangular') {
    const a = s.width * y;
    const v = Q / a;
    return (n * n * v * v) / Math.pow(a / (s.width + 2 * y), 4 / 3);
  }
  const g = geometry(s, y);
  const v = Q / g.area;
  return (n * n * v * v) / Math.pow(g.hydraulicRadius, 4 / 3);
}

export function _supercriticalRoot(s: Section, Q: number, E: number, yc: number): number {
  const eMin = _energy(s, Q, yc);
  if (E < eMin * (1 - 1e-12)) {
    throw new InputError(
      'E',
      'energy-too-low',
      `E (specific energy) ${E} m is below the minimum ${eMin.toPrecision(6)} m at critical depth: the flow cannot pass`,
      { E, eMin },
    );
  }
  if (E <= eMin) return yc;
  let lo = yc / 2;
  for (let i = 0; i < 400 && _energy(s, Q, lo) < E; i++) lo /= 2;
  return brent((y) => _energy(s, Q, y) / E - 1, lo, yc, 'supercritical depth');
}

export function _subcriticalRoot(s: Section, Q: number, E: number, yc: number): number {
  const eMin = _energy(s, Q, yc);
  if (E < eMin * (1 - 1e-12)) {
    throw new InputError(
      'E',
      'energy-too-low',
      `E (specific energy) ${E} m is below the minimum ${eMin.toPrecision(6)} m at critical depth: the flow cannot pass`,
      { E, eMin },
    );
  }
  if (E <= eMin) return yc;
  const top = maxDepth(s);
  let hi: number;
  if (Number.isFinite(top)) {
    hi = top;
    if (_energy(s, Q, hi) < E) {
      throw new InputError(
        'E',
        'conduit-full',
        `E (specific energy) ${E} m: the subcritical depth would overfill the conduit`,
        { E },
      );
    }
  } else {
    hi = Math.max(E, yc * 2);
  }
  return brent((y) => _energy(s, Q, y) / E - 1, yc, hi, 'subcritical depth');
}

/**
 * Supercritical (shallow) root of E = y + Q²/(2g·A²) (m). [Chow 1959, §3-1]
 * @example supercriticalDepth({ shape: 'rectangular', width: 1 }, 5, 20) // ≈ 0.25403
 */
export function supercriticalDepth(section: Section, Q: number, E: number): number {
  checkSQ(section, Q);
  requirePositive('E', E);
  return _supercriticalRoot(section, Q, E, _criticalDepth(section, Q));
}

/** Subcritical (deep) root of the energy equation (m). [Chow 1959, §3-1] */
export function subcriticalDepth(section: Section, Q: number, E: number): number {
  checkSQ(section, Q);
  requirePositive('E', E);
  return _subcriticalRoot(section, Q, E, _criticalDepth(section, Q));
}

/** Both roots of the energy equation, supercritical first. */
export function alternateDepths(
  section: Section,
  Q: number,
  E: number,
): { supercritical: number; subcritical: number } {
  checkSQ(section, Q);
  requirePositive('E', E);
  const yc = _criticalDepth(section, Q);
  return {
    supercritical: _supercriticalRoot(section, Q, E, yc),
    subcritical: _subcriticalRoot(section, Q, E, yc),
  };
}

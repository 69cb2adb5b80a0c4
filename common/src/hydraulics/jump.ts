// The hydraulic jump in a prismatic channel: sequent depth by the momentum function (any
// section), losses, length and class. SI units; g = 9.80665 m/s², ρ = 1000 kg/m³.
import { InputError } from '../errors';
import { G, RHO_WATER } from '../units/constants';
import { requireNonNegative, requirePositive } from './guards';
import { _criticalDepth, _energy, _froude, _momentum, _velocity } from './depths';
import { validateSection, type Section } from './sections';
import { brent } from './solve';

export type JumpClass = 'none' | 'undular' | 'weak' | 'oscillating' | 'steady' | 'strong';
export type JumpLengthMethod = 'usbr' | 'hager';

export interface JumpResult {
  /** depth before the jump, m */
  y1: number;
  /** sequent depth after the jump, m */
  y2: number;
  /** velocities, m/s */
  v1: number;
  v2: number;
  /** Froude numbers before and after */
  fr1: number;
  fr2: number;
  /** head loss E1 − E2, m */
  headLoss: number;
  /** ΔE / E1 */
  relativeLoss: number;
  /** E2 / E1 */
  efficiency: number;
  /** jump height y2 − y1, m */
  height: number;
  /** jump length, m (USBR curve unless Hager's relation was asked for) */
  length: number;
  /** roller length, m (Hager's relation) */
  rollerLength: number;
  jumpClass: JumpClass;
  /** power dissipated ρ·g·Q·ΔE, W */
  power: number;
}

/** Thrown when the sequent depth of a jump in a closed conduit would exceed its diameter. */
export class ConduitFullError extends InputError {
  constructor(
    readonly diameter: number,
    readonly momentumNeeded: number,
    readonly momentumFull: number,
  ) {
    super(
      'y1',
      'conduit-full',
      `the conduit (diameter ${diameter} m) would run full: the sequent depth exceeds the diameter ` +
        `(momentum needed ${momentumNeeded.toPrecision(5)} m³, open-channel maximum ${momentumFull.toPrecision(5)} m³); ` +
        'pressurised flow is outside this open-channel method',
      { diameter },
    );
    this.name = 'ConduitFullError';
  }
}

/**
 * Jump class by inflow Froude number [src: USBR classification via Chow 1959, §15-2]:
 * ≤ 1 none, 1–1.7 undular, 1.7–2.5 weak, 2.5–4.5 oscillating, 4.5–9 steady, > 9 strong.
 * @example classifyJump(6) // 'steady'
 */
export function classifyJump(fr1: number): JumpClass {
  requireNonNegative('fr1', fr1);
  if (fr1 <= 1) return 'none';
  if (fr1 < 1.7) return 'undular';
  if (fr1 < 2.5) return 'weak';
  if (fr1 < 4.5) return 'oscillating';
  if (fr1 <= 9) return 'steady';
  return 'strong';
}

/** Bélanger's equation, rectangle only: y2/y1 = ½(√(1+8Fr1²) − 1). [Chow 1959, eq. 3-20] */
export function belangerRatio(fr1: number): number {
  requirePositive('fr1', fr1);
  return 0.5 * (Math.sqrt(1 + 8 * fr1 * fr1) - 1);
}

/** Floor slope (rise over run) up to which a jump is treated as on a horizontal floor [src: HEC-14 ch. 6]. */
export const HORIZONTAL_APRON_SLOPE = 0.1;

export interface SlopingApronJump {
  /** sequent depth, m */
  y2: number;
  /** y2 / y1 */
  ratio: number;
  /** Γ = 10^(0.027·θ°) (1 when treated as horizontal) */
  gamma: number;
  /** G = Γ·Fr1, the Froude number the relation uses */
  G: number;
  /** floor slope as given (rise over run) and its angle, degrees */
  slope: number;
  angleDeg: number;
  /** true when the slope is at most 10 %: Bélanger on a horizontal floor */
  treatedAsHorizontal: boolean;
  notes: string[];
}

/**
 * Sequent depth of a jump on a sloping apron (Rajaratnam; relation from memory, hydraulics.md
 * §1 [mem] — check against the publication before relying on it): y2/y1 = ½(√(1 + 8·G²) − 1),
 * G = Γ·Fr1, Γ = 10^(0.027·θ°), θ the floor angle in degrees. A floor of at most 10 % slope is
 * treated as horizontal (Γ = 1, Bélanger) [src: HEC-14 ch. 6]; above it the result says so.
 * `slope` is rise over run (0.2 = 20 %), ≥ 0; y1 in m; Fr1 > 1.
 * @example slopingApronJump(6, 0.3, 0.25).y2 // θ = 14.04°, Γ = 2.39, y2 ≈ 5.93 m
 */
export function slopingApronJump(fr1: number, y1: number, slope: number): SlopingApronJump {
  requirePositive('fr1', fr1);
  if (!(fr1 > 1))
    throw new InputError(
      'fr1',
      'not-supercritical',
      `fr1 (inflow Froude number) ${fr1} is not supercritical (≤ 1): no jump forms`,
      { fr1 },
    );
  requirePositive('y1', y1);
  requireNonNegative('slope (floor slope, rise over run)', slope);
  const angleDeg = (Math.atan(slope) * 180) / Math.PI;
  const flat = slope <= HORIZONTAL_APRON_SLOPE;
  const gamma = flat ? 1 : Math.pow(10, 0.027 * angleDeg);
  const Gf = gamma * fr1;
  const ratio = 0.5 * (Math.sqrt(1 + 8 * Gf * Gf) - 1);
  const notes = flat
    ? [
        `floor slope ${(slope * 100).toFixed(1)} % is at most 10 %: treated as horizontal (Bélanger) [src: HEC-14 ch. 6]`,
      ]
    : [
        `floor slope ${(slope * 100).toFixed(1)} % exceeds 10 %: sloping-apron jump, Γ = 10^(0.027·${angleDeg.toFixed(2)}°) = ${gamma.toFixed(3)} (Rajaratnam, from memory)`,
      ];
  return { y2: ratio * y1, ratio, gamma, G: Gf, slope, angleDeg, treatedAsHorizontal: flat, notes };
}

/** USBR jump-length curve L/y2 against Fr1, approximate points (from memory; see hydraulics.md §1). */
export const USBR_LENGTH_CURVE: ReadonlyArray<readonly [number, number]> = [
  [1.7, 4.0],
  [2, 4.3],
  [2.5, 4.8],
  [3, 5.25],
  [3.5, 5.55],
  [4, 5.8],
  [4.5, 5.9],
  [5, 6.0],
  [6, 6.1],
  [8, 6.1],
  [10, 6.1],
  [12, 6.0],
];

/**
 * Jump length on a horizontal floor from the USBR curve L/y2 = f(Fr1), linear between the
 * points, held at the end values outside 1.7–12 (the curve is not extended). Metres.
 * @example jumpLengthUSBR(6, 8) // 6.1 · 8 = 48.8
 */
export function jumpLengthUSBR(fr1: number, y2: number): number {
  requirePositive('fr1', fr1);
  requirePositive('y2', y2);
  const c = USBR_LENGTH_CURVE;
  const first = c[0]!;
  const last = c[c.length - 1]!;
  if (fr1 <= first[0]) return first[1] * y2;
  if (fr1 >= last[0]) return last[1] * y2;
  for (let i = 1; i < c.length; i++) {
    const [x1, r1] = c[i]!;
    const [x0, r0] = c[i - 1]!;
    if (fr1 <= x1) return (r0 + ((r1 - r0) * (fr1 - x0)) / (x1 - x0)) * y2;
  }
  return last[1] * y2;
}

/** Hager's jump length Lj/y1 = 220·tanh((Fr1 − 1)/22) (from memory), metres. */
export function jumpLengthHager(fr1: number, y1: number): number {
  requirePositive('fr1', fr1);
  requirePositive('y1', y1);
  return Math.max(0, 220 * Math.tanh((fr1 - 1) / 22) * y1);
}

/** Hager's roller length Lr/y1 = 160·tanh(Fr1/20) − 12 (from memory), never below 0, metres. */
export function rollerLength(fr1: number, y1: number): number {
  requirePositive('fr1', fr1);
  requirePositive('y1', y1);
  return Math.max(0, (160 * Math.tanh(fr1 / 20) - 12) * y1);
}

/** Depth with the same momentum function on the other side of critical (validated inputs). */
export function _conjugate(s: Section, Q: number, y: number, yc: number): number {
  const m = _momentum(s, Q, y);
  const f = (x: number): number => _momentum(s, Q, x) / m - 1;
  if (Math.abs(y - yc) <= 1e-12 * yc) return y;
  if (y < yc) {
    if (s.shape === 'circular') {
      const mFull = _momentum(s, Q, s.diameter);
      if (mFull < m) throw new ConduitFullError(s.diameter, m, mFull);
      return brent(f, yc, s.diameter, 'sequent depth');
    }
    let hi = 2 * yc;
    for (let i = 0; i < 200 && f(hi) < 0; i++) hi *= 2;
    return brent(f, yc, hi, 'sequent depth');
  }
  let lo = yc / 2;
  for (let i = 0; i < 400 && f(lo) < 0; i++) lo /= 2;
  return brent(f, lo, yc, 'supercritical conjugate depth');
}

function checkJumpInput(section: Section, Q: number, y1: number): void {
  validateSection(section);
  requirePositive('Q', Q);
  requirePositive('y1', y1);
  if (section.shape === 'circular' && y1 >= section.diameter) {
    throw new InputError(
      'y1',
      'conduit-full',
      `y1 ${y1} m is not below the conduit diameter ${section.diameter} m`,
      { depth: y1, diameter: section.diameter },
    );
  }
}

/**
 * Sequent depth y2 (m) of a jump from supercritical depth y1: M(y1) = M(y2), any section.
 * Rectangles agree with Bélanger. A circular conduit that would run full throws
 * ConduitFullError (a RangeError). [Chow 1959, §3-6]
 * @example sequentDepth({ shape: 'rectangular', width: 1 }, 3, 0.568) // ≈ 1.53
 */
export function sequentDepth(section: Section, Q: number, y1: number): number {
  checkJumpInput(section, Q, y1);
  const fr1 = _froude(section, Q, y1);
  if (fr1 <= 1) {
    throw new InputError(
      'y1',
      'not-supercritical',
      `y1 ${y1} m is not supercritical (Fr1 = ${fr1.toPrecision(4)} ≤ 1): no jump forms`,
      { y1, fr1 },
    );
  }
  return _conjugate(section, Q, y1, _criticalDepth(section, Q));
}

/**
 * The depth of equal momentum on the other side of critical: the sequent of a supercritical
 * depth, or the supercritical conjugate of a subcritical one (m).
 */
export function conjugateDepth(section: Section, Q: number, y: number): number {
  checkJumpInput(section, Q, y);
  return _conjugate(section, Q, y, _criticalDepth(section, Q));
}

export interface JumpOptions {
  /** 'usbr' (default) or 'hager' for the jump length */
  lengthMethod?: JumpLengthMethod;
}

/**
 * Everything about a free jump on a horizontal floor from supercritical y1 (m) at Q (m³/s):
 * sequent depth by momentum, E1 − E2, efficiency, length, roller, class, power (W).
 * [Chow 1959, ch. 15; lengths from memory as documented]
 * @example hydraulicJump({ shape: 'rectangular', width: 5 }, 4.43, 0.2).y2 // ≈ 0.8
 */
export function hydraulicJump(
  section: Section,
  Q: number,
  y1: number,
  options: JumpOptions = {},
): JumpResult {
  checkJumpInput(section, Q, y1);
  const fr1 = _froude(section, Q, y1);
  if (fr1 <= 1) {
    throw new InputError(
      'y1',
      'not-supercritical',
      `y1 ${y1} m is not supercritical (Fr1 = ${fr1.toPrecision(4)} ≤ 1): no jump forms`,
      { y1, fr1 },
    );
  }
  const y2 = _conjugate(section, Q, y1, _criticalDepth(section, Q));
  return jumpFromDepths(section, Q, y1, y2, fr1, options);
}

export function jumpFromDepths(
  section: Section,
  Q: number,
  y1: number,
  y2: number,
  fr1: number,
  options: JumpOptions = {},
): JumpResult {
  const e1 = _energy(section, Q, y1);
  const e2 = _energy(section, Q, y2);
  // Rounding can make a very weak jump's loss −1e-17: a jump never gains energy.
  const headLoss = Math.max(0, e1 - e2);
  const length =
    options.lengthMethod === 'hager' ? jumpLengthHager(fr1, y1) : jumpLengthUSBR(fr1, y2);
  return {
    y1,
    y2,
    v1: _velocity(section, Q, y1),
    v2: _velocity(section, Q, y2),
    fr1,
    fr2: _froude(section, Q, y2),
    headLoss,
    relativeLoss: headLoss / e1,
    efficiency: e2 / e1,
    height: y2 - y1,
    length,
    rollerLength: rollerLength(fr1, y1),
    jumpClass: classifyJump(fr1),
    power: RHO_WATER * G * Q * headLoss,
  };
}

/** Head loss of a jump in a rectangle from the depths alone: (y2 − y1)³/(4·y1·y2). [Chow 1959, eq. 15-1] */
export function rectangularJumpLoss(y1: number, y2: number): number {
  requirePositive('y1', y1);
  requirePositive('y2', y2);
  return Math.pow(y2 - y1, 3) / (4 * y1 * y2);
}

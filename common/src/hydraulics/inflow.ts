// Inflow at the toe of the basin, per unit width of a rectangular floor. SI units.
// Sources per function; hydraulics.md §2.
import { InputError } from '../errors';
import { G } from '../units/constants';
import { requireInRange, requireNonNegative, requirePositive } from './guards';
import { ENGINE_LIMITS } from '../schemas/limits';

const CC = ENGINE_LIMITS.contractionCoefficient;
import { _criticalDepth, _froude, _normalDepth } from './depths';
import type { Section } from './sections';
import { geometry, validateSection } from './sections';
import { brent } from './solve';

/** How the head lost between the reservoir (or outlet) and the toe is allowed for. */
export type LossModel =
  | { kind: 'none' }
  /** hL = value · H0 */
  | { kind: 'fraction'; value: number }
  /** V1 = Cv·√(2g(H0 − y1)) */
  | { kind: 'velocityCoefficient'; Cv: number }
  /** H0 = y1 + (1 + K)·V1²/(2g) */
  | { kind: 'lossCoefficient'; K: number };

/** Flow at the toe of the basin (upstream end of the jump). */
export interface ToeConditions {
  /** unit discharge, m²/s */
  q: number;
  /** depth, m */
  y1: number;
  /** velocity, m/s */
  v1: number;
  /** Froude number V1/√(g·y1) */
  fr1: number;
  /** total head above the floor before losses, m (NaN-free: 0 when not applicable) */
  H0: number;
  /** head lost before the toe, m */
  headLoss: number;
}

function toe(q: number, y1: number, H0: number): ToeConditions {
  const v1 = q / y1;
  return {
    q,
    y1,
    v1,
    fr1: v1 / Math.sqrt(G * y1),
    H0,
    headLoss: Math.max(0, H0 - y1 - (v1 * v1) / (2 * G)),
  };
}

export function validateLossModel(loss: LossModel): void {
  switch (loss.kind) {
    case 'none':
      return;
    case 'fraction':
      requireInRange('loss.value (fraction of head)', loss.value, 0, 0.95);
      return;
    case 'velocityCoefficient':
      requireInRange('loss.Cv (velocity coefficient)', loss.Cv, 0.1, 1);
      return;
    case 'lossCoefficient':
      requireNonNegative('loss.K (loss coefficient)', loss.K);
      return;
    default:
      throw new InputError(
        'loss.kind',
        'unknown-option',
        `loss.kind must be 'none', 'fraction', 'velocityCoefficient' or 'lossCoefficient'`,
        {},
      );
  }
}

/**
 * Depth at the toe of a chute or spillway from the total head H0 above the basin floor (m)
 * and unit discharge q (m²/s): y1 is the supercritical root of H0 − hL = y1 + q²/(2g·y1²),
 * with the loss as the user chose (fraction of H0, velocity coefficient, loss coefficient).
 * [Chow 1959, §3-1; Cv form: quoted hydraulic-formula collections; hydraulics.md §2]
 * @example toeFromHead(5, 20, { kind: 'none' }).y1 // ≈ 0.2541
 */
export function toeFromHead(
  q: number,
  H0: number,
  loss: LossModel = { kind: 'none' },
): ToeConditions {
  requirePositive('q', q);
  requirePositive('H0', H0);
  validateLossModel(loss);
  return toe(q, _toeDepth(q, H0, loss), H0);
}

/**
 * y1 (m) for validated q, H0 and loss model. Every loss model has the form E = y + c/y²:
 * fraction E = (1 − f)·H0, c = q²/2g; velocity coefficient E = H0, c = q²/(2g·Cv²) (from
 * V1 = Cv·√(2g(H0 − y1))); loss coefficient E = H0, c = (1 + K)·q²/2g. The shallow root is
 * found by Newton's method from the left, which on this convex, falling branch climbs to the
 * root without overshooting (allocation-free: the whole-range study calls it constantly).
 */
export function _toeDepth(q: number, H0: number, loss: LossModel): number {
  const y = _toeDepthOrNegative(q, H0, loss);
  if (y < 0) {
    const what =
      loss.kind === 'velocityCoefficient'
        ? ` with Cv = ${loss.Cv}`
        : loss.kind === 'lossCoefficient'
          ? ` with K = ${loss.K}`
          : '';
    throw new InputError(
      'H0',
      'head-too-small',
      `H0 (head above the floor) ${H0} m is too small to pass q = ${q} m²/s${what}`,
      { H0, q },
    );
  }
  return y;
}

/** As _toeDepth, but −1 when the head cannot pass q (no exception in the floor search). */
export function _toeDepthOrNegative(q: number, H0: number, loss: LossModel): number {
  if (!(H0 > 0)) return -1;
  let E = H0;
  let c = (q * q) / (2 * G);
  if (loss.kind === 'fraction') E = H0 * (1 - loss.value);
  else if (loss.kind === 'velocityCoefficient') c /= loss.Cv * loss.Cv;
  else if (loss.kind === 'lossCoefficient') c *= 1 + loss.K;
  const yStar = Math.cbrt(2 * c); // least E of y + c/y² is 1.5·y*
  if (E < 1.5 * yStar * (1 - 1e-12)) return -1;
  let y = Math.min(Math.sqrt(c / E), yStar); // c/y² = E: left of the root
  for (let i = 0; i < 100; i++) {
    const f = y + c / (y * y) - E;
    const d = 1 - (2 * c) / (y * y * y);
    if (!(d < 0) || f <= 0) break; // at the minimum, or rounding reached the root
    const next = y - f / d;
    if (!(next > y) || next >= yStar) break;
    const done = next - y <= 1e-15 * next;
    y = next;
    if (done) break;
  }
  return y;
}

/**
 * Head on a weir crest from Q = C·L·H^1.5 (C in SI units, m^0.5/s), m. [standard weir equation]
 * @example weirHead(85, 2.15, 12) // ≈ 2.26
 */
export function weirHead(Q: number, C: number, L: number): number {
  requirePositive('Q', Q);
  requirePositive('weir.C (weir coefficient)', C);
  requirePositive('weir.L (crest length)', L);
  return Math.pow(Q / (C * L), 2 / 3);
}

export interface GateFlow {
  /** unit discharge under the gate, m²/s */
  q: number;
  /** vena contracta depth Cc·a, m */
  y1: number;
  /** discharge coefficient Cd = Cc/√(1 + Cc·a/y0) */
  Cd: number;
  v1: number;
  fr1: number;
  opening: number;
  upstreamDepth: number;
}

function checkGate(a: number, Cc: number, y0: number): void {
  requirePositive('gate.opening', a);
  requireInRange('gate.Cc', Cc, CC.min, CC.max);
  requirePositive('gate.upstreamDepth', y0);
  if (a >= y0) {
    throw new InputError(
      'gate.opening',
      'gate-not-controlling',
      `gate.opening ${a} m is not below the upstream depth ${y0} m: the gate does not control the flow`,
      { opening: a, upstreamDepth: y0 },
    );
  }
}

function gateResult(a: number, Cc: number, y0: number): GateFlow {
  const Cd = Cc / Math.sqrt(1 + (Cc * a) / y0);
  const q = Cd * a * Math.sqrt(2 * G * y0);
  const y1 = Cc * a;
  const v1 = q / y1;
  return { q, y1, Cd, v1, fr1: v1 / Math.sqrt(G * y1), opening: a, upstreamDepth: y0 };
}

/**
 * Free flow under a sluice gate: y1 = Cc·a, q = Cd·a·√(2g·y0), Cd = Cc/√(1 + Cc·a/y0).
 * Cc ≈ 0.61 [Henderson 1966, Open Channel Flow, §6.3: 0.598–0.611]. Free only while the
 * tailwater is no deeper than the sequent depth of y1.
 * @example gateFlow({ opening: 0.5, Cc: 0.61, upstreamDepth: 3 }).q // ≈ 2.229
 */
export function gateFlow(g: { opening: number; Cc: number; upstreamDepth: number }): GateFlow {
  checkGate(g.opening, g.Cc, g.upstreamDepth);
  return gateResult(g.opening, g.Cc, g.upstreamDepth);
}

/** Upstream depth y0 (m) that passes q (m²/s) under opening a: closed-form root of the gate equation. */
export function gateUpstreamDepth(q: number, opening: number, Cc: number): number {
  requirePositive('q', q);
  requirePositive('gate.opening', opening);
  requireInRange('gate.Cc', Cc, CC.min, CC.max);
  // q²(y0 + Cc·a) = 2g·Cc²·a²·y0²  →  quadratic in y0, positive root.
  const A = 2 * G * Cc * Cc * opening * opening;
  const y0 = (q * q + Math.sqrt(q ** 4 + 4 * A * q * q * Cc * opening)) / (2 * A);
  if (y0 <= opening) {
    throw new InputError(
      'gate.opening',
      'gate-opening-too-large',
      `gate.opening ${opening} m is too large for q = ${q} m²/s: the water would not touch the gate (upstream depth ${y0.toPrecision(4)} m)`,
      { opening, q },
    );
  }
  return y0;
}

/** Opening a (m) that passes q (m²/s) with upstream depth y0 (m). */
export function gateOpening(q: number, upstreamDepth: number, Cc: number): number {
  requirePositive('q', q);
  requirePositive('gate.upstreamDepth', upstreamDepth);
  requireInRange('gate.Cc', Cc, CC.min, CC.max);
  const qOf = (a: number): number => gateResult(a, Cc, upstreamDepth).q;
  const aMax = upstreamDepth * (1 - 1e-9);
  if (q > qOf(aMax)) {
    throw new InputError(
      'gate.upstreamDepth',
      'gate-pool-too-shallow',
      `gate.upstreamDepth ${upstreamDepth} m is too small to pass q = ${q} m²/s under the gate (at most ${qOf(aMax).toPrecision(5)} m²/s)`,
      { upstreamDepth, q },
    );
  }
  return brent((a) => qOf(a) / q - 1, 1e-12 * upstreamDepth, aMax, 'gate opening');
}

/**
 * Jet flare from a culvert or pipe outlet: tanθ = 1/(3·Fr) — walls that diverge faster than
 * this separate from the flow. [HEC-14 2006, ch. 6; errata example Fr = 1.52 → 0.22]
 * @example jetFlareTangent(1.52) // ≈ 0.219
 */
export function jetFlareTangent(fr: number): number {
  requirePositive('fr (outlet Froude number)', fr);
  return 1 / (3 * fr);
}

export interface OutletFlow {
  depth: number;
  velocity: number;
  fr: number;
  /** 'normal' when the barrel is steep (yn < yc), 'critical' otherwise */
  control: 'normal' | 'critical' | 'given';
}

/**
 * Depth and velocity at a culvert or pipe outlet from its barrel: normal depth when that is
 * supercritical, else critical depth (free outfall) — common practice for a concept check.
 */
export function outletFlow(
  barrel: Section,
  Q: number,
  slope: number,
  manningN: number,
): OutletFlow {
  validateSection(barrel);
  requirePositive('Q', Q);
  requirePositive('pipe.slope', slope);
  requirePositive('pipe.manningN', manningN);
  const yc = _criticalDepth(barrel, Q);
  // A barrel too small for Q is refused by _normalDepth (coded: its capacity quoted).
  const yn = _normalDepth(barrel, Q, slope, manningN, 1);
  const depth = yn < yc ? yn : yc;
  const a = geometry(barrel, depth).area;
  return {
    depth,
    velocity: Q / a,
    fr: _froude(barrel, Q, depth),
    control: yn < yc ? 'normal' : 'critical',
  };
}

/**
 * Toe conditions on a floor `drop` (m) below a pipe or culvert outlet invert: energy from
 * outlet depth and velocity, then the supercritical root in the basin (unit width, q = Q/b).
 * [energy equation; hydraulics.md §2]
 */
export function toeFromOutlet(
  q: number,
  outlet: { depth: number; velocity: number },
  drop: number,
  loss: LossModel = { kind: 'none' },
): ToeConditions {
  requirePositive('outlet.depth', outlet.depth);
  requirePositive('outlet.velocity', outlet.velocity);
  const H0 = drop + outlet.depth + (outlet.velocity * outlet.velocity) / (2 * G);
  if (!(H0 > 0))
    throw new InputError(
      'floorElevation',
      'above-energy-line',
      `floor elevation: the basin floor lies above the outlet's energy line`,
      { H0 },
    );
  return toeFromHead(q, H0, loss);
}

/** Known toe conditions as typed: depth and velocity, or Fr1 with q or with y1. */
export type KnownToe =
  { y1: number; v1: number } | { fr1: number; q: number } | { fr1: number; y1: number };

/**
 * Completes known toe conditions. Fr1 & q: y1 = (q/(Fr1·√g))^(2/3); Fr1 & y1: q = Fr1·√(g·y1)·y1.
 * @example toeFromKnown({ fr1: 2, y1: 0.467 }).q // ≈ 2.0
 */
export function toeFromKnown(k: KnownToe): ToeConditions {
  if ('v1' in k) {
    requirePositive('known.y1', k.y1);
    requirePositive('known.v1', k.v1);
    return toe(k.y1 * k.v1, k.y1, 0);
  }
  if ('q' in k) {
    requirePositive('known.fr1', k.fr1);
    requirePositive('known.q', k.q);
    const y1 = Math.pow(k.q / (k.fr1 * Math.sqrt(G)), 2 / 3);
    return toe(k.q, y1, 0);
  }
  requirePositive('known.fr1', k.fr1);
  requirePositive('known.y1', k.y1);
  return toe(k.fr1 * Math.sqrt(G * k.y1) * k.y1, k.y1, 0);
}

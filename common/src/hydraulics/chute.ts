// The chute computed: the water surface down a steep rectangular chute from critical depth at
// the crest to the toe, by the direct step method with Manning friction (profiles.ts), so the
// depth at the toe comes from the chute's own friction instead of a typed loss allowance.
// SI units. [Chow 1959, §10-2 (direct step), §5-6 (Manning); S2 profile below a crest, §9-3]
import { G } from '../units/constants';
import { InputError } from '../errors';
import { CHUTE_SLOPE_RANGE, ENGINE_LIMITS } from '../schemas/limits';
import { _froude, _normalDepth } from './depths';
import { requireInRange, requirePositive } from './guards';
import { directStepProfile, type ProfilePoint } from './profiles';
import type { Section } from './sections';

/** The chute's own geometry: when given, y1 comes from its friction, not from a loss allowance. */
export interface ChuteGeometry {
  /** bed slope of the chute, vertical over horizontal (tan θ): 0.5 is 1V:2H */
  slope: number;
  /** width of the rectangular chute, m (default: the basin width) */
  width?: number;
  /** Manning's n of the chute lining (formed concrete ≈ 0.013–0.015, common practice) */
  manningN: number;
}

/** Depth steps of each stretch of the tabulated profile (three stretches, each nearer yn). */
const STEPS = 200;
/** The tabulated profile stops where y − yn is this fraction of yc − yn; beyond it y = yn. */
const TAIL = 1e-6;

/** The S2 profile of one discharge down a chute, tabulated once: depth against distance along the bed. */
export interface ChuteProfile {
  Q: number;
  /** critical depth on the crest, m */
  yc: number;
  /** normal depth on the chute, m (the profile tends to it) */
  yn: number;
  /** sin θ: the bed slope the step method uses, distance measured along the bed */
  sinTheta: number;
  width: number;
  /** distance along the bed from the crest (m) and depth normal to it (m), x ascending */
  points: ProfilePoint[];
}

export function validateChute(c: ChuteGeometry, field = 'inflow.chute'): void {
  if (!c || typeof c !== 'object') throw new InputError(field, 'invalid', `${field} must be given`);
  requireInRange(`${field}.slope`, c.slope, CHUTE_SLOPE_RANGE.min, CHUTE_SLOPE_RANGE.max);
  requireInRange(
    `${field}.manningN`,
    c.manningN,
    ENGINE_LIMITS.manningN.min,
    ENGINE_LIMITS.manningN.max,
  );
  if (c.width !== undefined) requirePositive(`${field}.width`, c.width);
}

/**
 * Tabulates the water surface down a rectangular chute of width `width` (m) at discharge Q
 * (m³/s): critical depth yc = (q²/g)^⅓ on the crest, then the S2 drawdown towards normal depth
 * yn by the direct step method (directStepProfile), in three stretches each a hundred times
 * nearer yn (the distance grows like ln(y − yn) there). The bed slope in the step is sin θ with
 * distance along the bed and depth normal to it; the pressure correction cos θ is neglected
 * (concept level). InputError 'not-supercritical' when the chute is not steep at Q (yn ≥ yc).
 * [Chow 1959, §10-2, §9-3]
 */
export function chuteProfile(c: ChuteGeometry, width: number, Q: number): ChuteProfile {
  validateChute(c);
  requirePositive('Q', Q);
  const section: Section = { shape: 'rectangular', width };
  const sinTheta = c.slope / Math.sqrt(1 + c.slope * c.slope);
  const q = Q / width;
  const yc = Math.cbrt((q * q) / G);
  const yn = _normalDepth(section, Q, sinTheta, c.manningN, 1);
  if (!(yn < yc * (1 - 1e-9)))
    throw new InputError(
      'inflow.chute.slope',
      'not-supercritical',
      `inflow.chute: the chute is not steep at Q = ${Number(Q.toPrecision(4))} m³/s (normal depth ${yn.toPrecision(4)} m is not below critical ${yc.toPrecision(4)} m): the flow does not run supercritical down it`,
      { Q, fr1: _froude(section, Q, yn) },
    );
  const span = yc - yn;
  const points: ProfilePoint[] = [];
  let from = yc;
  let x0 = 0;
  for (const to of [yn + 1e-2 * span, yn + 1e-4 * span, yn + TAIL * span]) {
    const part = directStepProfile(section, Q, c.manningN, sinTheta, from, to, x0, STEPS);
    if (points.length > 0) part.shift(); // its first point is the last of the stretch before
    points.push(...part);
    x0 = points[points.length - 1]!.x;
    from = to;
  }
  return { Q, yc, yn, sinTheta, width, points };
}

/** Depth (m) at distance s (m) along the bed from the crest: linear between tabulated points. */
export function chuteDepthAt(p: ChuteProfile, s: number): number {
  const pts = p.points;
  if (!(s > 0)) return p.yc;
  const last = pts[pts.length - 1]!;
  if (s >= last.x) return last.y;
  let lo = 0;
  let hi = pts.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (pts[mid]!.x <= s) lo = mid;
    else hi = mid;
  }
  const a = pts[lo]!;
  const b = pts[hi]!;
  return a.y + ((b.y - a.y) * (s - a.x)) / (b.x - a.x);
}

/**
 * The flow at the foot of the chute for a floor `drop` metres below the crest: the depth where
 * the chute, running down at its slope, meets the floor (distance drop / sin θ along the bed),
 * and its specific energy E = y + V²/2g above the floor, m. `drop` ≤ 0: null (no chute).
 */
export function chuteFoot(
  p: ChuteProfile,
  drop: number,
): { y: number; energy: number; length: number } | null {
  if (!(drop > 0)) return null;
  const length = drop / p.sinTheta;
  const y = chuteDepthAt(p, length);
  const v = p.Q / (p.width * y);
  return { y, energy: y + (v * v) / (2 * G), length };
}

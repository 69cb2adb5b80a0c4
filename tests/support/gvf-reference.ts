// An independent reference for open-channel tests, written apart from the engine: a prismatic
// trapezoidal channel (z = 0 for a rectangle), SI, g = 9.80665 m/s² (NIST SP 330). Depths by
// bisection; gradually varied flow dy/dx = (S0 − Sf)/(1 − Fr²) (Chow 1959, eq. 9-13) integrated
// in x by classical Runge–Kutta; Manning friction (Chow 1959, §5-6); momentum function
// M = Q²/(gA) + A·ȳ (Chow 1959, §3-6). The engine steps in depth (direct step method): a
// different discretisation of the same physics.
import { G } from '@basinwright/common';

/** A prismatic channel: bottom width b, side slope z (H per 1V), Manning's n, bed slope S0, discharge Q. */
export interface Chan {
  b: number;
  z: number;
  n: number;
  S0: number;
  Q: number;
}

export const A = (c: Chan, y: number): number => c.b * y + c.z * y * y;
export const T = (c: Chan, y: number): number => c.b + 2 * c.z * y;
export const P = (c: Chan, y: number): number => c.b + 2 * y * Math.sqrt(1 + c.z * c.z);
/** friction slope by Manning, SI */
export const Sf = (c: Chan, y: number): number =>
  (c.n * c.Q) ** 2 / (A(c, y) ** 2 * (A(c, y) / P(c, y)) ** (4 / 3));
export const Fr2 = (c: Chan, y: number): number => (c.Q * c.Q * T(c, y)) / (G * A(c, y) ** 3);
/** momentum function per unit weight, m³ */
export const M = (c: Chan, y: number): number =>
  (c.Q * c.Q) / (G * A(c, y)) + (c.b * y * y) / 2 + (c.z * y ** 3) / 3;
export const dydx = (c: Chan, y: number): number => (c.S0 - Sf(c, y)) / (1 - Fr2(c, y));

/** A root of f between a and b (f changes sign there), to the last bit by 200 halvings. */
export function bisect(f: (x: number) => number, a: number, b: number): number {
  const fa = f(a) > 0;
  for (let i = 0; i < 200; i++) {
    const m = 0.5 * (a + b);
    if (f(m) > 0 === fa) a = m;
    else b = m;
  }
  return 0.5 * (a + b);
}

/** normal depth: Q = (1/n)·A·R^(2/3)·S0^(1/2) */
export const normal = (c: Chan): number =>
  bisect(
    (y) => (1 / c.n) * A(c, y) * (A(c, y) / P(c, y)) ** (2 / 3) * Math.sqrt(c.S0) - c.Q,
    1e-4,
    50,
  );
/** critical depth: Fr = 1 */
export const critical = (c: Chan): number => bisect((y) => Fr2(c, y) - 1, 1e-4, 50);
/** the depth of equal momentum on the other side of critical */
export function conj(c: Chan, y: number): number {
  const yc = critical(c);
  return y < yc
    ? bisect((x) => M(c, x) - M(c, y), yc, 50)
    : bisect((x) => M(c, x) - M(c, y), 1e-5, yc);
}

/** RK4 in x from (0, y0), step h (its sign the direction), until stop(y) ≥ 0; linear in the last step. */
export function rk4Until(c: Chan, y0: number, h: number, stop: (y: number) => number): number {
  let x = 0;
  let y = y0;
  for (let i = 0; i < 5_000_000; i++) {
    const k1 = dydx(c, y);
    const k2 = dydx(c, y + (h / 2) * k1);
    const k3 = dydx(c, y + (h / 2) * k2);
    const k4 = dydx(c, y + h * k3);
    const yn = y + (h / 6) * (k1 + 2 * k2 + 2 * k3 + k4);
    if (stop(yn) >= 0) {
      const s0 = stop(y);
      return x + (h * -s0) / (stop(yn) - s0);
    }
    x += h;
    y = yn;
  }
  throw new Error('reference integration did not reach its end');
}

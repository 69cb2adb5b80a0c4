// Monotone piecewise-cubic interpolation (Fritsch & Carlson 1980, SIAM J. Numer. Anal. 17:
// "Monotone piecewise cubic interpolation"): a rating curve stays monotone between its
// points, unlike a natural spline. Outside the table: straight-line continuation of the end
// segment, flagged so the caller can say so.
import { InputError } from '../errors';
import { requireFinite } from './guards';

export interface Interpolated {
  value: number;
  /** 'below' / 'above' when x lies outside the table (value extrapolated linearly) */
  outside: 'below' | 'above' | null;
}

export type Interpolant = (x: number) => Interpolated;

/**
 * Builds a monotone interpolant through (xs[i], ys[i]); xs strictly increasing, ≥ 2 points.
 * @param what names the table in RangeError messages
 * @example createMonotoneInterpolant([0, 1, 2], [0, 1, 4], 'rating')(1.5).value // between 1 and 4
 */
export function createMonotoneInterpolant(
  xs: readonly number[],
  ys: readonly number[],
  what: string,
): Interpolant {
  const n = xs.length;
  if (n < 2 || ys.length !== n)
    throw new InputError(
      what,
      'table-too-short',
      `${what}: needs at least two rows with both values`,
      {},
    );
  for (let i = 0; i < n; i++) {
    requireFinite(`${what} row ${i + 1}`, xs[i]);
    requireFinite(`${what} row ${i + 1}`, ys[i]);
    if (i > 0 && !(xs[i]! > xs[i - 1]!)) {
      throw new InputError(
        what,
        'table-not-increasing',
        `${what}: discharges must increase strictly from row to row (row ${i + 1})`,
        { row: i + 1 },
      );
    }
  }
  const h: number[] = [];
  const d: number[] = [];
  for (let i = 0; i < n - 1; i++) {
    h.push(xs[i + 1]! - xs[i]!);
    d.push((ys[i + 1]! - ys[i]!) / h[i]!);
  }
  const m: number[] = new Array<number>(n).fill(0);
  m[0] = d[0]!;
  m[n - 1] = d[n - 2]!;
  for (let i = 1; i < n - 1; i++) {
    const a = d[i - 1]!;
    const b = d[i]!;
    if (a * b <= 0) m[i] = 0;
    else {
      // Weighted harmonic mean (Fritsch–Butland form) keeps each piece monotone.
      const w1 = 2 * h[i]! + h[i - 1]!;
      const w2 = h[i]! + 2 * h[i - 1]!;
      m[i] = (w1 + w2) / (w1 / a + w2 / b);
    }
  }
  // End slopes: limit to three times the secant so the end pieces stay monotone.
  for (const [i, k] of [
    [0, 0],
    [n - 1, n - 2],
  ] as const) {
    const dk = d[k]!;
    if (m[i]! * dk <= 0) m[i] = 0;
    else if (Math.abs(m[i]!) > 3 * Math.abs(dk)) m[i] = 3 * dk;
  }
  const x0 = xs[0]!;
  const xn = xs[n - 1]!;
  return (x: number): Interpolated => {
    requireFinite(`${what}: x`, x);
    if (x < x0) return { value: ys[0]! + d[0]! * (x - x0), outside: 'below' };
    if (x > xn) return { value: ys[n - 1]! + d[n - 2]! * (x - xn), outside: 'above' };
    let lo = 0;
    let hi = n - 1;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (xs[mid]! <= x) lo = mid;
      else hi = mid;
    }
    const hh = h[lo]!;
    const t = (x - xs[lo]!) / hh;
    const t2 = t * t;
    const t3 = t2 * t;
    const value =
      (2 * t3 - 3 * t2 + 1) * ys[lo]! +
      (t3 - 2 * t2 + t) * hh * m[lo]! +
      (-2 * t3 + 3 * t2) * ys[lo + 1]! +
      (t3 - t2) * hh * m[lo + 1]!;
    return { value, outside: null };
  };
}

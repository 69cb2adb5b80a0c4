// Bracketed root finding. Brent's method (Brent 1973, "Algorithms for Minimization without
// Derivatives", ch. 4): bisection's guarantee with secant/inverse-quadratic speed. Always
// ends: either the bracket shrinks below tolerance or the iteration cap is hit, in which case
// the midpoint of a bracket that still holds the root is returned.

const MAX_ITER = 200;

/**
 * Root of f on [a, b]; f(a) and f(b) must differ in sign (or one be zero).
 * @param what  names the quantity for the RangeError when the bracket holds no root
 */
export function brent(
  f: (x: number) => number,
  a: number,
  b: number,
  what: string,
  relTol = 1e-13,
): number {
  let fa = f(a);
  let fb = f(b);
  if (!Number.isFinite(fa) || !Number.isFinite(fb)) {
    throw new RangeError(`${what}: the function is not finite at the bracket ends`);
  }
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (fa * fb > 0) throw new RangeError(`${what}: no solution in the range searched`);
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let i = 0; i < MAX_ITER; i++) {
    if (fb * fc > 0) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol = 2 * Number.EPSILON * Math.abs(b) + 0.5 * relTol * Math.max(Math.abs(b), 1e-300);
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || fb === 0) return b;
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      let p: number;
      let q: number;
      const s = fb / fa;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qq = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = d;
      }
    } else {
      d = m;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b);
    if (!Number.isFinite(fb)) throw new RangeError(`${what}: the function is not finite at ${b}`);
  }
  return b;
}

/**
 * The highest x in [bottom, top] where `ok` holds, for a predicate that may hold on several
 * bands (not monotonic): `ok` is sampled at `steps` equal steps down from `top`, and the boundary
 * above the first sample that holds is refined by bisection to `tol`. A band thinner than one
 * step can be missed; null when no sample holds. Always ends (steps + 200 evaluations at most).
 * @example highestTrue((x) => x <= 2.5, 10, 0, 20, 1e-9) // ≈ 2.5
 */
export function highestTrue(
  ok: (x: number) => boolean,
  top: number,
  bottom: number,
  steps: number,
  tol: number,
): number | null {
  const h = (top - bottom) / steps;
  let bad = top;
  if (ok(top)) return top;
  for (let k = 1; k <= steps; k++) {
    const x = k === steps ? bottom : top - k * h;
    if (ok(x)) {
      let good = x;
      for (let i = 0; i < 200 && bad - good > tol; i++) {
        const mid = 0.5 * (good + bad);
        if (ok(mid)) good = mid;
        else bad = mid;
      }
      return good;
    }
    bad = x;
  }
  return null;
}

/** Golden-section search for the maximum of a unimodal f on [a, b]. */
export function goldenMax(f: (x: number) => number, a: number, b: number, iters = 100): number {
  const r = (Math.sqrt(5) - 1) / 2;
  let x1 = b - r * (b - a);
  let x2 = a + r * (b - a);
  let f1 = f(x1);
  let f2 = f(x2);
  for (let i = 0; i < iters && b - a > 1e-14 * Math.max(1, Math.abs(b)); i++) {
    if (f1 < f2) {
      a = x1;
      x1 = x2;
      f1 = f2;
      x2 = a + r * (b - a);
      f2 = f(x2);
    } else {
      b = x2;
      x2 = x1;
      f2 = f1;
      x1 = b - r * (b - a);
      f1 = f(x1);
    }
  }
  return 0.5 * (a + b);
}

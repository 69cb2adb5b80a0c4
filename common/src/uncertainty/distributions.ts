// Distributions of the uncertain inputs, sampled by their inverse cumulative distribution from
// one uniform number each (so a seed fixes every sample). Pure; no units of their own.
// Uniform and triangular: closed forms [e.g. Evans, Hastings & Peacock, Statistical
// Distributions]; the normal truncated to [low, high]: Φ⁻¹(Φ(a) + u·(Φ(b) − Φ(a))) with the
// error function of simple-statistics (|error| < 1.2e-7) and Acklam's rational approximation of
// Φ⁻¹ (relative error < 1.15e-9; simple-statistics' probit is good to about 1e-3 only).
import { errorFunction } from 'simple-statistics';
import { InputError } from '../errors';

export type Distribution =
  /** every value between low and high equally likely */
  | { kind: 'uniform'; low: number; high: number }
  /** most likely at mode, falling linearly to nothing at low and high */
  | { kind: 'triangular'; low: number; mode: number; high: number }
  /** normal with this mean and standard deviation, truncated to [low, high] (physical range) */
  | { kind: 'normal'; mean: number; sd: number; low: number; high: number };

export const DISTRIBUTION_KINDS = ['uniform', 'triangular', 'normal'] as const;

const fin = (field: string, v: unknown): number => {
  if (typeof v !== 'number' || !Number.isFinite(v))
    throw new InputError(field, 'not-finite', `${field} must be a finite number`);
  return v;
};

/** Refuses a distribution that is not one (low above high, a mode or mean outside them, sd < 0). */
export function validateDistribution(d: Distribution, field: string): void {
  if (!d || typeof d !== 'object')
    throw new InputError(field, 'invalid', `${field} must be a distribution`);
  const low = fin(`${field}.low`, d.low);
  const high = fin(`${field}.high`, d.high);
  if (high < low)
    throw new InputError(`${field}.high`, 'out-of-range', `${field}.high must not be below low`, {
      min: low,
    });
  if (d.kind === 'uniform') return;
  if (d.kind === 'triangular') {
    const m = fin(`${field}.mode`, d.mode);
    if (m < low || m > high)
      throw new InputError(
        `${field}.mode`,
        'out-of-range',
        `${field}.mode must lie between low and high`,
        { min: low, max: high },
      );
    return;
  }
  if (d.kind === 'normal') {
    const mean = fin(`${field}.mean`, d.mean);
    const sd = fin(`${field}.sd`, d.sd);
    if (sd < 0) throw new InputError(`${field}.sd`, 'negative', `${field}.sd must not be negative`);
    if (mean < low || mean > high)
      throw new InputError(
        `${field}.mean`,
        'out-of-range',
        `${field}.mean must lie between low and high`,
        { min: low, max: high },
      );
    return;
  }
  throw new InputError(
    `${field}.kind`,
    'invalid',
    `${field}.kind must be 'uniform', 'triangular' or 'normal'`,
  );
}

/** Φ⁻¹ by P. J. Acklam's rational approximation (2003; relative error below 1.15e-9). */
function probit(p: number): number {
  const a = [
    -39.69683028665376, 220.9460984245205, -275.9285104469687, 138.357751867269, -30.66479806614716,
    2.506628277459239,
  ];
  const b = [
    -54.47609879822406, 161.5858368580409, -155.6989798598866, 66.80131188771972,
    -13.28068155288572,
  ];
  const c = [
    -0.007784894002430293, -0.3223964580411365, -2.400758277161838, -2.549732539343734,
    4.374664141464968, 2.938163982698783,
  ];
  const d = [0.007784695709041462, 0.3224671290700398, 2.445134137142996, 3.754408661907416];
  const q0 = Math.min(Math.max(p, 1e-300), 1 - 1e-16);
  const lowTail = 0.02425;
  if (q0 < lowTail) {
    const q = Math.sqrt(-2 * Math.log(q0));
    return (
      (((((c[0]! * q + c[1]!) * q + c[2]!) * q + c[3]!) * q + c[4]!) * q + c[5]!) /
      ((((d[0]! * q + d[1]!) * q + d[2]!) * q + d[3]!) * q + 1)
    );
  }
  if (q0 > 1 - lowTail) return -probit(1 - q0);
  const q = q0 - 0.5;
  const r = q * q;
  return (
    ((((((a[0]! * r + a[1]!) * r + a[2]!) * r + a[3]!) * r + a[4]!) * r + a[5]!) * q) /
    (((((b[0]! * r + b[1]!) * r + b[2]!) * r + b[3]!) * r + b[4]!) * r + 1)
  );
}

/** Φ, the standard normal cumulative distribution. */
const phi = (x: number): number => 0.5 * (1 + errorFunction(x / Math.SQRT2));

/**
 * The value below which a fraction p (0–1) of the distribution lies. A distribution with no
 * spread (low = high, or sd = 0) gives its one value exactly, whatever p.
 * @example quantile({ kind: 'triangular', low: 0, mode: 0, high: 1 }, 0.75) // 0.5
 */
export function quantile(d: Distribution, p: number): number {
  const u = Math.min(1, Math.max(0, p));
  switch (d.kind) {
    case 'uniform':
      return d.low === d.high ? d.low : d.low + u * (d.high - d.low);
    case 'triangular': {
      const { low: a, mode: c, high: b } = d;
      if (a === b) return a;
      const fc = (c - a) / (b - a);
      return u < fc
        ? a + Math.sqrt(u * (b - a) * (c - a))
        : b - Math.sqrt((1 - u) * (b - a) * (b - c));
    }
    case 'normal': {
      if (d.sd === 0 || d.low === d.high) return d.low === d.high ? d.low : d.mean;
      const pa = phi((d.low - d.mean) / d.sd);
      const pb = phi((d.high - d.mean) / d.sd);
      if (!(pb > pa)) return Math.min(d.high, Math.max(d.low, d.mean));
      const x = d.mean + d.sd * probit(pa + u * (pb - pa));
      return Math.min(d.high, Math.max(d.low, x)); // the approximations never leave [low, high]
    }
  }
}

/** The low and high ends of the tornado: the 5 % and 95 % points. */
export const SENSITIVITY_QUANTILES = { low: 0.05, high: 0.95 } as const;

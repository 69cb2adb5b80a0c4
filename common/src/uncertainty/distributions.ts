// Distributions of the uncertain inputs, sampled by their inverse cumulative distribution from
// one uniform number each (so a seed fixes every sample). Pure; no units of their own.
// Uniform and triangular: closed forms [e.g. Evans, Hastings & Peacock, Statistical
// Distributions]; the normal truncated to [low, high]: Φ⁻¹(Φ(a) + u·(Φ(b) − Φ(a))) with the
// error function and its inverse from simple-statistics.
import { errorFunction, probit } from 'simple-statistics';
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

// Argument checks shared by the engine: every impossible input ends in an InputError (a
// RangeError) naming the argument and a code, so no function returns NaN.
import { InputError } from '../errors';

export function requireFinite(name: string, value: unknown): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new InputError(
      name,
      'not-finite',
      `${name} must be a finite number (got ${String(value)})`,
    );
  }
  return value;
}

export function requirePositive(name: string, value: unknown): number {
  const v = requireFinite(name, value);
  if (v <= 0)
    throw new InputError(name, 'not-positive', `${name} must be greater than zero (got ${v})`, {
      value: v,
    });
  return v;
}

export function requireNonNegative(name: string, value: unknown): number {
  const v = requireFinite(name, value);
  if (v < 0)
    throw new InputError(name, 'negative', `${name} must not be negative (got ${v})`, { value: v });
  return v;
}

export function requireInRange(name: string, value: unknown, lo: number, hi: number): number {
  const v = requireFinite(name, value);
  if (v < lo || v > hi)
    throw new InputError(
      name,
      'out-of-range',
      `${name} must lie between ${lo} and ${hi} (got ${v})`,
      {
        value: v,
        min: lo,
        max: hi,
      },
    );
  return v;
}

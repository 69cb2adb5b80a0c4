// Argument checks shared by the engine: every impossible input ends in a RangeError naming
// the argument, so no function returns NaN.

export function requireFinite(name: string, value: unknown): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new RangeError(`${name} must be a finite number (got ${String(value)})`);
  }
  return value;
}

export function requirePositive(name: string, value: unknown): number {
  const v = requireFinite(name, value);
  if (v <= 0) throw new RangeError(`${name} must be greater than zero (got ${v})`);
  return v;
}

export function requireNonNegative(name: string, value: unknown): number {
  const v = requireFinite(name, value);
  if (v < 0) throw new RangeError(`${name} must not be negative (got ${v})`);
  return v;
}

export function requireInRange(name: string, value: unknown, lo: number, hi: number): number {
  const v = requireFinite(name, value);
  if (v < lo || v > hi) throw new RangeError(`${name} must lie between ${lo} and ${hi} (got ${v})`);
  return v;
}

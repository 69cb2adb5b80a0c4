import { expect } from 'vitest';

/**
 * Relative-tolerance comparison. `toBeCloseTo(x, n)` counts decimal digits, which is
 * wrong for engineering values of any magnitude; this compares |a − e| ≤ rel·|e|
 * (with an absolute floor for expected zeros).
 */
export function expectRel(actual: number, expected: number, rel: number, absFloor = 1e-12): void {
  expect(Number.isFinite(actual), `expected a finite number, got ${actual}`).toBe(true);
  const tol = Math.max(Math.abs(expected) * rel, absFloor);
  const diff = Math.abs(actual - expected);
  expect(
    diff <= tol,
    `expected ${actual} to be within ${rel * 100}% of ${expected} (|diff| = ${diff}, tol = ${tol})`,
  ).toBe(true);
}

// Argument checks for the dissipator engine: impossible input ends in a RangeError naming the
// argument, so no function returns NaN.

// The same checks as the hydraulics engine's, under the short names the basin modules use.
export {
  requireFinite as reqFinite,
  requirePositive as reqPositive,
  requireNonNegative as reqNonNegative,
} from '../hydraulics/guards';

/** Piecewise-linear interpolation on (x, y) points sorted by x, held at the end values. */
export function interpolate(points: ReadonlyArray<readonly [number, number]>, x: number): number {
  const first = points[0];
  const last = points[points.length - 1];
  if (!first || !last) throw new RangeError('points must hold at least one (x, y) pair');
  if (x <= first[0]) return first[1];
  if (x >= last[0]) return last[1];
  for (let i = 1; i < points.length; i++) {
    const [x1, y1] = points[i]!;
    const [x0, y0] = points[i - 1]!;
    if (x <= x1) return y0 + ((y1 - y0) * (x - x0)) / (x1 - x0);
  }
  return last[1];
}

/** Rounds up to a multiple of `step` (construction sizes), tolerant of float noise. */
export function roundUp(value: number, step: number): number {
  return Math.ceil(value / step - 1e-9) * step;
}

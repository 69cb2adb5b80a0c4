// The floor solve over a prepared discharge range: the highest floor elevation that holds the
// jump at every discharge. [hydraulics.md §3]
import { G } from '../units/constants';
import { InputError } from '../errors';
import { requireInRange } from '../hydraulics/guards';
import { belangerRatio } from '../hydraulics/jump';
import { highestTrue } from '../hydraulics/solve';
import { MIN_FLOOR_FR1 } from './limits';
import type { DischargeRange } from './prepare';
import type { FloorSolution, TailwaterFactor } from './types';

/** C at one discharge, checked (0.5–2). */
export function factorAt(
  C: TailwaterFactor,
  row: () => { Q: number; fr1: number; y1: number; y2: number; v1: number; q: number },
): number {
  const c = typeof C === 'number' ? C : C(row());
  return requireInRange('tailwaterFactor', c, 0.5, 2);
}

/** y1 at index i and floor z, −1 when the head cannot pass the flow there. */
function y1Of(r: DischargeRange, i: number, z: number): number {
  if (r.y1At) return r.y1At(i, z);
  try {
    return r.toeAt(i, z).y1;
  } catch (e) {
    if (!(e instanceof RangeError)) throw e;
    return -1;
  }
}

interface Worst {
  /** least margin TW − z − C·y2 over the range, m (−∞ where Fr1 < the minimum) */
  margin: number;
  index: number;
  fr1: number;
}

/** TW − z − C·y2 at discharge index i and floor z, m (−∞ where Fr1 is below the minimum). */
function marginAt(r: DischargeRange, i: number, z: number, C: TailwaterFactor): number {
  const Q = r.Qs[i]!;
  const y1 = y1Of(r, i, z);
  const q = Q / r.width;
  const fr1 = y1 > 0 ? q / (y1 * Math.sqrt(G * y1)) : 0;
  // A toe the floor cannot change needs only to be supercritical; a head-driven one, the minimum.
  if (r.floorDependent ? !(fr1 >= MIN_FLOOR_FR1) : !(fr1 > 1)) return -Infinity;
  const y2 = y1 * belangerRatio(fr1); // Bélanger (the basin is rectangular)
  const c = typeof C === 'number' ? C : factorAt(C, () => ({ Q, fr1, y1, y2, v1: q / y1, q }));
  return r.tw[i]!.elevation - z - c * y2;
}

/** The least margin over the range at floor z. */
export function worstMargin(r: DischargeRange, z: number, C: TailwaterFactor): Worst {
  let worst: Worst = { margin: Infinity, index: 0, fr1: 0 };
  for (let i = 0; i < r.Qs.length; i++) {
    const m = marginAt(r, i, z, C);
    if (m < worst.margin) {
      const y1 = y1Of(r, i, z);
      const q = r.Qs[i]! / r.width;
      worst = { margin: m, index: i, fr1: y1 > 0 ? q / (y1 * Math.sqrt(G * y1)) : 0 };
    }
  }
  return worst;
}

/** Equal steps the solve samples between the lowest tailwater level and a floor that holds. */
export const FLOOR_SCAN_STEPS = 64;

/**
 * The highest floor elevation (m) with, at every discharge of the range, Fr1 ≥ MIN_FLOOR_FR1
 * (1.7; for a toe the floor cannot change — a fixed gate opening or pool, a known toe — only
 * Fr1 > 1) and tailwater ≥ C·y2. y1 depends on the floor through the head, and the margin need not
 * fall monotonically as the floor rises (a high floor can meet a small y2 with a weak inflow), so:
 * a floor that holds is found by lowering from the lowest tailwater level in doubling steps
 * (1, 2, 4 … m); the span above it is then sampled in FLOOR_SCAN_STEPS equal steps from the top,
 * and the first band that holds is refined by bisection. A band thinner than one step can be
 * missed. InputError 'no-floor' naming the discharge and the cause when no floor within
 * 2⁴⁰ m holds.
 */
export function solveFloor(r: DischargeRange, C: TailwaterFactor): FloorSolution {
  const zTop = Math.min(...r.tw.map((t) => t.elevation));
  // Whether floor z holds at every discharge; the discharge that failed last is tried first, so
  // a floor that does not hold is usually rejected after one discharge.
  let hint = r.designIndex;
  const ok = (z: number): boolean => {
    if (marginAt(r, hint, z, C) < 0) return false;
    for (let i = 0; i < r.Qs.length; i++) {
      if (i !== hint && marginAt(r, i, z, C) < 0) {
        hint = i;
        return false;
      }
    }
    return true;
  };
  let zLo = zTop;
  let found = false;
  for (let k = 0, d = 1; k < 40; k++, d *= 2) {
    zLo = zTop - d;
    if (ok(zLo)) {
      found = true;
      break;
    }
  }
  if (!found) {
    const w = worstMargin(r, zLo, C);
    const Q = r.Qs[w.index]!;
    throw new InputError(
      'floorElevation',
      'no-floor',
      w.margin === -Infinity
        ? `no floor elevation holds a jump at Q = ${Number(Q.toPrecision(4))} m³/s: the inflow does not reach Fr1 ${r.floorDependent ? MIN_FLOOR_FR1 : 1} however low the floor`
        : `no floor elevation holds the jump at Q = ${Number(Q.toPrecision(4))} m³/s: the tailwater stays short of the sequent depth however low the floor`,
      { Q, fr1: w.fr1 },
    );
  }
  const tol = 1e-8 * Math.max(1, Math.abs(zLo));
  const z = highestTrue(ok, zTop, zLo, FLOOR_SCAN_STEPS, tol) ?? zLo;
  return { elevation: z, governingQ: r.Qs[worstMargin(r, z, C).index]! };
}

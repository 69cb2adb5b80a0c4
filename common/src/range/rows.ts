// The rows of a prepared discharge range at one floor: toe, jump, tailwater, margin, position
// and sweep-out distance at every discharge. [hydraulics.md §1, §3]
import { G } from '../units/constants';
import { InputError } from '../errors';
import { belangerRatio, jumpFromDepths } from '../hydraulics/jump';
import { _directStepDistance } from '../hydraulics/profiles';
import { factorAt } from './floor';
import { jumpPosition } from './position';
import type { DischargeRange } from './prepare';
import type { RowNoteCode, StudyRow, TailwaterFactor } from './types';

/**
 * One row at discharge index i and floor z; InputError naming the discharge when no jump forms.
 * `sweepOut` false leaves the sweep-out distance out (null): rows read only for their toe and
 * tailwater (the screening at the channel bed) skip the profile computation.
 */
export function rowAt(
  r: DischargeRange,
  i: number,
  z: number,
  C: TailwaterFactor,
  sweepOut = true,
): StudyRow {
  const Q = r.Qs[i]!;
  const toe = r.toeAt(i, z);
  if (!(toe.fr1 > 1))
    throw new InputError(
      'floorElevation',
      'not-supercritical',
      `at Q = ${Number(Q.toPrecision(4))} m³/s the inflow is not supercritical (Fr1 = ${toe.fr1.toPrecision(3)}): no jump forms`,
      { Q, fr1: toe.fr1 },
    );
  const q = toe.q;
  const yc = Math.cbrt((q * q) / G);
  const fr1 = q / (toe.y1 * Math.sqrt(G * toe.y1));
  const y2 = toe.y1 * belangerRatio(fr1);
  const jump = jumpFromDepths(r.basin, Q, toe.y1, y2, fr1, { lengthMethod: r.jumpLengthMethod });
  const c = factorAt(C, () => ({ Q, fr1, y1: toe.y1, y2, v1: jump.v1, q }));
  const tw = r.tw[i]!;
  const twDepth = tw.elevation - z;
  const required = c * y2;
  const position = jumpPosition(twDepth, required, r.submergenceTolerance);
  const codes: RowNoteCode[] = [];
  let sweep: number | null = null;
  if (position === 'swept-out') {
    if (twDepth > yc) {
      // Horizontal rectangular floor: the H3 profile from y1 rises to the depth whose sequent
      // is the tailwater (Bélanger, reversed), by the direct step method.
      const frTw = q / (twDepth * Math.sqrt(G * twDepth));
      const yToe = twDepth * belangerRatio(frTw);
      if (sweepOut)
        sweep =
          yToe > toe.y1 ? _directStepDistance(r.basin, Q, r.floorManningN, 0, toe.y1, yToe) : 0;
      codes.push('swept-out');
    } else codes.push('leaves-basin');
  } else if (position === 'drowned') codes.push('drowned');
  if (tw.outside) codes.push('tailwater-extended');
  let gate: StudyRow['gate'] = null;
  if (toe.gate) {
    const submerged = twDepth > y2;
    gate = { opening: toe.gate.opening, upstreamDepth: toe.gate.upstreamDepth, submerged };
    if (submerged) codes.push('gate-submerged');
  }
  return {
    // Fields listed, not spread: V8 builds a large object from a spread slowly.
    y1: jump.y1,
    y2: jump.y2,
    v1: jump.v1,
    v2: jump.v2,
    fr1: jump.fr1,
    fr2: jump.fr2,
    headLoss: jump.headLoss,
    relativeLoss: jump.relativeLoss,
    efficiency: jump.efficiency,
    height: jump.height,
    length: jump.length,
    rollerLength: jump.rollerLength,
    jumpClass: jump.jumpClass,
    power: jump.power,
    Q,
    q,
    H0: toe.H0 > 0 && !toe.gate ? toe.H0 : null,
    yc,
    tailwaterElevation: tw.elevation,
    tailwaterDepth: twDepth,
    tailwaterOutside: tw.outside,
    tailwaterFactor: c,
    requiredDepth: required,
    margin: twDepth - required,
    position,
    submergenceRatio: (twDepth - y2) / y2,
    sweepOutDistance: sweep,
    gate,
    isDesign: i === r.designIndex,
    noteCodes: codes,
  };
}

/** Every row of the range at floor z (m) with tailwater factor C (`sweepOut` as in rowAt). */
export function rowsAt(
  r: DischargeRange,
  z: number,
  C: TailwaterFactor,
  sweepOut = true,
): StudyRow[] {
  return r.Qs.map((_, i) => rowAt(r, i, z, C, sweepOut));
}

/** The row at the design discharge (exactly; the design discharge is always in the range). */
export function designRowOf(rows: readonly StudyRow[]): StudyRow {
  const row = rows.find((x) => x.isDesign);
  if (!row) throw new Error('rows: no row at the design discharge');
  return row;
}

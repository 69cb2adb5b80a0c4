// Criteria shared by several types; reasons in plain words with SI numbers.
import { G } from '../../units/constants';
import type { BasinDefaults } from '../defaults';
import type { CriterionResult, DebrisLevel, DischargeRow, ScreeningContext } from '../types';

/** Numbers in reasons: three significant figures, no trailing noise. */
export function n3(x: number): string {
  if (!Number.isFinite(x)) return String(x);
  const a = Math.abs(x);
  if (a >= 100) return x.toFixed(0);
  if (a >= 10) return x.toFixed(1);
  return x.toFixed(2);
}

/** Two numbers compared in a reason, with enough digits to tell them apart. */
export function pair(x: number, limit: number): [string, string] {
  let a = n3(x);
  let b = n3(limit);
  for (let k = 3; a === b && x !== limit && k <= 6; k++) {
    a = x.toFixed(k);
    b = limit.toFixed(k);
  }
  return [a, b];
}

export function crit(
  criterion: CriterionResult['criterion'],
  status: CriterionResult['status'],
  reason: string,
  atQ?: number,
): CriterionResult {
  return atQ === undefined ? { criterion, status, reason } : { criterion, status, reason, atQ };
}

/** Froude number inside an inclusive published range: pass; outside: fail. */
export function froudeInRange(row: DischargeRow, lo: number, hi: number, tag: string): CriterionResult {
  const f = row.fr1;
  if (f < lo) return crit('froude', 'fail', `Fr1 ${pair(f, lo)[0]} is below the tested range ${lo}–${hi === Infinity ? '∞' : hi} ${tag}`, row.Q);
  if (f > hi) return crit('froude', 'fail', `Fr1 ${pair(f, hi)[0]} is above the tested range ${lo}–${hi} ${tag}`, row.Q);
  return crit('froude', 'pass', `Fr1 ${n3(f)} is within ${lo}–${hi === Infinity ? '∞' : hi} ${tag}`, row.Q);
}

/** Jump basins: the tailwater against C·y2 (need) and against excess (submergence). */
export function jumpTailwater(
  row: DischargeRow,
  factor: number,
  d: BasinDefaults,
  rows: readonly DischargeRow[],
): CriterionResult {
  const need = factor * row.y2;
  const tw = row.tailwaterDepth;
  if (tw === undefined) return crit('tailwater', 'warn', `tailwater not known: this basin needs ${n3(need)} m (C ${n3(factor)} × y2)`, row.Q);
  if (tw < need - 1e-6) {
    return crit('tailwater', 'fail', `tailwater ${n3(tw)} m is short of the ${n3(need)} m needed (C ${n3(factor)} × y2 ${n3(row.y2)} m): the jump would sweep out`, row.Q);
  }
  const ratio = tw / need;
  if (ratio > d.excessSubmergenceRatio) {
    const qMax = Math.max(...rows.map((r) => r.Q));
    const atDesign = row.Q >= qMax - 1e-9;
    return crit(
      'tailwater',
      atDesign ? 'warn' : 'pass',
      atDesign
        ? `tailwater ${n3(tw)} m is ${n3(ratio)}× the ${n3(need)} m needed at the largest discharge: excess submergence, the jump is drowned and dissipates less`
        : `tailwater ${n3(tw)} m is ${n3(ratio)}× the ${n3(need)} m needed: a drowned jump at this partial flow (acceptable, less dissipation)`,
      row.Q,
    );
  }
  return crit('tailwater', 'pass', `tailwater ${n3(tw)} m holds the jump (needs ${n3(need)} m = C ${n3(factor)} × y2)`, row.Q);
}

export function debrisCriterion(ctx: ScreeningContext, heavy: 'pass' | 'warn' | 'fail', light: 'pass' | 'warn', what: string): CriterionResult {
  const level: DebrisLevel | undefined = ctx.debris;
  if (level === undefined || level === 'none') return crit('debris', 'pass', level === undefined ? 'no debris stated' : 'no debris expected');
  const status = level === 'heavy' ? heavy : light;
  const reason =
    status === 'pass' ? `${level} debris: ${what}` : `${level} debris: ${what}`;
  return crit('debris', status, reason);
}

export function noDischargeLimit(row: DischargeRow): CriterionResult {
  return crit('discharge', 'pass', `no published limit on total discharge (Q ${n3(row.Q)} m³/s)`, row.Q);
}

/** Total head above the floor: given, or at least the specific energy at the toe. */
export function headOf(row: DischargeRow): number {
  return row.head ?? row.y1 + (row.v1 * row.v1) / (2 * G);
}

/** The row with the largest discharge (the design discharge of the range). */
export function designRow(rows: readonly DischargeRow[]): DischargeRow | undefined {
  let best: DischargeRow | undefined;
  for (const r of rows) if (!best || r.Q > best.Q) best = r;
  return best;
}

// Criteria shared by several types; reasons in plain words, numbers in the user's units
// (ctx.units, default SI) through the phraser.
import { G } from '../../units/constants';
import { n3, n3Pair, phraser, type Phraser } from '../../units/phrase';
import type { BasinDefaults } from '../defaults';
import { jumpPosition } from '../../range/position';
import type { CriterionResult, DebrisLevel, DischargeRow, ScreeningContext } from '../types';

export { n3 };

/** The phraser of the screening context's unit system. */
export function ph(ctx: { units?: 'SI' | 'US' } | undefined): Phraser {
  return phraser(ctx?.units ?? 'SI');
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
export function froudeInRange(
  row: DischargeRow,
  lo: number,
  hi: number,
  tag: string,
): CriterionResult {
  const f = row.fr1;
  const range = hi === Infinity ? `Fr1 ≥ ${lo}` : `${lo}–${hi}`;
  if (f < lo)
    return crit(
      'froude',
      'fail',
      `Fr1 ${n3Pair(f, lo)[0]} is below the tested range ${range} ${tag}`,
      row.Q,
    );
  if (f > hi)
    return crit(
      'froude',
      'fail',
      `Fr1 ${n3Pair(f, hi)[0]} is above the tested range ${range} ${tag}`,
      row.Q,
    );
  return crit(
    'froude',
    'pass',
    hi === Infinity
      ? `Fr1 ${n3(f)} is at least ${lo} ${tag}`
      : `Fr1 ${n3(f)} is within ${range} ${tag}`,
    row.Q,
  );
}

/** Jump basins: the tailwater against C·y2 (need) and against excess (submergence). */
export function jumpTailwater(
  row: DischargeRow,
  factor: number,
  d: BasinDefaults,
  rows: readonly DischargeRow[],
  ctx?: ScreeningContext,
): CriterionResult {
  const P = ph(ctx);
  const need = factor * row.y2;
  const tw = row.tailwaterDepth;
  if (tw === undefined)
    return crit(
      'tailwater',
      'warn',
      `tailwater not known: this basin needs ${P.len(need)} (C ${n3(factor)} × y2)`,
      row.Q,
    );
  if (tw < need - 1e-6) {
    return crit(
      'tailwater',
      'fail',
      `tailwater ${P.len(tw)} is short of the ${P.len(need)} needed (C ${n3(factor)} × y2 ${P.len(row.y2)}): the jump would sweep out`,
      row.Q,
    );
  }
  const ratio = tw / need;
  if (jumpPosition(tw, need, ctx?.submergenceTolerance) === 'drowned') {
    const atDesign =
      row.isDesign === true ||
      (ctx?.designQ !== undefined ? row.Q === ctx.designQ : row === designRow(rows));
    return crit(
      'tailwater',
      atDesign ? 'warn' : 'pass',
      atDesign
        ? `tailwater ${P.len(tw)} is ${n3(ratio)}× the ${P.len(need)} needed at the largest discharge: excess submergence, the jump is drowned and dissipates less`
        : `tailwater ${P.len(tw)} is ${n3(ratio)}× the ${P.len(need)} needed: a drowned jump at this partial flow (acceptable, less dissipation)`,
      row.Q,
    );
  }
  return crit(
    'tailwater',
    'pass',
    `tailwater ${P.len(tw)} holds the jump (needs ${P.len(need)} = C ${n3(factor)} × y2)`,
    row.Q,
  );
}

export function debrisCriterion(
  ctx: ScreeningContext,
  heavy: 'pass' | 'warn' | 'fail',
  light: 'pass' | 'warn',
  what: string,
): CriterionResult {
  const level: DebrisLevel | undefined = ctx.debris;
  if (level === undefined || level === 'none')
    return crit('debris', 'pass', level === undefined ? 'no debris stated' : 'no debris expected');
  return crit('debris', level === 'heavy' ? heavy : light, `${level} debris: ${what}`);
}

export function noDischargeLimit(row: DischargeRow, ctx?: ScreeningContext): CriterionResult {
  return crit(
    'discharge',
    'pass',
    `no published limit on total discharge (Q ${ph(ctx).Q(row.Q)})`,
    row.Q,
  );
}

/** Total head above the floor: given, or at least the specific energy at the toe. */
export function headOf(row: DischargeRow): number {
  return row.head ?? row.y1 + (row.v1 * row.v1) / (2 * G);
}

/**
 * The design row: the row at the design discharge (marked by the study; the design discharge is
 * always analysed), else the row whose Q equals `designQ`; for rows from elsewhere with neither,
 * the largest discharge.
 */
export function designRow<T extends DischargeRow>(
  rows: readonly T[],
  designQ?: number,
): T | undefined {
  // Screening asks once per row for the same list: answered once per list and design discharge.
  const key = designQ ?? -1;
  const cached = DESIGN_ROW.get(rows)?.get(key);
  if (cached) return cached as T;
  const found = findDesignRow(rows, designQ);
  if (found) {
    const byQ = DESIGN_ROW.get(rows) ?? new Map<number, DischargeRow>();
    byQ.set(key, found);
    DESIGN_ROW.set(rows, byQ);
  }
  return found;
}

const DESIGN_ROW = new WeakMap<readonly DischargeRow[], Map<number, DischargeRow>>();

function findDesignRow<T extends DischargeRow>(
  rows: readonly T[],
  designQ: number | undefined,
): T | undefined {
  const marked = rows.find((r) => r.isDesign);
  if (marked) return marked;
  if (designQ !== undefined) {
    const exact = rows.find((r) => r.Q === designQ);
    if (exact) return exact;
  }
  let best: T | undefined;
  for (const r of rows) if (!best || r.Q > best.Q) best = r;
  return best;
}

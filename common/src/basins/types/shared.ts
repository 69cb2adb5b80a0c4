// Criteria shared by several types, as data: a reason code and the SI quantities it quotes.
// The sentences are made at the edge (common/src/messages/reasons.ts).
import { G } from '../../units/constants';
import { BASIN_DEFAULTS, limitQuantity, type BasinDefaults, type PublishedKey } from '../defaults';
import { jumpPosition } from '../../range/position';
import { qty, quote, type Quantity, type Quotes } from '../../warnings';
import type {
  CriterionResult,
  DebrisLevel,
  DischargeRow,
  ReasonCode,
  ScreeningContext,
} from '../types';

/** Quantities of a row, by kind (SI). */
export const len = (si: number): Quantity => qty('length', si);
export const vel = (si: number): Quantity => qty('velocity', si);
export const dis = (si: number): Quantity => qty('discharge', si);
export const udis = (si: number): Quantity => qty('unitDischarge', si);
/** A published limit at its default, for the catalogue's limit texts (said as published). */
export const published = (key: PublishedKey): Quantity => limitQuantity(BASIN_DEFAULTS, key);
/** A published limit in force (its key kept when at its default). */
export const lim = (d: BasinDefaults, key: PublishedKey): Quantity => limitQuantity(d, key);

/**
 * One criterion's outcome as data.
 * @example crit('velocity', 'pass', 'velocity-within', { v1: vel(12) }, 40, '[src: EM-25]')
 */
export function crit(
  criterion: CriterionResult['criterion'],
  status: CriterionResult['status'],
  code: ReasonCode,
  quotes: Quotes = {},
  atQ?: number,
  source?: string,
): CriterionResult {
  const c: CriterionResult = { criterion, status, code, ...quote(quotes) };
  if (source !== undefined) c.source = source;
  if (atQ !== undefined) c.atQ = atQ;
  return c;
}

/** Froude number inside an inclusive published range: pass; outside: fail. */
export function froudeInRange(
  row: DischargeRow,
  lo: number,
  hi: number,
  tag: string,
): CriterionResult {
  const f = row.fr1;
  const range = { fr1: f, lo, ...(hi === Infinity ? {} : { hi }) };
  if (f < lo) return crit('froude', 'fail', 'froude-below-range', range, row.Q, tag);
  if (f > hi) return crit('froude', 'fail', 'froude-above-range', range, row.Q, tag);
  return crit(
    'froude',
    'pass',
    hi === Infinity ? 'froude-at-least' : 'froude-within',
    range,
    row.Q,
    tag,
  );
}

/** Jump basins: the tailwater against C·y2 (need) and against excess (submergence). */
export function jumpTailwater(
  row: DischargeRow,
  factor: number,
  _d: BasinDefaults,
  rows: readonly DischargeRow[],
  ctx?: ScreeningContext,
): CriterionResult {
  const need = factor * row.y2;
  const tw = row.tailwaterDepth;
  if (tw === undefined)
    return crit('tailwater', 'warn', 'tailwater-unknown', { need: len(need), factor }, row.Q);
  if (tw < need - 1e-6) {
    return crit(
      'tailwater',
      'fail',
      'tailwater-short',
      { tw: len(tw), need: len(need), factor, y2: len(row.y2) },
      row.Q,
    );
  }
  if (jumpPosition(tw, need, ctx?.submergenceTolerance) === 'drowned') {
    const atDesign =
      row.isDesign === true ||
      (ctx?.designQ !== undefined ? row.Q === ctx.designQ : row === designRow(rows));
    return crit(
      'tailwater',
      atDesign ? 'warn' : 'pass',
      atDesign ? 'tailwater-drowned-design' : 'tailwater-drowned-partial',
      { tw: len(tw), ratio: tw / need, need: len(need) },
      row.Q,
    );
  }
  return crit(
    'tailwater',
    'pass',
    'tailwater-holds',
    { tw: len(tw), need: len(need), factor },
    row.Q,
  );
}

/** Debris: stated heavy or light, with what it does to this type (`what`, a reason code). */
export function debrisCriterion(
  ctx: ScreeningContext,
  heavy: 'pass' | 'warn' | 'fail',
  light: 'pass' | 'warn',
  what: ReasonCode,
): CriterionResult {
  const level: DebrisLevel | undefined = ctx.debris;
  if (level === undefined || level === 'none')
    return crit('debris', 'pass', level === undefined ? 'debris-unstated' : 'debris-none');
  return crit('debris', level === 'heavy' ? heavy : light, what, {
    heavy: level === 'heavy' ? 1 : 0,
  });
}

export function noDischargeLimit(row: DischargeRow): CriterionResult {
  return crit('discharge', 'pass', 'discharge-no-limit', { Q: dis(row.Q) }, row.Q);
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

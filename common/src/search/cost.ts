// Costing a take-off with unit rates (per SI unit), and the sized types side by side.
import type { DesignEntry } from '../basins/study';
import type { DissipatorDesign } from '../basins/design';
import type { DissipatorTypeId } from '../basins/types';
import type { StudyResult } from '../result';
import { InputError } from '../errors';
import { quantityInUnit, type PriceUnit } from '../estimate/estimate';
import { ESTIMATE_LIMITS } from '../schemas/limits';
import {
  TAKEOFF_ITEM_KINDS,
  TAKEOFF_QUANTITY_KINDS,
  takeoff,
  type Takeoff,
  type TakeoffItemKind,
} from '../takeoff/takeoff';
import type { TakeoffOverrides } from '../takeoff/assumptions';

/**
 * Unit rates per SI unit of a take-off quantity (currency per m³, kg, m² or m): by line key
 * (e.g. 'concrete.endSill') first, else by item kind. The prices come from the firm's price
 * book at the edges (siRate converts a price in any price unit).
 */
export interface UnitRates {
  byKind?: Partial<Record<TakeoffItemKind, number>>;
  byKey?: Record<string, number>;
}

/**
 * A price per `unit` as a rate per SI unit of its kind.
 * @example siRate(100, 'concrete', 'yd3') // ≈ 130.8 per m³
 */
export function siRate(unitPrice: number, kind: TakeoffItemKind, unit: PriceUnit): number {
  return unitPrice * quantityInUnit(1, TAKEOFF_QUANTITY_KINDS[kind], unit);
}

/** Checks a set of unit rates (non-negative finite numbers, known kinds). */
export function checkRates(rates: UnitRates): void {
  if (!rates || typeof rates !== 'object')
    throw new InputError('rates', 'invalid', 'the unit rates must be an object');
  const check = (field: string, v: unknown): void => {
    if (typeof v !== 'number' || !Number.isFinite(v) || v < 0 || v > ESTIMATE_LIMITS.maxAmount)
      throw new InputError(field, 'out-of-range', `${field} must be a non-negative number`, {
        min: 0,
        max: ESTIMATE_LIMITS.maxAmount,
      });
  };
  for (const [k, v] of Object.entries(rates.byKind ?? {})) {
    if (!(TAKEOFF_ITEM_KINDS as readonly string[]).includes(k))
      throw new InputError(`rates.byKind.${k}`, 'invalid', `unknown take-off item "${k}"`);
    check(`rates.byKind.${k}`, v);
  }
  for (const [k, v] of Object.entries(rates.byKey ?? {})) check(`rates.byKey.${k}`, v);
}

/** Direct cost of a take-off at the rates; keys with no rate are listed, not priced. */
export function costOf(t: Takeoff, rates: UnitRates): { cost: number; unpriced: string[] } {
  let cost = 0;
  const unpriced: string[] = [];
  for (const l of t.lines) {
    const r = rates.byKey?.[l.key] ?? rates.byKind?.[l.kind];
    if (r === undefined) unpriced.push(l.key);
    else cost += l.quantity * r;
  }
  return { cost, unpriced };
}

/** One sized type's measures and cost (SI). */
export interface TypeMeasures {
  type: DissipatorTypeId;
  name: string;
  width: number;
  /** structure length along the flow, m */
  length: number;
  /** floor (top of slab) elevation, m; null where the type has none (a sloping apron, an apron of stone) */
  floorElevation: number | null;
  /** structural and exit-protection excavation, m³ */
  excavation: number;
  /** concrete, m³ (waste included) */
  concrete: number;
  /** reinforcement, kg */
  steel: number;
  /** direct cost at the rates */
  cost: number;
  unpriced: string[];
}

export function floorOf(d: DissipatorDesign): number | null {
  return d.family === 'jump-basin' || d.family === 'impact-basin' ? d.floorElevation : null;
}

/** A design's measures and cost from its take-off. */
export function measuresOf(
  entry: DesignEntry,
  rates: UnitRates,
  overrides: TakeoffOverrides = {},
): TypeMeasures & { takeoff: Takeoff } {
  const t = takeoff(entry, overrides);
  const { cost, unpriced } = costOf(t, rates);
  const d = entry.design;
  return {
    type: entry.type,
    name: d.name,
    width: d.width,
    length: d.length,
    floorElevation: floorOf(d),
    excavation: t.totals.excavation,
    concrete: t.totals.concrete,
    steel: t.totals.reinforcement,
    cost,
    unpriced,
    takeoff: t,
  };
}

/**
 * The sized types of a study side by side: length, floor elevation, excavation, concrete,
 * steel and direct cost at the rates (the chosen design first, then the alternatives).
 */
export function compareAlternatives(
  result: StudyResult,
  rates: UnitRates,
  overrides: TakeoffOverrides = {},
): TypeMeasures[] {
  checkRates(rates);
  return [result.design, ...result.alternatives]
    .filter((e): e is DesignEntry => e !== null)
    .map((e) => {
      const m: Partial<ReturnType<typeof measuresOf>> = measuresOf(e, rates, overrides);
      delete m.takeoff;
      return m as TypeMeasures;
    });
}

// The take-off in the project's units: m³ ⇄ yd³, kg ⇄ lb, m² ⇄ ft², m ⇄ ft (units/), and its
// assumptions and overrides between SI and US customary. The totals are the same quantity
// either way: only the unit changes.
import { fromSIValue, toSIValue, UNIT_LABELS } from '../units';
import { convert } from '../units/convert';
import type { UnitSystem } from '../range/types';
import {
  TAKEOFF_ASSUMPTIONS,
  type TakeoffAssumptionKey,
  type TakeoffAssumptionUnit,
  type TakeoffOverrides,
} from './assumptions';
import type { Takeoff, TakeoffItemKind, TakeoffLine } from './takeoff';
import { TAKEOFF_QUANTITY_KINDS } from './takeoff';

/** A take-off line with its quantity in a unit system. */
export interface DisplayTakeoffLine extends TakeoffLine {
  /** the quantity in `units` */
  value: number;
  /** its unit label (m³, yd³, kg, lb, m², ft², m, ft) */
  unit: string;
}

/** A line's SI quantity in a unit system, and the unit's label. */
export function takeoffQuantity(
  quantity: number,
  kind: TakeoffItemKind,
  units: UnitSystem,
): { value: number; unit: string } {
  const q = TAKEOFF_QUANTITY_KINDS[kind];
  return { value: fromSIValue(quantity, q, units), unit: UNIT_LABELS[q][units] };
}

/** Every line of a take-off in the project's units. */
export function formatTakeoff(t: Pick<Takeoff, 'lines'>, units: UnitSystem): DisplayTakeoffLine[] {
  return t.lines.map((l) => ({ ...l, ...takeoffQuantity(l.quantity, l.kind, units) }));
}

/** The totals of a take-off in the project's units. */
export function formatTakeoffTotals(
  t: Takeoff,
  units: UnitSystem,
): Record<TakeoffItemKind, { value: number; unit: string }> {
  return Object.fromEntries(
    Object.entries(t.totals).map(([k, v]) => [k, takeoffQuantity(v, k as TakeoffItemKind, units)]),
  ) as Record<TakeoffItemKind, { value: number; unit: string }>;
}

const ASSUMPTION_UNITS: Record<TakeoffAssumptionUnit, Record<UnitSystem, string> | null> = {
  length: { SI: 'm', US: 'ft' },
  ratio: null,
  slope: null,
  density: { SI: 'kg/m^3', US: 'lb/ft^3' },
  reinforcement: { SI: 'kg/m^3', US: 'lb/yd^3' },
};

/** Label of an assumption's unit in a unit system. */
export const TAKEOFF_ASSUMPTION_LABELS: Record<
  TakeoffAssumptionUnit,
  Record<UnitSystem, string>
> = {
  length: { SI: 'm', US: 'ft' },
  ratio: { SI: '-', US: '-' },
  slope: { SI: 'H:V', US: 'H:V' },
  density: { SI: 'kg/m³', US: 'lb/ft³' },
  reinforcement: { SI: 'kg/m³', US: 'lb/yd³' },
};

/** An assumption's value from SI into a unit system. */
export function assumptionFromSI(
  value: number,
  unit: TakeoffAssumptionUnit,
  units: UnitSystem,
): number {
  const u = ASSUMPTION_UNITS[unit];
  if (!u || units === 'SI') return value;
  if (unit === 'length') return fromSIValue(value, 'length', units);
  return convert(value, u.SI, u.US);
}

/** An assumption's value from a unit system into SI. */
export function assumptionToSI(
  value: number,
  unit: TakeoffAssumptionUnit,
  units: UnitSystem,
): number {
  const u = ASSUMPTION_UNITS[unit];
  if (!u || units === 'SI') return value;
  if (unit === 'length') return toSIValue(value, 'length', units);
  return convert(value, u.US, u.SI);
}

function mapOverrides(
  o: TakeoffOverrides,
  f: (v: number, unit: TakeoffAssumptionUnit) => number,
): TakeoffOverrides {
  const out: TakeoffOverrides = {};
  for (const [k, v] of Object.entries(o)) {
    if (k === 'soil') out.soil = v as TakeoffOverrides['soil'];
    else if (typeof v === 'number' && k in TAKEOFF_ASSUMPTIONS) {
      const key = k as TakeoffAssumptionKey;
      out[key] = f(v, TAKEOFF_ASSUMPTIONS[key].unitKind);
    }
  }
  return out;
}

/** Overrides typed in a unit system → SI (what takeoff() reads). */
export function takeoffOverridesToSI(o: TakeoffOverrides, units: UnitSystem): TakeoffOverrides {
  return mapOverrides(o, (v, u) => assumptionToSI(v, u, units));
}

/** Overrides in SI → a unit system (for a form). */
export function takeoffOverridesFromSI(o: TakeoffOverrides, units: UnitSystem): TakeoffOverrides {
  return mapOverrides(o, (v, u) => assumptionFromSI(v, u, units));
}

/** The take-off's kinds of item in words (the web's steps and the proposal print these). */
export const TAKEOFF_KIND_LABELS: Record<string, string> = {
  concrete: 'Concrete',
  reinforcement: 'Reinforcement',
  formwork: 'Formwork',
  excavation: 'Excavation',
  backfill: 'Backfill',
  riprap: 'Riprap',
  riprapMass: 'Riprap (mass)',
  bedding: 'Bedding',
  geotextile: 'Geotextile',
  waterstop: 'Waterstop',
  joint: 'Joints',
};
export const takeoffKindLabel = (k: string): string => TAKEOFF_KIND_LABELS[k] ?? k;

/** The take-off's elements in words. */
export const TAKEOFF_ELEMENT_LABELS: Record<string, string> = {
  floorSlab: 'Floor slab',
  sideWalls: 'Side walls',
  chuteBlocks: 'Chute blocks',
  bafflePiers: 'Baffle piers',
  floorBlocks: 'Floor blocks',
  impactBaffle: 'Impact baffle',
  endSill: 'End sill',
  cutoffWalls: 'Cutoff walls',
  wingwalls: 'Wingwalls',
  transition: 'Transition',
  structure: 'Whole structure',
  exitProtection: 'Protection at the exit',
};
export const takeoffElementLabel = (e: string): string => TAKEOFF_ELEMENT_LABELS[e] ?? e;

/** A take-off line key (`kind.element`) in words: "Concrete — Floor slab". */
export const takeoffLineLabel = (key: string): string => {
  const [kind = '', element = ''] = key.split('.');
  return `${takeoffKindLabel(kind)} — ${takeoffElementLabel(element)}`;
};

// The maths of a concept estimate, pure: lines of quantity × unit price (a quantity may be
// overridden with a reason), a location factor, percentages, escalation to the construction
// mid-point and the accuracy range of the estimate's class. No rounding: the edges round.
import { InputError } from '../errors';
import { convert } from '../units/convert';
import { ESTIMATE_LIMITS } from '../schemas/limits';
import type { TakeoffQuantityKind } from '../takeoff/takeoff';

/**
 * Units a price may be given in, by the kind of quantity they measure: a take-off line's SI
 * quantity converts into any unit of its kind (quantityInUnit). 'ton' is the US short ton
 * (2,000 lb), 't' the metric tonne.
 */
export const PRICE_UNITS = {
  m3: { kind: 'earthwork', expr: 'm^3', label: 'm³' },
  yd3: { kind: 'earthwork', expr: 'yd^3', label: 'yd³' },
  ft3: { kind: 'earthwork', expr: 'ft^3', label: 'ft³' },
  kg: { kind: 'mass', expr: 'kg', label: 'kg' },
  t: { kind: 'mass', expr: 'tonne', label: 't' },
  lb: { kind: 'mass', expr: 'lb', label: 'lb' },
  ton: { kind: 'mass', expr: 'ton', label: 'ton' },
  m2: { kind: 'area', expr: 'm^2', label: 'm²' },
  ft2: { kind: 'area', expr: 'ft^2', label: 'ft²' },
  yd2: { kind: 'area', expr: 'yd^2', label: 'yd²' },
  m: { kind: 'length', expr: 'm', label: 'm' },
  ft: { kind: 'length', expr: 'ft', label: 'ft' },
} as const satisfies Record<string, { kind: TakeoffQuantityKind; expr: string; label: string }>;
export type PriceUnit = keyof typeof PRICE_UNITS;

const SI_EXPR: Record<TakeoffQuantityKind, string> = {
  earthwork: 'm^3',
  mass: 'kg',
  area: 'm^2',
  length: 'm',
};

export function isPriceUnit(u: unknown): u is PriceUnit {
  return typeof u === 'string' && Object.prototype.hasOwnProperty.call(PRICE_UNITS, u);
}

/**
 * A take-off quantity (SI: m³, kg, m², m) in a price unit of the same kind.
 * @example quantityInUnit(0.764554857984, 'earthwork', 'yd3') // 1
 */
export function quantityInUnit(si: number, kind: TakeoffQuantityKind, unit: PriceUnit): number {
  const u = PRICE_UNITS[unit];
  if (!u) throw new InputError('unit', 'invalid', `unknown price unit "${String(unit)}"`);
  if (u.kind !== kind)
    throw new InputError(
      'unit',
      'invalid',
      `a quantity of kind ${kind} cannot be priced per ${u.label} (a unit of ${u.kind})`,
    );
  return convert(si, SI_EXPR[kind], u.expr);
}

/** The AACE estimate classes a concept estimate may carry. */
export const AACE_CLASSES = [3, 4, 5] as const;
export type AaceClass = (typeof AACE_CLASSES)[number];

/**
 * Expected accuracy ranges by class [src: AACE International Recommended Practice 18R-97, Cost
 * Estimate Classification System, Figure 1]: the low end lies between the two figures of `low`,
 * the high end between those of `high` (fractions of the estimate).
 */
export const AACE_BANDS: Readonly<
  Record<AaceClass, { low: readonly [number, number]; high: readonly [number, number] }>
> = {
  5: { low: [-0.2, -0.5], high: [0.3, 1.0] },
  4: { low: [-0.15, -0.3], high: [0.2, 0.5] },
  3: { low: [-0.1, -0.2], high: [0.1, 0.3] },
};
export const AACE_SOURCE =
  'AACE International Recommended Practice 18R-97, Cost Estimate Classification System';

export interface EstimateLineInput {
  /** usually a take-off line's key, e.g. 'concrete.floorSlab' */
  key: string;
  description?: string;
  /** in `unit` (convert a take-off quantity with quantityInUnit) */
  quantity: number;
  /** the price's unit, as the price book gives it */
  unit: string;
  /** currency per unit */
  unitPrice: number;
  /** a quantity the estimator set instead of the take-off's, with the reason */
  override?: { quantity: number; reason: string };
}

export interface EstimatePercentages {
  mobilisation: number;
  careOfWater: number;
  contingency: number;
  overheadAndProfit: number;
}

export interface EstimateInput {
  lines: EstimateLineInput[];
  /** multiplies the direct cost (1 = the price book's own location) */
  locationFactor: number;
  /** fractions (0.05 = 5 %), applied in the order stated on estimate() */
  percentages: EstimatePercentages;
  /** compound escalation to the construction mid-point: × ((1 + annualRate)^years − 1) */
  escalation: { annualRate: number; years: number };
  /**
   * the estimate's class; low and high (fractions, e.g. −0.3 and 0.5) chosen within the
   * class's band, or absent to take the band's wide ends
   */
  accuracy: { aaceClass: AaceClass; low?: number; high?: number };
}

export interface EstimateLineResult extends EstimateLineInput {
  /** the quantity priced: the override's when there is one */
  quantityUsed: number;
  amount: number;
}

export interface EstimateResult {
  lines: EstimateLineResult[];
  /** Σ quantity × unit price */
  direct: number;
  /** direct × location factor */
  located: number;
  mobilisation: number;
  careOfWater: number;
  contingency: number;
  overheadAndProfit: number;
  escalation: number;
  total: number;
  accuracy: {
    aaceClass: AaceClass;
    lowPct: number;
    highPct: number;
    /** total × (1 + lowPct) and total × (1 + highPct) */
    low: number;
    high: number;
    /** 'band-ends': the class's wide ends (none chosen); 'chosen': the user's, within the band */
    basis: 'band-ends' | 'chosen';
    source: string;
  };
  /** the order of operations, in words */
  steps: string[];
}

function req(field: string, v: unknown, min: number, max: number): number {
  if (typeof v !== 'number' || !Number.isFinite(v) || v < min || v > max)
    throw new InputError(field, 'out-of-range', `${field} must be a number from ${min} to ${max}`, {
      min,
      max,
    });
  return v;
}

/** The order the amounts are built in (stated with every estimate). */
export const ESTIMATE_STEPS: readonly string[] = [
  'Direct cost = Σ quantity × unit price (an overridden quantity replaces the take-off one)',
  'Located cost = direct cost × location factor',
  'Mobilisation and care of water = their percentages × located cost',
  'Contingency = its percentage × (located cost + mobilisation + care of water)',
  'Overhead and profit = its percentage × (the above + contingency)',
  'Escalation = (the above + overhead and profit) × ((1 + annual rate)^years − 1), compounded yearly to the construction mid-point',
  'Total = the above + escalation; accuracy range = total × (1 + low %) to total × (1 + high %)',
];

/**
 * A concept estimate from priced lines (ESTIMATE_STEPS gives the order). Throws an InputError
 * naming the field for a value out of its bounds (ESTIMATE_LIMITS), an override without a
 * reason, or a low/high outside the class's published band.
 */
export function estimate(input: EstimateInput): EstimateResult {
  const L = ESTIMATE_LIMITS;
  if (!input || typeof input !== 'object' || !Array.isArray(input.lines))
    throw new InputError('lines', 'invalid', 'an estimate needs its lines');
  if (input.lines.length > L.maxLines)
    throw new InputError('lines', 'out-of-range', `at most ${L.maxLines} lines`, {
      max: L.maxLines,
    });
  const lines: EstimateLineResult[] = input.lines.map((l, i) => {
    const q = req(`lines[${i}].quantity`, l.quantity, 0, L.maxAmount);
    const p = req(`lines[${i}].unitPrice`, l.unitPrice, 0, L.maxAmount);
    let used = q;
    if (l.override !== undefined) {
      used = req(`lines[${i}].override.quantity`, l.override.quantity, 0, L.maxAmount);
      if (typeof l.override.reason !== 'string' || l.override.reason.trim() === '')
        throw new InputError(
          `lines[${i}].override.reason`,
          'invalid',
          'a changed quantity needs its reason',
        );
    }
    return { ...l, quantityUsed: used, amount: used * p };
  });
  const lf = req(
    'locationFactor',
    input.locationFactor,
    L.locationFactor.min,
    L.locationFactor.max,
  );
  const pc = input.percentages ?? ({} as EstimatePercentages);
  const pct = (k: keyof EstimatePercentages): number =>
    req(`percentages.${k}`, pc[k], L.percentage.min, L.percentage.max);
  const rate = req(
    'escalation.annualRate',
    input.escalation?.annualRate,
    L.escalationRate.min,
    L.escalationRate.max,
  );
  const years = req(
    'escalation.years',
    input.escalation?.years,
    L.escalationYears.min,
    L.escalationYears.max,
  );
  const cls = input.accuracy?.aaceClass;
  if (!AACE_CLASSES.includes(cls as AaceClass))
    throw new InputError('accuracy.aaceClass', 'invalid', 'the estimate class must be 3, 4 or 5');
  const band = AACE_BANDS[cls];
  const chosenLow = input.accuracy.low;
  const chosenHigh = input.accuracy.high;
  const lowPct =
    chosenLow === undefined
      ? band.low[1]
      : req('accuracy.low', chosenLow, band.low[1], band.low[0]);
  const highPct =
    chosenHigh === undefined
      ? band.high[1]
      : req('accuracy.high', chosenHigh, band.high[0], band.high[1]);

  const direct = lines.reduce((s, l) => s + l.amount, 0);
  const located = direct * lf;
  const mobilisation = located * pct('mobilisation');
  const careOfWater = located * pct('careOfWater');
  const s1 = located + mobilisation + careOfWater;
  const contingency = s1 * pct('contingency');
  const s2 = s1 + contingency;
  const overheadAndProfit = s2 * pct('overheadAndProfit');
  const s3 = s2 + overheadAndProfit;
  const escalation = s3 * (Math.pow(1 + rate, years) - 1);
  const total = s3 + escalation;
  return {
    lines,
    direct,
    located,
    mobilisation,
    careOfWater,
    contingency,
    overheadAndProfit,
    escalation,
    total,
    accuracy: {
      aaceClass: cls,
      lowPct,
      highPct,
      low: total * (1 + lowPct),
      high: total * (1 + highPct),
      basis: chosenLow === undefined && chosenHigh === undefined ? 'band-ends' : 'chosen',
      source: AACE_SOURCE,
    },
    steps: [...ESTIMATE_STEPS],
  };
}

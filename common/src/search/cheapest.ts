// The cheapest design that works: a search over basin width × every type that passes
// screening, costing each design's take-off at the given unit rates. The discharge range is
// prepared once (tailwater, discharges); each width re-prepares only the toes and designs the
// types, so the search costs about (widths × one study).
import { designDissipators, type DesignEntry } from '../basins/study';
import type { DissipatorTypeId } from '../basins/types';
import { DISSIPATOR_CATALOGUE } from '../basins/catalogue';
import { prepareInflowToes } from '../hydraulics/toeByInflow';
import { engineFailure, InputError, type EngineFailure } from '../errors';
import { prepareRange, type DischargeRange, type StudyInput } from '../range';
import { ENGINE_LIMITS, SEARCH_LIMITS } from '../schemas/limits';
import type { TakeoffOverrides } from '../takeoff/assumptions';
import type { Takeoff } from '../takeoff/takeoff';
import { checkRates, measuresOf, type TypeMeasures, type UnitRates } from './cost';

export interface CheapestSearchInput {
  /** the study input, SI */
  study: StudyInput;
  /** widths the engineer allows, m (SI); `steps` widths evenly spaced, ends included */
  width: { min: number; max: number; steps?: number };
  rates: UnitRates;
  overrides?: TakeoffOverrides;
}

/** One type at one width. */
export interface SearchPoint extends TypeMeasures {
  /** usable by screening and, for a jump basin, the jump held at every discharge */
  passes: boolean;
  /** why it does not pass (plain words), when it does not */
  reason?: string;
}

export interface CheapestSearchResult {
  widths: number[];
  /** the range searched and why it is what it is */
  widthBounds: { min: number; max: number; basis: string[] };
  /** every type designed at every width (passing or not) */
  points: SearchPoint[];
  /** the chart: one line per type, cost at each width (null where it does not pass) */
  series: Array<{
    type: DissipatorTypeId;
    name: string;
    points: Array<{ width: number; cost: number | null }>;
  }>;
  /** the cheapest passing design, with its take-off; null when none passes */
  best: (SearchPoint & { takeoff: Takeoff }) | null;
  /** widths where nothing could be designed, and why */
  /** widths no type could be designed at, with why as data (phrase with engineFailureText) */
  failures: Array<{ width: number; failure: EngineFailure }>;
  /** take-off keys that had no rate (not priced) */
  unpricedKeys: string[];
}

const USABLE = new Set(['recommended', 'suitable', 'marginal']);

/** The prepared range at another basin width: the tailwater and discharges are reused. */
export function rangeAtWidth(range: DischargeRange, width: number): DischargeRange {
  const input: StudyInput = { ...range.input, basinWidth: width };
  const toes = prepareInflowToes(input.inflow, range.Qs, width, range.designIndex);
  const kept = range.notes.filter(
    (n) => n.code === 'design-discharge-added' || n.code === 'tailwater-extended',
  );
  return {
    ...range,
    input,
    width,
    basin: { shape: 'rectangular', width },
    y1At: toes.y1At,
    toeAt: toes.toeAt,
    floorDependent: toes.floorDependent,
    notes: [...kept, ...toes.notes],
  };
}

/** Width of the flow entering the basin, m, when the input gives it (outlet barrel or weir crest). */
function inflowWidth(input: StudyInput): number | null {
  const inflow = input.inflow;
  if (inflow.kind === 'pipe' && inflow.outlet.kind === 'barrel') {
    const s = inflow.outlet.section;
    return s.shape === 'circular'
      ? s.diameter
      : s.shape === 'rectangular'
        ? s.width
        : s.bottomWidth;
  }
  if (inflow.kind === 'chute' && inflow.headwater.kind === 'weir') return inflow.headwater.L;
  return null;
}

/** Does a design hold the jump at every discharge (a jump basin's own rows), and if not, why. */
export function holdsEverywhere(entry: DesignEntry): { ok: boolean; reason?: string } {
  const d = entry.design;
  if (d.family !== 'jump-basin') return { ok: true };
  const short = d.rows.filter((r) => r.margin < -1e-9 * Math.max(1, r.requiredDepth));
  return short.length === 0
    ? { ok: true }
    : { ok: false, reason: `the tailwater is short of C·y2 at ${short.length} discharge(s)` };
}

/**
 * The cheapest design that holds the jump at every discharge, over `steps` widths between
 * the engineer's limits (narrowed by the natural spread of the jet: no basin narrower than the
 * flow entering it, none wider than the jet spreads to over the basin, tanθ = 1/(3·Fr1)
 * [src: HEC-14]) and every type that passes screening at that width. Costs are direct costs at
 * the unit rates (percentages scale every design alike and do not change the order). Pure; SI.
 */
export function cheapestDesign(input: CheapestSearchInput): CheapestSearchResult {
  if (!input || typeof input !== 'object')
    throw new InputError(
      'body',
      'invalid',
      'the search needs a study, width limits and unit rates',
    );
  checkRates(input.rates);
  const w = input.width;
  const maxW = ENGINE_LIMITS.maxBasinWidth.SI;
  const reqW = (f: string, v: unknown): number => {
    if (typeof v !== 'number' || !Number.isFinite(v) || v <= 0 || v > maxW)
      throw new InputError(
        f,
        'out-of-range',
        `${f} must be a width above 0 and at most ${maxW} m`,
        {
          min: 0,
          max: maxW,
        },
      );
    return v;
  };
  const wMin = reqW('width.min', w?.min);
  const wMax = reqW('width.max', w?.max);
  if (wMax < wMin)
    throw new InputError('width.max', 'out-of-range', 'width.max must not be below width.min', {
      min: wMin,
      max: maxW,
    });
  const steps = w.steps ?? SEARCH_LIMITS.defaultWidthSteps;
  if (!Number.isInteger(steps) || steps < 1 || steps > SEARCH_LIMITS.maxWidthSteps)
    throw new InputError(
      'width.steps',
      'out-of-range',
      `width.steps must be a whole number from 1 to ${SEARCH_LIMITS.maxWidthSteps}`,
      { min: 1, max: SEARCH_LIMITS.maxWidthSteps },
    );
  const overrides = input.overrides ?? {};
  const base = prepareRange(input.study);
  const opts = { ...(input.study.dissipators ?? {}), units: 'SI' as const };
  delete (opts as { chosenType?: unknown }).chosenType;

  // The natural spread of the jet bounds the range.
  const basis: string[] = [`the engineer's limits ${wMin}–${wMax} m`];
  let lo = wMin;
  let hi = wMax;
  const b0 = inflowWidth(input.study);
  if (b0 !== null && b0 > lo) {
    lo = Math.min(b0, hi);
    basis.push(`no narrower than the flow entering the basin (${b0} m)`);
  }
  // The designs at the narrowest width: the spread is read from them, and the grid reuses them.
  let atLo: { width: number; res: ReturnType<typeof designDissipators> } | null = null;
  if (b0 !== null) {
    // The spread over the basin, from the design discharge at the narrowest width tried.
    try {
      const r0 = designDissipators(rangeAtWidth(base, lo), opts);
      atLo = { width: lo, res: r0 };
      const lengths = [r0.design, ...r0.alternatives]
        .filter((e): e is DesignEntry => e !== null && e.design.family === 'jump-basin')
        .map((e) =>
          e.design.family === 'jump-basin' ? { L: e.design.length, fr: e.design.water.fr1 } : null,
        )
        .filter((x): x is { L: number; fr: number } => x !== null);
      if (lengths.length > 0) {
        const spread = Math.max(...lengths.map((x) => b0 + (2 * x.L) / (3 * x.fr)));
        if (spread < hi) {
          hi = Math.max(lo, spread);
          basis.push(
            `no wider than the jet spreads over the basin, b0 + 2·L/(3·Fr1) = ${Number(spread.toPrecision(4))} m [src: HEC-14 tanθ = 1/(3·Fr)]`,
          );
        }
      }
    } catch (e) {
      if (!(e instanceof RangeError)) throw e;
    }
  }
  const widths =
    steps === 1 || hi === lo
      ? [lo]
      : Array.from({ length: steps }, (_, i) => lo + ((hi - lo) * i) / (steps - 1));

  const points: SearchPoint[] = [];
  const failures: CheapestSearchResult['failures'] = [];
  const unpriced = new Set<string>();
  let best: CheapestSearchResult['best'] = null;
  for (const W of widths) {
    let res;
    try {
      res = atLo?.width === W ? atLo.res : designDissipators(rangeAtWidth(base, W), opts);
    } catch (e) {
      if (!(e instanceof RangeError)) throw e;
      failures.push({ width: W, failure: engineFailure(e) });
      continue;
    }
    const entries = [res.design, ...res.alternatives].filter((e): e is DesignEntry => e !== null);
    for (const s of res.screening) {
      const entry = entries.find((e) => e.type === s.type);
      if (!entry) continue; // not sized (a specialist type, or one this inflow cannot have)
      const m = measuresOf(entry, input.rates, overrides);
      for (const k of m.unpriced) unpriced.add(k);
      const hold = holdsEverywhere(entry);
      const usable = USABLE.has(s.verdict);
      const point: SearchPoint = {
        ...m,
        width: W,
        passes: usable && hold.ok,
      };
      delete (point as Partial<typeof m>).takeoff;
      if (!usable) point.reason = `screening: ${s.verdict}`;
      else if (!hold.ok) point.reason = hold.reason!;
      points.push(point);
      if (point.passes && (best === null || point.cost < best.cost))
        best = { ...point, takeoff: m.takeoff };
    }
  }
  const types = [...new Set(points.map((p) => p.type))];
  const series = types.map((type) => ({
    type,
    name: DISSIPATOR_CATALOGUE.find((m) => m.id === type)?.name ?? type,
    points: widths.map((width) => {
      const p = points.find((x) => x.type === type && x.width === width);
      return { width, cost: p && p.passes ? p.cost : null };
    }),
  }));
  return {
    widths,
    widthBounds: { min: lo, max: hi, basis },
    points,
    series,
    best,
    failures,
    unpricedKeys: [...unpriced].sort(),
  };
}

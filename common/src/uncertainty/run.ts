// How sure is the floor: the sensitivity of the required floor to each uncertain input (tornado
// data) and a seeded Monte Carlo of the risk that the chosen floor lets the jump sweep out.
// Pure and SI; the discharge range is prepared once and each sample costs only what changes
// (a tailwater rating when the downstream n varies, the toes when the inflow varies) and one
// floor solve. Reproducible: the same seed gives the same numbers (seedrandom's ARC4 generator).
import seedrandom from 'seedrandom';
import { G } from '../units/constants';
import { InputError } from '../errors';
import { belangerRatio } from '../hydraulics/jump';
import {
  prepareRange,
  solveFloor,
  RANGE_DEFAULTS,
  type DischargeRange,
  type StudyInput,
} from '../range';
import { UNCERTAINTY_LIMITS } from '../schemas/limits';
import { quantile, SENSITIVITY_QUANTILES } from './distributions';
import {
  AS_DESIGNED,
  rangeWith,
  validateUncertainInputs,
  valuesAt,
  type UncertainInput,
  type UncertainKey,
  type Values,
} from './inputs';

export interface UncertaintyRequest {
  inputs: UncertainInput[];
  /** Monte Carlo samples (1 – UNCERTAINTY_LIMITS.maxSamples) */
  samples: number;
  /** any text: the same seed gives the same samples */
  seed: string;
  /** confidence of the floor to report, e.g. 0.9: the floor that holds in 90 % of the samples */
  confidence: number;
}

export interface SensitivityRow {
  key: UncertainKey;
  /** the input at its 5 % and 95 % points (factor or depth, m) */
  low: number;
  high: number;
  /** required floor elevation with the input there, others as designed, m (null: no floor holds) */
  floorAtLow: number | null;
  floorAtHigh: number | null;
  /** change from the floor as designed, m (null: no floor holds) */
  changeAtLow: number | null;
  changeAtHigh: number | null;
  governingQAtLow: number | null;
  governingQAtHigh: number | null;
  /** the larger of the two changes, m (Infinity where no floor holds): the tornado's order */
  swing: number;
}

export interface HistogramBin {
  /** bin edges, m */
  from: number;
  to: number;
  count: number;
}

export interface UncertaintyResult {
  /** required floor elevation and governing discharge as designed (the deterministic study), SI */
  asDesigned: { requiredElevation: number; governingQ: number };
  /** the floor the risk is computed at: the fixed floor, or the required one less the safety depth, m */
  chosenFloor: number;
  /** largest swing first */
  sensitivity: SensitivityRow[];
  monteCarlo: {
    samples: number;
    seed: string;
    /** samples where the tailwater falls short of C·y2 at some analysed discharge at the chosen floor */
    sweepOutCount: number;
    probability: number;
    /** √(p(1 − p)/N): the sampling error of the probability */
    standardError: number;
    /** the discharge (as designed) where the shortfall is largest most often, and how often; null: never */
    mostOftenQ: { Q: number; isDesign: boolean; count: number } | null;
    /** samples where no floor at all holds the jump (a supercritical tailwater or too weak a jump) */
    noFloorCount: number;
    requiredFloor: {
      min: number;
      max: number;
      mean: number;
      /** the 5, 10, 50, 90 and 95 % points of the required floor, m */
      percentiles: Array<{ p: number; elevation: number }>;
      histogram: HistogramBin[];
    } | null;
    /** the floor that holds in `confidence` of the samples: the (1 − confidence) point, m; null if too many have no floor */
    floorAtConfidence: { confidence: number; elevation: number } | null;
  };
}

export interface UncertaintyOptions {
  /** called every `progressEvery` samples and at the end with (done, total) */
  onProgress?: (done: number, total: number) => void;
  progressEvery?: number;
}

/** TW − z − C·y2 at discharge i and floor z (+∞ where no supercritical toe forms: nothing to sweep out). */
function shortfallMargin(r: DischargeRange, i: number, z: number, C: number): number {
  let y1: number;
  if (r.y1At) y1 = r.y1At(i, z);
  else {
    try {
      y1 = r.toeAt(i, z).y1;
    } catch (e) {
      if (!(e instanceof RangeError)) throw e;
      y1 = -1;
    }
  }
  if (!(y1 > 0)) return Infinity;
  const q = r.Qs[i]! / r.width;
  const fr1 = q / (y1 * Math.sqrt(G * y1));
  if (!(fr1 > 1)) return Infinity;
  return r.tw[i]!.elevation - z - C * y1 * belangerRatio(fr1); // Bélanger, rectangular basin
}

function floorOf(r: DischargeRange | { noJump: true }, C: number) {
  if ('noJump' in r) return null;
  try {
    return solveFloor(r, C);
  } catch (e) {
    if (e instanceof InputError && e.code === 'no-floor') return null;
    throw e;
  }
}

/** The p point of ascending values (linear between order statistics, Hyndman & Fan type 7). */
function percentile(sorted: readonly number[], p: number): number {
  const h = (sorted.length - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.min(sorted.length - 1, lo + 1);
  return sorted[lo]! + (h - lo) * (sorted[hi]! - sorted[lo]!);
}

function histogram(sorted: readonly number[], bins = 20): HistogramBin[] {
  const min = sorted[0]!;
  const max = sorted[sorted.length - 1]!;
  if (max === min) return [{ from: min, to: max, count: sorted.length }];
  const w = (max - min) / bins;
  const out: HistogramBin[] = Array.from({ length: bins }, (_, k) => ({
    from: min + k * w,
    to: k === bins - 1 ? max : min + (k + 1) * w,
    count: 0,
  }));
  for (const x of sorted) out[Math.min(bins - 1, Math.floor((x - min) / w))]!.count++;
  return out;
}

/** Refuses a request outside its bounds (UNCERTAINTY_LIMITS), naming the field. */
export function validateUncertaintyRequest(input: StudyInput, req: UncertaintyRequest): void {
  if (!req || typeof req !== 'object')
    throw new InputError('uncertainty', 'invalid', 'uncertainty must be given');
  const n = req.samples;
  if (!Number.isInteger(n) || n < 1 || n > UNCERTAINTY_LIMITS.maxSamples)
    throw new InputError(
      'uncertainty.samples',
      'out-of-range',
      `uncertainty.samples must be a whole number 1–${UNCERTAINTY_LIMITS.maxSamples}`,
      { min: 1, max: UNCERTAINTY_LIMITS.maxSamples },
    );
  const { min, max } = UNCERTAINTY_LIMITS.confidence;
  if (!(req.confidence >= min && req.confidence <= max))
    throw new InputError(
      'uncertainty.confidence',
      'out-of-range',
      `uncertainty.confidence must lie between ${min} and ${max}`,
      { min, max },
    );
  if (typeof req.seed !== 'string')
    throw new InputError('uncertainty.seed', 'invalid', 'uncertainty.seed must be text');
  validateUncertainInputs(input, req.inputs);
}

/**
 * Sensitivity and risk of the floor of a design (SI input, as runStudy takes it). The design's
 * floor as designed comes from the same floor solve as runStudy's `floor.requiredElevation`.
 * Risk: for each sample, every uncertain input drawn by its inverse distribution from one
 * seeded uniform number, the floor solved again, and the margin TW − C·y2 checked at the
 * chosen floor at every analysed discharge. [hydraulics.md §3; Monte Carlo standard error
 * √(p(1 − p)/N), e.g. any text on sampling]
 */
export function runUncertainty(
  input: StudyInput,
  req: UncertaintyRequest,
  options: UncertaintyOptions = {},
): UncertaintyResult {
  const base = prepareRange(input);
  validateUncertaintyRequest(input, req);
  const C = input.tailwaterFactor ?? RANGE_DEFAULTS.tailwaterFactor;
  const designed = solveFloor(base, C);
  const chosenFloor =
    input.floorElevation !== undefined
      ? input.floorElevation
      : designed.elevation - base.floorSafetyDepth;

  // Sensitivity: each input to its 5 % and 95 % points, the others as designed.
  const sensitivity: SensitivityRow[] = req.inputs.map((u) => {
    const at = (p: number) => {
      const x = quantile(u.distribution, p);
      const v: Values = { ...AS_DESIGNED, [u.key]: x };
      const f = floorOf(rangeWith(base, v), C);
      return { x, f };
    };
    const lo = at(SENSITIVITY_QUANTILES.low);
    const hi = at(SENSITIVITY_QUANTILES.high);
    const change = (f: { elevation: number } | null) =>
      f ? f.elevation - designed.elevation : null;
    const cl = change(lo.f);
    const ch = change(hi.f);
    return {
      key: u.key,
      low: lo.x,
      high: hi.x,
      floorAtLow: lo.f?.elevation ?? null,
      floorAtHigh: hi.f?.elevation ?? null,
      changeAtLow: cl,
      changeAtHigh: ch,
      governingQAtLow: lo.f?.governingQ ?? null,
      governingQAtHigh: hi.f?.governingQ ?? null,
      swing: cl === null || ch === null ? Infinity : Math.max(Math.abs(cl), Math.abs(ch)),
    };
  });
  sensitivity.sort((a, b) => b.swing - a.swing);

  // Monte Carlo.
  const N = req.samples;
  const every = Math.max(1, options.progressEvery ?? 100);
  const rng = seedrandom(req.seed);
  const floors: number[] = [];
  const worstAt = new Array<number>(base.Qs.length).fill(0);
  let sweepOut = 0;
  let noFloor = 0;
  const u: number[] = new Array<number>(req.inputs.length).fill(0);
  for (let s = 0; s < N; s++) {
    for (let k = 0; k < u.length; k++) u[k] = rng();
    const r = rangeWith(base, valuesAt(req.inputs, u));
    if ('noJump' in r) {
      noFloor++;
      sweepOut++;
      worstAt[base.designIndex]!++; // no discharge holds it: counted at the design discharge
    } else {
      const f = floorOf(r, C);
      if (f) floors.push(f.elevation);
      else noFloor++;
      let least = Infinity;
      let at = -1;
      for (let i = 0; i < r.Qs.length; i++) {
        const m = shortfallMargin(r, i, chosenFloor, C);
        if (m < least) {
          least = m;
          at = i;
        }
      }
      if (least < 0) {
        sweepOut++;
        worstAt[at]!++;
      }
    }
    if ((s + 1) % every === 0 || s + 1 === N) options.onProgress?.(s + 1, N);
  }
  floors.sort((a, b) => a - b);
  const p = sweepOut / N;
  let most: UncertaintyResult['monteCarlo']['mostOftenQ'] = null;
  worstAt.forEach((count, i) => {
    if (count > 0 && (!most || count > most.count))
      most = { Q: base.Qs[i]!, isDesign: i === base.designIndex, count };
  });
  // The floor that holds in `confidence` of all samples: samples with no floor are the lowest.
  const tail = (1 - req.confidence) * N;
  let floorAtConfidence: UncertaintyResult['monteCarlo']['floorAtConfidence'] = null;
  if (floors.length > 0 && noFloor <= tail) {
    const within = (tail - noFloor) / floors.length; // the point among the samples that have a floor
    floorAtConfidence = {
      confidence: req.confidence,
      elevation: percentile(floors, Math.min(1, Math.max(0, within))),
    };
  }
  return {
    asDesigned: { requiredElevation: designed.elevation, governingQ: designed.governingQ },
    chosenFloor,
    sensitivity,
    monteCarlo: {
      samples: N,
      seed: req.seed,
      sweepOutCount: sweepOut,
      probability: p,
      standardError: Math.sqrt((p * (1 - p)) / N),
      mostOftenQ: most,
      noFloorCount: noFloor,
      requiredFloor:
        floors.length === 0
          ? null
          : {
              min: floors[0]!,
              max: floors[floors.length - 1]!,
              mean: floors.reduce((a, b) => a + b, 0) / floors.length,
              percentiles: [0.05, 0.1, 0.5, 0.9, 0.95].map((q) => ({
                p: q,
                elevation: percentile(floors, q),
              })),
              histogram: histogram(floors),
            },
      floorAtConfidence,
    },
  };
}

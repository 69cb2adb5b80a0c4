// The uncertain inputs of a design, their default spreads (each naming its basis), and how a set
// of their values changes the prepared discharge range. SI; a factor multiplies the design's
// value (1 = as designed), a depth is in metres.
import { InputError } from '../errors';
import { _froude } from '../hydraulics/depths';
import { makeTailwaterRating, type TailwaterAt } from '../hydraulics/tailwater';
import { prepareInflowToes, type StudyInflow } from '../hydraulics/toeByInflow';
import type { LossModel } from '../hydraulics/inflow';
import type { DischargeRange, StudyInput } from '../range';
import { ENGINE_LIMITS, UNCERTAINTY_LIMITS } from '../schemas/limits';
import { quantile, validateDistribution, type Distribution } from './distributions';

export const UNCERTAIN_KEYS = [
  'downstreamN',
  'ratingShift',
  'bedLowering',
  'chuteLoss',
  'weirC',
  'designDischarge',
] as const;

/**
 * downstreamN: factor on the downstream channel's Manning's n (a Manning tailwater);
 * ratingShift: depth (m) added to every tailwater level of a rating table (+ up);
 * bedLowering: long-term lowering of the downstream bed (m, ≥ 0): the whole rating drops by it;
 * chuteLoss: factor on the loss allowance (fraction, Cv or K) — or on the chute's Manning's n
 * when the chute is computed; weirC: factor on the weir coefficient; designDischarge: factor on
 * the design discharge (its row moves; the other analysed discharges stay).
 */
export type UncertainKey = (typeof UNCERTAIN_KEYS)[number];

/** Whether the values of a key are a factor on a design value or a depth (m). */
export const UNCERTAIN_KIND: Record<UncertainKey, 'factor' | 'depth'> = {
  downstreamN: 'factor',
  ratingShift: 'depth',
  bedLowering: 'depth',
  chuteLoss: 'factor',
  weirC: 'factor',
  designDischarge: 'factor',
};

export interface UncertainInput {
  key: UncertainKey;
  distribution: Distribution;
  /** the published basis of the spread, or "engineer's judgement" */
  basis: string;
}

/** The value of every key as designed: factor 1, depth 0. */
export type Values = Record<UncertainKey, number>;
export const AS_DESIGNED: Readonly<Values> = {
  downstreamN: 1,
  ratingShift: 0,
  bedLowering: 0,
  chuteLoss: 1,
  weirC: 1,
  designDischarge: 1,
};

/** A note the engineer reads beside the bed lowering. */
export const BED_LOWERING_NOTE =
  'Expect long-term lowering below a dam or pond that traps sediment (the clear water picks up the bed), where the channel has been straightened, dredged or mined, and where a downstream control is being lowered; it develops over years to decades. Take it from a sediment study or from surveys of the reach where there are any.';

/** Which keys apply to a design (SI input), and why the others do not. */
export function applicableKeys(input: StudyInput): UncertainKey[] {
  const keys: UncertainKey[] = [];
  if (input.tailwater?.kind === 'manning') keys.push('downstreamN');
  if (input.tailwater?.kind === 'table') keys.push('ratingShift');
  keys.push('bedLowering');
  const inflow = input.inflow;
  if (inflow?.kind === 'chute') {
    if (inflow.chute !== undefined || inflow.lossModel?.kind !== 'none') keys.push('chuteLoss');
    if (inflow.chute === undefined && inflow.headwater?.kind === 'weir') keys.push('weirC');
  } else if (inflow?.kind === 'pipe' && inflow.lossModel && inflow.lossModel.kind !== 'none')
    keys.push('chuteLoss');
  keys.push('designDischarge');
  return keys;
}

/**
 * The default spread of every input that applies to the design (SI input), each naming its
 * basis. Values recalled from texts are marked "from memory".
 */
export function defaultUncertainInputs(input: StudyInput): UncertainInput[] {
  const out: UncertainInput[] = [];
  for (const key of applicableKeys(input)) {
    switch (key) {
      case 'downstreamN':
        out.push({
          key,
          distribution: { kind: 'triangular', low: 0.8, mode: 1, high: 1.2 },
          basis:
            "Chow 1959, Open-Channel Hydraulics, table 5-6: for a natural stream the minimum and maximum n of a class lie about 15–25 % either side of its normal value (from memory); ±20 % about the design's n",
        });
        break;
      case 'ratingShift':
        out.push({
          key,
          distribution: { kind: 'uniform', low: -0.15, high: 0.15 },
          basis:
            "engineer's judgement: a rating table shifts by a few tenths of a metre after floods as its control scours or fills",
        });
        break;
      case 'bedLowering':
        out.push({
          key,
          distribution: { kind: 'triangular', low: 0, mode: 0, high: 0.5 },
          basis: `engineer's judgement: none most likely, up to 0.5 m over the structure's life. ${BED_LOWERING_NOTE}`,
        });
        break;
      case 'chuteLoss': {
        const inflow = input.inflow;
        const loss: LossModel | undefined =
          inflow.kind === 'chute' || inflow.kind === 'pipe' ? inflow.lossModel : undefined;
        if (inflow.kind === 'chute' && inflow.chute !== undefined)
          out.push({
            key,
            distribution: { kind: 'triangular', low: 0.85, mode: 1, high: 1.2 },
            basis:
              "Chow 1959, Open-Channel Hydraulics, table 5-6: concrete linings run from about 0.011 (trowelled) to 0.017 (rough, unfinished) about a normal 0.013–0.015 (from memory); −15 %/+20 % about the chute's n",
          });
        else if (loss?.kind === 'velocityCoefficient')
          out.push({
            key,
            distribution: {
              kind: 'normal',
              mean: 1,
              sd: 0.03,
              low: 0.9,
              high: Math.min(1.1, 1 / loss.Cv),
            },
            basis:
              "engineer's judgement: a velocity coefficient is known to a few per cent at best; truncated so Cv never exceeds 1",
          });
        else
          out.push({
            key,
            distribution: { kind: 'uniform', low: 0.5, high: 1.5 },
            basis: "engineer's judgement: a loss allowance is an estimate; ±50 % of the one typed",
          });
        break;
      }
      case 'weirC':
        out.push({
          key,
          distribution: { kind: 'normal', mean: 1, sd: 0.05, low: 0.9, high: 1.1 },
          basis:
            "engineer's judgement: without a model test or a calibrated rating a weir coefficient is seldom known better than ±5–10 %",
        });
        break;
      case 'designDischarge':
        out.push({
          key,
          distribution: { kind: 'triangular', low: 0.85, mode: 1, high: 1.25 },
          basis:
            "engineer's judgement: a design flood estimate carries wide error, more often under than over; use the hydrology's own confidence limits where it gives them",
        });
        break;
    }
  }
  return out;
}

/** The design value a factor multiplies, with its field and physical range (null: none). */
function targetOf(
  input: StudyInput,
  key: UncertainKey,
): { field: string; value: number; min: number; max: number } | null {
  const inflow = input.inflow;
  const N = ENGINE_LIMITS.manningN;
  switch (key) {
    case 'downstreamN':
      return input.tailwater?.kind === 'manning'
        ? { field: 'tailwater.manningN', value: input.tailwater.manningN, ...N }
        : null;
    case 'weirC':
      return inflow?.kind === 'chute' && inflow.headwater?.kind === 'weir'
        ? {
            field: 'inflow.headwater.C',
            value: inflow.headwater.C,
            ...ENGINE_LIMITS.weirCoefficient.SI,
          }
        : null;
    case 'designDischarge':
      return { field: 'designDischarge', value: input.designDischarge, min: 0, max: Infinity };
    case 'chuteLoss': {
      if (inflow?.kind === 'chute' && inflow.chute !== undefined)
        return { field: 'inflow.chute.manningN', value: inflow.chute.manningN, ...N };
      const loss = inflow?.kind === 'chute' || inflow?.kind === 'pipe' ? inflow.lossModel : null;
      if (loss?.kind === 'fraction')
        return { field: 'inflow.lossModel.value', value: loss.value, min: 0, max: 0.95 };
      if (loss?.kind === 'velocityCoefficient')
        return { field: 'inflow.lossModel.Cv', value: loss.Cv, min: 0.1, max: 1 };
      if (loss?.kind === 'lossCoefficient')
        return { field: 'inflow.lossModel.K', value: loss.K, min: 0, max: Infinity };
      return null;
    }
    default:
      return null;
  }
}

/**
 * Refuses uncertain inputs that do not apply to the design, repeat a key, or reach outside the
 * physical range of what they move (a normal is truncated to [low, high], so those ends must be
 * physical). `field` is the path of the list in the request.
 */
export function validateUncertainInputs(
  input: StudyInput,
  inputs: readonly UncertainInput[],
  field = 'uncertainty.inputs',
): void {
  if (!Array.isArray(inputs as unknown))
    throw new InputError(field, 'invalid', `${field} must be a list of uncertain inputs`);
  const applicable = applicableKeys(input);
  const seen = new Set<string>();
  inputs.forEach((u, i) => {
    const at = `${field}[${i}]`;
    if (!u || typeof u !== 'object' || !(UNCERTAIN_KEYS as readonly string[]).includes(u.key))
      throw new InputError(
        `${at}.key`,
        'invalid',
        `${at}.key must be one of ${UNCERTAIN_KEYS.join(', ')}`,
      );
    if (seen.has(u.key))
      throw new InputError(`${at}.key`, 'invalid', `${at}.key: ${u.key} is listed twice`);
    seen.add(u.key);
    if (!applicable.includes(u.key))
      throw new InputError(
        `${at}.key`,
        'invalid',
        `${at}.key: ${u.key} does not apply to this design (it applies to: ${applicable.join(', ')})`,
      );
    const d = u.distribution;
    validateDistribution(d, `${at}.distribution`);
    const fieldLow = `${at}.distribution.low`;
    const fieldHigh = `${at}.distribution.high`;
    if (UNCERTAIN_KIND[u.key] === 'factor') {
      const { min, max } = UNCERTAINTY_LIMITS.factor;
      if (d.low < min)
        throw new InputError(fieldLow, 'out-of-range', `${fieldLow} must be at least ${min}`, {
          min,
          max,
        });
      if (d.high > max)
        throw new InputError(fieldHigh, 'out-of-range', `${fieldHigh} must not exceed ${max}`, {
          min,
          max,
        });
      const t = targetOf(input, u.key);
      if (t) {
        if (!(t.value * d.low >= t.min))
          throw new InputError(
            fieldLow,
            'out-of-range',
            `${fieldLow}: ${t.field} × ${d.low} falls below its least value ${t.min}`,
            { min: t.min / t.value },
          );
        if (!(t.value * d.high <= t.max))
          throw new InputError(
            fieldHigh,
            'out-of-range',
            `${fieldHigh}: ${t.field} × ${d.high} exceeds its greatest value ${t.max}`,
            { max: t.max / t.value },
          );
      }
    } else {
      const max = UNCERTAINTY_LIMITS.depth.SI;
      const min = u.key === 'bedLowering' ? 0 : -max;
      if (d.low < min)
        throw new InputError(fieldLow, 'out-of-range', `${fieldLow} must be at least ${min} m`, {
          min,
          max,
        });
      if (d.high > max)
        throw new InputError(fieldHigh, 'out-of-range', `${fieldHigh} must not exceed ${max} m`, {
          min,
          max,
        });
    }
  });
}

/** The value of each key at the probabilities `u` (one per input, in order); the rest as designed. */
export function valuesAt(inputs: readonly UncertainInput[], u: readonly number[]): Values {
  const v: Values = { ...AS_DESIGNED };
  inputs.forEach((x, i) => {
    v[x.key] = quantile(x.distribution, u[i]!);
  });
  return v;
}

/** The inflow with its loss (or chute n) and weir coefficient scaled. */
function scaledInflow(inflow: StudyInflow, lossF: number, cF: number): StudyInflow {
  const scaleLoss = (l: LossModel): LossModel =>
    l.kind === 'fraction'
      ? { kind: 'fraction', value: l.value * lossF }
      : l.kind === 'velocityCoefficient'
        ? { kind: 'velocityCoefficient', Cv: l.Cv * lossF }
        : l.kind === 'lossCoefficient'
          ? { kind: 'lossCoefficient', K: l.K * lossF }
          : l;
  if (inflow.kind === 'chute') {
    const headwater =
      inflow.headwater.kind === 'weir' && cF !== 1
        ? { ...inflow.headwater, C: inflow.headwater.C * cF }
        : inflow.headwater;
    if (inflow.chute !== undefined)
      return {
        ...inflow,
        headwater,
        chute: { ...inflow.chute, manningN: inflow.chute.manningN * lossF },
      };
    return { ...inflow, headwater, lossModel: scaleLoss(inflow.lossModel) };
  }
  if (inflow.kind === 'pipe' && inflow.lossModel)
    return { ...inflow, lossModel: scaleLoss(inflow.lossModel) };
  return inflow;
}

/** A range whose tailwater is supercritical at some discharge: no jump can be held there. */
export interface NoJump {
  noJump: true;
  Q: number;
}

/**
 * The prepared range with the uncertain inputs at `v`: the design discharge's row moved, the
 * tailwater re-rated only when the downstream n or a discharge changed (a shift or a lowering
 * only moves its levels), the toes prepared again only when the inflow or a discharge changed.
 * With every value as designed it is `base` itself.
 */
export function rangeWith(base: DischargeRange, v: Values): DischargeRange | NoJump {
  const input = base.input;
  const qF = v.designDischarge;
  const nF = v.downstreamN;
  const inflowChanged = v.chuteLoss !== 1 || v.weirC !== 1;
  const dz = v.ratingShift - v.bedLowering;
  if (qF === 1 && nF === 1 && !inflowChanged && dz === 0) return base;
  let Qs = base.Qs;
  const di = base.designIndex;
  if (qF !== 1) {
    const moved = [...base.Qs];
    moved[di] = input.designDischarge * qF;
    Qs = moved;
  }
  let tw: readonly TailwaterAt[] = base.tw;
  const spec = input.tailwater;
  if (nF !== 1 && spec.kind === 'manning') {
    const s = { ...spec, manningN: spec.manningN * nF };
    const rating = makeTailwaterRating(s, input.channelBedElevation);
    tw = Qs.map((Q) => rating(Q));
    for (let i = 0; i < Qs.length; i++)
      if (_froude(s.section, Qs[i]!, tw[i]!.depth) >= 1) return { noJump: true, Q: Qs[i]! };
  } else if (qF !== 1) {
    const rating = makeTailwaterRating(spec, input.channelBedElevation);
    const moved = [...base.tw];
    moved[di] = rating(Qs[di]!);
    if (spec.kind === 'manning' && _froude(spec.section, Qs[di]!, moved[di]!.depth) >= 1)
      return { noJump: true, Q: Qs[di]! };
    tw = moved;
  }
  if (dz !== 0)
    tw = tw.map((t) => ({
      elevation: t.elevation + dz,
      depth: t.depth + v.ratingShift, // a lowered bed takes the depth down with it
      outside: t.outside,
    }));
  let { y1At, toeAt, floorDependent } = base;
  let changedInput: StudyInput = input;
  if (inflowChanged || qF !== 1) {
    const inflow = inflowChanged ? scaledInflow(input.inflow, v.chuteLoss, v.weirC) : input.inflow;
    const toes = prepareInflowToes(inflow, Qs, base.width, di);
    ({ y1At, toeAt, floorDependent } = toes);
    changedInput = { ...input, inflow, designDischarge: Qs[di]! };
  }
  return { ...base, input: changedInput, Qs, tw, y1At, toeAt, floorDependent };
}

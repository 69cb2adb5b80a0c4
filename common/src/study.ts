// The whole design computation for one basin: inflow at the toe, jump and tailwater over the
// range of discharges, the highest floor elevation that holds the jump, excavation, the
// design-discharge jump and its diagrams. Pure; SI inside (m, s, m³/s); elevations on the
// project datum. Conversion to and from US customary is in units/ (toSI / fromSI).
import { G } from './units/constants';
import { requireFinite, requireInRange, requirePositive } from './hydraulics/guards';
import { _froude } from './hydraulics/depths';
import {
  hydraulicJump,
  jumpFromDepths,
  type JumpLengthMethod,
  type JumpResult,
} from './hydraulics/jump';
import {
  gateOpening,
  gateUpstreamDepth,
  jetFlareTangent,
  outletFlow,
  toeFromHead,
  _toeDepthOrNegative,
  toeFromKnown,
  validateLossModel,
  weirHead,
  type KnownToe,
  type LossModel,
  type ToeConditions,
} from './hydraulics/inflow';
import { createMonotoneInterpolant, type Interpolant } from './hydraulics/interpolate';
import { _directStepDistance } from './hydraulics/profiles';
import { validateSection, type Section } from './hydraulics/sections';
import { makeTailwaterRating, type TailwaterAt, type TailwaterSpec } from './hydraulics/tailwater';
import { jumpDiagrams, type JumpDiagrams } from './hydraulics/diagrams';
import {
  designDissipators,
  type DesignEntry,
  type DissipatorStudyOptions,
  type DissipatorStudyResult,
} from './basins/study';
import type { TypeScreening } from './basins/screening';
import type { DissipatorTypeId } from './basins/types';
import { phraser, type Phraser } from './units/phrase';
import { ENGINE_LIMITS, requireStudySize } from './schemas/limits';

export type UnitSystem = 'SI' | 'US';

export type DischargeSpec =
  { kind: 'list'; values: number[] } | { kind: 'range'; min: number; max: number; count: number };

export type HeadwaterSpec =
  /** Q = C·L·H^1.5 over the crest; C in the unit system of the input (SI: m^0.5/s) */
  | { kind: 'weir'; C: number; L: number }
  /** reservoir water-surface elevation against discharge */
  | { kind: 'table'; rows: Array<{ Q: number; elevation: number }> };

export type StudyInflow =
  | {
      kind: 'chute';
      crestElevation: number;
      headwater: HeadwaterSpec;
      lossModel: LossModel;
      /** velocity head of the approach flow added to the headwater, m (default 0: negligible) */
      approachVelocityHead?: number;
    }
  | {
      kind: 'gate';
      /** contraction coefficient, ≈ 0.61 [Henderson 1966] */
      Cc: number;
      /** give exactly one of: a fixed opening (upstream depth follows from Q), … */
      opening?: number;
      /** … a fixed upstream depth above the gate sill (opening follows), … */
      upstreamDepth?: number;
      /** … or a fixed upstream water elevation (depth = elevation − floor; sill at floor level) */
      upstreamElevation?: number;
    }
  | {
      kind: 'pipe';
      /** outlet invert elevation on the datum, m */
      invertElevation: number;
      outlet:
        | { kind: 'table'; rows: Array<{ Q: number; depth: number; velocity: number }> }
        | { kind: 'barrel'; section: Section; slope: number; manningN: number };
      lossModel?: LossModel;
    }
  | {
      kind: 'known';
      /** toe conditions at the design discharge; other discharges keep the same velocity */
      toe: KnownToe;
    };

/** Factor C on the sequent depth the tailwater must provide: TW ≥ C·y2. */
export type TailwaterFactor =
  | number
  | ((row: { Q: number; fr1: number; y1: number; y2: number; v1: number; q: number }) => number);

export interface StudyInput {
  /** units the user works in (presentation); every number here is SI once through toSI */
  units: UnitSystem;
  /** downstream channel bed elevation on the datum, m */
  channelBedElevation: number;
  /** rectangular basin width, m */
  basinWidth: number;
  /** design discharge, m³/s */
  designDischarge: number;
  /** discharges to check, m³/s */
  discharges: DischargeSpec;
  tailwater: TailwaterSpec;
  inflow: StudyInflow;
  /** TW ≥ C·y2 (default 1.0; the basin type sets it later) */
  tailwaterFactor?: number;
  /** a fixed floor elevation to analyse instead of the solved one, m */
  floorElevation?: number;
  /** tailwater above y2 by more than this fraction counts as a drowned jump (default 0.10) */
  submergenceTolerance?: number;
  /** Manning's n of the basin floor for the sweep-out distance (default 0.014, concrete) */
  floorManningN?: number;
  jumpLengthMethod?: JumpLengthMethod;
  /** dissipator screening and sizing options (debris, culvert, chosen type, defaults overrides) */
  dissipators?: DissipatorStudyOptions;
}

export type JumpPosition = 'at-toe' | 'swept-out' | 'drowned';

export interface StudyRow extends JumpResult {
  Q: number;
  /** unit discharge Q/b, m²/s */
  q: number;
  /** total head above the floor, m (null for known toe or fixed gate opening) */
  H0: number | null;
  yc: number;
  tailwaterElevation: number;
  /** tailwater depth above the basin floor, m */
  tailwaterDepth: number;
  /** 'below'/'above' when Q lies outside the tailwater rating table */
  tailwaterOutside: 'below' | 'above' | null;
  tailwaterFactor: number;
  /** C·y2, m */
  requiredDepth: number;
  /** tailwater depth − C·y2, m (negative: short) */
  margin: number;
  position: JumpPosition;
  /** (TW − y2)/y2: positive = submergence, negative = shortfall */
  submergenceRatio: number;
  /** how far down the horizontal floor the toe is pushed when swept out, m (null otherwise or off the floor) */
  sweepOutDistance: number | null;
  gate: { opening: number; upstreamDepth: number; submerged: boolean } | null;
  notes: string[];
}

export interface FloorSolution {
  /** highest floor elevation with TW ≥ C·y2 at every discharge, m */
  elevation: number;
  /** discharge where that condition binds, m³/s */
  governingQ: number;
}

export interface StudyResult {
  /** the input with defaults filled in, SI */
  input: StudyInput;
  rows: StudyRow[];
  floor: {
    /** floor elevation analysed, m */
    elevation: number;
    /** highest floor that holds the jump at every discharge, m (null if not found with a fixed floor) */
    requiredElevation: number | null;
    fixed: boolean;
    governingQ: number | null;
    tailwaterFactor: number;
    /** channel bed − floor, m (0 when the floor is at or above the bed) */
    depthBelowBed: number;
    excavation: { depth: number; width: number; length: number; volume: number; basis: string };
  };
  designJump: {
    Q: number;
    toe: ToeConditions;
    jump: JumpResult;
    tailwaterDepth: number;
    margin: number;
    position: JumpPosition;
  };
  diagrams: JumpDiagrams;
  warnings: string[];
  cautions: string[];
  /** every dissipator type screened at every discharge, in rank order (basins/screening.ts) */
  screening: TypeScreening[];
  /** the best-ranked usable type, or null (see the specialist types) */
  recommendedType: DissipatorTypeId | null;
  /** the chosen type's design with its drawing (the recommended one unless the user chose) */
  design: DesignEntry | null;
  /** the other usable types, designed */
  alternatives: DesignEntry[];
  /** the rest of the dissipator result: floors per type, context, assumptions, notes */
  dissipators: Omit<
    DissipatorStudyResult,
    'screening' | 'design' | 'alternatives' | 'recommended'
  > | null;
}

/** The cautions carried by every result (product.md; hydraulics.md §7), SI wording. */
export const STUDY_CAUTIONS: readonly string[] = [
  'Concept level only: verify with detailed design before construction.',
  'Large or high-hazard structures, inflow velocities above 15 m/s, Froude numbers outside the tested ranges and asymmetric approach flow call for physical or numerical model studies.',
  'Check cavitation on blocks and piers where the inflow velocity is high.',
  'Check sweep-out of the jump at partial flows and excess submergence.',
  'Check uplift and flotation of the floor slab.',
  'Check scour and undermining below the end sill; protect the channel downstream.',
  'Consider debris and ice for the basin type chosen.',
  'The design must be reviewed and sealed by a licensed professional engineer and follow local codes and dam-safety regulations.',
];

/** The cautions in the wording of a unit system (the 15 m/s threshold is about 50 ft/s). */
export function studyCautions(units: UnitSystem = 'SI'): string[] {
  if (units !== 'US') return [...STUDY_CAUTIONS];
  return STUDY_CAUTIONS.map((c) =>
    c.replace('inflow velocities above 15 m/s', 'inflow velocities above about 50 ft/s (15 m/s)'),
  );
}

/** Options of runStudy that do not change any number. */
export interface StudyOptions {
  /** unit system of warnings, notes and screening reasons; default the input's `units` */
  units?: UnitSystem;
}

const DEFAULTS = {
  tailwaterFactor: 1,
  submergenceTolerance: 0.1,
  floorManningN: 0.014,
  jumpLengthMethod: 'usbr' as const,
};
const MAX_DISCHARGES = ENGINE_LIMITS.maxDischarges;

/** Discharges to analyse, ascending, m³/s. */
export function dischargeList(spec: DischargeSpec): number[] {
  if (spec.kind === 'list') {
    if (!Array.isArray(spec.values) || spec.values.length === 0)
      throw new RangeError('discharges.values must list at least one discharge');
    if (spec.values.length > MAX_DISCHARGES)
      throw new RangeError(`discharges.values: at most ${MAX_DISCHARGES} discharges`);
    spec.values.forEach((v, i) => requirePositive(`discharges.values[${i}]`, v));
    return [...new Set(spec.values)].sort((a, b) => a - b);
  }
  if (spec.kind === 'range') {
    const min = requirePositive('discharges.min', spec.min);
    const max = requirePositive('discharges.max', spec.max);
    if (max < min) throw new RangeError('discharges.max must not be below discharges.min');
    const n = spec.count;
    if (!Number.isInteger(n) || n < 1 || n > MAX_DISCHARGES) {
      throw new RangeError(`discharges.count must be a whole number 1–${MAX_DISCHARGES}`);
    }
    if (n === 1 || max === min) return [min];
    return Array.from({ length: n }, (_, i) =>
      i === n - 1 ? max : min + ((max - min) * i) / (n - 1),
    );
  }
  throw new RangeError(`discharges.kind must be 'list' or 'range'`);
}

interface Toe extends ToeConditions {
  gate: { opening: number; upstreamDepth: number } | null;
}

interface Prepared {
  input: StudyInput;
  /** fast y1 for the floor search, −1 when the head cannot pass the flow (chute, pipe) */
  y1At: ((Q: number, index: number, floor: number) => number) | null;
  Qs: number[];
  tw: TailwaterAt[];
  basin: Section;
  toeAt: (Q: number, index: number, floor: number) => Toe;
  warnings: string[];
}

function withField<T>(field: string, f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof RangeError && !e.message.startsWith(field))
      throw new RangeError(`${field}: ${e.message}`, { cause: e });
    throw e;
  }
}

function withGate(t: ToeConditions): Toe {
  return { q: t.q, y1: t.y1, v1: t.v1, fr1: t.fr1, H0: t.H0, headLoss: t.headLoss, gate: null };
}

function prepare(input: StudyInput, P: Phraser = phraser('SI')): Prepared {
  if (input === null || typeof input !== 'object')
    throw new RangeError('input must be a study object');
  if (input.units !== 'SI' && input.units !== 'US')
    throw new RangeError(`units must be 'SI' or 'US'`);
  requireFinite('channelBedElevation', input.channelBedElevation);
  requireStudySize(input); // widths, discharge counts, table rows: before any work
  const b = requirePositive('basinWidth', input.basinWidth);
  const Qd = requirePositive('designDischarge', input.designDischarge);
  if (input.floorElevation !== undefined) requireFinite('floorElevation', input.floorElevation);
  requireInRange(
    'submergenceTolerance',
    input.submergenceTolerance ?? DEFAULTS.submergenceTolerance,
    0,
    1,
  );
  const { min: nMin, max: nMax } = ENGINE_LIMITS.manningN;
  requireInRange('floorManningN', input.floorManningN ?? DEFAULTS.floorManningN, nMin, nMax);
  if (
    input.jumpLengthMethod !== undefined &&
    input.jumpLengthMethod !== 'usbr' &&
    input.jumpLengthMethod !== 'hager'
  ) {
    throw new RangeError(`jumpLengthMethod must be 'usbr' or 'hager'`);
  }
  if (input.tailwaterFactor !== undefined)
    requireInRange('tailwaterFactor', input.tailwaterFactor, 0.5, 2);
  const Qs = withField('discharges', () => dischargeList(input.discharges));
  const basin: Section = { shape: 'rectangular', width: b };
  const warnings: string[] = [];
  const tws = withField('tailwater', () => {
    if (!input.tailwater || typeof input.tailwater !== 'object') throw new RangeError('missing');
    const rating = makeTailwaterRating(input.tailwater, input.channelBedElevation);
    return Qs.map((Q) => rating(Q));
  });
  const outside = Qs.filter((_, i) => tws[i]!.outside !== null);
  if (outside.length > 0) {
    warnings.push(
      `${outside.length} discharge(s) lie outside the tailwater rating table (${P.Q(outside[0]!)}${outside.length > 1 ? ' …' : ''}); the tailwater there is extended in a straight line from the end of the table — extend the table.`,
    );
  }
  const inflow = input.inflow;
  if (!inflow || typeof inflow !== 'object') throw new RangeError('inflow must be given');
  let toeAt: Prepared['toeAt'];
  let y1At: Prepared['y1At'] = null;
  switch (inflow.kind) {
    case 'chute': {
      requireFinite('inflow.crestElevation', inflow.crestElevation);
      withField('inflow.lossModel', () => validateLossModel(inflow.lossModel));
      const hv = inflow.approachVelocityHead ?? 0;
      requireInRange('inflow.approachVelocityHead', hv, 0, 1e3);
      const hw = inflow.headwater;
      let headwater: (Q: number) => number;
      if (hw?.kind === 'weir') {
        const { min: cMin, max: cMax } = ENGINE_LIMITS.weirCoefficient.SI;
        requireInRange('inflow.headwater.C', hw.C, cMin, cMax);
        requirePositive('inflow.headwater.L', hw.L);
        headwater = (Q) => inflow.crestElevation + weirHead(Q, hw.C, hw.L);
      } else if (hw?.kind === 'table') {
        if (!Array.isArray(hw.rows)) throw new RangeError('inflow.headwater.rows must be a list');
        const f: Interpolant = withField('inflow.headwater', () =>
          createMonotoneInterpolant(
            hw.rows.map((r) => r.Q),
            hw.rows.map((r) => r.elevation),
            'headwater rating table',
          ),
        );
        const hwOutside = Qs.filter((Q) => f(Q).outside !== null);
        if (hwOutside.length > 0) {
          warnings.push(
            `${hwOutside.length} discharge(s) lie outside the headwater rating table; headwater extended in a straight line.`,
          );
        }
        headwater = (Q) => f(Q).value;
      } else throw new RangeError(`inflow.headwater.kind must be 'weir' or 'table'`);
      const hws = Qs.map((Q) => headwater(Q));
      const hwD = headwater(Qd);
      y1At = (Q, i, z) =>
        _toeDepthOrNegative(Q / b, (i >= 0 ? hws[i]! : hwD) + hv - z, inflow.lossModel);
      toeAt = (Q, i, z) => {
        const H0 = (i >= 0 ? hws[i]! : hwD) + hv - z;
        if (!(H0 > 0))
          throw new RangeError(
            `floorElevation ${z} m lies above the headwater energy line at Q = ${Q} m³/s`,
          );
        return withGate(toeFromHead(Q / b, H0, inflow.lossModel));
      };
      break;
    }
    case 'gate': {
      const { min: ccMin, max: ccMax } = ENGINE_LIMITS.contractionCoefficient;
      requireInRange('inflow.Cc', inflow.Cc, ccMin, ccMax);
      const given = [inflow.opening, inflow.upstreamDepth, inflow.upstreamElevation].filter(
        (v) => v !== undefined,
      );
      if (given.length !== 1) {
        throw new RangeError(
          'inflow: give exactly one of opening, upstreamDepth or upstreamElevation for the gate',
        );
      }
      const Cc = inflow.Cc;
      const gateToe = (q: number, a: number, y0: number): Toe => {
        const y1 = Cc * a;
        const v1 = q / y1;
        return {
          q,
          y1,
          v1,
          fr1: v1 / Math.sqrt(G * y1),
          H0: y0,
          headLoss: 0,
          gate: { opening: a, upstreamDepth: y0 },
        };
      };
      if (inflow.opening !== undefined) {
        const a = requirePositive('inflow.opening', inflow.opening);
        toeAt = (Q) => {
          const q = Q / b;
          return gateToe(
            q,
            a,
            withField('inflow.opening', () => gateUpstreamDepth(q, a, Cc)),
          );
        };
      } else if (inflow.upstreamDepth !== undefined) {
        const y0 = requirePositive('inflow.upstreamDepth', inflow.upstreamDepth);
        toeAt = (Q) => {
          const q = Q / b;
          return gateToe(
            q,
            withField('inflow.upstreamDepth', () => gateOpening(q, y0, Cc)),
            y0,
          );
        };
      } else {
        const ws = requireFinite('inflow.upstreamElevation', inflow.upstreamElevation);
        toeAt = (Q, _i, z) => {
          const q = Q / b;
          const y0 = ws - z;
          if (!(y0 > 0))
            throw new RangeError(`floorElevation ${z} m lies above the upstream water elevation`);
          return gateToe(
            q,
            withField('inflow.upstreamElevation', () => gateOpening(q, y0, Cc)),
            y0,
          );
        };
      }
      break;
    }
    case 'pipe': {
      const invert = requireFinite('inflow.invertElevation', inflow.invertElevation);
      const loss = inflow.lossModel ?? { kind: 'none' as const };
      withField('inflow.lossModel', () => validateLossModel(loss));
      const out = inflow.outlet;
      let outletAt: (Q: number) => { depth: number; velocity: number; fr: number };
      if (out?.kind === 'table') {
        if (!Array.isArray(out.rows)) throw new RangeError('inflow.outlet.rows must be a list');
        out.rows.forEach((r, i) => {
          requirePositive(`inflow.outlet.rows[${i}].depth`, r.depth);
          requirePositive(`inflow.outlet.rows[${i}].velocity`, r.velocity);
        });
        const xs = out.rows.map((r) => r.Q);
        const fd = withField('inflow.outlet', () =>
          createMonotoneInterpolant(
            xs,
            out.rows.map((r) => r.depth),
            'outlet table',
          ),
        );
        const fv = withField('inflow.outlet', () =>
          createMonotoneInterpolant(
            xs,
            out.rows.map((r) => r.velocity),
            'outlet table',
          ),
        );
        if (Qs.some((Q) => fd(Q).outside !== null))
          warnings.push(
            'Some discharges lie outside the outlet table; outlet depth and velocity extended in a straight line.',
          );
        outletAt = (Q) => {
          const depth = fd(Q).value;
          const velocity = fv(Q).value;
          if (!(depth > 0 && velocity > 0))
            throw new RangeError(
              `inflow.outlet: the table gives no positive depth and velocity at Q = ${Q} m³/s`,
            );
          return { depth, velocity, fr: velocity / Math.sqrt(G * depth) };
        };
      } else if (out?.kind === 'barrel') {
        withField('inflow.outlet.section', () => validateSection(out.section));
        outletAt = (Q) =>
          withField('inflow.outlet', () => outletFlow(out.section, Q, out.slope, out.manningN));
      } else throw new RangeError(`inflow.outlet.kind must be 'table' or 'barrel'`);
      const outs = Qs.map((Q) => outletAt(Q));
      const outD = outletAt(Qd);
      const frMax = Math.max(...outs.map((o) => o.fr), outD.fr);
      warnings.push(
        `Jet from the outlet: walls should diverge no faster than tanθ = 1/(3·Fr) = ${jetFlareTangent(frMax).toFixed(3)} at the highest outlet Froude number ${frMax.toFixed(2)} (HEC-14).`,
      );
      y1At = (Q, i, z) => {
        const o = i >= 0 ? outs[i]! : outD;
        return _toeDepthOrNegative(
          Q / b,
          invert - z + o.depth + (o.velocity * o.velocity) / (2 * G),
          loss,
        );
      };
      toeAt = (Q, i, z) => {
        const o = i >= 0 ? outs[i]! : outD;
        const H0 = invert - z + o.depth + (o.velocity * o.velocity) / (2 * G);
        if (!(H0 > 0))
          throw new RangeError(`floorElevation ${z} m lies above the outlet's energy line`);
        return withGate(toeFromHead(Q / b, H0, loss));
      };
      break;
    }
    case 'known': {
      const k = withField('inflow.toe', () => toeFromKnown(inflow.toe));
      if (!(k.fr1 > 1))
        throw new RangeError(
          `inflow.toe: Fr1 = ${k.fr1.toPrecision(3)} is not supercritical: no jump forms`,
        );
      const qDesign = Qd / b;
      if (Math.abs(k.q - qDesign) > 0.01 * qDesign) {
        warnings.push(
          `The toe conditions give q = ${P.q(k.q)} but the design discharge over the basin width gives ${P.q(qDesign)}; the toe velocity ${P.vel(k.v1)} is used with the basin's unit discharge.`,
        );
      }
      warnings.push(
        'Known toe conditions: the toe velocity is held the same at every discharge (y1 = q/V1) — an approximation; enter each discharge separately to refine.',
      );
      const v1 = k.v1;
      toeAt = (Q) => {
        const q = Q / b;
        const y1 = q / v1;
        return { q, y1, v1, fr1: v1 / Math.sqrt(G * y1), H0: 0, headLoss: 0, gate: null };
      };
      break;
    }
    default:
      throw new RangeError(`inflow.kind must be 'chute', 'gate', 'pipe' or 'known'`);
  }
  return { input, Qs, tw: tws, basin, toeAt, y1At, warnings };
}

function factorFor(
  C: TailwaterFactor,
  row: () => { Q: number; fr1: number; y1: number; y2: number; v1: number; q: number },
): number {
  const c = typeof C === 'number' ? C : C(row());
  return requireInRange('tailwaterFactor', c, 0.5, 2);
}

/** y1 and y2 at one discharge and floor; RangeError when no jump forms. */
function jumpCore(
  p: Prepared,
  Q: number,
  i: number,
  z: number,
): { toe: Toe; y2: number; yc: number } {
  const toe = p.toeAt(Q, i, z);
  if (!(toe.fr1 > 1)) {
    throw new RangeError(
      `at Q = ${Q} m³/s the inflow is not supercritical (Fr1 = ${toe.fr1.toPrecision(3)}): no jump forms`,
    );
  }
  // The basin is rectangular: critical depth and the momentum balance have closed forms
  // there (yc = (q²/g)^(1/3); Bélanger), which keeps the whole-range solve fast.
  const q = toe.q;
  const yc = Math.cbrt((q * q) / G);
  const fr1 = q / (toe.y1 * Math.sqrt(G * toe.y1));
  return { toe, y2: 0.5 * toe.y1 * (Math.sqrt(1 + 8 * fr1 * fr1) - 1), yc };
}

function minMargin(p: Prepared, z: number, C: TailwaterFactor): { margin: number; index: number } {
  let margin = Infinity;
  let index = 0;
  const b = p.input.basinWidth;
  for (let i = 0; i < p.Qs.length; i++) {
    const Q = p.Qs[i]!;
    let m: number;
    let y1: number;
    if (p.y1At) y1 = p.y1At(Q, i, z);
    else {
      try {
        y1 = p.toeAt(Q, i, z).y1;
      } catch (e) {
        if (!(e instanceof RangeError)) throw e;
        y1 = -1;
      }
    }
    const q = Q / b;
    const fr1 = y1 > 0 ? q / (y1 * Math.sqrt(G * y1)) : 0;
    if (!(fr1 > 1)) {
      // A floor too high for the head to drive supercritical flow is simply infeasible.
      m = -Infinity;
    } else {
      const y2 = 0.5 * y1 * (Math.sqrt(1 + 8 * fr1 * fr1) - 1); // Bélanger (rectangular basin)
      const c = typeof C === 'number' ? C : factorFor(C, () => ({ Q, fr1, y1, y2, v1: q / y1, q }));
      m = p.tw[i]!.elevation - z - c * y2;
    }
    if (m < margin) {
      margin = m;
      index = i;
    }
  }
  return { margin, index };
}

function floorSolve(p: Prepared, C: TailwaterFactor): FloorSolution {
  let zHi = Math.min(...p.tw.map((t) => t.elevation));
  let zLo = zHi;
  let d = 1;
  let found = false;
  for (let k = 0; k < 40; k++) {
    zLo = zHi - d;
    if (minMargin(p, zLo, C).margin >= 0) {
      found = true;
      break;
    }
    zHi = zLo;
    d *= 2;
  }
  if (!found)
    throw new RangeError(
      'floorElevation: no floor elevation within reach holds the jump at every discharge',
    );
  for (let k = 0; k < 100 && zHi - zLo > 1e-7 * Math.max(1, Math.abs(zLo)); k++) {
    const mid = 0.5 * (zLo + zHi);
    if (minMargin(p, mid, C).margin >= 0) zLo = mid;
    else zHi = mid;
  }
  return { elevation: zLo, governingQ: p.Qs[minMargin(p, zLo, C).index]! };
}

/**
 * Highest basin floor elevation (m) with tailwater ≥ C·y2 at every discharge; y1 depends on the
 * floor through the head, so the floor is found by bisection. [hydraulics.md §3]
 */
export function solveFloorElevation(
  input: StudyInput,
  tailwaterFactor: TailwaterFactor,
): FloorSolution {
  return floorSolve(prepare(input), tailwaterFactor);
}

/** Where the jump stands against a tailwater depth: short of y2 sweeps out; above y2 by more than `tol` (a fraction) drowns. */
function jumpPosition(twDepth: number, y2: number, tol: number): JumpPosition {
  if (twDepth < y2 * (1 - 1e-9)) return 'swept-out';
  return (twDepth - y2) / y2 > tol ? 'drowned' : 'at-toe';
}

function rowsAt(p: Prepared, z: number, C: TailwaterFactor): StudyRow[] {
  const inp = p.input;
  const tol = inp.submergenceTolerance ?? DEFAULTS.submergenceTolerance;
  const nFloor = inp.floorManningN ?? DEFAULTS.floorManningN;
  const method = inp.jumpLengthMethod ?? DEFAULTS.jumpLengthMethod;
  return p.Qs.map((Q, i) => {
    const { toe, y2, yc } = jumpCore(p, Q, i, z);
    const jump = jumpFromDepths(p.basin, Q, toe.y1, y2, _froude(p.basin, Q, toe.y1), {
      lengthMethod: method,
    });
    const c = factorFor(C, () => ({ Q, fr1: jump.fr1, y1: toe.y1, y2, v1: jump.v1, q: toe.q }));
    const tw = p.tw[i]!;
    const twDepth = tw.elevation - z;
    const ratio = (twDepth - y2) / y2;
    const notes: string[] = [];
    const position = jumpPosition(twDepth, y2, tol);
    let sweep: number | null = null;
    if (position === 'swept-out') {
      if (twDepth > yc) {
        // Horizontal rectangular floor: the H3 profile from y1 rises to the depth whose
        // sequent is the tailwater (Bélanger, reversed), by the direct step method.
        const frTw = toe.q / (twDepth * Math.sqrt(G * twDepth));
        const yToe = 0.5 * twDepth * (Math.sqrt(1 + 8 * frTw * frTw) - 1);
        sweep = yToe > toe.y1 ? _directStepDistance(p.basin, Q, nFloor, 0, toe.y1, yToe) : 0;
        notes.push(
          'tailwater short of the sequent depth: the jump is pushed downstream of the toe',
        );
      } else {
        notes.push(
          'tailwater below critical depth on the floor: the flow stays supercritical and leaves the basin',
        );
      }
    } else if (position === 'drowned') {
      notes.push(`jump drowned: tailwater ${(ratio * 100).toFixed(1)} % above the sequent depth`);
    }
    if (tw.outside) notes.push(`tailwater extended ${tw.outside} the rating table`);
    let gate: StudyRow['gate'] = null;
    if (toe.gate) {
      const submerged = twDepth > y2;
      gate = { opening: toe.gate.opening, upstreamDepth: toe.gate.upstreamDepth, submerged };
      if (submerged)
        notes.push(
          'tailwater above the sequent depth of the vena contracta: the gate runs submerged and the free-flow gate equation does not apply',
        );
    }
    return {
      // Fields listed, not spread: V8 builds a large object from a spread slowly (≈ 20 µs).
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
      q: toe.q,
      H0: toe.H0 > 0 && !toe.gate ? toe.H0 : null,
      yc,
      tailwaterElevation: tw.elevation,
      tailwaterDepth: twDepth,
      tailwaterOutside: tw.outside,
      tailwaterFactor: c,
      requiredDepth: c * y2,
      margin: twDepth - c * y2,
      position,
      submergenceRatio: ratio,
      sweepOutDistance: sweep,
      gate,
      notes,
    };
  });
}

/**
 * Per-discharge rows (SI) at a given floor elevation: toe, jump, tailwater, margin, position.
 * @example analyseRange(input, 85.2, 1.0)[0].position // 'at-toe' | 'swept-out' | 'drowned'
 */
export function analyseRange(
  input: StudyInput,
  floorElevation: number,
  tailwaterFactor: TailwaterFactor,
): StudyRow[] {
  requireFinite('floorElevation', floorElevation);
  return rowsAt(prepare(input), floorElevation, tailwaterFactor);
}

/**
 * The whole study: rows over the range, floor elevation (solved, or the fixed one checked),
 * excavation, design-discharge jump and diagrams, warnings and cautions. SI in, SI out.
 * [hydraulics.md §1–3, §7]
 */
export function runStudy(input: StudyInput, options: StudyOptions = {}): StudyResult {
  if (options.units !== undefined && options.units !== 'SI' && options.units !== 'US')
    throw new RangeError(`options.units must be 'SI' or 'US'`);
  const units: UnitSystem =
    options.units ?? input?.dissipators?.units ?? (input?.units === 'US' ? 'US' : 'SI');
  const P = phraser(units);
  const p = prepare(input, P);
  const C = input.tailwaterFactor ?? DEFAULTS.tailwaterFactor;
  const warnings = [...p.warnings];
  const fixed = input.floorElevation !== undefined;
  let solved: FloorSolution | null = null;
  try {
    solved = floorSolve(p, C);
  } catch (e) {
    if (!(e instanceof RangeError) || !fixed) throw e;
    warnings.push(`No floor elevation holding the jump at every discharge was found: ${e.message}`);
  }
  const z = fixed ? input.floorElevation! : solved!.elevation;
  const rows = rowsAt(p, z, C);
  const Qd = input.designDischarge;
  const toe = p.toeAt(Qd, p.Qs.indexOf(Qd), z);
  const jump = withField('designDischarge', () =>
    hydraulicJump(p.basin, Qd, toe.y1, {
      lengthMethod: input.jumpLengthMethod ?? DEFAULTS.jumpLengthMethod,
    }),
  );
  const rating = makeTailwaterRating(input.tailwater, input.channelBedElevation);
  const twD = rating(Qd);
  const twDepth = twD.elevation - z;
  const tol = input.submergenceTolerance ?? DEFAULTS.submergenceTolerance;
  const designPos = jumpPosition(twDepth, jump.y2, tol);
  const depthBelowBed = Math.max(0, input.channelBedElevation - z);
  const length = Math.max(...rows.map((r) => r.length), jump.length);
  const b = input.basinWidth;

  if (fixed && solved && z > solved.elevation + 1e-6) {
    warnings.push(
      `The fixed floor at elevation ${P.value(z, 'length').toFixed(units === 'US' ? 2 : 3)} ${P.unit('length')} is above the highest floor that holds the jump at every discharge (${P.value(solved.elevation, 'length').toFixed(units === 'US' ? 2 : 3)} ${P.unit('length')}).`,
    );
  }
  const swept = rows.filter((r) => r.position === 'swept-out');
  if (swept.length > 0) {
    warnings.push(
      `Sweep-out: tailwater is short of the sequent depth at ${swept.length} discharge(s), from ${P.Q(swept[0]!.Q)}.`,
    );
  }
  const drowned = rows.filter((r) => r.position === 'drowned');
  if (drowned.length > 0) {
    const worst = drowned.reduce((a, r) => (r.submergenceRatio > a.submergenceRatio ? r : a));
    warnings.push(
      `Excess submergence at ${drowned.length} discharge(s): up to ${(worst.submergenceRatio * 100).toFixed(0)} % above the sequent depth (Q = ${P.Q(worst.Q)}); a drowned jump dissipates less energy.`,
    );
  }
  const vMax = Math.max(...rows.map((r) => r.v1), jump.v1);
  if (vMax > 15)
    warnings.push(
      `Inflow velocity reaches ${P.vel(vMax)} (> ${units === 'US' ? P.vel(15) : '15 m/s'}): cavitation risk on blocks; model study advised.`,
    );
  const osc = rows.filter((r) => r.jumpClass === 'oscillating');
  if (osc.length > 0)
    warnings.push(
      `Oscillating jump (Fr1 2.5–4.5) at ${osc.length} discharge(s): waves downstream; avoid, or use a wave-suppressing basin (USBR Type IV).`,
    );
  const weak = rows.filter((r) => r.jumpClass === 'undular' || r.jumpClass === 'weak');
  if (weak.length > 0)
    warnings.push(
      `Undular or weak jump (Fr1 < 2.5) at ${weak.length} discharge(s): little energy is dissipated.`,
    );
  const frHi = rows.filter((r) => r.fr1 > 17);
  if (frHi.length > 0)
    warnings.push(
      `Fr1 above 17 at ${frHi.length} discharge(s): outside the range tested for standard basins.`,
    );
  if (rows.some((r) => r.gate?.submerged))
    warnings.push(
      'The gate runs submerged at some discharges: the free-flow gate equation used for the toe does not apply there.',
    );

  // Dissipators: each type on its own floor, screened, the chosen one and the alternatives designed.
  let dissipators: DissipatorStudyResult | null = null;
  try {
    dissipators = designDissipators(input, { ...(input.dissipators ?? {}), units });
  } catch (e) {
    if (!(e instanceof RangeError)) throw e;
    warnings.push(`Dissipator screening and sizing could not run: ${e.message}`);
  }

  return {
    input: {
      ...input,
      tailwaterFactor: C,
      submergenceTolerance: tol,
      floorManningN: input.floorManningN ?? DEFAULTS.floorManningN,
      jumpLengthMethod: input.jumpLengthMethod ?? DEFAULTS.jumpLengthMethod,
    },
    rows,
    floor: {
      elevation: z,
      requiredElevation: solved ? solved.elevation : null,
      fixed,
      governingQ: solved ? solved.governingQ : null,
      tailwaterFactor: C,
      depthBelowBed,
      excavation: {
        depth: depthBelowBed,
        width: b,
        length,
        volume: depthBelowBed * b * length,
        basis:
          'vertical cut of basin width × longest free-jump length over the range × depth of the floor below the channel bed; slab, walls and side slopes come with the basin sizing',
      },
    },
    designJump: {
      Q: Qd,
      toe,
      jump,
      tailwaterDepth: twDepth,
      margin: twDepth - C * jump.y2,
      position: designPos,
    },
    diagrams: jumpDiagrams(p.basin, Qd, jump.y1, jump.y2, twDepth > 0 ? twDepth : null),
    warnings,
    cautions: studyCautions(units),
    screening: dissipators?.screening ?? [],
    recommendedType: dissipators?.recommended ?? null,
    design: dissipators?.design ?? null,
    alternatives: dissipators?.alternatives ?? [],
    dissipators: dissipators
      ? {
          chosen: dissipators.chosen,
          floors: dissipators.floors,
          context: dissipators.context,
          assumptions: dissipators.assumptions,
          notes: dissipators.notes,
        }
      : null,
  };
}

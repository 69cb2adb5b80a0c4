// The toe at every discharge of a set, for each kind of inflow (chute or spillway, sluice gate,
// pipe or culvert outlet, known toe), on a rectangular floor of width b at a floor elevation z.
// Prepared once per set: everything that does not depend on the floor (headwater, outlet flow,
// a fixed gate's pool) is computed here, once. SI; elevations on the project datum.
// Relations: hydraulics.md §2 (inflow.ts names the sources).
import { G } from '../units/constants';
import { InputError, withField, type InputErrorCode } from '../errors';
import { ENGINE_LIMITS } from '../schemas/limits';
import { requireFinite, requireInRange, requirePositive } from './guards';
import {
  gateOpening,
  gateUpstreamDepth,
  jetFlareTangent,
  outletFlow,
  toeFromHead,
  toeFromKnown,
  validateLossModel,
  weirHead,
  _toeDepthOrNegative,
  type KnownToe,
  type LossModel,
  type ToeConditions,
} from './inflow';
import { createMonotoneInterpolant, type Interpolant } from './interpolate';
import { chuteFoot, chuteProfile, validateChute, type ChuteGeometry } from './chute';
import { validateSection, type Section } from './sections';

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
      /**
       * the chute's own geometry: when given, y1 comes from its friction (critical depth on the
       * crest, the step method down the chute; chute.ts) and `lossModel` is not applied
       */
      chute?: ChuteGeometry;
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

/** The toe at one discharge, with the gate's opening and pool when a gate makes it. */
export interface Toe extends ToeConditions {
  gate: { opening: number; upstreamDepth: number } | null;
}

/** Facts about the inflow worth a warning, with their SI quantities (phrased at the edge). */
export type InflowNote =
  | { code: 'headwater-extended'; count: number }
  | { code: 'outlet-extended'; count: number }
  | { code: 'jet-flare'; tanTheta: number; fr: number }
  | { code: 'known-toe-q-differs'; qToe: number; qBasin: number; v1: number }
  | { code: 'known-toe-velocity-held' };

export interface InflowToes {
  /**
   * y1 at discharge index i and floor z, −1 when the head cannot pass the flow there (the fast
   * path of the floor search); null when the toe does not depend on a head (gate, known).
   */
  y1At: ((i: number, z: number) => number) | null;
  /** the toe at discharge index i and floor z; InputError naming the cause when impossible */
  toeAt: (i: number, z: number) => Toe;
  /** false when the toe does not depend on the floor (a fixed gate opening or pool, a known toe) */
  floorDependent: boolean;
  notes: InflowNote[];
}

function plain(t: ToeConditions): Toe {
  return { q: t.q, y1: t.y1, v1: t.v1, fr1: t.fr1, H0: t.H0, headLoss: t.headLoss, gate: null };
}

const fmt = (x: number): string => String(Number(x.toPrecision(4)));

/**
 * Prepares the toe for every discharge Qs[i] (m³/s, ascending) on a rectangular floor of width
 * b (m); `designIndex` is the index of the design discharge in Qs (the known-toe case is stated
 * there). Throws an InputError naming the field when the inflow is impossible at any discharge.
 */
export function prepareInflowToes(
  inflow: StudyInflow,
  Qs: readonly number[],
  b: number,
  designIndex: number,
): InflowToes {
  if (!inflow || typeof inflow !== 'object')
    throw new InputError('inflow', 'invalid', 'inflow must be given');
  const notes: InflowNote[] = [];
  /** The toe from the chute's computed profile, tabulated once per discharge (chute.ts). */
  const computedChute = (crest: number, geo: ChuteGeometry): InflowToes => {
    validateChute(geo);
    const bc = geo.width ?? b;
    const profiles = Qs.map((Q) => chuteProfile(geo, bc, Q));
    const y1Of = (i: number, z: number): number => {
      const foot = chuteFoot(profiles[i]!, crest - z);
      if (!foot) return -1;
      // The same width: the chute's depth is y1; else its energy is carried onto the floor.
      return bc === b ? foot.y : _toeDepthOrNegative(Qs[i]! / b, foot.energy, { kind: 'none' });
    };
    return {
      y1At: y1Of,
      toeAt: (i, z) => {
        const y1 = y1Of(i, z);
        if (!(y1 > 0))
          throw new InputError(
            'floorElevation',
            'above-energy-line',
            `the floor at ${fmt(z)} m leaves no chute below the crest at ${fmt(crest)} m to carry Q = ${fmt(Qs[i]!)} m³/s onto it`,
            { floorElevation: z, Q: Qs[i]! },
          );
        const q = Qs[i]! / b;
        const v1 = q / y1;
        const H0 = crest + 1.5 * profiles[i]!.yc - z; // critical flow on the crest: E = 1.5·yc
        return {
          q,
          y1,
          v1,
          fr1: v1 / Math.sqrt(G * y1),
          H0,
          headLoss: Math.max(0, H0 - y1 - (v1 * v1) / (2 * G)),
          gate: null,
        };
      },
      floorDependent: true,
      notes,
    };
  };
  switch (inflow.kind) {
    case 'chute': {
      requireFinite('inflow.crestElevation', inflow.crestElevation);
      withField('inflow.lossModel', () => validateLossModel(inflow.lossModel));
      const hv = inflow.approachVelocityHead ?? 0;
      requireInRange('inflow.approachVelocityHead', hv, 0, 1e3);
      const hw = inflow.headwater;
      let hws: number[];
      if (hw?.kind === 'weir') {
        const { min: cMin, max: cMax } = ENGINE_LIMITS.weirCoefficient.SI;
        requireInRange('inflow.headwater.C', hw.C, cMin, cMax);
        requirePositive('inflow.headwater.L', hw.L);
        hws = Qs.map((Q) => inflow.crestElevation + weirHead(Q, hw.C, hw.L));
      } else if (hw?.kind === 'table') {
        if (!Array.isArray(hw.rows))
          throw new InputError(
            'inflow.headwater.rows',
            'invalid',
            'inflow.headwater.rows must be a list',
          );
        const f: Interpolant = withField('inflow.headwater', () =>
          createMonotoneInterpolant(
            hw.rows.map((r) => r.Q),
            hw.rows.map((r) => r.elevation),
            'headwater rating table',
          ),
        );
        const at = Qs.map((Q) => f(Q));
        const count = at.filter((r) => r.outside !== null).length;
        if (count > 0) notes.push({ code: 'headwater-extended', count });
        hws = at.map((r) => r.value);
      } else
        throw new InputError(
          'inflow.headwater.kind',
          'invalid',
          `inflow.headwater.kind must be 'weir' or 'table'`,
        );
      if (inflow.chute !== undefined) return computedChute(inflow.crestElevation, inflow.chute);
      const loss = inflow.lossModel;
      const energy = hws.map((h) => h + hv);
      return {
        y1At: (i, z) => _toeDepthOrNegative(Qs[i]! / b, energy[i]! - z, loss),
        toeAt: (i, z) => {
          const H0 = energy[i]! - z;
          if (!(H0 > 0))
            throw new InputError(
              'floorElevation',
              'above-energy-line',
              `the floor at ${fmt(z)} m lies above the headwater energy line at Q = ${fmt(Qs[i]!)} m³/s`,
              { floorElevation: z, Q: Qs[i]! },
            );
          return plain(toeFromHead(Qs[i]! / b, H0, loss));
        },
        floorDependent: true,
        notes,
      };
    }
    case 'gate': {
      requireInRange(
        'inflow.Cc',
        inflow.Cc,
        ENGINE_LIMITS.contractionCoefficient.min,
        ENGINE_LIMITS.contractionCoefficient.max,
      );
      const given = [inflow.opening, inflow.upstreamDepth, inflow.upstreamElevation].filter(
        (v) => v !== undefined,
      );
      if (given.length !== 1) {
        throw new InputError(
          'inflow',
          'invalid',
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
      /** A gate relation's refusal at one discharge, re-filed as the field the engineer typed. */
      const gateOr = (
        f: () => number,
        field: string,
        code: InputErrorCode,
        sentence: () => string,
        values: Record<string, number>,
      ): number => {
        try {
          return f();
        } catch (e) {
          if (!(e instanceof RangeError)) throw e;
          throw new InputError(field, code, sentence(), values, { cause: e });
        }
      };
      if (inflow.opening !== undefined || inflow.upstreamDepth !== undefined) {
        // The toe under a fixed opening or pool does not depend on the floor: once per discharge.
        let toes: Toe[];
        if (inflow.opening !== undefined) {
          const a = requirePositive('inflow.opening', inflow.opening);
          toes = Qs.map((Q) => {
            const q = Q / b;
            const y0 = gateOr(
              () => gateUpstreamDepth(q, a, Cc),
              'inflow.opening',
              'gate-opening-too-large',
              () =>
                `the gate opening ${fmt(a)} m is too large for Q = ${fmt(Q)} m³/s: the water would not touch the gate`,
              { opening: a, Q },
            );
            return gateToe(q, a, y0);
          });
        } else {
          const y0 = requirePositive('inflow.upstreamDepth', inflow.upstreamDepth);
          toes = Qs.map((Q) => {
            const q = Q / b;
            const a = gateOr(
              () => gateOpening(q, y0, Cc),
              'inflow.upstreamDepth',
              'gate-pool-too-shallow',
              () => `the pool ${fmt(y0)} m deep above the gate cannot pass Q = ${fmt(Q)} m³/s`,
              { upstreamDepth: y0, Q },
            );
            return gateToe(q, a, y0);
          });
        }
        return { y1At: null, toeAt: (i) => toes[i]!, floorDependent: false, notes };
      }
      const ws = requireFinite('inflow.upstreamElevation', inflow.upstreamElevation);
      return {
        y1At: null,
        toeAt: (i, z) => {
          const Q = Qs[i]!;
          const q = Q / b;
          const y0 = ws - z;
          if (!(y0 > 0))
            throw new InputError(
              'floorElevation',
              'above-energy-line',
              `the floor at ${fmt(z)} m lies above the water upstream of the gate`,
              { floorElevation: z },
            );
          const a = gateOr(
            () => gateOpening(q, y0, Cc),
            'inflow.upstreamElevation',
            'gate-pool-too-shallow',
            () =>
              `the pool above the gate (${fmt(y0)} m deep on a floor at ${fmt(z)} m) cannot pass Q = ${fmt(Q)} m³/s`,
            { upstreamDepth: y0, Q },
          );
          return gateToe(q, a, y0);
        },
        floorDependent: true,
        notes,
      };
    }
    case 'pipe': {
      const invert = requireFinite('inflow.invertElevation', inflow.invertElevation);
      const loss = inflow.lossModel ?? { kind: 'none' as const };
      withField('inflow.lossModel', () => validateLossModel(loss));
      const out = inflow.outlet;
      let outs: Array<{ depth: number; velocity: number; fr: number }>;
      if (out?.kind === 'table') {
        if (!Array.isArray(out.rows))
          throw new InputError(
            'inflow.outlet.rows',
            'invalid',
            'inflow.outlet.rows must be a list',
          );
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
        const count = Qs.filter((Q) => fd(Q).outside !== null).length;
        if (count > 0) notes.push({ code: 'outlet-extended', count });
        outs = Qs.map((Q) => {
          const depth = fd(Q).value;
          const velocity = fv(Q).value;
          if (!(depth > 0 && velocity > 0))
            throw new InputError(
              'inflow.outlet',
              'invalid',
              `inflow.outlet: the table gives no positive depth and velocity at Q = ${fmt(Q)} m³/s`,
              { Q },
            );
          return { depth, velocity, fr: velocity / Math.sqrt(G * depth) };
        });
      } else if (out?.kind === 'barrel') {
        withField('inflow.outlet.section', () => validateSection(out.section));
        outs = Qs.map((Q) =>
          withField('inflow.outlet', () => outletFlow(out.section, Q, out.slope, out.manningN)),
        );
      } else
        throw new InputError(
          'inflow.outlet.kind',
          'invalid',
          `inflow.outlet.kind must be 'table' or 'barrel'`,
        );
      const frMax = Math.max(...outs.map((o) => o.fr));
      notes.push({ code: 'jet-flare', tanTheta: jetFlareTangent(frMax), fr: frMax });
      const energy = outs.map((o) => invert + o.depth + (o.velocity * o.velocity) / (2 * G));
      return {
        y1At: (i, z) => _toeDepthOrNegative(Qs[i]! / b, energy[i]! - z, loss),
        toeAt: (i, z) => {
          const H0 = energy[i]! - z;
          if (!(H0 > 0))
            throw new InputError(
              'floorElevation',
              'above-energy-line',
              `the floor at ${fmt(z)} m lies above the outlet's energy line`,
              { floorElevation: z },
            );
          return plain(toeFromHead(Qs[i]! / b, H0, loss));
        },
        floorDependent: true,
        notes,
      };
    }
    case 'known': {
      const k = withField('inflow.toe', () => toeFromKnown(inflow.toe));
      if (!(k.fr1 > 1))
        throw new InputError(
          'inflow.toe',
          'not-supercritical',
          `inflow.toe: Fr1 = ${k.fr1.toPrecision(3)} is not supercritical: no jump forms`,
          { fr1: k.fr1 },
        );
      const qDesign = Qs[designIndex]! / b;
      if (Math.abs(k.q - qDesign) > 0.01 * qDesign)
        notes.push({ code: 'known-toe-q-differs', qToe: k.q, qBasin: qDesign, v1: k.v1 });
      notes.push({ code: 'known-toe-velocity-held' });
      const v1 = k.v1;
      return {
        y1At: null,
        toeAt: (i) => {
          const q = Qs[i]! / b;
          const y1 = q / v1;
          return { q, y1, v1, fr1: v1 / Math.sqrt(G * y1), H0: 0, headLoss: 0, gate: null };
        },
        floorDependent: false,
        notes,
      };
    }
    default:
      throw new InputError(
        'inflow.kind',
        'invalid',
        `inflow.kind must be 'chute', 'gate', 'pipe' or 'known'`,
      );
  }
}

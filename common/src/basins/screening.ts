// Screening: every catalogue type at every discharge, pass / warn / fail per criterion with a
// coded reason, an overall verdict and a ranking. The sentences (reasons and each type's summary)
// are made at the edge: reasonText and screeningSummaryText in common/src/messages/reasons.ts.
import { InputError } from '../errors';
import { DISSIPATOR_CATALOGUE, isJumpBasinType } from './catalogue';
import { resolveDefaults, type BasinDefaults } from './defaults';
import { sizeJumpBasin } from './jumpBasin';
import { designCulvertApron } from './riprap';
import type {
  CriterionId,
  CriterionResult,
  CriterionStatus,
  DischargeRow,
  DissipatorFamily,
  DissipatorModule,
  DissipatorTypeId,
  ScreeningContext,
} from './types';
import { sizeBaffledApron } from './types/usbr9';
import { sizeImpactBasin } from './types/usbr6';
import { designRow } from './types/shared';

/**
 * Overall verdict of a type: 'recommended' (the best-ranked of the usable types), 'suitable'
 * (passes every criterion), 'marginal' (usable with warnings), 'unsuitable' (fails a
 * criterion), 'specialist' (a jet structure is the likely answer: specialist study, not sized).
 */
export type Verdict = 'recommended' | 'suitable' | 'marginal' | 'unsuitable' | 'specialist';

/**
 * The screening of one type, as the web app renders it.
 * `criteria` holds one entry per criterion: the worst outcome over all discharges, with the
 * discharge where it occurs (`atQ`); `perDischarge` holds every discharge's outcomes.
 */
export interface TypeScreening {
  type: DissipatorTypeId;
  name: string;
  source: string;
  family: DissipatorFamily;
  verdict: Verdict;
  /** 1 = best */
  rank: number;
  criteria: CriterionResult[];
  perDischarge: { Q: number; criteria: CriterionResult[] }[];
  /** basin length used in the ranking, m (absent for types not sized) */
  length?: number;
  /** concrete volume used in the ranking, m³ (rough when no design was given) */
  concreteVolume?: number;
  warnCount: number;
  failCount: number;
}

export interface ScreeningInput {
  /** rows for every type that has no rows of its own (e.g. computed at the channel bed) */
  rows: readonly DischargeRow[];
  /** rows per type, e.g. with the floor solved for that type's tailwater factor */
  rowsByType?: Partial<Record<DissipatorTypeId, readonly DischargeRow[]>>;
  context: ScreeningContext;
  defaults?: Partial<BasinDefaults>;
  /** ranking measures from full designs; otherwise estimated here */
  measures?: Partial<Record<DissipatorTypeId, { length?: number; concreteVolume?: number }>>;
  /** a subset of the catalogue (default: all) */
  types?: readonly DissipatorTypeId[];
}

const ORDER: Record<CriterionStatus, number> = { pass: 0, warn: 1, fail: 2 };

/** One entry per criterion: the worst status over the discharges, first discharge where it occurs. */
export function aggregateCriteria(
  perRow: readonly CriterionResult[][],
  fixed: readonly CriterionResult[],
): CriterionResult[] {
  // One pass, in order of first appearance: per criterion the worst status, the first outcome at
  // it and how many share it; for a pass, the one at the largest discharge (the design case).
  const byId = new Map<CriterionId, { pick: CriterionResult; worst: number; hits: number }>();
  const visit = (c: CriterionResult): void => {
    const o = ORDER[c.status];
    const cur = byId.get(c.criterion);
    if (!cur) byId.set(c.criterion, { pick: c, worst: o, hits: 1 });
    else if (o > cur.worst) {
      cur.pick = c;
      cur.worst = o;
      cur.hits = 1;
    } else if (o === cur.worst) {
      cur.hits++;
      if (o === 0 && (c.atQ ?? 0) > (cur.pick.atQ ?? 0)) cur.pick = c;
    }
  };
  for (const list of perRow) for (const c of list) visit(c);
  for (const c of fixed) visit(c);
  const out: CriterionResult[] = [];
  for (const { pick, worst, hits } of byId.values())
    out.push(worst > 0 && hits > 1 ? { ...pick, others: hits - 1 } : pick);
  return out;
}

function roughMeasures(
  m: DissipatorModule,
  rows: readonly DischargeRow[],
  ctx: ScreeningContext,
  d: BasinDefaults,
): { length?: number; concreteVolume?: number } {
  const dr = designRow(rows, ctx.designQ);
  if (!dr) return {};
  try {
    if (isJumpBasinType(m.id)) {
      const s = sizeJumpBasin(m.id, { width: ctx.width, Q: dr.Q, y1: dr.y1 }, { defaults: d });
      const t = d.minSlabThickness;
      const tw = d.minWallThickness;
      return {
        length: s.length,
        concreteVolume: s.length * (ctx.width + 2 * tw) * t + 2 * s.length * s.wallHeight * tw,
      };
    }
    if (m.id === 'usbr-6') {
      const s = sizeImpactBasin({ Q: dr.Q, velocity: dr.v1 }, d);
      const tw = d.minWallThickness;
      return {
        length: s.length,
        concreteVolume: s.length * s.width * tw + 2 * s.length * s.wallHeight * tw,
      };
    }
    if (m.id === 'usbr-9') {
      const drop = dr.head ?? dr.y1 + (dr.v1 * dr.v1) / 19.6133;
      const s = sizeBaffledApron({ Q: dr.Q, width: ctx.width, drop }, d);
      const tw = d.minWallThickness;
      return {
        length: s.length,
        concreteVolume:
          s.slopeLength * ctx.width * d.minSlabThickness + 2 * s.slopeLength * s.wallHeight * tw,
      };
    }
    if (m.id === 'riprap-apron' && ctx.culvert) {
      const a = designCulvertApron({
        Q: dr.Q,
        rise: ctx.culvert.rise,
        shape: ctx.culvert.shape,
        ...(ctx.culvert.span !== undefined ? { span: ctx.culvert.span } : {}),
      });
      return { length: a.length, concreteVolume: 0 };
    }
  } catch (e) {
    if (!(e instanceof RangeError)) throw e;
  }
  return {};
}

const VERDICT_ORDER: Record<Verdict, number> = {
  recommended: 0,
  suitable: 0,
  marginal: 1,
  specialist: 2,
  unsuitable: 3,
};

/**
 * Screens every type of the catalogue at every discharge (hydraulics.md §4) and ranks them:
 * hydraulic suitability first (verdict, then fewer warnings), then basin length, then
 * concrete. The best usable type becomes 'recommended'. Pure; SI.
 * @example screenDissipators({ rows, context: { inflow: 'chute', width: 12 } })[0].verdict
 */
export function screenDissipators(input: ScreeningInput): TypeScreening[] {
  if (input === null || typeof input !== 'object')
    throw new InputError('body', 'invalid', 'screening input must be an object', {});
  if (!Array.isArray(input.rows))
    throw new InputError('rows', 'invalid', 'rows must be an array of discharges', {});
  const ctx = input.context;
  if (!ctx || typeof ctx !== 'object')
    throw new InputError('context', 'missing', 'context must be given (inflow kind and width)', {});
  if (!(typeof ctx.width === 'number' && Number.isFinite(ctx.width) && ctx.width > 0)) {
    throw new InputError(
      'context.width',
      'not-positive',
      `context.width must be greater than zero (got ${String(ctx.width)})`,
      {},
    );
  }
  const d = resolveDefaults(input.defaults);
  const modules = input.types
    ? DISSIPATOR_CATALOGUE.filter((m) => input.types!.includes(m.id))
    : DISSIPATOR_CATALOGUE;
  const results: TypeScreening[] = modules.map((m) => {
    const rows = input.rowsByType?.[m.id] ?? input.rows;
    for (const r of rows) checkRow(r);
    const perRow = rows.map((r) => m.screenRow(r, ctx, d, rows));
    const fixed = m.screenFixed(ctx, d, rows);
    const criteria = aggregateCriteria(perRow, fixed);
    const failCount = criteria.filter((c) => c.status === 'fail').length;
    const warnCount = criteria.filter((c) => c.status === 'warn').length;
    let verdict: Verdict;
    if (m.specialist) verdict = m.indicated?.(criteria) ? 'specialist' : 'unsuitable';
    else
      verdict =
        rows.length === 0
          ? 'unsuitable'
          : failCount > 0
            ? 'unsuitable'
            : warnCount > 0
              ? 'marginal'
              : 'suitable';
    const measures =
      input.measures?.[m.id] ??
      (verdict === 'unsuitable' && !isJumpBasinType(m.id) ? {} : roughMeasures(m, rows, ctx, d));
    const res: TypeScreening = {
      type: m.id,
      name: m.name,
      source: m.source,
      family: m.family,
      verdict,
      rank: 0,
      criteria,
      perDischarge: rows.map((r, i) => ({ Q: r.Q, criteria: perRow[i]! })),
      warnCount,
      failCount,
    };
    if (measures.length !== undefined) res.length = measures.length;
    if (measures.concreteVolume !== undefined) res.concreteVolume = measures.concreteVolume;
    return res;
  });
  results.sort(
    (a, b) =>
      VERDICT_ORDER[a.verdict] - VERDICT_ORDER[b.verdict] ||
      a.warnCount - b.warnCount ||
      (a.length ?? Infinity) - (b.length ?? Infinity) ||
      (a.concreteVolume ?? Infinity) - (b.concreteVolume ?? Infinity),
  );
  results.forEach((r, i) => (r.rank = i + 1));
  const best = results.find((r) => r.verdict === 'suitable' || r.verdict === 'marginal');
  if (best) best.verdict = 'recommended';
  return results;
}

function checkRow(r: DischargeRow): void {
  for (const k of ['Q', 'q', 'y1', 'v1', 'fr1', 'y2'] as const) {
    const v = r[k];
    if (typeof v !== 'number' || !Number.isFinite(v) || v <= 0)
      throw new InputError(
        `row.${k}`,
        'invalid',
        `row.${k} must be a positive finite number (got ${String(v)})`,
        {},
      );
  }
}

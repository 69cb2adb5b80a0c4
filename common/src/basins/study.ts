// The dissipator part of a study: per candidate type, the floor solved with that type's
// tailwater factor, the rows over the range, the screening, the designs and their drawings.
import { InputError } from '../errors';
import {
  prepareRange,
  rowsAt,
  solveFloor,
  type DischargeRange,
  type StudyInput,
  type StudyRow,
} from '../range';
import { DISSIPATOR_CATALOGUE, JUMP_BASIN_TYPES, isJumpBasinType } from './catalogue';
import type { DissipatorStudyOptions } from './options';
import { warn, warningCause, type StudyWarning } from '../warnings';
import { listAssumptions, resolveDefaults, type Assumption, type BasinDefaults } from './defaults';
import {
  designBaffledApron,
  designImpactBasin,
  designJumpBasin,
  designRiprapApron,
  type DesignRow,
  type DissipatorDesign,
} from './design';
import { buildBasinDrawing, type Drawing } from '../drawing/geometry';
import { screenDissipators, type TypeScreening, type Verdict } from './screening';
import type { DissipatorTypeId, JumpBasinType, ScreeningContext } from './types';

export type { DissipatorStudyOptions };

/** One designed type: its verdict, the design and its drawing. */
export interface DesignEntry {
  type: DissipatorTypeId;
  verdict: Verdict;
  design: DissipatorDesign;
  drawing: Drawing;
}

export interface DissipatorStudyResult {
  /** every type, in rank order, with its criteria and reasons */
  screening: TypeScreening[];
  /** the best-ranked usable type, or null when none (then see the specialist types) */
  recommended: DissipatorTypeId | null;
  /** the type designed as `design` (the user's choice, else the recommended one) */
  chosen: DissipatorTypeId | null;
  design: DesignEntry | null;
  alternatives: DesignEntry[];
  /** floor per jump-basin type, m (solved, less the safety depths, or the fixed one), with the governing discharge */
  floors: Partial<
    Record<
      JumpBasinType,
      {
        elevation: number;
        /** highest floor that holds the jump at every discharge with this type's C, m (null when fixed) */
        requiredElevation: number | null;
        governingQ: number | null;
        depthBelowBed: number;
      }
    >
  >;
  /** rows over the range on each jump-basin type's floor, with its C */
  rowsByType: Partial<Record<JumpBasinType, StudyRow[]>>;
  context: ScreeningContext;
  /** every default in force (from memory, common practice, sources) */
  assumptions: Assumption[];
  /** notes on the choice, as data (phrase with studyWarningText) */
  notes: StudyWarning[];
}

/** A type the study could not design, with the refusal behind it. */
function notDesigned(type: DissipatorTypeId, e: RangeError): StudyWarning {
  return { ...warn('type-not-designed', {}, { type }), cause: warningCause(e, 'dissipators') };
}

function toRow(r: StudyRow): DesignRow {
  const row: DesignRow = {
    Q: r.Q,
    q: r.q,
    y1: r.y1,
    v1: r.v1,
    fr1: r.fr1,
    y2: r.y2,
    tailwaterDepth: r.tailwaterDepth,
    tailwaterElevation: r.tailwaterElevation,
  };
  if (r.H0 !== null) row.head = r.H0;
  if (r.isDesign) row.isDesign = true;
  return row;
}

/** The screening context from the study input and the user's options. */
export function screeningContext(
  input: StudyInput,
  opts: DissipatorStudyOptions = {},
): ScreeningContext {
  const inflow = input.inflow;
  let culvert = opts.culvert;
  if (!culvert && inflow.kind === 'pipe' && inflow.outlet.kind === 'barrel') {
    const s = inflow.outlet.section;
    if (s.shape === 'circular') culvert = { shape: 'circular', rise: s.diameter };
  }
  const ctx: ScreeningContext = {
    inflow: inflow.kind,
    width: input.basinWidth,
    designQ: input.designDischarge,
  };
  if (input.submergenceTolerance !== undefined)
    ctx.submergenceTolerance = input.submergenceTolerance;
  if (opts.debris) ctx.debris = opts.debris;
  if (culvert) ctx.culvert = culvert;
  return ctx;
}

function outletWidth(input: StudyInput): number | undefined {
  const inflow = input.inflow;
  if (inflow.kind !== 'pipe' || inflow.outlet.kind !== 'barrel') return undefined;
  const s = inflow.outlet.section;
  return s.shape === 'circular' ? s.diameter : s.shape === 'rectangular' ? s.width : s.bottomWidth;
}

/**
 * Screens every catalogue type for a study, recommends one, designs it and the usable
 * alternatives (each jump basin on its own floor, solved with its tailwater factor over the
 * whole range) and draws them. Pure; SI.
 */
export function designDissipators(
  study: StudyInput | DischargeRange,
  options: DissipatorStudyOptions = {},
): DissipatorStudyResult {
  const range: DischargeRange = 'Qs' in study ? study : prepareRange(study);
  const input = range.input;
  const opts: DissipatorStudyOptions = {
    ...options,
    submergenceTolerance: range.submergenceTolerance,
  };
  const d: BasinDefaults = resolveDefaults(opts.defaults);
  for (const t of [
    ...(opts.chosenType !== undefined ? [opts.chosenType] : []),
    ...(opts.alternatives ?? []),
  ]) {
    if (!DISSIPATOR_CATALOGUE.some((m) => m.id === t))
      throw new InputError(
        'dissipators.chosenType',
        'unknown-option',
        `dissipators.chosenType: "${String(t)}" is not a type of the catalogue`,
        {},
      );
  }
  const ctx = screeningContext(input, opts);
  const notes: StudyWarning[] = [];
  const extra = opts.extraFloorDepth ?? 0;
  if (!(Number.isFinite(extra) && extra >= 0))
    throw new InputError(
      'dissipators.extraFloorDepth',
      'negative',
      `dissipators.extraFloorDepth (extra floor depth) must be a non-negative number (got ${extra})`,
      {},
    );
  const fixedFloor = input.floorElevation;
  const bed = input.channelBedElevation;

  // Rows at the natural level (for the types that need no floor solve).
  const naturalFloor = input.inflow.kind === 'pipe' ? input.inflow.invertElevation : bed;
  // (read for the toe and tailwater only: no sweep-out profiles)
  const bedRows = rowsAt(range, fixedFloor ?? naturalFloor, 1, false).map(toRow);

  const rowsByType: Partial<Record<DissipatorTypeId, DesignRow[]>> = {};
  const studyRowsByType: DissipatorStudyResult['rowsByType'] = {};
  const floors: DissipatorStudyResult['floors'] = {};
  const designs: Partial<Record<DissipatorTypeId, DissipatorDesign>> = {};
  for (const type of JUMP_BASIN_TYPES) {
    const rules = DISSIPATOR_CATALOGUE.find((m) => m.id === type)!.jump!;
    const factor = (r: { fr1: number }): number => rules.tailwaterFactor(r.fr1, d);
    try {
      let floor: number;
      let governingQ: number | null = null;
      let requiredElevation: number | null = null;
      if (fixedFloor !== undefined) floor = fixedFloor;
      else {
        const sol = solveFloor(range, factor);
        floor = sol.elevation - extra - range.floorSafetyDepth;
        governingQ = sol.governingQ;
        requiredElevation = sol.elevation;
      }
      const studyRows = rowsAt(range, floor, factor);
      studyRowsByType[type] = studyRows;
      const rows = studyRows.map(toRow);
      rowsByType[type] = rows;
      floors[type] = {
        elevation: floor,
        requiredElevation,
        governingQ,
        depthBelowBed: Math.max(0, bed - floor),
      };
      const inflowWidth = outletWidth(input);
      designs[type] = designJumpBasin(
        {
          type,
          width: input.basinWidth,
          floorElevation: floor,
          channelBedElevation: bed,
          designQ: input.designDischarge,
          governingQ,
          rows,
          ...(inflowWidth !== undefined ? { inflowWidth } : {}),
        },
        opts,
      );
    } catch (e) {
      if (!(e instanceof RangeError)) throw e;
      notes.push(notDesigned(type, e));
    }
  }

  // Types with their own rules, where the study describes what they need.
  try {
    designs['usbr-6'] = designImpactBasin(
      {
        floorElevation: naturalFloor,
        channelBedElevation: bed,
        designQ: input.designDischarge,
        rows: bedRows,
      },
      opts,
    );
  } catch (e) {
    if (!(e instanceof RangeError)) throw e;
    notes.push(notDesigned('usbr-6', e));
  }
  if (input.inflow.kind === 'chute') {
    try {
      designs['usbr-9'] = designBaffledApron(
        {
          crestElevation: input.inflow.crestElevation,
          channelBedElevation: bed,
          width: input.basinWidth,
          designQ: input.designDischarge,
        },
        opts,
      );
    } catch (e) {
      if (!(e instanceof RangeError)) throw e;
      notes.push(notDesigned('usbr-9', e));
    }
  }
  if (ctx.culvert) {
    const dr = bedRows.find((r) => r.isDesign)!;
    try {
      designs['riprap-apron'] = designRiprapApron(
        {
          invertElevation: naturalFloor,
          designQ: dr.Q,
          culvert: ctx.culvert,
          tailwaterElevation: dr.tailwaterElevation,
        },
        opts,
      );
    } catch (e) {
      if (!(e instanceof RangeError)) throw e;
      notes.push(notDesigned('riprap-apron', e));
    }
  }

  const measures: Partial<Record<DissipatorTypeId, { length?: number; concreteVolume?: number }>> =
    {};
  for (const [id, des] of Object.entries(designs) as Array<[DissipatorTypeId, DissipatorDesign]>) {
    measures[id] = { length: des.length, concreteVolume: des.concrete.total };
  }
  const screening = screenDissipators({
    rows: bedRows,
    rowsByType,
    context: ctx,
    defaults: d,
    measures,
  });
  const recommended = screening.find((s) => s.verdict === 'recommended')?.type ?? null;
  if (!recommended) {
    const sp = screening.filter((s) => s.verdict === 'specialist').map((s) => s.type);
    if (sp.length > 0) notes.push({ ...warn('specialist-needed'), types: sp });
    else notes.push(warn('no-catalogue-type'));
  }
  if (screening.some((s) => s.verdict === 'specialist') && recommended) {
    notes.push(warn('jet-also-indicated'));
  }
  const chosen = opts.chosenType ?? recommended;
  const entry = (type: DissipatorTypeId): DesignEntry | null => {
    const des = designs[type];
    const s = screening.find((x) => x.type === type);
    if (!des || !s) return null;
    return { type, verdict: s.verdict, design: des, drawing: buildBasinDrawing(des, opts.drawing) };
  };
  let design: DesignEntry | null = null;
  if (chosen) {
    design = entry(chosen);
    if (!design) notes.push(warn('chosen-not-designed', {}, { type: chosen }));
  }
  const altIds = new Set<DissipatorTypeId>([
    ...screening
      .filter(
        (s) =>
          (s.verdict === 'suitable' || s.verdict === 'marginal' || s.verdict === 'recommended') &&
          s.type !== chosen,
      )
      .map((s) => s.type),
    ...(opts.alternatives ?? []).filter((t) => t !== chosen),
  ]);
  const alternatives = [...altIds].map(entry).filter((x): x is DesignEntry => x !== null);
  return {
    screening,
    recommended,
    chosen,
    design,
    alternatives,
    floors,
    rowsByType: studyRowsByType,
    context: ctx,
    // The flotation case, when given, takes the place of its two defaults: list what is in force.
    assumptions: listAssumptions({
      ...d,
      ...(opts.flotation?.safetyFactor !== undefined
        ? { flotationSafetyFactor: opts.flotation.safetyFactor }
        : {}),
      ...(opts.flotation?.minThickness !== undefined
        ? { minSlabThickness: opts.flotation.minThickness }
        : {}),
    }),
    notes,
  };
}

export { isJumpBasinType };

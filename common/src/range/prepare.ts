// The discharge range, prepared once per run: the discharge set (with the design discharge in
// it), the tailwater at each discharge, and the toe at each discharge as a function of the floor.
// The floor solve, the rows, the screening and every type's design all read this one object.
import { InputError, withField } from '../errors';
import { requireFinite, requireInRange, requirePositive } from '../hydraulics/guards';
import { _froude } from '../hydraulics/depths';
import type { Section } from '../hydraulics/sections';
import { makeTailwaterRating, type TailwaterAt, type TailwaterSpec } from '../hydraulics/tailwater';
import { prepareInflowToes, type InflowNote, type Toe } from '../hydraulics/toeByInflow';
import { DEFAULT_SUBMERGENCE_TOLERANCE } from './position';
import { MAX_DISCHARGES, MAX_ELEVATION_SPAN } from './limits';
import { ENGINE_LIMITS, requireStudySize } from '../schemas/limits';
import type { DischargeSpec, StudyInput } from './types';

/** The defaults of the range model's optional inputs. */
export const RANGE_DEFAULTS = {
  tailwaterFactor: 1,
  submergenceTolerance: DEFAULT_SUBMERGENCE_TOLERANCE,
  floorManningN: 0.014,
  jumpLengthMethod: 'usbr' as const,
  floorSafetyDepth: 0,
};

/** The discharges as typed, ascending and without repeats, m³/s (the design discharge not yet added). */
export function dischargeList(spec: DischargeSpec): number[] {
  if (spec?.kind === 'list') {
    if (!Array.isArray(spec.values) || spec.values.length === 0)
      throw new InputError(
        'discharges.values',
        'invalid',
        'discharges.values must list at least one discharge',
      );
    if (spec.values.length > MAX_DISCHARGES)
      throw new InputError(
        'discharges.values',
        'out-of-range',
        `discharges.values: at most ${MAX_DISCHARGES} discharges`,
        { max: MAX_DISCHARGES },
      );
    spec.values.forEach((v, i) => requirePositive(`discharges.values[${i}]`, v));
    return [...new Set(spec.values)].sort((a, b) => a - b);
  }
  if (spec?.kind === 'range') {
    const min = requirePositive('discharges.min', spec.min);
    const max = requirePositive('discharges.max', spec.max);
    if (max < min)
      throw new InputError(
        'discharges.max',
        'out-of-range',
        'discharges.max must not be below discharges.min',
        { min, max },
      );
    const n = spec.count;
    if (!Number.isInteger(n) || n < 1 || n > MAX_DISCHARGES) {
      throw new InputError(
        'discharges.count',
        'out-of-range',
        `discharges.count must be a whole number 1–${MAX_DISCHARGES}`,
        { min: 1, max: MAX_DISCHARGES },
      );
    }
    if (n === 1 || max === min) return [min];
    return Array.from({ length: n }, (_, i) =>
      i === n - 1 ? max : min + ((max - min) * i) / (n - 1),
    );
  }
  throw new InputError('discharges.kind', 'invalid', `discharges.kind must be 'list' or 'range'`);
}

/**
 * The discharges analysed: those typed plus the design discharge when they lack it, ascending.
 * @example analysedDischarges({ kind: 'list', values: [5, 10] }, 85) // { Qs: [5, 10, 85], designIndex: 2, designAdded: true }
 */
export function analysedDischarges(
  spec: DischargeSpec,
  designDischarge: number,
): { Qs: number[]; designIndex: number; designAdded: boolean } {
  const typed = dischargeList(spec);
  const at = typed.indexOf(designDischarge);
  if (at >= 0) return { Qs: typed, designIndex: at, designAdded: false };
  const Qs = [...typed, designDischarge].sort((a, b) => a - b);
  return { Qs, designIndex: Qs.indexOf(designDischarge), designAdded: true };
}

/** Facts about the range worth a warning (SI quantities; phrased at the edge). */
export type RangeNote =
  | InflowNote
  | { code: 'design-discharge-added'; Q: number; aboveRange: boolean }
  | { code: 'tailwater-extended'; count: number; firstQ: number };

/** A discharge set prepared once: what the floor solve and the rows read. */
export interface DischargeRange {
  /** the input, SI, as given */
  readonly input: StudyInput;
  /** discharges analysed, ascending, m³/s (the design discharge among them) */
  readonly Qs: readonly number[];
  /** index of the design discharge in Qs */
  readonly designIndex: number;
  readonly width: number;
  readonly basin: Section;
  /** the tailwater at each discharge */
  readonly tw: readonly TailwaterAt[];
  /** y1 at index i and floor z (−1: the head cannot pass the flow); null when it needs the toe */
  readonly y1At: ((i: number, z: number) => number) | null;
  readonly toeAt: (i: number, z: number) => Toe;
  /** false when the toe does not depend on the floor (fixed gate opening or pool, known toe) */
  readonly floorDependent: boolean;
  readonly notes: readonly RangeNote[];
  readonly submergenceTolerance: number;
  readonly floorManningN: number;
  readonly jumpLengthMethod: 'usbr' | 'hager';
  readonly floorSafetyDepth: number;
}

function requireNear(field: string, z: number, bed: number): void {
  requireFinite(field, z);
  if (Math.abs(z - bed) > MAX_ELEVATION_SPAN)
    throw new InputError(
      field,
      'far-from-bed',
      `${field} lies ${Math.abs(z - bed).toFixed(0)} m from the channel bed: check the datum`,
      { elevation: z, channelBedElevation: bed, span: MAX_ELEVATION_SPAN },
    );
}

function requireAboveBed(field: string, z: number, bed: number, what: string): void {
  if (z < bed)
    throw new InputError(field, 'below-bed', `${what} lies below the channel bed it drops to`, {
      elevation: z,
      channelBedElevation: bed,
    });
}

/** Refuses site geometry no structure could have (before anything is computed). */
function checkSite(input: StudyInput): void {
  const bed = input.channelBedElevation;
  const inflow = input.inflow;
  if (input.floorElevation !== undefined) requireNear('floorElevation', input.floorElevation, bed);
  const tw: TailwaterSpec | undefined = input.tailwater;
  if (tw?.kind === 'table' && Array.isArray(tw.rows)) {
    tw.rows.forEach((r, i) => {
      const f = `tailwater.rows[${i}].elevation`;
      requireNear(f, r.elevation, bed);
      requireAboveBed(f, r.elevation, bed, 'the tailwater level');
    });
  }
  if (!inflow || typeof inflow !== 'object') return;
  if (inflow.kind === 'chute') {
    requireNear('inflow.crestElevation', inflow.crestElevation, bed);
    requireAboveBed('inflow.crestElevation', inflow.crestElevation, bed, 'the crest');
    const hw = inflow.headwater;
    if (hw?.kind === 'table' && Array.isArray(hw.rows))
      hw.rows.forEach((r, i) => {
        const f = `inflow.headwater.rows[${i}].elevation`;
        requireNear(f, r.elevation, bed);
        requireAboveBed(f, r.elevation, bed, 'the headwater level');
      });
  } else if (inflow.kind === 'pipe') {
    requireNear('inflow.invertElevation', inflow.invertElevation, bed);
    requireAboveBed('inflow.invertElevation', inflow.invertElevation, bed, 'the outlet invert');
  } else if (inflow.kind === 'gate' && inflow.upstreamElevation !== undefined) {
    requireNear('inflow.upstreamElevation', inflow.upstreamElevation, bed);
    requireAboveBed(
      'inflow.upstreamElevation',
      inflow.upstreamElevation,
      bed,
      'the water upstream of the gate',
    );
  }
}

/**
 * Validates a study input (SI) and prepares its discharge range once. Throws an InputError
 * naming the field and the cause: impossible site geometry, a tailwater rating that is
 * supercritical at an analysed discharge (a steep channel cannot hold a jump), an inflow that
 * cannot pass a discharge. [hydraulics.md §2–3]
 */
export function prepareRange(input: StudyInput): DischargeRange {
  if (input === null || typeof input !== 'object')
    throw new InputError('body', 'invalid', 'input must be a study object');
  if (input.units === 'US')
    throw new InputError(
      'units',
      'units-not-si',
      'the study input is in US customary units: convert it with toSI before running the study',
    );
  if (input.units !== 'SI') throw new InputError('units', 'invalid', `units must be 'SI' or 'US'`);
  requireFinite('channelBedElevation', input.channelBedElevation);
  requireStudySize(input); // widths, discharge counts, table rows: bounded before any work
  const b = requirePositive('basinWidth', input.basinWidth);
  const Qd = requirePositive('designDischarge', input.designDischarge);
  const tol = requireInRange(
    'submergenceTolerance',
    input.submergenceTolerance ?? RANGE_DEFAULTS.submergenceTolerance,
    0,
    1,
  );
  const nFloor = requireInRange(
    'floorManningN',
    input.floorManningN ?? RANGE_DEFAULTS.floorManningN,
    ENGINE_LIMITS.manningN.min,
    ENGINE_LIMITS.manningN.max,
  );
  const safety = requireInRange(
    'floorSafetyDepth',
    input.floorSafetyDepth ?? RANGE_DEFAULTS.floorSafetyDepth,
    0,
    MAX_ELEVATION_SPAN,
  );
  const method = input.jumpLengthMethod ?? RANGE_DEFAULTS.jumpLengthMethod;
  if (method !== 'usbr' && method !== 'hager')
    throw new InputError(
      'jumpLengthMethod',
      'invalid',
      `jumpLengthMethod must be 'usbr' or 'hager'`,
    );
  if (input.tailwaterFactor !== undefined)
    requireInRange('tailwaterFactor', input.tailwaterFactor, 0.5, 2);
  checkSite(input);

  const { Qs, designIndex, designAdded } = analysedDischarges(input.discharges, Qd);
  const notes: RangeNote[] = [];
  if (designAdded)
    notes.push({
      code: 'design-discharge-added',
      Q: Qd,
      aboveRange: designIndex === Qs.length - 1,
    });

  const spec = input.tailwater;
  if (!spec || typeof spec !== 'object')
    throw new InputError('tailwater', 'invalid', 'tailwater: missing');
  const rating = withField('tailwater', () => makeTailwaterRating(spec, input.channelBedElevation));
  const tw = withField('tailwater', () => Qs.map((Q) => rating(Q)));
  if (spec.kind === 'manning') {
    // A normal depth that is supercritical cannot stand below a jump: refuse, naming the discharge.
    for (let i = 0; i < Qs.length; i++) {
      const Q = Qs[i]!;
      const fr = _froude(spec.section, Q, tw[i]!.depth);
      if (fr >= 1)
        throw new InputError(
          'tailwater',
          'supercritical-tailwater',
          `the downstream channel runs supercritical at Q = ${Number(Q.toPrecision(4))} m³/s (Froude number ${fr.toFixed(2)} at normal depth): a steep channel cannot hold a jump — give a tailwater rating table or a downstream control`,
          { Q, fr },
        );
    }
  }
  const outside = Qs.filter((_, i) => tw[i]!.outside !== null);
  if (outside.length > 0)
    notes.push({ code: 'tailwater-extended', count: outside.length, firstQ: outside[0]! });

  const toes = prepareInflowToes(input.inflow, Qs, b, designIndex);
  notes.push(...toes.notes);
  return {
    input,
    Qs,
    designIndex,
    width: b,
    basin: { shape: 'rectangular', width: b },
    tw,
    y1At: toes.y1At,
    toeAt: toes.toeAt,
    floorDependent: toes.floorDependent,
    notes,
    submergenceTolerance: tol,
    floorManningN: nFloor,
    jumpLengthMethod: method,
    floorSafetyDepth: safety,
  };
}

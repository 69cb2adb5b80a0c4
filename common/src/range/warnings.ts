// The study's warnings about the range: what the notes, the rows and the floor say, as coded
// data (common/src/warnings.ts). SI quantities; messages/ phrases them in the project's units.
import { studyWarning, type StudyWarning } from '../warnings';
import type { DischargeRange, RangeNote } from './prepare';
import type { FloorSolution, StudyRow } from './types';

/** Inflow velocity above which blocks risk cavitation and a model study is advised, m/s (hydraulics.md §7). */
export const CAVITATION_VELOCITY = 15;
/** Fr1 above which standard basins were not tested (hydraulics.md §7). */
export const MAX_TESTED_FR1 = 17;

/** The warning of a range note. */
export function rangeNoteWarning(n: RangeNote): StudyWarning {
  switch (n.code) {
    case 'design-discharge-added':
      return studyWarning(
        n.aboveRange ? 'design-discharge-above-range' : 'design-discharge-added',
        { Q: n.Q },
        { Q: 'discharge' },
        { Q: n.Q },
      );
    case 'tailwater-extended':
      return studyWarning(
        'tailwater-extended',
        { count: n.count, Q: n.firstQ },
        { Q: 'discharge' },
        { Q: n.firstQ },
      );
    case 'headwater-extended':
      return studyWarning('headwater-extended', { count: n.count });
    case 'outlet-extended':
      return studyWarning('outlet-extended', { count: n.count });
    case 'jet-flare':
      return studyWarning('jet-flare', { tanTheta: n.tanTheta, fr: n.fr });
    case 'known-toe-q-differs':
      return studyWarning(
        'known-toe-q-differs',
        { qToe: n.qToe, qBasin: n.qBasin, v1: n.v1 },
        { qToe: 'unitDischarge', qBasin: 'unitDischarge', v1: 'velocity' },
      );
    case 'known-toe-velocity-held':
      return studyWarning('known-toe-velocity-held');
  }
}

/** Warnings about the rows on the study floor (sweep-out, submergence, velocity, jump class). */
export function rangeWarnings(
  range: DischargeRange,
  rows: readonly StudyRow[],
  floor: { elevation: number; fixed: boolean; solved: FloorSolution | null },
): StudyWarning[] {
  const warnings = range.notes.map(rangeNoteWarning);
  const z = floor.elevation;
  if (floor.fixed && floor.solved && z > floor.solved.elevation + 1e-6) {
    warnings.push(
      studyWarning(
        'fixed-floor-above-required',
        { floorElevation: z, requiredElevation: floor.solved.elevation },
        { floorElevation: 'length', requiredElevation: 'length' },
      ),
    );
  }
  const swept = rows.filter((r) => r.position === 'swept-out');
  if (swept.length > 0)
    warnings.push(
      studyWarning(
        'sweep-out',
        { count: swept.length, Q: swept[0]!.Q },
        { Q: 'discharge' },
        { Q: swept[0]!.Q },
      ),
    );
  const drowned = rows.filter((r) => r.position === 'drowned');
  if (drowned.length > 0) {
    const worst = drowned.reduce((a, r) =>
      r.tailwaterDepth / r.requiredDepth > a.tailwaterDepth / a.requiredDepth ? r : a,
    );
    warnings.push(
      studyWarning(
        'excess-submergence',
        {
          count: drowned.length,
          excess: worst.tailwaterDepth / worst.requiredDepth - 1,
          Q: worst.Q,
        },
        { Q: 'discharge' },
        { Q: worst.Q },
      ),
    );
  }
  const fastest = rows.reduce((a, r) => (r.v1 > a.v1 ? r : a), rows[0]!);
  if (fastest && fastest.v1 > CAVITATION_VELOCITY)
    warnings.push(
      studyWarning(
        'high-inflow-velocity',
        { v1: fastest.v1, limit: CAVITATION_VELOCITY, Q: fastest.Q },
        { v1: 'velocity', limit: 'velocity', Q: 'discharge' },
        { Q: fastest.Q },
      ),
    );
  const osc = rows.filter((r) => r.jumpClass === 'oscillating');
  if (osc.length > 0) warnings.push(studyWarning('oscillating-jump', { count: osc.length }));
  const weak = rows.filter((r) => r.jumpClass === 'undular' || r.jumpClass === 'weak');
  if (weak.length > 0) warnings.push(studyWarning('weak-jump', { count: weak.length }));
  const frHi = rows.filter((r) => r.fr1 > MAX_TESTED_FR1);
  if (frHi.length > 0)
    warnings.push(
      studyWarning('froude-above-tested', { count: frHi.length, limit: MAX_TESTED_FR1 }),
    );
  if (rows.some((r) => r.gate?.submerged)) warnings.push(studyWarning('gate-submerged'));
  return warnings;
}

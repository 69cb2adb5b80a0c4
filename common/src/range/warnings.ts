// The study's warnings about the range: what the rows and the floor say, in one unit system.
// Numbers are SI until the phraser words them.
import type { Phraser } from '../units/phrase';
import type { DischargeRange, RangeNote } from './prepare';
import type { FloorSolution, StudyRow } from './types';

/** The sentence of a range note. */
export function rangeNoteText(n: RangeNote, P: Phraser): string {
  switch (n.code) {
    case 'design-discharge-added':
      return n.aboveRange
        ? `The design discharge ${P.Q(n.Q)} lies above the discharges checked: it was added and analysed.`
        : `The discharges checked did not include the design discharge ${P.Q(n.Q)}: it was added and analysed.`;
    case 'tailwater-extended':
      return `${n.count} discharge(s) lie outside the tailwater rating table (${P.Q(n.firstQ)}${n.count > 1 ? ' …' : ''}); the tailwater there is extended in a straight line from the end of the table — extend the table.`;
    case 'headwater-extended':
      return `${n.count} discharge(s) lie outside the headwater rating table; headwater extended in a straight line.`;
    case 'outlet-extended':
      return 'Some discharges lie outside the outlet table; outlet depth and velocity extended in a straight line.';
    case 'jet-flare':
      return `Jet from the outlet: walls should diverge no faster than tanθ = 1/(3·Fr) = ${n.tanTheta.toFixed(3)} at the highest outlet Froude number ${n.fr.toFixed(2)} (HEC-14).`;
    case 'known-toe-q-differs':
      return `The toe conditions give q = ${P.q(n.qToe)} but the design discharge over the basin width gives ${P.q(n.qBasin)}; the toe velocity ${P.vel(n.v1)} is used with the basin's unit discharge.`;
    case 'known-toe-velocity-held':
      return 'Known toe conditions: the toe velocity is held the same at every discharge (y1 = q/V1) — an approximation; enter each discharge separately to refine.';
  }
}

/** Warnings about the rows on the study floor (sweep-out, submergence, velocity, jump class). */
export function rangeWarnings(
  range: DischargeRange,
  rows: readonly StudyRow[],
  floor: { elevation: number; fixed: boolean; solved: FloorSolution | null },
  P: Phraser,
): string[] {
  const warnings = range.notes.map((n) => rangeNoteText(n, P));
  const z = floor.elevation;
  if (floor.fixed && floor.solved && z > floor.solved.elevation + 1e-6) {
    warnings.push(
      `The fixed floor at elevation ${P.len(z)} is above the highest floor that holds the jump at every discharge (${P.len(floor.solved.elevation)}).`,
    );
  }
  const swept = rows.filter((r) => r.position === 'swept-out');
  if (swept.length > 0)
    warnings.push(
      `Sweep-out: tailwater is short of the required depth at ${swept.length} discharge(s), from ${P.Q(swept[0]!.Q)}.`,
    );
  const drowned = rows.filter((r) => r.position === 'drowned');
  if (drowned.length > 0) {
    const worst = drowned.reduce((a, r) =>
      r.tailwaterDepth / r.requiredDepth > a.tailwaterDepth / a.requiredDepth ? r : a,
    );
    warnings.push(
      `Excess submergence at ${drowned.length} discharge(s): up to ${((worst.tailwaterDepth / worst.requiredDepth - 1) * 100).toFixed(0)} % above the required depth (Q = ${P.Q(worst.Q)}); a drowned jump dissipates less energy.`,
    );
  }
  const vMax = Math.max(...rows.map((r) => r.v1));
  if (vMax > 15)
    warnings.push(
      `Inflow velocity reaches ${P.vel(vMax)} (> ${P.units === 'US' ? '50 ft/s' : '15 m/s'}): cavitation risk on blocks; model study advised.`,
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
  return warnings;
}

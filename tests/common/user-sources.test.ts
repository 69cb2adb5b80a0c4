// Every source a user reads names a publication, or says "common practice" or "judgement" —
// never a file of this project (issue 13: an assumption once read "hydraulics.md §4 (concept
// structure)"). The scan reads every string the engine hands the screens and the proposal:
// the defaults' provenance, the catalogue, the take-off's assumptions and bases, the default
// spreads of the uncertainty run, and the whole study result of each demo design.
import { describe, expect, it } from 'vitest';
import {
  BASIN_DEFAULT_PROVENANCE,
  DISSIPATOR_CATALOGUE,
  TAKEOFF_ASSUMPTIONS,
  defaultUncertainInputs,
  runStudy,
  takeoff,
  toSI,
} from '@basinwright/common';
import { fenwickDesign, caldwellDesign } from '../../seed/designs';

/** Every string inside a value (functions and their source are not read). */
function strings(value: unknown, out: string[] = [], seen = new Set<unknown>()): string[] {
  if (typeof value === 'string') out.push(value);
  else if (value !== null && typeof value === 'object' && !seen.has(value)) {
    seen.add(value);
    for (const v of Object.values(value)) strings(v, out, seen);
  }
  return out;
}

// a file name with the extensions this project keeps its notes and code in
const FILE = /\b[\w-]+\.(md|ts|tsx|js|mjs|json|vue)\b/i;

describe('sources a user reads', () => {
  const sets: Array<[string, unknown]> = [
    ['defaults', BASIN_DEFAULT_PROVENANCE],
    ['catalogue', DISSIPATOR_CATALOGUE],
    ['take-off assumptions', TAKEOFF_ASSUMPTIONS],
    ['uncertainty spreads', defaultUncertainInputs(fenwickDesign)],
    ...[fenwickDesign, caldwellDesign].flatMap((d, i): Array<[string, unknown]> => {
      const r = runStudy(toSI(d));
      return [
        [`study ${i}`, r],
        [`take-off ${i}`, takeoff(r.design!, {})],
      ];
    }),
  ];
  it.each(sets)('%s: no internal file named', (_name, value) => {
    const all = strings(value);
    expect(all.length).toBeGreaterThan(0);
    expect(all.filter((s) => FILE.test(s))).toEqual([]);
  });
});

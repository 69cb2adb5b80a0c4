// Conversion between any two unit strings, through a private mathjs instance that holds the extra
// unit cfs (the global mathjs stays untouched). Factors: NIST SP 811 (1 ft = 0.3048 m exactly).
// The instance is built through mathjs's custom-bundle API from the two factories the units
// need (unit(), createUnit() and what their Unit class depends on), not create(all): the same
// Unit class and definitions, so the same numbers, at about a third of the size in the browser
// (no expression parser, matrices or statistics). A module of its own: the conversions by kind
// (toSIValue, fromSIValue, toSI, fromSI in ./index) read the table in ./factors and never load
// mathjs, so only a page that converts arbitrary units (take-off, estimate) carries it.
import { create, createUnitDependencies, unitDependencies, type MathJsInstance } from 'mathjs';

// Built on first use, not at import: creating the instance costs a long task in the browser
// (hundreds of ms with the CPU slowed).
let instance: MathJsInstance | null = null;
function mathjs(): MathJsInstance {
  if (instance) return instance;
  // The dependency maps are typed optional only because of mathjs's lite builds; this one has them.
  if (!unitDependencies || !createUnitDependencies)
    throw new Error('mathjs: the unit factories are missing from this build');
  const math = create({ unitDependencies, createUnitDependencies }, {});
  // mathjs has no cfs; ft³/s is the trade's unit of discharge in US practice.
  math.createUnit('cfs', '1 ft^3/s');
  instance = math;
  return math;
}

/**
 * Converts a value between any two mathjs unit strings (with cfs added).
 * @example convert(1, 'cfs', 'm^3/s') // 0.028316846592
 */
export function convert(value: number, from: string, to: string): number {
  if (!Number.isFinite(value)) throw new RangeError(`value must be a finite number (got ${value})`);
  try {
    return mathjs().unit(value, from).toNumber(to);
  } catch (e) {
    throw new RangeError(
      `cannot convert ${from} to ${to}: ${e instanceof Error ? e.message : String(e)}`,
      { cause: e },
    );
  }
}

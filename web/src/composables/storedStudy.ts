// The result the server kept with the saved design (it runs the same engine on every save),
// shown when the workspace opens instead of waiting for the browser to work it out again. It
// is used only when it answers exactly the input on the form: the same engine version, and the
// engine's SI input, as the form would send it, identical to the one the server ran.
import {
  ENGINE_VERSION,
  studyInputSchema,
  toSI,
  type StudyInput,
  type StudyResult,
} from '@basinwright/common';
import type { Design } from '@/api/designs';

/**
 * Equal as JSON: the same keys (a key holding undefined counts as absent, as JSON drops it) and
 * the same numbers to the bit. A stored result's keys come back in the database's order.
 */
export function sameJson(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (typeof a === 'number' && typeof b === 'number') return Object.is(a, b);
  if (a === null || b === null || typeof a !== 'object' || typeof b !== 'object') return false;
  if (Array.isArray(a) !== Array.isArray(b)) return false;
  const ka = Object.keys(a).filter((k) => (a as Record<string, unknown>)[k] !== undefined);
  const kb = Object.keys(b).filter((k) => (b as Record<string, unknown>)[k] !== undefined);
  if (ka.length !== kb.length) return false;
  return ka.every((k) =>
    sameJson((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k]),
  );
}

/** The saved design's result when it is the answer to `values` (the form's input), else null. */
export function storedResultFor(values: unknown, design: Design | null): StudyResult | null {
  if (!design?.input || !design.result || design.engineVersion !== ENGINE_VERSION) return null;
  // The form as it opens holds the saved input itself, which the server validated before it
  // ran the engine on it: the same JSON needs no second check (a schema check of the whole
  // input is the longest step of opening the workspace on a slow machine).
  if (sameJson(values, design.input)) return design.result;
  try {
    const own = studyInputSchema.validateSync(values, { abortEarly: false, stripUnknown: true });
    return sameJson(toSI(own as StudyInput), toSI(design.input)) ? design.result : null;
  } catch {
    return null; // an input the form cannot pass is worked out (and refused) the usual way
  }
}

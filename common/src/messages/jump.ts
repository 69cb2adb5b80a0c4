// Sentences for the notes of locateJump (the jump-position tool), in either unit system: the
// notes are data (hydraulics/profiles.ts: a code and the SI depths they quote).
import type { JumpNote, JumpNoteCode } from '../hydraulics/profiles';
import type { UnitSystem } from '../range/types';
import { formatQuantity } from './quote';

const SENTENCES: Record<JumpNoteCode, (v: JumpNote['values'], units: UnitSystem) => string> = {
  drowned: () => 'The jump is drowned: the tailwater holds it against the structure (submerged).',
  'gate-submerged': () =>
    'The gate may run submerged: the free-flow gate discharge does not apply.',
  'at-structure': () =>
    'The approach flow has more momentum than the pool at the control: the jump stands at the structure.',
  'from-vena-contracta': (v, units) =>
    v.y1 !== undefined
      ? `Distance measured from the vena contracta, where the depth is Cc·a = ${formatQuantity(v.y1, 'length', units)}.`
      : 'Distance measured from the vena contracta, where the depth is Cc·a.',
  'from-weir-foot': (v, units) =>
    v.y1 !== undefined
      ? `Distance measured from the foot of the weir, where the fast flow is ${formatQuantity(v.y1, 'length', units)} deep.`
      : 'Distance measured from the foot of the weir, where the supercritical depth is taken.',
};

/** Every code of the jump-position notes (for tests). */
export const JUMP_NOTE_CODES = Object.keys(SENTENCES) as JumpNoteCode[];

/**
 * A note of the jump-position tool as a sentence in the project's units.
 * @example jumpNoteText({ code: 'from-vena-contracta', values: { y1: 0.183 } }, 'US') // '… Cc·a = 0.60 ft.'
 */
export function jumpNoteText(note: JumpNote, units: UnitSystem = 'SI'): string {
  return SENTENCES[note.code](note.values, units);
}

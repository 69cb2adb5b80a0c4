/**
 * The version of the engine's answer: what `runStudy` returns for a given input, its shape and
 * its figures. A stored result carries the version that computed it, so a reader knows whether
 * the current engine would give the same answer and whether today's code can read it.
 *
 * Raise it with every change that alters a result (a relation, a default, a rounding, a field
 * added, renamed or removed); a change that leaves every result as it was keeps it.
 */
export const ENGINE_VERSION = '2.3.1';

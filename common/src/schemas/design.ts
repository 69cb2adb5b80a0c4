import { mixed, object, type ObjectSchema } from 'yup';
import { revisionSchema } from './version';
import type { StudyInput } from '../range/types';
import { studyInputSchema } from './study';

function isPlainObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

export interface DesignSaveInput {
  input: StudyInput;
  /** what steers the dissipator catalogue: the chosen type, overrides of defaults */
  options?: Record<string, unknown> | null;
  /**
   * the draft revision this copy was based on (from GET); required once a design exists — a save
   * without it, or based on another revision, is refused with 409 and the current copy
   */
  revision?: number | null;
}

/** PUT /projects/:id/design: the study input in the project's units, and the catalogue options. */
export const designSaveSchema: ObjectSchema<DesignSaveInput> = object({
  input: studyInputSchema.required('Send the design input.'),
  options: mixed<Record<string, unknown>>()
    .nullable()
    .optional()
    .test('object', 'The design options must be an object.', (v) => v == null || isPlainObject(v)),
  revision: revisionSchema.nullable().optional(),
});

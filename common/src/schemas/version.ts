import { number, object, string, type InferType } from 'yup';
import { trimString } from './text';

// Free text: null from a cleared form field means "empty".
const text = (max: number, label: string) =>
  string()
    .transform((value: unknown, original: unknown) => (original === null ? '' : value))
    .transform(trimString)
    .max(max, `${label} has at most ${max} characters.`);

/** The draft revision a client's copy is based on (optimistic concurrency). */
export const revisionSchema = number()
  .typeError('The revision must be a whole number.')
  .integer('The revision must be a whole number.')
  .min(1, 'The revision is at least 1.')
  .max(2_147_483_647, 'The revision is too large.');

/** POST /projects/:id/versions: issue the draft at `revision` with a note. */
export const versionIssueSchema = object({
  revision: revisionSchema.required('Send the revision of the draft you are issuing.'),
  note: text(2000, 'The note').default(''),
});
export type VersionIssueInput = InferType<typeof versionIssueSchema>;

/** POST …/versions/:versionId/approve: optional comments. */
export const reviewApproveSchema = object({
  comments: text(4000, 'Comments').default(''),
});
export type ReviewApproveInput = InferType<typeof reviewApproveSchema>;

/** POST …/versions/:versionId/return: the comments say what to change. */
export const reviewReturnSchema = object({
  comments: text(4000, 'Comments')
    .min(1, 'Say what should change.')
    .required('Say what should change.'),
});
export type ReviewReturnInput = InferType<typeof reviewReturnSchema>;

/** PUT /members/:id/reviewer: mark a member as licensed reviewer. */
export const reviewerMarkSchema = object({
  licenceNumber: text(60, 'The licence number')
    .min(1, 'Enter the licence number.')
    .required('Enter the licence number.'),
  jurisdiction: text(120, 'The jurisdiction')
    .min(1, 'Enter the jurisdiction.')
    .required('Enter the jurisdiction.'),
  statement: text(2000, 'The statement')
    .min(1, 'Enter the statement printed with the signature.')
    .required('Enter the statement printed with the signature.'),
});
export type ReviewerMarkInput = InferType<typeof reviewerMarkSchema>;

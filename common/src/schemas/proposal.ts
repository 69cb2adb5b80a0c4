import { object, string, type InferType } from 'yup';
import { emailSchema } from './auth';
import { trimString } from './text';

const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** POST /projects/:id/proposals: draw the proposal of one issued version. */
export const proposalCreateSchema = object({
  versionId: string()
    .required('Choose the issued version to make the proposal from.')
    .matches(uuidPattern, 'The version id is not valid.'),
});
export type ProposalCreateInput = InferType<typeof proposalCreateSchema>;

/** POST /projects/:id/proposals/:proposalId/send: e-mail the PDF to the client. */
export const proposalSendSchema = object({
  to: emailSchema.required('Enter the e-mail address of the client.'),
  message: string()
    .transform((value: unknown, original: unknown) => (original === null ? '' : value))
    .transform(trimString)
    .max(4000, 'The message has at most 4000 characters.')
    .default(''),
});
export type ProposalSendInput = InferType<typeof proposalSendSchema>;

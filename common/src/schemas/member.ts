import { boolean, object, string, type InferType } from 'yup';
import { emailSchema } from './auth';
import { INVITABLE_ROLES, ROLES, type InvitableRole, type Role } from './limits';

export const invitationCreateSchema = object({
  email: emailSchema,
  role: string<InvitableRole>()
    .required('Choose a role.')
    .oneOf(INVITABLE_ROLES, 'Choose one of: admin, engineer, estimator, viewer.'),
});
export type InvitationCreateInput = InferType<typeof invitationCreateSchema>;

export const memberUpdateSchema = object({
  role: string<Role>()
    .oneOf(ROLES, 'Choose one of: owner, admin, engineer, estimator, viewer.')
    .optional(),
  active: boolean().typeError('Active must be true or false.').optional(),
}).test('member-update-not-empty', 'Change the role or the active flag.', (value) => {
  return value.role !== undefined || value.active !== undefined;
});
export type MemberUpdateInput = InferType<typeof memberUpdateSchema>;

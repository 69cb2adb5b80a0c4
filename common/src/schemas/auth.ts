import { object, string, type InferType } from 'yup';
import { lowerString, trimString } from './text';
import { LIMITS, utf8ByteLength } from './limits';

/** E-mail as stored: trimmed and lowercased, so look-ups and the unique index agree. */
export const emailSchema = string()
  .transform(trimString)
  .transform(lowerString)
  .required('Enter an e-mail address.')
  .max(LIMITS.emailMaxLength, `An e-mail address has at most ${LIMITS.emailMaxLength} characters.`)
  .email('Enter a valid e-mail address.');

/**
 * A new password: at least 8 characters and at most 72 UTF-8 bytes. bcrypt ignores every byte after the 72nd, so a longer
 * password is refused rather than cut short (a cut password would accept other passwords).
 * Never trimmed: spaces are part of a password.
 */
export const newPasswordSchema = string()
  .required('Enter a password.')
  .test(
    'password-min-chars',
    `Use at least ${LIMITS.passwordMinChars} characters.`,
    (value) => value === undefined || [...value].length >= LIMITS.passwordMinChars,
  )
  .test(
    'password-max-bytes',
    `Use at most ${LIMITS.passwordMaxBytes} bytes (fewer when the password has accented letters or symbols).`,
    (value) => value === undefined || utf8ByteLength(value) <= LIMITS.passwordMaxBytes,
  );

/** A password typed to sign in: any length up to the bcrypt limit (no minimum: old rules may differ). */
export const currentPasswordSchema = string()
  .required('Enter your password.')
  .test(
    'password-max-bytes',
    'Incorrect e-mail or password.',
    (value) => value === undefined || utf8ByteLength(value) <= LIMITS.passwordMaxBytes,
  );

export const personNameSchema = string()
  .transform(trimString)
  .required('Enter your name.')
  .max(LIMITS.personNameMaxLength, `A name has at most ${LIMITS.personNameMaxLength} characters.`);

/** An e-mailed token (reset or invitation). */
export const emailTokenSchema = string()
  .transform(trimString)
  .required('The link is missing its token.')
  .max(LIMITS.tokenMaxLength, 'This link is not valid.');

export const signupSchema = object({
  firmName: string()
    .transform(trimString)
    .required('Enter the name of your firm.')
    .max(
      LIMITS.firmNameMaxLength,
      `A firm name has at most ${LIMITS.firmNameMaxLength} characters.`,
    ),
  name: personNameSchema,
  email: emailSchema,
  password: newPasswordSchema,
});
export type SignupInput = InferType<typeof signupSchema>;

export const loginSchema = object({
  email: emailSchema,
  password: currentPasswordSchema,
});
export type LoginInput = InferType<typeof loginSchema>;

export const forgotPasswordSchema = object({
  email: emailSchema,
});
export type ForgotPasswordInput = InferType<typeof forgotPasswordSchema>;

export const resetPasswordSchema = object({
  token: emailTokenSchema,
  password: newPasswordSchema,
});
export type ResetPasswordInput = InferType<typeof resetPasswordSchema>;

/** POST /auth/signup/confirm: the token of the e-mailed link that finishes a sign-up. */
export const confirmSignupSchema = object({
  token: emailTokenSchema,
});
export type ConfirmSignupInput = InferType<typeof confirmSignupSchema>;

export const acceptInvitationSchema = object({
  token: emailTokenSchema,
  name: personNameSchema,
  password: newPasswordSchema,
});
export type AcceptInvitationInput = InferType<typeof acceptInvitationSchema>;

/** PATCH /auth/me: what a member may change of their own profile. */
export const profileUpdateSchema = object({
  name: personNameSchema,
});
export type ProfileUpdateInput = InferType<typeof profileUpdateSchema>;

/** POST /auth/change-password: the current password, then the new one. */
export const changePasswordSchema = object({
  currentPassword: currentPasswordSchema,
  newPassword: newPasswordSchema,
});
export type ChangePasswordInput = InferType<typeof changePasswordSchema>;

// Glue between vee-validate and ant-design-vue form items, shared by every form.
import type { PublicPathState } from 'vee-validate';
import { ApiError } from '@/api/client';

/**
 * Validate a field when it loses focus; once it shows an error, re-check it as the user types
 * so the message clears as soon as the value is right.
 */
export function lazyField(state: Pick<PublicPathState, 'errors'>) {
  const live = state.errors.length > 0;
  return { validateOnBlur: true, validateOnChange: live, validateOnInput: live, validateOnModelUpdate: live };
}

/** Props for `a-form-item` from one field's error message. */
export function itemStatus(error: string | undefined): { validateStatus?: 'error'; help?: string } {
  return error ? { validateStatus: 'error', help: error } : {};
}

/**
 * Puts a server 422's field messages on the form. Returns the message to show above the form
 * for anything that is not a field error (or null when every detail landed on a field).
 */
export function applyServerErrors(
  error: unknown,
  setErrors: (errors: Record<string, string>) => void,
  fields: readonly string[],
): string | null {
  if (error instanceof ApiError && error.details) {
    const onFields: Record<string, string> = {};
    const rest: string[] = [];
    for (const [path, message] of Object.entries(error.details)) {
      if (fields.includes(path)) onFields[path] = message;
      else rest.push(message);
    }
    setErrors(onFields);
    if (rest.length > 0) return rest.join(' ');
    return Object.keys(onFields).length > 0 ? null : error.message;
  }
  if (error instanceof ApiError) return error.message;
  return 'Something went wrong. Please try again.';
}

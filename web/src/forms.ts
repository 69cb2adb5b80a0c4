// Glue between vee-validate and ant-design-vue form items, shared by every form.
import { inject, provide, type InjectionKey, type Ref } from 'vue';
import type { PublicPathState, TypedSchema, TypedSchemaError } from 'vee-validate';
import { ValidationError, type Schema } from 'yup';
import type { UnitSystem } from '@basinwright/common';
import { ApiError } from '@/api/client';

/** What a form's number fields (AppNumberField) share: values, messages, units, and how to name them. */
export interface NumberFormContext {
  values: object;
  errors: Ref<Partial<Record<string, string | undefined>>>;
  setFieldValue: (path: string, value: unknown) => void;
  units: Ref<UnitSystem>;
  readOnly?: Ref<boolean>;
  /** the inputs' ids are `${idPrefix}-${path}` and their data-test `${testPrefix}-${path}` */
  idPrefix: string;
  testPrefix: string;
}

const NUMBER_FORM_KEY: InjectionKey<NumberFormContext> = Symbol('number-form');

export function provideNumberForm(ctx: NumberFormContext): void {
  provide(NUMBER_FORM_KEY, ctx);
}

export function useNumberForm(): NumberFormContext {
  const ctx = inject(NUMBER_FORM_KEY);
  if (!ctx)
    throw new Error('A number field needs a form that provides its context (provideNumberForm)');
  return ctx;
}

/** Reads a path ("inflow.headwater.C", "rows[2].Q") from a form's values. */
export function getPath(obj: unknown, path: string): unknown {
  let node: unknown = obj;
  for (const key of path.replace(/\[(\d+)\]/g, '.$1').split('.')) {
    if (node === null || typeof node !== 'object') return undefined;
    node = (node as Record<string, unknown>)[key];
  }
  return node;
}

/**
 * Validate a field when it loses focus; once it shows an error, re-check it as the user types
 * so the message clears as soon as the value is right.
 */
export function lazyField(state: Pick<PublicPathState, 'errors'>) {
  const live = state.errors.length > 0;
  return {
    validateOnBlur: true,
    validateOnChange: live,
    validateOnInput: live,
    validateOnModelUpdate: live,
  };
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

/**
 * A shared yup schema for a form whose fields are not the shape the schema checks (percentages
 * typed where the schema reads fractions, fields flattened): `toShared` turns the form's values
 * into what the schema reads, and each message lands on the field `fieldOf` names for the
 * schema's path. The schema's own messages are shown; the form's values stay as typed.
 */
export function sharedSchemaVia<TForm extends object, TShared>(
  schema: Schema<TShared>,
  toShared: (values: TForm) => unknown,
  fieldOf: (schemaPath: string) => string,
): TypedSchema<TForm, TShared> {
  return {
    __type: 'VVTypedSchema',
    async parse(values) {
      try {
        const value = await schema.validate(toShared(values), { abortEarly: false });
        return { value, errors: [] };
      } catch (e) {
        if (!(e instanceof ValidationError)) throw e;
        const byField = new Map<string, string[]>();
        for (const one of e.inner.length > 0 ? e.inner : [e]) {
          const field = fieldOf(one.path ?? '');
          byField.set(field, [...(byField.get(field) ?? []), ...one.errors]);
        }
        const errors: TypedSchemaError[] = [...byField].map(([path, errs]) => ({
          path,
          errors: errs,
        }));
        return { errors };
      }
    },
  };
}

/**
 * The first message of the shared schema for each of `fields` (absent when the field is right),
 * for a form in plain markup with no form library (the sign-in page: see DEVELOPERS.md).
 */
export async function schemaErrors<F extends string>(
  schema: Schema,
  values: Record<F, unknown>,
  fields: readonly F[],
): Promise<Partial<Record<F, string>>> {
  const found: Partial<Record<F, string>> = {};
  try {
    await schema.validate(values, { abortEarly: false });
  } catch (e) {
    if (!(e instanceof ValidationError)) throw e;
    for (const one of e.inner.length > 0 ? e.inner : [e]) {
      const field = fields.find((f) => f === one.path);
      if (field !== undefined && found[field] === undefined) found[field] = one.errors[0];
    }
  }
  return found;
}

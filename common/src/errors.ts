// The engine's refusal of impossible input: a RangeError (so existing `instanceof RangeError`
// handling keeps working) that names the input field and a stable code, so the edges (web, API)
// never read the sentence back. The sentence is for logs and developers; messages/ phrases it.

/** Stable codes of the engine's input refusals. */
export type InputErrorCode =
  | 'not-finite'
  | 'not-positive'
  | 'negative'
  | 'out-of-range'
  | 'invalid'
  | 'units-not-si'
  | 'below-bed'
  | 'far-from-bed'
  | 'supercritical-tailwater'
  | 'gate-opening-too-large'
  | 'gate-pool-too-shallow'
  | 'above-energy-line'
  | 'not-supercritical'
  | 'no-floor'
  | 'unknown-option'
  | 'missing'
  | 'too-small'
  | 'not-above'
  | 'conduit-full'
  | 'conduit-too-small'
  | 'conduit-capacity'
  | 'energy-too-low'
  | 'head-too-small'
  | 'gate-not-controlling'
  | 'needs-rectangular'
  | 'table-too-short'
  | 'table-not-increasing'
  | 'not-steep'
  | 'not-mild'
  | 'not-subcritical'
  | 'steep-no-jump'
  | 'no-normal-depth'
  | 'uniform-flow'
  | 'not-backwater'
  | 'too-many-blocks'
  | 'too-many-rows'
  | 'slab-cannot-hold';

/** An input the engine refuses: `field` is its path in the study input (e.g. `inflow.opening`). */
export class InputError extends RangeError {
  readonly field: string;
  readonly code: InputErrorCode;
  /** SI quantities the refusal quotes (e.g. { Q: 5 }), for the phraser */
  readonly values: Readonly<Record<string, number>>;
  constructor(
    field: string,
    code: InputErrorCode,
    message: string,
    values: Record<string, number> = {},
    options?: { cause?: unknown },
  ) {
    super(message, options);
    this.name = 'InputError';
    this.field = field;
    this.code = code;
    this.values = values;
  }
}

/** True for an engine input refusal (an InputError). */
export const isInputError = (e: unknown): e is InputError => e instanceof InputError;

/** A refusal as plain data (its field, code and SI quantities): it crosses a thread boundary. */
export interface EngineRefusal {
  field: string;
  code: InputErrorCode;
  values: Record<string, number>;
}

/**
 * Why an engine call gave no answer, as plain data for a Web Worker's message: a coded refusal
 * (phrased where the units are known, by engineFailureText), or an internal failure (an
 * uncoded guard or a bug) whose text is for logs only and never shown.
 */
export type EngineFailure =
  { kind: 'refusal'; refusal: EngineRefusal } | { kind: 'internal'; detail: string };

/** The failure of a caught error, as data. */
export function engineFailure(e: unknown): EngineFailure {
  if (e instanceof InputError)
    return { kind: 'refusal', refusal: { field: e.field, code: e.code, values: { ...e.values } } };
  return { kind: 'internal', detail: e instanceof Error ? `${e.name}: ${e.message}` : String(e) };
}

/**
 * Runs f with `field` as the context of any refusal it throws: a refusal naming a field inside
 * `field` keeps its own; any other RangeError is re-filed under `field`, its sentence prefixed.
 */
export function withField<T>(field: string, f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (!(e instanceof RangeError)) throw e;
    if (e instanceof InputError && e.field.startsWith(field)) throw e;
    if (!(e instanceof InputError) && e.message.startsWith(field)) {
      throw new InputError(field, 'invalid', e.message, {}, { cause: e });
    }
    const code = e instanceof InputError ? e.code : 'invalid';
    const values = e instanceof InputError ? e.values : {};
    throw new InputError(field, code, `${field}: ${e.message}`, { ...values }, { cause: e });
  }
}

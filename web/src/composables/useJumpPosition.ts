// Where the jump forms: the form's situation (in the user's units) → shared schema → SI →
// locateJump, in the browser, after a pause in typing. Nothing is saved and nothing is fetched.
import { inject, provide, watch, type InjectionKey, type Ref } from 'vue';
import { ValidationError } from 'yup';
import {
  convertByKinds,
  engineFailure,
  JUMP_LOCATION_KINDS,
  JUMP_SITUATION_KINDS,
  jumpSituationSchema,
  locateJump,
  type EngineFailure,
  type JumpLocation,
  type JumpSituation,
  type Section,
  type UnitSystem,
} from '@basinwright/common';
import { STUDY_DEBOUNCE_MS, failureText } from '@/composables/useStudy';
import { useLiveResult } from '@/composables/useLive';
import { provideNumberForm } from '@/forms';

export type JumpKind = JumpSituation['kind'];
export type SectionShape = Section['shape'];

/** The page waits as long as the design workspace before it recomputes. */
export const JUMP_DEBOUNCE_MS = STUDY_DEBOUNCE_MS;

/** A situation typed in `units` as the engine takes it (SI). */
export function situationToSI<T>(situation: T, units: UnitSystem): T {
  return convertByKinds(situation, JUMP_SITUATION_KINDS, units, 'toSI');
}

/** An SI situation in `units`, rounded as an engineer would type it (for the form). */
export function situationFromSI<T>(situation: T, units: UnitSystem): T {
  // The one unit map (common/src/units/fields.ts): every number of a situation has a kind there.
  const out = convertByKinds(situation, JUMP_SITUATION_KINDS, units, 'fromSI');
  return tidy(out) as T;
}

/**
 * A converted value to four significant figures, whole digits kept (13.123359580052 ft → 13.12,
 * 423.776 cfs → 423.8): switching units is a change of the case's wording, so it moves the
 * result only in the fourth figure, and the form shows numbers a person would type.
 */
const clean = (v: number): number => {
  if (v === 0) return 0;
  const whole = Math.floor(Math.log10(Math.abs(v))) + 1;
  return Number(v.toPrecision(Math.min(15, Math.max(4, whole + 1))));
};

function tidy(node: unknown): unknown {
  if (typeof node === 'number') return Number.isFinite(node) ? clean(node) : node;
  if (node !== null && typeof node === 'object' && !Array.isArray(node)) {
    return Object.fromEntries(Object.entries(node).map(([k, v]) => [k, tidy(v)]));
  }
  return node;
}

// Starting values: an invented 4 m wide concrete channel carrying 12 m³/s, with each situation
// set up so the page shows a jump at once. Not a real site; the page says to replace them.
const START_SECTIONS: Record<SectionShape, Section> = {
  rectangular: { shape: 'rectangular', width: 4 },
  trapezoidal: { shape: 'trapezoidal', bottomWidth: 4, sideSlope: 1.5 },
  circular: { shape: 'circular', diameter: 3 },
};
const START_Q = 12;
const START_FIELDS: {
  [K in JumpKind]: Omit<Extract<JumpSituation, { kind: K }>, 'kind' | 'section' | 'Q'>;
} = {
  slopeBreak: {
    upstream: { slope: 0.05, manningN: 0.014 },
    downstream: { slope: 0.0008, manningN: 0.014 },
  },
  gateMildSlope: { opening: 0.35, Cc: 0.61, slope: 0.0008, manningN: 0.014 },
  gateSteepSlope: { slope: 0.03, manningN: 0.014, opening: 0.5, Cc: 0.61 },
  weirToMildSlope: { crestHeight: 2.5, slope: 0.0008, manningN: 0.014 },
};

/** A fresh section of a shape, in `units`. */
export function startingSection(shape: SectionShape, units: UnitSystem): Section {
  return situationFromSI({ ...START_SECTIONS[shape] }, units);
}

/** The starting fields of one situation (all but kind, section and Q), in `units`. */
export function startingFields(kind: JumpKind, units: UnitSystem): Record<string, unknown> {
  return situationFromSI(
    JSON.parse(JSON.stringify(START_FIELDS[kind])) as Record<string, unknown>,
    units,
  );
}

/** A depth above a gate on a steep slope that backs the water up far enough for a jump. */
export function startingUpstreamDepth(units: UnitSystem): number {
  return situationFromSI({ upstreamDepth: 2.5 }, units).upstreamDepth;
}

/** The whole starting example of one situation, in `units`. */
export function startingSituation(kind: JumpKind, units: UnitSystem): JumpSituation {
  const base = situationFromSI({ section: START_SECTIONS.rectangular, Q: START_Q }, units);
  return { kind, ...base, ...startingFields(kind, units) } as JumpSituation;
}

/** The lead of a refusal on the jump-position page. */
export const JUMP_FAILURE_LEAD = 'The jump position cannot be worked out with these inputs.';

export interface JumpOutcome {
  /** the engine's answer, SI */
  location: JumpLocation | null;
  /** the situation the engine ran on, SI */
  situation: JumpSituation | null;
  /** why the engine gave no answer, as data (phrased by failureText in the user's units) */
  failure: EngineFailure | null;
  /** the failure's sentence in the user's units, with the page's lead */
  engineError: string | null;
  /** schema messages while the form is incomplete or out of range */
  inputProblems: string[];
}

function finiteLocation(r: JumpLocation): boolean {
  const nums = [r.distance, r.yToe, r.ySequent, r.criticalDepth];
  const pts = [...r.supercriticalProfile, ...r.subcriticalProfile];
  return (
    nums.every(Number.isFinite) && pts.every((p) => Number.isFinite(p.x) && Number.isFinite(p.y))
  );
}

/** One evaluation, no debounce: schema (user's units) → SI → locateJump. Never throws. */
export function evaluateJumpPosition(raw: unknown, units: UnitSystem): JumpOutcome {
  let typed: JumpSituation;
  try {
    typed = jumpSituationSchema.validateSync(raw, { abortEarly: false, stripUnknown: true });
  } catch (e) {
    if (e instanceof ValidationError)
      return {
        location: null,
        situation: null,
        failure: null,
        engineError: null,
        inputProblems: [...new Set(e.errors)],
      };
    return refused(engineFailure(e), units);
  }
  try {
    const si = situationToSI(typed, units);
    const location = locateJump(si);
    if (!finiteLocation(location))
      return refused({ kind: 'internal', detail: 'locateJump gave no finite answer' }, units);
    return { location, situation: si, failure: null, engineError: null, inputProblems: [] };
  } catch (e) {
    return refused(engineFailure(e), units);
  }
}

function refused(failure: EngineFailure, units: UnitSystem): JumpOutcome {
  return {
    location: null,
    situation: null,
    failure,
    engineError: failureText(failure, units, JUMP_FAILURE_LEAD),
    inputProblems: [],
  };
}

/**
 * Runs `evaluateJumpPosition` on `source` whenever it or the units change, after a pause in
 * typing. The last good answer stays on the page (marked stale) while the input is refused.
 */
export function useJumpPosition(
  source: Ref<unknown>,
  units: Ref<UnitSystem>,
  debounceMs = JUMP_DEBOUNCE_MS,
) {
  const live = useLiveResult<JumpLocation>(() => {
    const out = evaluateJumpPosition(source.value, units.value);
    return { value: out.location, engineError: out.engineError, inputProblems: out.inputProblems };
  }, debounceMs);
  watch(source, live.schedule, { deep: true });
  const { value: location, engineError, inputProblems, stale, pending, runNow } = live;
  return { location, engineError, inputProblems, stale, pending, runNow };
}

/** What the form's fields share: values, errors and the units of the numbers typed. */
export interface JumpFormContext {
  values: JumpSituation;
  errors: Ref<Partial<Record<string, string | undefined>>>;
  setFieldValue: (path: string, value: unknown) => void;
  /** puts a whole new situation on the form (another kind, or the units switched) */
  replace: (values: JumpSituation) => void;
  units: Ref<UnitSystem>;
}

const FORM_KEY: InjectionKey<JumpFormContext> = Symbol('jump-position-form');

export function provideJumpForm(ctx: JumpFormContext): void {
  provide(FORM_KEY, ctx);
  provideNumberForm({ ...ctx, idPrefix: 'jump', testPrefix: 'jump-field' });
}

export function useJumpForm(): JumpFormContext {
  const ctx = inject(FORM_KEY);
  if (!ctx) throw new Error('useJumpForm needs the jump position page around it');
  return ctx;
}

/** The chart's lines in the user's units: [x, y] pairs, x positive downstream of the control. */
export interface JumpChartLines {
  supercritical: Array<[number, number]>;
  subcritical: Array<[number, number]>;
  critical: Array<[number, number]>;
  /** a vertical line at the jump toe, from the bed to above the deeper profile */
  toe: Array<[number, number]>;
  /** x of the toe, user's units */
  toeX: number;
}

/** At most about `max` points of a profile, the ends kept (the step method gives ~800). */
function thin(
  points: readonly { x: number; y: number }[],
  max = 240,
): Array<{ x: number; y: number }> {
  if (points.length <= max) return [...points];
  const step = Math.ceil(points.length / max);
  const out = points.filter((_, i) => i % step === 0);
  const last = points[points.length - 1]!;
  if (out[out.length - 1] !== last) out.push(last);
  return out;
}

/** The profiles, the critical depth and the toe of a JumpLocation (SI) for plotting in `units`. */
export function jumpChartLines(location: JumpLocation, units: UnitSystem): JumpChartLines {
  // Every number of the answer in the user's units by the one unit map (JUMP_LOCATION_KINDS).
  const shown = convertByKinds(location, JUMP_LOCATION_KINDS, units, 'fromSI');
  const pair = (p: { x: number; y: number }): [number, number] => [p.x, p.y];
  const sup = thin(shown.supercriticalProfile).map(pair);
  const sub = thin(shown.subcriticalProfile).map(pair);
  // Upstream jumps stand at negative x (the engine's profiles run from upstream to the control).
  const toeX =
    shown.position === 'downstream'
      ? shown.distance
      : shown.position === 'upstream'
        ? -shown.distance
        : 0;
  const yc = shown.criticalDepth;
  const xs = [...sup, ...sub].map((p) => p[0]);
  const ys = [...sup, ...sub].map((p) => p[1]);
  const xMin = Math.min(...xs, toeX);
  const xMax = Math.max(...xs, toeX);
  const top = Math.max(...ys, yc) * 1.1;
  return {
    supercritical: sup,
    subcritical: sub,
    critical: [
      [xMin, yc],
      [xMax, yc],
    ],
    toe: [
      [toeX, 0],
      [toeX, top],
    ],
    toeX,
  };
}

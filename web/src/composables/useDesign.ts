// The design of one project: load, save, busy state and errors; the starting input of a new
// design; the form's shared context for the step components. CSV tables for
// ratings: csvTable.ts.
import { computed, inject, provide, ref, watch, type InjectionKey, type Ref } from 'vue';
import { ValidationError } from 'yup';
import {
  BASIN_DEFAULTS,
  BASIN_DEFAULT_PROVENANCE,
  PUBLISHED_FIGURES,
  type PublishedFigure,
  UNIT_LABELS,
  dissipatorOptionsSchema,
  fromSIValue,
  inputFromSI,
  toSI,
  type Assumption,
  type BasinDefaultKey,
  type Confidence,
  type DissipatorStudyOptions,
  type QuantityKind,
  type StudyInput,
  type UnitSystem,
} from '@basinwright/common';
import { provideNumberForm } from '@/forms';
import { designsApi, type Design, type DesignOptions } from '@/api/designs';
import { projectsApi } from '@/api/projects';
import type { Project } from '@/api/types';
import { takePrefetched } from '@/api/prefetch';
import { useResource } from '@/composables/useResource';

/**
 * Where a new design starts: a plausible small spillway outlet, not the demo scenario. Written
 * once, in SI; the US starting values are the same outlet converted and rounded to two
 * significant figures (round numbers to replace, not exact conversions). The page labels them as
 * starting values.
 */
const STARTING_SI: StudyInput = {
  units: 'SI',
  channelBedElevation: 100,
  basinWidth: 10,
  designDischarge: 50,
  discharges: { kind: 'range', min: 5, max: 50, count: 10 },
  tailwater: {
    kind: 'manning',
    section: { shape: 'trapezoidal', bottomWidth: 12, sideSlope: 2 },
    slope: 0.001,
    manningN: 0.035,
  },
  inflow: {
    kind: 'chute',
    crestElevation: 110,
    headwater: { kind: 'weir', C: 2.1, L: 10 },
    lossModel: { kind: 'fraction', value: 0.1 },
  },
};

/** Two significant figures, for starting values typed by nobody. */
const roundStart = (v: number): number => Number(v.toPrecision(2));

/** The starting input of a new design, in the project's units. */
export function startingInput(units: UnitSystem): StudyInput {
  const start = structuredClone(STARTING_SI);
  if (units === 'SI') return start;
  // Counts, ratios, slopes and Manning's n come back unchanged from the conversion.
  return { ...mapNumbers(inputFromSI(start, 'US'), roundStart), units: 'US' };
}

/** Drops float noise from a unit conversion (e.g. 295.27559055118104 ft → 295.2755905512). */
export const clean = (v: number): number => Number(v.toPrecision(10));

/** `round` on every finite number of a JSON-like value. */
function mapNumbers<T>(node: T, round: (v: number) => number): T {
  if (typeof node === 'number') return (Number.isFinite(node) ? round(node) : node) as T;
  if (Array.isArray(node)) return node.map((v: unknown) => mapNumbers(v, round)) as T;
  if (node !== null && typeof node === 'object') {
    return Object.fromEntries(Object.entries(node).map(([k, v]) => [k, mapNumbers(v, round)])) as T;
  }
  return node;
}

/** `clean` on every number of a unit round trip. */
const tidy = <T>(node: T): T => mapNumbers(node, clean);

/**
 * A saved input as the form shows it, in the project's units. The API keeps the input in the
 * units it names (and converts with toSI itself); when the project's units changed since, the
 * numbers go through SI into the new system.
 */
export function inputForForm(saved: StudyInput, units: UnitSystem): StudyInput {
  if (saved.units === units) return tidy(saved);
  return { ...tidy(inputFromSI(toSI(saved), units)), units };
}

/**
 * The form's starting values from a saved design: the input in the project's units, with the
 * chosen basin type inside `input.dissipators`. Designs saved before the type moved there kept
 * it in `options.chosenType`: that is still read (the input's own choice wins).
 */
export function designFormValues(
  saved: StudyInput | null,
  options: DesignOptions | null,
  units: UnitSystem,
): StudyInput {
  const input = saved ? inputForForm(saved, units) : startingInput(units);
  const legacy = options?.chosenType;
  if (input.dissipators?.chosenType !== undefined || legacy === undefined) return input;
  return { ...input, dissipators: { ...(input.dissipators ?? {}), chosenType: legacy } };
}

/** The SI input the engine takes, from the form's values in the user's units. */
export function inputForEngine(values: StudyInput): StudyInput {
  return toSI(values);
}

/** One project and its design. */
export function useDesign(projectId: Ref<string>) {
  const { data, busy, error, reload } = useResource<{ project: Project; design: Design } | null>(
    async (signal) => {
      const id = projectId.value;
      // The router started both reads while this view's code loaded (api/prefetch.ts).
      const [p, d] = await Promise.all([
        takePrefetched<Project>(`project:${id}`) ?? projectsApi.get(id, signal),
        takePrefetched<Design>(`design:${id}`) ?? designsApi.get(id, signal),
      ]);
      return { project: p, design: d };
    },
    { initial: null, what: 'the design' },
  );
  const project = computed(() => data.value?.project ?? null);
  const design = computed(() => data.value?.design ?? null);
  const saving = ref(false);

  /** Saves the form's values (in the project's units); throws ApiError so the form can show it. */
  async function save(
    values: StudyInput,
    options: DesignOptions,
    /** the revision to save on top of (the server's current copy's, when saving over it on purpose) */
    basedOn?: number | null,
  ): Promise<Design> {
    saving.value = true;
    try {
      // Based on the copy we loaded: a save by someone else since is refused (409, staleCopyOf).
      const revision = basedOn !== undefined ? basedOn : (data.value?.design.revision ?? null);
      const saved = await designsApi.save(projectId.value, { input: values, options, revision });
      if (data.value) data.value = { ...data.value, design: saved };
      return saved;
    } finally {
      saving.value = false;
    }
  }

  /** Takes the server's current copy as ours (after a refused save: reload theirs). */
  function adopt(current: Design): void {
    if (data.value) data.value = { ...data.value, design: current };
  }

  watch(projectId, () => void reload(), { immediate: true });

  return { project, design, busy, saving, error, reload, save, adopt };
}

/** What the step components share with the workspace: values, errors, edit rights, units. */
export interface DesignFormContext {
  values: StudyInput;
  errors: Ref<Partial<Record<string, string | undefined>>>;
  setFieldValue: (path: string, value: unknown) => void;
  readOnly: Ref<boolean>;
  units: Ref<UnitSystem>;
}

const FORM_KEY: InjectionKey<DesignFormContext> = Symbol('design-form');

export function provideDesignForm(ctx: DesignFormContext): void {
  provide(FORM_KEY, ctx);
  provideNumberForm({ ...ctx, idPrefix: 'design', testPrefix: 'field' });
}

export function useDesignForm(): DesignFormContext {
  const ctx = inject(FORM_KEY);
  if (!ctx) throw new Error('useDesignForm needs the design workspace around it');
  return ctx;
}

// ---- Assumptions: the dissipator defaults in force, in the user's units, and their overrides ----

/** The quantity an assumption's SI unit label stands for (null: a ratio or a count). */
export function assumptionKind(unit: string): QuantityKind | null {
  if (unit === '-' || unit === '°') return null;
  const kinds = Object.keys(UNIT_LABELS) as QuantityKind[];
  return kinds.find((k) => UNIT_LABELS[k].SI === unit) ?? null;
}

/**
 * Two defaults are also fields of the flotation case (DesignOptions.flotation), which the
 * engine prefers when given: the panel edits them there so there is one place for each.
 */
export const FLOTATION_FIELDS: Partial<Record<BasinDefaultKey, 'safetyFactor' | 'minThickness'>> = {
  flotationSafetyFactor: 'safetyFactor',
  minSlabThickness: 'minThickness',
};

/** One row of the assumptions table, every number in the user's units. */
export interface AssumptionRow {
  key: BasinDefaultKey;
  label: string;
  source: string;
  confidence: Confidence;
  /** unit label in the user's system ('' for ratios and counts) */
  unit: string;
  kind: QuantityKind | null;
  /** the value in force (the engine's when a result is given) */
  value: number;
  defaultValue: number;
  overridden: boolean;
  /** form path of the override, under the study input */
  path: string;
}

/**
 * Every dissipator default as a row: label, source, confidence, the value in force in the
 * user's units and whether the engineer changed it. `assumptions` are the engine's (SI, from
 * result.dissipators.assumptions); without them (no result yet) the form's overrides stand in.
 */
export function assumptionRows(
  dissipators: DissipatorStudyOptions | undefined,
  units: UnitSystem,
  assumptions?: readonly Assumption[] | null,
): AssumptionRow[] {
  const byKey = new Map((assumptions ?? []).map((a) => [a.key, a]));
  return (Object.keys(BASIN_DEFAULTS) as BasinDefaultKey[]).map((key) => {
    const p = BASIN_DEFAULT_PROVENANCE[key];
    const kind = assumptionKind(p.unit);
    const show = (si: number): number => clean(kind ? fromSIValue(si, kind, units) : si);
    const flo = FLOTATION_FIELDS[key];
    const typedFlotation = flo ? dissipators?.flotation?.[flo] : undefined;
    const typedDefault = dissipators?.defaults?.[key];
    const typed = typedFlotation ?? typedDefault;
    const engine = byKey.get(key);
    // A default published in US units is shown exactly as published in a US project (50 ft/s).
    const published = (PUBLISHED_FIGURES as Partial<Record<BasinDefaultKey, PublishedFigure>>)[key];
    const defaultValue =
      published && published.units === units ? published.value : show(BASIN_DEFAULTS[key]);
    // The flotation case's value is what the engine uses, not the listed default.
    const value =
      typeof typed === 'number' && Number.isFinite(typed)
        ? typed
        : engine && engine.value !== BASIN_DEFAULTS[key]
          ? show(engine.value)
          : defaultValue;
    return {
      key,
      label: p.label,
      source: p.source,
      confidence: p.confidence,
      unit: kind ? UNIT_LABELS[kind][units] : p.unit === '°' ? '°' : '',
      kind,
      value,
      defaultValue,
      overridden: typed !== undefined,
      path: flo ? `dissipators.flotation.${flo}` : `dissipators.defaults.${key}`,
    };
  });
}

/**
 * The dissipator options with one default overridden (`value`, in the user's units) or, when
 * `value` is undefined, back to its default (the key removed, not left undefined: the schema
 * takes an override as a number). Never mutates `dissipators`.
 */
export function withOverride(
  dissipators: DissipatorStudyOptions | undefined,
  key: BasinDefaultKey,
  value: number | undefined,
): DissipatorStudyOptions {
  const out: DissipatorStudyOptions = { ...(dissipators ?? {}) };
  const flo = FLOTATION_FIELDS[key];
  if (flo) {
    const f = { ...(out.flotation ?? {}) };
    delete f[flo];
    if (value !== undefined) f[flo] = value;
    if (Object.keys(f).length > 0) out.flotation = f;
    else delete out.flotation;
    // An older override of the same default would hide behind the flotation field: drop it.
    if (out.defaults && key in out.defaults) {
      const rest = { ...out.defaults };
      delete rest[key];
      out.defaults = rest;
    }
  } else {
    const defaults = { ...(out.defaults ?? {}) };
    delete defaults[key];
    if (value !== undefined) defaults[key] = value;
    out.defaults = defaults;
  }
  if (out.defaults && Object.keys(out.defaults).length === 0) delete out.defaults;
  return out;
}

/**
 * Why an override (in the user's units) would be refused, in the shared schema's words, or
 * null when the schema takes it. Bounds are the engine schema's (dissipatorOptionsSchema).
 */
export function overrideProblem(key: BasinDefaultKey, value: number | undefined): string | null {
  if (value === undefined) return null;
  try {
    dissipatorOptionsSchema.validateSync(withOverride({}, key, value), { abortEarly: true });
    return null;
  } catch (e) {
    if (e instanceof ValidationError) return e.errors[0] ?? e.message;
    throw e;
  }
}

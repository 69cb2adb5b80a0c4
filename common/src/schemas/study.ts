// Shared yup schemas for the engine's requests: the jump calculator and the whole study.
// Numbers are in the units named by `units` (the engine converts with toSI); limits here
// only reject what can never be a valid problem — the engine's RangeErrors cover physics.
import {
  array,
  boolean,
  lazy,
  mixed,
  number,
  object,
  string,
  type ISchema,
  type Lazy,
  type ObjectSchema,
  type Schema,
} from 'yup';
import type { Section } from '../hydraulics/sections';
import type { JumpSituation } from '../hydraulics/profiles';
import type { KnownToe, LossModel } from '../hydraulics/inflow';
import type { TailwaterSpec } from '../hydraulics/tailwater';
import { DISSIPATOR_IDS } from '../basins/names';
import { BASIN_DEFAULTS, BASIN_DEFAULT_PROVENANCE } from '../basins/defaults';
import type { DischargeSpec, HeadwaterSpec, StudyInflow, StudyInput } from '../range/types';
import { CHUTE_SLOPE_RANGE, ENGINE_LIMITS } from './limits';

/** Discharges one study may analyse (ENGINE_LIMITS.maxDischarges, the reason there). */
export const MAX_STUDY_DISCHARGES = ENGINE_LIMITS.maxDischarges;
const MAX_TABLE_ROWS = ENGINE_LIMITS.maxTableRows;
const { manningN: N_RANGE, contractionCoefficient: CC_RANGE } = ENGINE_LIMITS;

const cap = (s: string): string => s.charAt(0).toUpperCase() + s.slice(1);
const num = (label: string) =>
  number()
    .typeError(`${cap(label)} must be a number.`)
    .test(
      'finite',
      `${cap(label)} must be a finite number.`,
      (v) => v === undefined || Number.isFinite(v),
    );
const positive = (label: string) =>
  num(label)
    .positive(`${cap(label)} must be greater than zero.`)
    .required(`Enter ${label}.`);
const nonNegative = (label: string) =>
  num(label)
    .min(0, `${cap(label)} must not be negative.`)
    .required(`Enter ${label}.`);
const elevation = (label: string) => num(label).required(`Enter ${label}.`);

/** One schema per kind of a union discriminated by `F`, each giving exactly its member. */
type Variants<U extends Record<F, string>, F extends string> = {
  [K in U[F]]: ISchema<Extract<U, Record<F, K>>>;
};

/** The schema of `value`'s kind, or one that refuses it saying which kinds there are. */
function pickKind<U extends Record<F, string>, F extends string>(
  field: F,
  label: string,
  schemas: Variants<U, F>,
  value: unknown,
): ISchema<U> {
  const kinds = Object.keys(schemas);
  const kind =
    value !== null && typeof value === 'object'
      ? (value as Record<string, unknown>)[field]
      : undefined;
  if (typeof kind === 'string' && kinds.includes(kind)) return schemas[kind as U[F]];
  return mixed<U>()
    .required(`Enter ${label}.`)
    .test('kind', (v, ctx) => {
      if (v === null || typeof v !== 'object')
        return ctx.createError({ message: `Enter ${label}.` });
      const at = ctx.path ? `${ctx.path}.${field}` : field;
      const k = (v as Record<string, unknown>)[field];
      return ctx.createError({
        path: at,
        message:
          k === undefined || k === null || k === ''
            ? `Choose ${label}.`
            : `${cap(label)} must be one of: ${kinds.join(', ')}.`,
      });
    });
}

/** A choice among the kinds of a discriminated union, each kind with its own schema. */
function byKind<U extends Record<F, string>, F extends string>(
  field: F,
  label: string,
  schemas: Variants<U, F>,
): Lazy<U> {
  return lazy((value: unknown) => pickKind(field, label, schemas, value));
}

/** The same, for a choice that may be left out altogether (the engine then takes its default). */
function optionalByKind<U extends Record<F, string>, F extends string>(
  field: F,
  label: string,
  schemas: Variants<U, F>,
): Lazy<U | undefined> {
  return lazy((value: unknown): ISchema<U | undefined> =>
    value === undefined ? mixed<U>().optional() : pickKind(field, label, schemas, value),
  );
}

export const sectionSchema = byKind<Section, 'shape'>('shape', 'the section shape', {
  rectangular: object({ shape: string<'rectangular'>().required(), width: positive('the width') }),
  trapezoidal: object({
    shape: string<'trapezoidal'>().required(),
    bottomWidth: nonNegative('the bottom width'),
    sideSlope: nonNegative('the side slope'),
  }).test(
    'not-degenerate',
    'A trapezoid needs a bottom width or a side slope greater than zero.',
    (v) => !v || v.bottomWidth > 0 || v.sideSlope > 0,
  ),
  circular: object({ shape: string<'circular'>().required(), diameter: positive('the diameter') }),
});

/** POST /calc/jump: section, Q and y1, SI. */
export const jumpRequestSchema = object({
  section: sectionSchema,
  Q: positive('the discharge Q'),
  y1: positive('the depth y1'),
  lengthMethod: string().oneOf(['usbr', 'hager'], 'lengthMethod must be usbr or hager.').optional(),
});

const reach = (label: string) =>
  object({
    slope: num(`the ${label} slope`)
      .min(0, `The ${label} slope must not be negative.`)
      .max(1, `The ${label} slope must not exceed 1 (45°).`)
      .required(`Enter the ${label} slope.`),
    manningN: num(`the ${label} Manning's n`)
      .min(N_RANGE.min, `Manning's n must be at least ${N_RANGE.min}.`)
      .max(N_RANGE.max, `Manning's n must not exceed ${N_RANGE.max}.`)
      .required(`Enter the ${label} Manning's n.`),
  }).required(`Enter the ${label} reach.`);
const slope = num('the bed slope')
  .min(0, 'The bed slope must not be negative.')
  .max(1, 'The bed slope must not exceed 1 (45°).')
  .required('Enter the bed slope.');
const manningN = num("Manning's n")
  .min(N_RANGE.min, `Manning's n must be at least ${N_RANGE.min}.`)
  .max(N_RANGE.max, `Manning's n must not exceed ${N_RANGE.max}.`)
  .required("Enter Manning's n.");
const optionalPositive = (label: string) =>
  num(label)
    .positive(`${cap(label)} must be greater than zero.`)
    .optional();

/** POST /calc/jump-position: where the jump forms below a control, SI. */
const jumpSituationChoice: Lazy<JumpSituation> = byKind<JumpSituation, 'kind'>(
  'kind',
  'the situation',
  {
    slopeBreak: object({
      kind: string<'slopeBreak'>().required(),
      section: sectionSchema,
      Q: positive('the discharge Q'),
      upstream: reach('upstream'),
      downstream: reach('downstream'),
      tailwaterDepth: optionalPositive('the tailwater depth'),
    }),
    gateMildSlope: object({
      kind: string<'gateMildSlope'>().required(),
      section: sectionSchema,
      Q: positive('the discharge Q'),
      opening: positive('the gate opening'),
      Cc: num('the contraction coefficient')
        .min(CC_RANGE.min, `The contraction coefficient must be at least ${CC_RANGE.min}.`)
        .max(CC_RANGE.max, `The contraction coefficient must not exceed ${CC_RANGE.max}.`)
        .required('Enter the contraction coefficient.'),
      slope,
      manningN,
      tailwaterDepth: optionalPositive('the tailwater depth'),
    }),
    gateSteepSlope: object({
      kind: string<'gateSteepSlope'>().required(),
      section: sectionSchema,
      Q: positive('the discharge Q'),
      slope,
      manningN,
      upstreamDepth: optionalPositive('the depth upstream of the gate'),
      opening: optionalPositive('the gate opening'),
      Cc: num('the contraction coefficient')
        .min(CC_RANGE.min, `The contraction coefficient must be at least ${CC_RANGE.min}.`)
        .max(CC_RANGE.max, `The contraction coefficient must not exceed ${CC_RANGE.max}.`)
        .optional(),
    }),
    weirToMildSlope: object({
      kind: string<'weirToMildSlope'>().required(),
      section: sectionSchema,
      Q: positive('the discharge Q'),
      crestHeight: positive('the crest height'),
      lossFraction: num('the loss fraction')
        .min(0, 'The loss fraction must not be negative.')
        .max(0.9, 'The loss fraction must not exceed 0.9.')
        .optional(),
      slope,
      manningN,
      tailwaterDepth: optionalPositive('the tailwater depth'),
    }),
  },
);
/**
 * The same choice typed as a yup Schema, for the form library (vee-validate's toTypedSchema
 * takes no Lazy). Its output type is checked by the compiler above (Lazy<JumpSituation>); this
 * only names the class of the schema.
 */
export const jumpSituationSchema = jumpSituationChoice as unknown as Schema<JumpSituation>;

const LOSS_MODELS = {
  none: object({ kind: string<'none'>().required() }),
  fraction: object({
    kind: string<'fraction'>().required(),
    value: num('the loss fraction')
      .min(0, 'The loss fraction must not be negative.')
      .max(0.95, 'The loss fraction must be below 0.95.')
      .required('Enter the loss fraction.'),
  }),
  velocityCoefficient: object({
    kind: string<'velocityCoefficient'>().required(),
    Cv: num('Cv')
      .min(0.1, 'Cv must be at least 0.1.')
      .max(1, 'Cv must not exceed 1.')
      .required('Enter Cv.'),
  }),
  lossCoefficient: object({
    kind: string<'lossCoefficient'>().required(),
    K: nonNegative('the loss coefficient K'),
  }),
};

const lossModelSchema = byKind<LossModel, 'kind'>('kind', 'the loss allowance', LOSS_MODELS);
// Where the loss allowance may be left out (the engine then takes its default).
const lossModelOptional = optionalByKind<LossModel, 'kind'>(
  'kind',
  'the loss allowance',
  LOSS_MODELS,
);

const qElevationRows = (label: string) =>
  array(object({ Q: positive('Q'), elevation: elevation('the elevation') }))
    .min(2, `The ${label} needs at least two rows.`)
    .max(MAX_TABLE_ROWS, `The ${label} has at most ${MAX_TABLE_ROWS} rows.`)
    .test(
      'increasing',
      `Discharges in the ${label} must increase from row to row.`,
      (rows) => !rows || rows.every((r, i) => i === 0 || r.Q > rows[i - 1]!.Q),
    )
    .required(`Enter the ${label}.`);

const manningChannel = {
  section: sectionSchema,
  slope: positive('the channel slope'),
  manningN: num("Manning's n")
    .min(N_RANGE.min, `Manning's n must be at least ${N_RANGE.min}.`)
    .max(N_RANGE.max, `Manning's n must not exceed ${N_RANGE.max}.`)
    .required("Enter Manning's n."),
};

const PAIRS = 'Give y1 and V1, or Fr1 and q, or Fr1 and y1.';
/** Which pair of toe conditions a value gives, or undefined for none or a mixture. */
function toePair(t: unknown): 'y1v1' | 'fr1q' | 'fr1y1' | undefined {
  if (t === null || typeof t !== 'object') return undefined;
  const has = (k: string) => (t as Record<string, unknown>)[k] !== undefined;
  const [y1, v1, fr1, q] = [has('y1'), has('v1'), has('fr1'), has('q')];
  if (y1 && v1 && !fr1 && !q) return 'y1v1';
  if (fr1 && q && !y1 && !v1) return 'fr1q';
  if (fr1 && y1 && !q && !v1) return 'fr1y1';
  return undefined;
}
const toeY1 = num('y1').positive('y1 must be greater than zero.').required('Enter y1.');
const toeFr1 = num('Fr1')
  .moreThan(1, 'Fr1 must exceed 1 (supercritical inflow).')
  .required('Enter Fr1.');
/** Known toe conditions: exactly one of the three pairs (KnownToe). */
const knownToeSchema = lazy((t: unknown): ISchema<KnownToe> => {
  switch (toePair(t)) {
    case 'y1v1':
      return object({ y1: toeY1, v1: positive('V1') });
    case 'fr1q':
      return object({ fr1: toeFr1, q: positive('q') });
    case 'fr1y1':
      return object({ fr1: toeFr1, y1: toeY1 });
    default:
      return mixed<KnownToe>()
        .required('Enter the toe conditions.')
        .test('pair', PAIRS, () => false);
  }
});

const inflowSchema = byKind<StudyInflow, 'kind'>('kind', 'the inflow type', {
  chute: object({
    kind: string<'chute'>().required(),
    crestElevation: elevation('the crest elevation'),
    headwater: byKind<HeadwaterSpec, 'kind'>('kind', 'the headwater rating', {
      weir: object({
        kind: string<'weir'>().required(),
        // Its range depends on the units (m^0.5/s or ft^0.5/s): checked with the whole input.
        C: positive('the weir coefficient C'),
        L: positive('the crest length L'),
      }),
      table: object({
        kind: string<'table'>().required(),
        rows: qElevationRows('headwater table'),
      }),
    }),
    lossModel: lossModelSchema,
    approachVelocityHead: num('the approach velocity head')
      .min(0, 'The approach velocity head must not be negative.')
      .optional(),
    // The chute computed (hydraulics/chute.ts): its geometry replaces the loss allowance.
    chute: object({
      slope: num('the chute slope')
        .min(CHUTE_SLOPE_RANGE.min, `The chute slope must be at least ${CHUTE_SLOPE_RANGE.min}.`)
        .max(CHUTE_SLOPE_RANGE.max, `The chute slope must not exceed ${CHUTE_SLOPE_RANGE.max}.`)
        .required('Enter the chute slope.'),
      width: num('the chute width')
        .positive('The chute width must be greater than zero.')
        .optional(),
      manningN: num("the chute's Manning's n")
        .min(N_RANGE.min, `The chute's Manning's n must be at least ${N_RANGE.min}.`)
        .max(N_RANGE.max, `The chute's Manning's n must not exceed ${N_RANGE.max}.`)
        .required("Enter the chute's Manning's n."),
    })
      .default(undefined)
      .optional(),
  }),
  gate: object({
    kind: string<'gate'>().required(),
    Cc: num('Cc')
      .min(CC_RANGE.min, `Cc must be at least ${CC_RANGE.min}.`)
      .max(CC_RANGE.max, `Cc must not exceed ${CC_RANGE.max}.`)
      .required('Enter the contraction coefficient Cc.'),
    opening: num('the gate opening')
      .positive('The gate opening must be greater than zero.')
      .optional(),
    upstreamDepth: num('the upstream depth')
      .positive('The upstream depth must be greater than zero.')
      .optional(),
    upstreamElevation: num('the upstream water elevation').optional(),
  }).test(
    'one-setting',
    'Give exactly one of: gate opening, upstream depth, upstream water elevation.',
    (v) =>
      !v ||
      [v.opening, v.upstreamDepth, v.upstreamElevation].filter((x) => x !== undefined).length === 1,
  ),
  pipe: object({
    kind: string<'pipe'>().required(),
    invertElevation: elevation('the outlet invert elevation'),
    outlet: byKind<Extract<StudyInflow, { kind: 'pipe' }>['outlet'], 'kind'>(
      'kind',
      'the outlet flow',
      {
        table: object({
          kind: string<'table'>().required(),
          rows: array(
            object({
              Q: positive('Q'),
              depth: positive('the outlet depth'),
              velocity: positive('the outlet velocity'),
            }),
          )
            .min(2, 'The outlet table needs at least two rows.')
            .max(MAX_TABLE_ROWS, `The outlet table has at most ${MAX_TABLE_ROWS} rows.`)
            .required('Enter the outlet table.'),
        }),
        barrel: object({ kind: string<'barrel'>().required(), ...manningChannel }),
      },
    ),
    // Optional, as in the StudyInput type: the engine takes 'none' (no loss) when absent.
    lossModel: lossModelOptional,
  }),
  known: object({
    kind: string<'known'>().required(),
    toe: knownToeSchema,
  }),
});

const tailwaterSchema = byKind<TailwaterSpec, 'kind'>('kind', 'the tailwater rating', {
  table: object({ kind: string<'table'>().required(), rows: qElevationRows('tailwater table') }),
  manning: object({ kind: string<'manning'>().required(), ...manningChannel }),
});

const dischargesSchema = byKind<DischargeSpec, 'kind'>('kind', 'the discharges to check', {
  list: object({
    kind: string<'list'>().required(),
    values: array(positive('each discharge'))
      .min(1, 'List at least one discharge.')
      .max(MAX_STUDY_DISCHARGES, `At most ${MAX_STUDY_DISCHARGES} discharges.`)
      .required('List the discharges.'),
  }),
  range: object({
    kind: string<'range'>().required(),
    min: positive('the smallest discharge'),
    max: positive('the largest discharge'),
    count: num('the number of discharges')
      .integer('The number of discharges must be a whole number.')
      .min(1, 'Check at least one discharge.')
      .max(MAX_STUDY_DISCHARGES, `At most ${MAX_STUDY_DISCHARGES} discharges.`)
      .required('Enter the number of discharges.'),
  }).test(
    'order',
    'The largest discharge must not be below the smallest.',
    (v) => !v || v.max >= v.min,
  ),
});

const typeList = DISSIPATOR_IDS.join(', ');
const DEFAULT_KEYS = new Set(Object.keys(BASIN_DEFAULTS));

/**
 * Overrides of the dissipator defaults: known keys only (named with their plain-words label),
 * each a non-negative finite number. Checked as a whole so an unknown key is reported, not
 * silently dropped by stripUnknown.
 */
const defaultsOverrideSchema = mixed<Record<string, number>>()
  .optional()
  .test('defaults', 'The default overrides must be an object of numbers.', (v, ctx) => {
    if (v === undefined || v === null) return true;
    if (typeof v !== 'object' || Array.isArray(v))
      return ctx.createError({ message: 'The default overrides must be an object of numbers.' });
    for (const [key, value] of Object.entries(v as Record<string, unknown>)) {
      if (!DEFAULT_KEYS.has(key))
        return ctx.createError({
          path: `${ctx.path}.${key}`,
          message: `"${key}" is not a setting of the dissipator catalogue.`,
        });
      const label = BASIN_DEFAULT_PROVENANCE[key as keyof typeof BASIN_DEFAULT_PROVENANCE].label;
      if (typeof value !== 'number' || !Number.isFinite(value) || value < 0)
        return ctx.createError({
          path: `${ctx.path}.${key}`,
          message: `${cap(label)} must be a number not below zero.`,
        });
    }
    return true;
  });

/**
 * The dissipator catalogue's options of a study (DissipatorStudyOptions in basins/study.ts):
 * debris, the culvert at the outlet, the chosen type and alternatives, default overrides, the
 * flotation case, an extra floor depth and the drawing. Lengths in the
 * units named by the study's `units`.
 */
export const dissipatorOptionsSchema = object({
  debris: string()
    .oneOf(['none', 'light', 'heavy'], 'Debris must be none, light or heavy.')
    .optional(),
  culvert: object({
    shape: string()
      .oneOf(['circular', 'box'], 'The culvert shape must be circular or box.')
      .required('Choose the culvert shape.'),
    rise: positive('the culvert rise (diameter or height)'),
    span: num('the culvert span')
      .positive('The culvert span must be greater than zero.')
      .optional(),
  })
    .test(
      'box-span',
      'A box culvert needs its span.',
      (c) => !c || c.shape !== 'box' || c.span !== undefined,
    )
    .default(undefined)
    .optional(),
  chosenType: string()
    .oneOf(DISSIPATOR_IDS, `The chosen basin type must be one of: ${typeList}.`)
    .optional(),
  alternatives: array(
    string()
      .oneOf(DISSIPATOR_IDS, `Each alternative basin type must be one of: ${typeList}.`)
      .required('Name the alternative basin type.'),
  )
    .max(DISSIPATOR_IDS.length, `At most ${DISSIPATOR_IDS.length} alternatives.`)
    .optional(),
  defaults: defaultsOverrideSchema,
  flotation: object({
    upliftElevation: num('the uplift (groundwater) elevation').optional(),
    waterOnSlabDepth: num('the water depth on the slab')
      .min(0, 'The water depth on the slab must not be negative.')
      .optional(),
    safetyFactor: num('the flotation safety factor')
      .min(1, 'The flotation safety factor must be at least 1.')
      .max(3, 'The flotation safety factor must not exceed 3.')
      .optional(),
    minThickness: num('the least slab thickness')
      .positive('The least slab thickness must be greater than zero.')
      .optional(),
    monolithic: boolean()
      .typeError('Say whether the walls are cast with the slab (true or false).')
      .optional(),
  })
    .default(undefined)
    .optional(),
  extraFloorDepth: num('the extra floor depth')
    .min(0, 'The extra floor depth must not be negative.')
    .optional(),
  drawing: object({
    flowBearingDeg: num('the flow bearing')
      .min(0, 'The flow bearing must lie between 0 and 360 degrees.')
      .max(360, 'The flow bearing must lie between 0 and 360 degrees.')
      .optional(),
    chuteSlope: num('the chute slope drawn')
      .positive('The chute slope drawn must be greater than zero.')
      .optional(),
  })
    .default(undefined)
    .optional(),
})
  .default(undefined)
  .optional();

/** The whole study request (POST /calc/study), in the units named by `units`. */
export const studyInputSchema: ObjectSchema<StudyInput> = object({
  units: string()
    .oneOf(['SI', 'US'], 'Choose SI or US customary units.')
    .required('Choose the units.'),
  displayUnits: string()
    .oneOf(['SI', 'US'] as const, 'Choose SI or US customary units to read results in.')
    .optional(),
  channelBedElevation: elevation('the channel bed elevation'),
  basinWidth: positive('the basin width').when('units', ([units], schema) => {
    const max = ENGINE_LIMITS.maxBasinWidth[units === 'US' ? 'US' : 'SI'];
    const unit = units === 'US' ? 'ft' : 'm';
    return schema.max(
      max,
      `The basin width must not exceed ${max} ${unit}: wider basins are beyond what one study computes.`,
    );
  }),
  designDischarge: positive('the design discharge'),
  discharges: dischargesSchema,
  tailwater: tailwaterSchema,
  inflow: inflowSchema,
  tailwaterFactor: num('the tailwater factor')
    .min(0.5, 'The tailwater factor must be at least 0.5.')
    .max(2, 'The tailwater factor must not exceed 2.')
    .optional(),
  floorElevation: num('the floor elevation').optional(),
  floorSafetyDepth: num('the safety depth below the floor')
    .min(0, 'The safety depth below the floor must not be negative.')
    .optional(),
  submergenceTolerance: num('the submergence tolerance')
    .min(0, 'The submergence tolerance must not be negative.')
    .max(1, 'The submergence tolerance must not exceed 1.')
    .optional(),
  floorManningN: num("the floor's Manning's n")
    .min(N_RANGE.min, `Manning's n must be at least ${N_RANGE.min}.`)
    .max(N_RANGE.max, `Manning's n must not exceed ${N_RANGE.max}.`)
    .optional(),
  jumpLengthMethod: string()
    .oneOf(['usbr', 'hager'], 'The jump length method must be usbr or hager.')
    .optional(),
  dissipators: dissipatorOptionsSchema,
}).test('weir-coefficient', (input, ctx) => {
  // The weir coefficient's range is in the units of the input (ENGINE_LIMITS.weirCoefficient).
  const inflow = input?.inflow as { headwater?: { kind?: unknown; C?: unknown } } | undefined;
  const C = inflow?.headwater?.kind === 'weir' ? inflow.headwater.C : undefined;
  if (typeof C !== 'number') return true;
  const units = input.units === 'US' ? 'US' : 'SI';
  const { min, max } = ENGINE_LIMITS.weirCoefficient[units];
  if (C >= min && C <= max) return true;
  const unit = units === 'US' ? 'ft^0.5/s' : 'm^0.5/s';
  return ctx.createError({
    path: 'inflow.headwater.C',
    message: `The weir coefficient C must lie between ${min} and ${max} ${unit}.`,
  });
});

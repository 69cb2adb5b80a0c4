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
  type ObjectSchema,
  type Schema,
} from 'yup';
import type { Section } from '../hydraulics/sections';
import type { JumpSituation } from '../hydraulics/profiles';
import { DISSIPATOR_CATALOGUE } from '../basins/catalogue';
import { BASIN_DEFAULTS, BASIN_DEFAULT_PROVENANCE } from '../basins/defaults';
import type { StudyInput } from '../range/types';

export const MAX_STUDY_DISCHARGES = 5000;

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

function byKind<T extends string>(
  field: string,
  label: string,
  schemas: Record<T, Schema>,
  optional = false,
) {
  const kinds = Object.keys(schemas) as T[];
  return lazy((value: unknown) => {
    // An optional choice may be left out altogether (the engine then takes its default).
    if (optional && value === undefined) return mixed().optional();
    const kind =
      value !== null && typeof value === 'object'
        ? (value as Record<string, unknown>)[field]
        : undefined;
    if (typeof kind === 'string' && (kinds as string[]).includes(kind)) return schemas[kind as T];
    return object({
      [field]: string()
        .required(`Choose ${label}.`)

        .oneOf(kinds, `${cap(label)} must be one of: ${kinds.join(', ')}.`),
    })
      .required(`Enter ${label}.`)
      .typeError(`Enter ${label}.`);
  });
}

export const sectionSchema = byKind<Section['shape']>('shape', 'the section shape', {
  rectangular: object({ shape: string().required(), width: positive('the width') }),
  trapezoidal: object({
    shape: string().required(),
    bottomWidth: nonNegative('the bottom width'),
    sideSlope: nonNegative('the side slope'),
  }).test(
    'not-degenerate',
    'A trapezoid needs a bottom width or a side slope greater than zero.',
    (v) => !v || v.bottomWidth > 0 || v.sideSlope > 0,
  ),
  circular: object({ shape: string().required(), diameter: positive('the diameter') }),
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
      .min(0.005, "Manning's n must be at least 0.005.")
      .max(0.2, "Manning's n must not exceed 0.2.")
      .required(`Enter the ${label} Manning's n.`),
  }).required(`Enter the ${label} reach.`);
const slope = num('the bed slope')
  .min(0, 'The bed slope must not be negative.')
  .max(1, 'The bed slope must not exceed 1 (45°).')
  .required('Enter the bed slope.');
const manningN = num("Manning's n")
  .min(0.005, "Manning's n must be at least 0.005.")
  .max(0.2, "Manning's n must not exceed 0.2.")
  .required("Enter Manning's n.");
const optionalPositive = (label: string) =>
  num(label)
    .positive(`${cap(label)} must be greater than zero.`)
    .optional();

/** POST /calc/jump-position: where the jump forms below a control, SI. */
export const jumpSituationSchema = byKind<JumpSituation['kind']>('kind', 'the situation', {
  slopeBreak: object({
    kind: string().required(),
    section: sectionSchema,
    Q: positive('the discharge Q'),
    upstream: reach('upstream'),
    downstream: reach('downstream'),
    tailwaterDepth: optionalPositive('the tailwater depth'),
  }),
  gateMildSlope: object({
    kind: string().required(),
    section: sectionSchema,
    Q: positive('the discharge Q'),
    opening: positive('the gate opening'),
    Cc: num('the contraction coefficient')
      .min(0.5, 'The contraction coefficient must be at least 0.5.')
      .max(1, 'The contraction coefficient must not exceed 1.')
      .required('Enter the contraction coefficient.'),
    slope,
    manningN,
    tailwaterDepth: optionalPositive('the tailwater depth'),
  }),
  gateSteepSlope: object({
    kind: string().required(),
    section: sectionSchema,
    Q: positive('the discharge Q'),
    slope,
    manningN,
    upstreamDepth: optionalPositive('the depth upstream of the gate'),
    opening: optionalPositive('the gate opening'),
    Cc: num('the contraction coefficient')
      .min(0.5, 'The contraction coefficient must be at least 0.5.')
      .max(1, 'The contraction coefficient must not exceed 1.')
      .optional(),
  }),
  weirToMildSlope: object({
    kind: string().required(),
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
}) as unknown as Schema<JumpSituation>;

const LOSS_MODELS = {
  none: object({ kind: string().required() }),
  fraction: object({
    kind: string().required(),
    value: num('the loss fraction')
      .min(0, 'The loss fraction must not be negative.')
      .max(0.95, 'The loss fraction must be below 0.95.')
      .required('Enter the loss fraction.'),
  }),
  velocityCoefficient: object({
    kind: string().required(),
    Cv: num('Cv')
      .min(0.1, 'Cv must be at least 0.1.')
      .max(1, 'Cv must not exceed 1.')
      .required('Enter Cv.'),
  }),
  lossCoefficient: object({ kind: string().required(), K: nonNegative('the loss coefficient K') }),
};

const lossModelSchema = byKind('kind', 'the loss allowance', LOSS_MODELS);
// Where the loss allowance may be left out (the engine then takes its default).
const lossModelOptional = byKind('kind', 'the loss allowance', LOSS_MODELS, true);

const qElevationRows = (label: string) =>
  array(object({ Q: positive('Q'), elevation: elevation('the elevation') }))
    .min(2, `The ${label} needs at least two rows.`)
    .max(MAX_STUDY_DISCHARGES, `The ${label} has at most ${MAX_STUDY_DISCHARGES} rows.`)
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
    .min(0.005, "Manning's n must be at least 0.005.")
    .max(0.2, "Manning's n must not exceed 0.2.")
    .required("Enter Manning's n."),
};

const inflowSchema = byKind('kind', 'the inflow type', {
  chute: object({
    kind: string().required(),
    crestElevation: elevation('the crest elevation'),
    headwater: byKind('kind', 'the headwater rating', {
      weir: object({
        kind: string().required(),
        C: positive('the weir coefficient C'),
        L: positive('the crest length L'),
      }),
      table: object({ kind: string().required(), rows: qElevationRows('headwater table') }),
    }),
    lossModel: lossModelSchema,
    approachVelocityHead: num('the approach velocity head')
      .min(0, 'The approach velocity head must not be negative.')
      .optional(),
  }),
  gate: object({
    kind: string().required(),
    Cc: num('Cc')
      .min(0.3, 'Cc must be at least 0.3.')
      .max(1, 'Cc must not exceed 1.')
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
    kind: string().required(),
    invertElevation: elevation('the outlet invert elevation'),
    outlet: byKind('kind', 'the outlet flow', {
      table: object({
        kind: string().required(),
        rows: array(
          object({
            Q: positive('Q'),
            depth: positive('the outlet depth'),
            velocity: positive('the outlet velocity'),
          }),
        )
          .min(2, 'The outlet table needs at least two rows.')
          .max(MAX_STUDY_DISCHARGES, `The outlet table has at most ${MAX_STUDY_DISCHARGES} rows.`)
          .required('Enter the outlet table.'),
      }),
      barrel: object({ kind: string().required(), ...manningChannel }),
    }),
    // Optional, as in the StudyInput type: the engine takes 'none' (no loss) when absent.
    lossModel: lossModelOptional,
  }),
  known: object({
    kind: string().required(),
    toe: object({
      y1: num('y1').positive('y1 must be greater than zero.').optional(),
      v1: num('V1').positive('V1 must be greater than zero.').optional(),
      fr1: num('Fr1').moreThan(1, 'Fr1 must exceed 1 (supercritical inflow).').optional(),
      q: num('q').positive('q must be greater than zero.').optional(),
    })
      .test(
        'pair',
        'Give y1 and V1, or Fr1 and q, or Fr1 and y1.',
        (t) =>
          !t ||
          (t.y1 !== undefined && t.v1 !== undefined && t.fr1 === undefined && t.q === undefined) ||
          (t.fr1 !== undefined && t.q !== undefined && t.y1 === undefined && t.v1 === undefined) ||
          (t.fr1 !== undefined && t.y1 !== undefined && t.q === undefined && t.v1 === undefined),
      )
      .required('Enter the toe conditions.'),
  }),
});

const tailwaterSchema = byKind('kind', 'the tailwater rating', {
  table: object({ kind: string().required(), rows: qElevationRows('tailwater table') }),
  manning: object({ kind: string().required(), ...manningChannel }),
});

const dischargesSchema = byKind('kind', 'the discharges to check', {
  list: object({
    kind: string().required(),
    values: array(positive('each discharge'))
      .min(1, 'List at least one discharge.')
      .max(MAX_STUDY_DISCHARGES, `At most ${MAX_STUDY_DISCHARGES} discharges.`)
      .required('List the discharges.'),
  }),
  range: object({
    kind: string().required(),
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

const DISSIPATOR_IDS = DISSIPATOR_CATALOGUE.map((m) => m.id);
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
 * flotation case, an extra floor depth, the drawing and the wording units. Lengths in the
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
  units: string().oneOf(['SI', 'US'], 'The wording units must be SI or US.').optional(),
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
export const studyInputSchema = object({
  units: string()
    .oneOf(['SI', 'US'], 'Choose SI or US customary units.')
    .required('Choose the units.'),
  channelBedElevation: elevation('the channel bed elevation'),
  basinWidth: positive('the basin width'),
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
    .min(0.005, "Manning's n must be at least 0.005.")
    .max(0.2, "Manning's n must not exceed 0.2.")
    .optional(),
  jumpLengthMethod: string()
    .oneOf(['usbr', 'hager'], 'The jump length method must be usbr or hager.')
    .optional(),
  dissipators: dissipatorOptionsSchema,
}) as unknown as ObjectSchema<StudyInput>;

// One module for every limit the web form and the API share, so the two can never disagree.
import { InputError } from '../errors';

export const ROLES = ['owner', 'admin', 'engineer', 'estimator', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

/** Roles an invitation may carry: ownership is granted by an owner, never by invitation. */
export const INVITABLE_ROLES = [
  'admin',
  'engineer',
  'estimator',
  'viewer',
] as const satisfies readonly Role[];
export type InvitableRole = (typeof INVITABLE_ROLES)[number];

export const PLANS = ['concept', 'professional', 'firm'] as const;
export type Plan = (typeof PLANS)[number];

export interface PlanLimits {
  /** Largest number of projects a firm may hold; null = unlimited. */
  maxProjects: number | null;
  /** Largest number of seats (active members + pending invitations); null = as bought. */
  maxSeats: number | null;
  /** Seats a new firm on this plan starts with. */
  defaultSeats: number;
}

export const PLAN_LIMITS: Readonly<Record<Plan, PlanLimits>> = {
  concept: { maxProjects: 3, maxSeats: 1, defaultSeats: 1 },
  professional: { maxProjects: null, maxSeats: null, defaultSeats: 1 },
  firm: { maxProjects: null, maxSeats: null, defaultSeats: 3 },
};

/** Seats a firm can actually fill: what it bought, capped by its plan. */
export function seatLimit(plan: Plan, seats: number): number {
  const cap = PLAN_LIMITS[plan].maxSeats;
  return cap === null ? seats : Math.min(seats, cap);
}

export const PROJECT_UNITS = ['SI', 'US'] as const;
export type ProjectUnits = (typeof PROJECT_UNITS)[number];

export const PROJECT_STATUSES = ['draft', 'in review', 'issued', 'archived'] as const;
export type ProjectStatus = (typeof PROJECT_STATUSES)[number];

export const PROJECT_SORTS = ['updatedAt', 'createdAt', 'name', 'client', 'status'] as const;
export type ProjectSort = (typeof PROJECT_SORTS)[number];

export const SORT_ORDERS = ['asc', 'desc'] as const;
export type SortOrder = (typeof SORT_ORDERS)[number];

export const LIMITS = {
  /** Minimum counted in characters (code points), as a person counts them. */
  passwordMinChars: 8,
  /** bcrypt reads at most 72 bytes; longer passwords are refused rather than silently cut. */
  passwordMaxBytes: 72,
  /** RFC 5321 path limit. */
  emailMaxLength: 254,
  personNameMaxLength: 120,
  firmNameMaxLength: 160,
  projectNameMaxLength: 200,
  projectClientMaxLength: 200,
  projectLocationMaxLength: 200,
  projectNotesMaxLength: 10_000,
  searchMaxLength: 200,
  pageSizeDefault: 20,
  pageSizeMax: 100,
  /** Tokens sent by e-mail: 32 random bytes, base64url → 43 characters. */
  tokenMaxLength: 128,
} as const;

/** Lifetimes of the single-use tokens sent by e-mail. */
export const TOKEN_TTL_MS = {
  passwordReset: 60 * 60 * 1000,
  invitation: 7 * 24 * 60 * 60 * 1000,
  signup: 24 * 60 * 60 * 1000,
} as const;

/**
 * Length of a string in UTF-8 bytes, as bcrypt sees it. A lone surrogate counts 3 bytes
 * (it is encoded as U+FFFD). Written out so the module needs neither DOM nor Node types.
 */
export function utf8ByteLength(value: string): number {
  let bytes = 0;
  for (let i = 0; i < value.length; i += 1) {
    const code = value.charCodeAt(i);
    if (code < 0x80) bytes += 1;
    else if (code < 0x800) bytes += 2;
    else if (code >= 0xd800 && code <= 0xdbff && i + 1 < value.length) {
      const next = value.charCodeAt(i + 1);
      if (next >= 0xdc00 && next <= 0xdfff) {
        bytes += 4;
        i += 1;
      } else bytes += 3;
    } else bytes += 3;
  }
  return bytes;
}

/**
 * Bounds on the engine's inputs, kept here once and read by the yup schemas (schemas/study.ts),
 * the engine's own guards (study.ts, hydraulics/inflow.ts, basins/blocks.ts) and the API's
 * compute pool. Each bounds the time or memory of one study, or refuses a value no real
 * structure has; the reason stands beside each. Lengths are given in each unit system, as
 * typed: the US figure never exceeds the SI one converted, so input the schema accepts is
 * never refused by the engine after conversion.
 */
export const ENGINE_LIMITS = {
  /**
   * Discharges analysed in one study (a range's count or a list's length). Each one is a
   * toe, jump and tailwater solve at every floor the search tries: 5,000 take several
   * seconds of CPU, the most one request may use (the API's time budget stops it beyond);
   * a rating curve needs tens.
   */
  maxDischarges: 5000,
  /**
   * Rows of a rating or outlet table (tailwater, headwater, outlet). Read once per study and
   * searched per discharge; a gauged rating or a model run gives tens to hundreds of rows.
   */
  maxTableRows: 5000,
  /**
   * Basin width. The block rows of a basin grow with the width over y1, and y1 shrinks as
   * the width spreads the flow, so without the block limits below the work grew with about
   * the square of the width: 200 m took 0.6 s and 7 MB, 1,000 m 52 s and 280 MB, and 10,000 m
   * stopped the process (issue 8). With them a 300 m demo study takes well under a second.
   * The widest stilling basins built are of the order of 100–200 m [from memory].
   */
  maxBasinWidth: { SI: 300, US: 980 },
  /**
   * Blocks in one row across a basin (chute blocks, baffle piers, floor blocks, sill teeth):
   * a row is built block by block for the drawing, so this bounds its memory. 2,000 blocks
   * (a 60 m basin with 3 cm blocks) is already far beyond any basin built; a type that would
   * need more is reported "not sized", naming the basin width, and the study goes on.
   */
  maxBlocksPerRow: 2000,
  /**
   * Rows of baffle piers down a baffled apron (USBR Type IX): their number grows with the drop
   * over the critical depth, and the drawing holds every block of every row. Aprons are built
   * with four rows and more [Design of Small Dams, from memory]; 200 is far beyond any built.
   */
  maxBlockRows: 200,
  /**
   * Baffle piers on one baffled apron, all rows together: the drawing holds each one, so this
   * bounds its memory (10,000 shapes ≈ 3 MB of result). A built apron has some tens to hundreds.
   */
  maxApronBlocks: 10_000,
  /**
   * Contraction coefficient of a gate: 0.5 is the strongest contraction a free jet can have
   * (Borda's re-entrant mouthpiece, a fact of the trade); a vertical sluice gate gives about
   * 0.61 [Henderson 1966, §6.3], a radial gate more; 1 is no contraction.
   */
  contractionCoefficient: { min: 0.5, max: 1 },
  /**
   * Manning's n, the same number in SI and US customary: 0.005 is below the smoothest
   * surfaces tabulated (glass, plastic ≈ 0.009) and 0.2 above the roughest flood plains
   * with dense brush (≈ 0.16) [Chow 1959, Table 5-6, from memory] — a sanity bound.
   */
  manningN: { min: 0.005, max: 0.2 },
  /**
   * Weir coefficient C of Q = C·L·H^1.5, in m^0.5/s (SI) or ft^0.5/s (US; × 1.811 of SI):
   * broad-crested weirs ≈ 1.45–1.7 SI (2.6–3.1 US), sharp-crested ≈ 1.8 and ogee crests up
   * to ≈ 2.2 SI (4.0 US) [common practice, from memory]; the bounds leave room on both sides.
   */
  weirCoefficient: { SI: { min: 1.2, max: 2.5 }, US: { min: 2.2, max: 4.5 } },
} as const;

/** A field whose size made a study large, and how large, for a message that names it. */
export interface StudySize {
  field: string;
  label: string;
  value: number;
  /** value ÷ its limit (1 = at the limit) */
  share: number;
}

interface StudySizeView {
  units?: unknown;
  basinWidth?: unknown;
  discharges?: { kind?: unknown; count?: unknown; values?: unknown } | null;
  tailwater?: { rows?: unknown } | null;
  inflow?: {
    headwater?: { rows?: unknown } | null;
    outlet?: { rows?: unknown } | null;
  } | null;
}

const lengthOf = (v: unknown): number => (Array.isArray(v) ? v.length : 0);

/**
 * The sizes of a study input that drive its time and memory, largest share of its limit
 * first. Reads any object (validated or not) and never throws.
 */
export function studySizes(input: unknown): StudySize[] {
  if (input === null || typeof input !== 'object') return [];
  const s = input as StudySizeView;
  const units = s.units === 'US' ? 'US' : 'SI';
  const sizes: StudySize[] = [];
  const d = s.discharges;
  if (d?.kind === 'range' && typeof d.count === 'number')
    sizes.push({
      field: 'discharges.count',
      label: 'the number of discharges',
      value: d.count,
      share: 0,
    });
  else if (d?.kind === 'list')
    sizes.push({
      field: 'discharges.values',
      label: 'the number of discharges',
      value: lengthOf(d.values),
      share: 0,
    });
  for (const [field, rows] of [
    ['tailwater.rows', s.tailwater?.rows],
    ['inflow.headwater.rows', s.inflow?.headwater?.rows],
    ['inflow.outlet.rows', s.inflow?.outlet?.rows],
  ] as const) {
    if (Array.isArray(rows))
      sizes.push({ field, label: 'the rows of a table', value: rows.length, share: 0 });
  }
  if (typeof s.basinWidth === 'number')
    sizes.push({ field: 'basinWidth', label: 'the basin width', value: s.basinWidth, share: 0 });
  const limitOf = (field: string): number =>
    field === 'basinWidth'
      ? ENGINE_LIMITS.maxBasinWidth[units]
      : field.startsWith('discharges')
        ? ENGINE_LIMITS.maxDischarges
        : ENGINE_LIMITS.maxTableRows;
  return sizes
    .map((x) => ({ ...x, share: x.value / limitOf(x.field) }))
    .sort((a, b) => b.share - a.share);
}

/**
 * The engine's own check of the size limits (the schema checks the same before any work, in
 * the input's units; this one guards direct callers, in SI): a RangeError naming the field.
 */
export function requireStudySize(input: unknown): void {
  for (const size of studySizes({ ...(input as object), units: 'SI' })) {
    if (size.share > 1) {
      const limit = Math.round(size.value / size.share);
      throw new InputError(
        size.field,
        'out-of-range',
        size.field === 'basinWidth'
          ? `basinWidth must not exceed ${limit} m (got ${size.value} m)`
          : `${size.field}: at most ${limit} ${size.field.startsWith('discharges') ? 'discharges' : 'rows'} (got ${size.value})`,
        { min: 0, max: limit },
      );
    }
  }
}

/**
 * Bounds on the take-off's overrides (SI; the schema converts them for a US form). Each keeps
 * a figure within what a concrete hydraulic structure can have; the reason stands beside it.
 */
export const TAKEOFF_LIMITS = {
  /** slab and wall thickness: 0.1 m is thinner than any reinforced slab with cover; 5 m is a mass-concrete block */
  thickness: { min: 0.1, max: 5 },
  /** waste and laps: a fraction of the neat quantity; more than doubling is a different job */
  fraction: { min: 0, max: 1 },
  /** reinforcement ratio, kg/m³: 0 is mass concrete; 400 is beyond any heavily reinforced member */
  reinforcement: { min: 0, max: 400 },
  /** working room each side, m */
  workingRoom: { min: 0, max: 5 },
  /** side slope H:V: 0 is a vertical (shored) cut; 4:1 is flatter than any temporary cut */
  sideSlope: { min: 0, max: 4 },
  /** bedding layer, m */
  beddingThickness: { min: 0, max: 2 },
  /** placed stone, kg/m³: between a loose rock fill and solid granite */
  riprapDensity: { min: 1000, max: 3000 },
  /** joint spacing, m: closer than 2 m is not a contraction joint pattern; 100 m is none */
  jointSpacing: { min: 2, max: 100 },
} as const;

/** Bounds on an estimate's inputs (fractions unless said). */
export const ESTIMATE_LIMITS = {
  /** lines of one estimate: a concept estimate has tens; the bound keeps one request small */
  maxLines: 2000,
  /** a location factor outside 0.2–5 is a data-entry error, not a place */
  locationFactor: { min: 0.2, max: 5 },
  /** each percentage (mobilisation, care of water, contingency, overhead and profit) as a fraction */
  percentage: { min: 0, max: 2 },
  /** escalation rate a year, fraction (−20 % to +50 %) */
  escalationRate: { min: -0.2, max: 0.5 },
  /** years to the construction mid-point */
  escalationYears: { min: 0, max: 30 },
  /** a unit price or a quantity: non-negative and below 1e12 (no real line is larger) */
  maxAmount: 1e12,
  /** the reason for a quantity override, characters */
  reasonMaxLength: 500,
} as const;

/** Bounds on the cheapest-design search. */
export const SEARCH_LIMITS = {
  /**
   * widths tried: each one costs about one study (the range is prepared once), so 41 widths
   * of a 5,000-discharge study stay within the API's time budget only for small studies; the
   * pool's budget stops the rest with a 422
   */
  maxWidthSteps: 41,
  defaultWidthSteps: 9,
} as const;

// One module for every limit the web form and the API share, so the two can never disagree.

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

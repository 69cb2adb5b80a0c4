import type { Action } from './policy';
import type { Plan } from './schemas/limits';

/**
 * The one plan table (product brief, "Plans"): read by the API's checks and the web's prompts.
 * Concept is free (1 seat, 3 projects, proposals watermarked and unbranded); Professional is
 * per seat (unlimited projects, branded proposals, price-book import); Firm is per seat with at
 * least 3 (several price books, alternatives export).
 */

/** Things a plan either allows or not. */
export const PLAN_FEATURES = [
  'brandedProposals',
  'priceBookImport',
  'severalPriceBooks',
  'alternativesExport',
] as const;
export type PlanFeature = (typeof PLAN_FEATURES)[number];

/** Counted limits; null in the table = unlimited (seats: as bought). */
export const PLAN_LIMIT_NAMES = ['projects', 'seats', 'priceBooks'] as const;
export type PlanLimitName = (typeof PLAN_LIMIT_NAMES)[number];

export interface PlanDefinition {
  plan: Plan;
  /** The plan's name as the user sees it. */
  name: string;
  /** Paid per seat (false: free). */
  perSeat: boolean;
  /** Fewest seats the plan can be bought with. */
  minimumSeats: number;
  /** Seats a new firm on this plan starts with. */
  defaultSeats: number;
  /** Proposals carry the "Concept plan" watermark. */
  watermark: boolean;
  limits: Readonly<Record<PlanLimitName, number | null>>;
  features: Readonly<Record<PlanFeature, boolean>>;
}

/** Plans from the smallest to the largest: the first that lifts a limit is the one named. */
export const PLAN_ORDER = ['concept', 'professional', 'firm'] as const satisfies readonly Plan[];

export const PLAN_TABLE: Readonly<Record<Plan, PlanDefinition>> = {
  concept: {
    plan: 'concept',
    name: 'Concept',
    perSeat: false,
    minimumSeats: 1,
    defaultSeats: 1,
    watermark: true,
    limits: { projects: 3, seats: 1, priceBooks: 1 },
    features: {
      brandedProposals: false,
      priceBookImport: false,
      severalPriceBooks: false,
      alternativesExport: false,
    },
  },
  professional: {
    plan: 'professional',
    name: 'Professional',
    perSeat: true,
    minimumSeats: 1,
    defaultSeats: 1,
    watermark: false,
    limits: { projects: null, seats: null, priceBooks: 1 },
    features: {
      brandedProposals: true,
      priceBookImport: true,
      severalPriceBooks: false,
      alternativesExport: false,
    },
  },
  firm: {
    plan: 'firm',
    name: 'Firm',
    perSeat: true,
    minimumSeats: 3,
    defaultSeats: 3,
    watermark: false,
    limits: { projects: null, seats: null, priceBooks: null },
    features: {
      brandedProposals: true,
      priceBookImport: true,
      severalPriceBooks: true,
      alternativesExport: true,
    },
  },
};

/** The plan's name as the user sees it ("Concept", "Professional", "Firm"). */
export function planName(plan: Plan): string {
  return PLAN_TABLE[plan].name;
}

/** True when `plan` includes `feature`. */
export function planAllows(plan: Plan, feature: PlanFeature): boolean {
  return PLAN_TABLE[plan].features[feature];
}

/** The plan's cap on `limit`; null = unlimited (for seats: as many as bought). */
export function limitFor(plan: Plan, limit: PlanLimitName): number | null {
  return PLAN_TABLE[plan].limits[limit];
}

/** Fewest seats the plan can be bought with (Firm: 3). */
export function minimumSeats(plan: Plan): number {
  return PLAN_TABLE[plan].minimumSeats;
}

/** The smallest plan that includes `feature` (always exists: Firm includes everything). */
export function featureLiftedBy(feature: PlanFeature): Plan {
  return PLAN_ORDER.find((p) => planAllows(p, feature)) ?? 'firm';
}

/**
 * The smallest plan above `current` whose cap on `limit` is larger than the current one
 * (null when no plan lifts it, e.g. seats on a paid plan: buy more seats instead).
 */
export function limitLiftedBy(limit: PlanLimitName, current: Plan): Plan | null {
  const cap = limitFor(current, limit);
  if (cap === null) return null;
  const start = PLAN_ORDER.indexOf(current);
  return (
    PLAN_ORDER.slice(start + 1).find((p) => {
      const other = limitFor(p, limit);
      return other === null || other > cap;
    }) ?? null
  );
}

/** Seats a firm can actually fill: what it bought, capped by its plan. */
export function seatLimit(plan: Plan, seats: number): number {
  const cap = limitFor(plan, 'seats');
  return cap === null ? seats : Math.min(seats, cap);
}

/** Words for a limit in a sentence. */
const LIMIT_WORDS: Record<PlanLimitName, [one: string, many: string]> = {
  projects: ['project', 'projects'],
  seats: ['seat', 'seats'],
  priceBooks: ['price book', 'price books'],
};

const FEATURE_WORDS: Record<PlanFeature, string> = {
  brandedProposals: "Proposals with the firm's logo and colour",
  priceBookImport: 'Importing a price book',
  severalPriceBooks: 'More than one price book',
  alternativesExport: 'Exporting the comparison of alternatives',
};

/** The sentence of a refused feature, naming the plan that includes it. */
export function featureLimitText(plan: Plan, feature: PlanFeature): string {
  const lifted = featureLiftedBy(feature);
  return `${FEATURE_WORDS[feature]} is not part of the ${planName(plan)} plan. The ${planName(lifted)} plan includes it.`;
}

/** The sentence of a reached limit, naming the plan that lifts it (or what else to do). */
export function limitReachedText(plan: Plan, limit: PlanLimitName, cap: number): string {
  const [one, many] = LIMIT_WORDS[limit];
  const lifted = limitLiftedBy(limit, plan);
  const holds = `The ${planName(plan)} plan holds ${cap === 1 ? `a single ${one}` : `up to ${cap} ${many}`}.`;
  if (lifted !== null) return `${holds} Upgrade to ${planName(lifted)} for more.`;
  if (limit === 'seats')
    return `All ${cap} ${cap === 1 ? one : many} are taken. Add seats, deactivate a member or withdraw an invitation first.`;
  return holds;
}

/**
 * Billing states of a firm. 'past_due': a payment failed and the grace period runs (everything
 * still works, the owner is told); 'read_only': the grace ended unpaid — every write is refused,
 * everything stays readable, nothing is deleted.
 */
export const BILLING_STATUSES = ['active', 'past_due', 'read_only'] as const;
export type BillingStatus = (typeof BILLING_STATUSES)[number];

/** Writes still allowed while a firm is read-only for billing (signing out, own profile, paying). */
const ALLOWED_WHILE_READ_ONLY: readonly string[] = [
  'session.end',
  'profile.update',
  'password.change',
];

/** True when `action` may still write while the firm's billing status is 'read_only'. */
export function allowedWhileReadOnly(action: Action | string): boolean {
  return action.startsWith('billing.') || ALLOWED_WHILE_READ_ONLY.includes(action);
}

/**
 * Which projects stay writable when a plan caps projects below what a firm holds (after a
 * downgrade): the `cap` OLDEST by creation (created_at, then id, ascending) stay writable, the
 * newer ones become read-only. Nothing is deleted; deleting a project or upgrading frees them.
 */
export const WRITABLE_PROJECTS_RULE =
  'The oldest projects (by creation date) up to the plan’s limit stay editable; newer ones are read-only.';

/** The older face of the table (kept for its callers): caps and starting seats by plan. */
export interface PlanLimits {
  /** Largest number of projects a firm may hold; null = unlimited. */
  maxProjects: number | null;
  /** Largest number of seats (active members + pending invitations); null = as bought. */
  maxSeats: number | null;
  /** Seats a new firm on this plan starts with. */
  defaultSeats: number;
}

export const PLAN_LIMITS: Readonly<Record<Plan, PlanLimits>> = Object.fromEntries(
  PLAN_ORDER.map((p) => [
    p,
    {
      maxProjects: limitFor(p, 'projects'),
      maxSeats: limitFor(p, 'seats'),
      defaultSeats: PLAN_TABLE[p].defaultSeats,
    },
  ]),
) as Record<Plan, PlanLimits>;

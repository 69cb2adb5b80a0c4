// The words the UI shows for enum values, in one place.
import { INVITABLE_ROLES, PROJECT_STATUSES, UNCERTAIN_INPUT_NAMES } from '@basinwright/common';
import type {
  Confidence,
  CriterionId,
  DesignStatus,
  ReviewState,
  VersionFigures,
  CriterionStatus,
  DebrisLevel,
  DissipatorFamily,
  JumpClass,
  JumpLocation,
  JumpPosition,
  JumpSituation,
  Verdict,
} from '@basinwright/common';
import type { Distribution, UncertainKey } from '@basinwright/common';
import type { Plan, ProjectStatus, Role, Units } from '@/api/types';

const roles: Record<Role, string> = {
  owner: 'Owner',
  admin: 'Admin',
  engineer: 'Engineer',
  estimator: 'Estimator',
  viewer: 'Viewer',
};

const plans: Record<Plan, string> = {
  concept: 'Concept',
  professional: 'Professional',
  firm: 'Firm',
};

const statuses: Record<ProjectStatus, { label: string; color: string }> = {
  draft: { label: 'Draft', color: 'default' },
  'in review': { label: 'In review', color: 'gold' },
  issued: { label: 'Issued', color: 'cyan' },
  archived: { label: 'Archived', color: 'purple' },
};

export const roleLabel = (role: Role): string => roles[role];
export const planLabel = (plan: Plan): string => plans[plan];
export const statusLabel = (status: ProjectStatus): string => statuses[status].label;
export const statusColor = (status: ProjectStatus): string => statuses[status].color;
export const unitsLabel = (units: Units): string =>
  units === 'SI' ? 'SI (metric)' : 'US customary';

// Only what each role can do in the app today; a role gains a line when its feature arrives.
export const roleDescriptions: Record<Role, string> = {
  owner: 'Everything an admin can do, and makes or removes owners',
  admin: 'Manages members, invitations and the firm brand; creates and edits projects and designs',
  engineer: 'Creates and edits projects and designs',
  estimator: 'Reads projects and designs',
  viewer: 'Reads projects and designs',
};

export const projectStatuses: readonly ProjectStatus[] = PROJECT_STATUSES;
export const invitableRoles: readonly Role[] = INVITABLE_ROLES;

const dateFormat = new Intl.DateTimeFormat('en-GB', {
  day: 'numeric',
  month: 'short',
  year: 'numeric',
});
const dateTimeFormat = new Intl.DateTimeFormat('en-GB', {
  day: 'numeric',
  month: 'short',
  year: 'numeric',
  hour: '2-digit',
  minute: '2-digit',
});

/** An ISO timestamp in one format; a dash when missing or unreadable. */
function formatIso(format: Intl.DateTimeFormat, iso: string | null | undefined): string {
  if (!iso) return '—';
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? '—' : format.format(d);
}

export const formatDate = (iso: string | null | undefined): string => formatIso(dateFormat, iso);
export const formatDateTime = (iso: string | null | undefined): string =>
  formatIso(dateTimeFormat, iso);

// Design workspace: jump positions, jump classes, screening verdicts and criteria in our words.

const jumpPositions: Record<JumpPosition, string> = {
  'at-toe': 'At the toe',
  'swept-out': 'Swept out',
  drowned: 'Drowned',
};
export const jumpPositionLabel = (p: JumpPosition): string => jumpPositions[p];

const jumpClasses: Record<string, string> = {
  none: 'No jump',
  undular: 'Undular',
  weak: 'Weak',
  oscillating: 'Oscillating',
  steady: 'Steady',
  strong: 'Strong',
};
export const jumpClassLabel = (c: string): string => jumpClasses[c] ?? c;

const verdicts: Record<Verdict, string> = {
  recommended: 'Recommended',
  suitable: 'Suitable',
  marginal: 'Usable with cautions',
  unsuitable: 'Not suitable',
  specialist: 'Specialist study',
};
export const verdictLabel = (v: Verdict): string => verdicts[v];

const criterionStatuses: Record<CriterionStatus, string> = {
  pass: 'Meets',
  warn: 'Caution',
  fail: 'Fails',
};
// A jet structure (flip or slotted bucket) is screened for whether the site points to it, not
// for limits it must stay within: its criteria read as indications.
const jetCriterionStatuses: Record<CriterionStatus, string> = {
  pass: 'Indicates',
  warn: 'Borderline',
  fail: 'Not indicated',
};
export const criterionStatusLabel = (s: CriterionStatus, family?: DissipatorFamily): string =>
  (family === 'jet' ? jetCriterionStatuses : criterionStatuses)[s];

const criteria: Record<CriterionId, string> = {
  froude: 'Froude number',
  velocity: 'Inflow velocity',
  unitDischarge: 'Unit discharge',
  discharge: 'Total discharge',
  tailwater: 'Tailwater',
  debris: 'Debris',
  culvertSize: 'Culvert size',
  stoneSize: 'Stone size',
  inflow: 'Kind of inflow',
  head: 'Head',
};
export const criterionLabel = (c: CriterionId): string => criteria[c] ?? c;

// How sure a default is, in words (the engine's provenance tags src, mem, calc, practice).
const confidences: Record<Confidence, { label: string; color: string; help: string }> = {
  src: { label: 'Published', color: 'cyan', help: 'Read in the named publication.' },
  mem: {
    label: 'From memory — verify',
    color: 'gold',
    help: 'Recalled from the named publication, not re-read: check it before relying on it.',
  },
  calc: { label: 'Computed', color: 'blue', help: 'Follows from physics or a standard constant.' },
  practice: {
    label: 'Common practice',
    color: 'default',
    help: 'A habit of the trade with no single source.',
  },
};
export const CONFIDENCES = Object.keys(confidences) as Confidence[];
export const confidenceLabel = (c: Confidence): string => confidences[c].label;
export const confidenceColor = (c: Confidence): string => confidences[c].color;
export const confidenceHelp = (c: Confidence): string => confidences[c].help;

const debrisLevels: Record<DebrisLevel, string> = {
  none: 'None expected',
  light: 'Light (leaves, small branches)',
  heavy: 'Heavy (trees, large floating debris)',
};
export const debrisLabel = (d: DebrisLevel): string => debrisLevels[d];
export const DEBRIS_LEVELS: readonly DebrisLevel[] = ['none', 'light', 'heavy'];

// The floor the Jump check's chart and table are computed at.
export type CheckFloor = 'design' | 'reference';
export const CHECK_AT_LABEL = 'Check at';
export const checkFloorLabel = (f: CheckFloor, basin: string): string =>
  f === 'design' ? `Design floor — ${basin}` : 'Free-jump floor (reference)';
/** Why a chosen type has no tailwater check of its own (impact basin, baffled apron, riprap apron). */
export const noDesignCheckNote = (basin: string | null): string =>
  basin
    ? `The ${basin} does not hold a hydraulic jump on a floor against the tailwater, so it has no tailwater check of its own. The check below is the free-jump one, for reference only.`
    : 'No basin type is designed yet, so the check below is the free-jump one, for reference only.';

// Where the jump forms (the jump position tool): the page, its situations, the places a jump
// can stand and the control the distance is measured from, in our words.
export const JUMP_TOOL_TITLE = 'Where the jump forms';
export const JUMP_TOOL_SUBTITLE =
  'The water-surface profiles below a slope break, a gate or a weir, and where the jump between them stands. Nothing here is saved.';

export type JumpSituationKind = JumpSituation['kind'];
const jumpSituations: Record<JumpSituationKind, { label: string; help: string }> = {
  slopeBreak: {
    label: 'Steep reach onto a mild one',
    help: 'A chute or steep channel meets a flatter channel at a break in the bed slope.',
  },
  gateMildSlope: {
    label: 'Sluice gate on a mild slope',
    help: 'Flow issues under a gate onto a mild bed; the fast flow deepens downstream until the jump.',
  },
  gateSteepSlope: {
    label: 'Gate on a steep slope',
    help: 'A gate across a steep channel backs the water up; the jump forms upstream of the gate.',
  },
  weirToMildSlope: {
    label: 'Weir or drop onto a mild slope',
    help: 'Flow passes critical depth on a crest, falls to the bed below and runs onto a mild reach.',
  },
};
export const JUMP_SITUATION_KINDS: readonly JumpSituationKind[] = [
  'slopeBreak',
  'gateMildSlope',
  'gateSteepSlope',
  'weirToMildSlope',
];
export const jumpSituationLabel = (k: JumpSituationKind): string => jumpSituations[k].label;
export const jumpSituationHelp = (k: JumpSituationKind): string => jumpSituations[k].help;

/** The control the distance to the toe is measured from, as a noun phrase. */
const jumpControls: Record<JumpSituationKind, string> = {
  slopeBreak: 'the slope break',
  gateMildSlope: 'the vena contracta below the gate',
  gateSteepSlope: 'the gate',
  weirToMildSlope: 'the foot of the weir',
};
export const jumpControlLabel = (k: JumpSituationKind): string => jumpControls[k];
/** The structure a drowned jump is held against. */
const jumpStructures: Record<JumpSituationKind, string> = {
  slopeBreak: 'the slope break',
  gateMildSlope: 'the gate',
  gateSteepSlope: 'the gate',
  weirToMildSlope: 'the foot of the weir',
};

export type JumpPlace = JumpLocation['position'];
const jumpPlaces: Record<JumpPlace, { label: string; color: string }> = {
  downstream: { label: 'Downstream of the control', color: 'cyan' },
  upstream: { label: 'Upstream of the control', color: 'blue' },
  drowned: { label: 'Drowned at the structure', color: 'gold' },
  'at-structure': { label: 'At the structure', color: 'purple' },
};
export const jumpPlaceLabel = (p: JumpPlace): string => jumpPlaces[p].label;
export const jumpPlaceColor = (p: JumpPlace): string => jumpPlaces[p].color;

/** The position in one plain sentence; `distance` is already written with its unit. */
export function jumpPlaceSentence(p: JumpPlace, k: JumpSituationKind, distance: string): string {
  const control = jumpControls[k];
  switch (p) {
    case 'downstream':
      return `The jump forms ${distance} downstream of ${control}.`;
    case 'upstream':
      return k === 'slopeBreak'
        ? `The jump forms ${distance} upstream of ${control}, on the steep reach.`
        : `The jump forms ${distance} upstream of ${control}.`;
    case 'drowned':
      return `The jump is drowned: the tailwater holds it against ${jumpStructures[k]}.`;
    case 'at-structure':
      return `The jump stands right at ${jumpStructures[k]}.`;
  }
}

/** The concept-level caution shown with every result, as on the design pages. */
export const CONCEPT_CAUTION_LEAD = 'Concept level only.';
export const CONCEPT_CAUTION_TEXT =
  'Model studies for large or high-hazard structures; review and seal by a licensed professional engineer; local codes and dam-safety rules govern.';

/**
 * The jump classes by inflow Froude number, as bands [USBR classification via Chow 1959, §15-2;
 * the engine's classifyJump]: undular 1–1.7, weak 1.7–2.5, oscillating 2.5–4.5, steady 4.5–9,
 * strong above 9.
 */
export const JUMP_CLASS_BANDS: ReadonlyArray<{
  jumpClass: JumpClass;
  from: number;
  to: number | null;
  color: string;
}> = [
  { jumpClass: 'undular', from: 1, to: 1.7, color: '#f1f5f9' },
  { jumpClass: 'weak', from: 1.7, to: 2.5, color: '#e2e8f0' },
  { jumpClass: 'oscillating', from: 2.5, to: 4.5, color: '#fde68a' },
  { jumpClass: 'steady', from: 4.5, to: 9, color: '#d1fae5' },
  { jumpClass: 'strong', from: 9, to: null, color: '#e0f2fe' },
];

// The Uncertainty panel (Jump check step): the uncertain inputs in plain words.
export const UNCERTAIN_INPUT_LABEL: Record<UncertainKey, string> = {
  downstreamN: "Downstream channel Manning's n (× design value)",
  ratingShift: 'Tailwater rating shift (depth, + up)',
  bedLowering: 'Long-term bed lowering (depth)',
  chuteLoss: 'Chute loss allowance, Cv or K, or chute n (× design value)',
  weirC: 'Weir coefficient C (× design value)',
  designDischarge: 'Design discharge (× design value)',
};
/** The short name of each input on the tornado chart (the proposal's chart uses the same). */
export const UNCERTAIN_INPUT_SHORT: Record<UncertainKey, string> = UNCERTAIN_INPUT_NAMES;
export const DISTRIBUTION_LABEL: Record<Distribution['kind'], string> = {
  uniform: 'Uniform',
  triangular: 'Triangular',
  normal: 'Normal (truncated)',
};
// ---- Issued versions, review and the audit trail ----

const reviewStates: Record<ReviewState, { label: string; color: string }> = {
  not_sent: { label: 'Not sent for review', color: 'default' },
  in_review: { label: 'In review', color: 'gold' },
  approved: { label: 'Approved', color: 'green' },
  returned: { label: 'Returned', color: 'red' },
};
export const reviewStateLabel = (s: ReviewState): string => reviewStates[s].label;
export const reviewStateColor = (s: ReviewState): string => reviewStates[s].color;

const designStatuses: Record<DesignStatus, { label: string; color: string }> = {
  draft: { label: 'Draft', color: 'default' },
  in_review: { label: 'In review', color: 'gold' },
  approved: { label: 'Approved', color: 'green' },
  returned: { label: 'Returned', color: 'red' },
};
/** The design's review status (its latest issued version's), as the list and project page show it. */
// A project from a server without design review reads as a draft.
export const designStatusLabel = (s: DesignStatus | undefined): string =>
  (designStatuses[s ?? 'draft'] ?? designStatuses.draft).label;
export const designStatusColor = (s: DesignStatus | undefined): string =>
  (designStatuses[s ?? 'draft'] ?? designStatuses.draft).color;

export const HISTORY_TITLE = 'Issued versions';
export const AUDIT_TITLE = 'Audit trail';
export const NOT_PRICED = 'Not priced';
export const STALE_SAVE_TITLE = 'Someone else saved this design';

/** An input path of a comparison in plain words: "tailwater.points.2.Q" → "tailwater › points › 3 › Q". */
export const inputPathLabel = (path: string): string =>
  path
    .split('.')
    .map((p) => (/^\d+$/.test(p) ? String(Number(p) + 1) : p))
    .join(' › ');

const figureNames: Record<keyof VersionFigures, string> = {
  floorElevation: 'Floor elevation',
  type: 'Type',
  typeName: 'Type name',
  length: 'Length',
  concrete: 'Concrete',
  cost: 'Cost',
  costStatus: 'Priced',
};
export const figureLabel = (f: keyof VersionFigures): string => figureNames[f];
// Take-off, estimates and price books (issue 9).
export { takeoffElementLabel, takeoffKindLabel, takeoffLineLabel } from '@basinwright/common';
export const PRICE_BOOKS_TITLE = 'Price books';
export const estimateStatusLabel = (s: 'draft' | 'issued'): string =>
  s === 'issued' ? 'Issued' : 'Draft';

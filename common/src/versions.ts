// Issued versions of a design and their review: the shared vocabulary of the API and the web,
// the key figures taken from a stored result, and the comparison of two versions. Pure.
import type { DissipatorTypeId } from './basins/types';
import type { StudyResult } from './result';

/** Where an issued version stands in review. */
export const REVIEW_STATES = ['not_sent', 'in_review', 'approved', 'returned'] as const;
export type ReviewState = (typeof REVIEW_STATES)[number];

/** A design's status, shown in the project list and on the project page: its latest issued version's review. */
export const DESIGN_STATUSES = ['draft', 'in_review', 'approved', 'returned'] as const;
export type DesignStatus = (typeof DESIGN_STATUSES)[number];

/** The steps the audit trail records. */
export const AUDIT_ACTIONS = [
  'version.issued',
  'version.sent',
  'version.approved',
  'version.returned',
  'reviewer.marked',
  'reviewer.unmarked',
  /** a proposal PDF of a version was drawn (the member who asked for it, the version, its pages) */
  'proposal.rendered',
  /** a proposal PDF was e-mailed to the client (who sent it, to whom, which version) */
  'proposal.sent',
] as const;
export type AuditAction = (typeof AUDIT_ACTIONS)[number];

/**
 * The key figures of an issued version, SI (m, m³), taken from the stored result when it is
 * issued. `cost` stays null with `costStatus: 'not_priced'` until an estimate exists for it.
 */
export interface VersionFigures {
  /** the chosen design's floor (or apron invert), m; else the study floor; null for a type with neither */
  floorElevation: number | null;
  /** the chosen dissipator type, or null when none was designed */
  type: DissipatorTypeId | null;
  /** the chosen design's name as the catalogue gives it */
  typeName: string | null;
  /** the chosen design's length, m */
  length: number | null;
  /** the chosen design's concrete, m³ */
  concrete: number | null;
  /** the issued estimate's total in the firm's currency, or null when not priced */
  cost: number | null;
  costStatus: 'priced' | 'not_priced';
}

/** The key figures of a stored study result (see VersionFigures). */
export function figuresOf(result: StudyResult): VersionFigures {
  const entry = result.design;
  if (entry === null) {
    return {
      floorElevation: result.floor.elevation,
      type: null,
      typeName: null,
      length: null,
      concrete: null,
      cost: null,
      costStatus: 'not_priced',
    };
  }
  const d = entry.design;
  const floor =
    d.family === 'jump-basin' || d.family === 'impact-basin'
      ? d.floorElevation
      : d.family === 'riprap-apron'
        ? d.invertElevation
        : null;
  return {
    floorElevation: floor,
    type: entry.type,
    typeName: d.name,
    length: d.length,
    concrete: d.concrete.total,
    cost: null,
    costStatus: 'not_priced',
  };
}

/** The design's status from its latest issued version's review state (none issued: draft). */
export function designStatusOf(latest: ReviewState | null): DesignStatus {
  return latest === null || latest === 'not_sent' ? 'draft' : latest;
}

/** One input value that differs between two versions; `path` is dotted (`tailwater.points.2.Q`). */
export interface InputChange {
  path: string;
  before: unknown;
  after: unknown;
}

/** One key figure that differs between two versions. */
export interface FigureChange {
  field: keyof VersionFigures;
  before: VersionFigures[keyof VersionFigures];
  after: VersionFigures[keyof VersionFigures];
}

export interface VersionComparison {
  inputs: InputChange[];
  figures: FigureChange[];
}

/** Every leaf of a JSON value as path → value (arrays by index; an empty object or array is a leaf). */
function leaves(value: unknown, prefix: string, out: Map<string, unknown>): Map<string, unknown> {
  if (value !== null && typeof value === 'object') {
    const entries = Array.isArray(value)
      ? value.map((v, i) => [String(i), v] as const)
      : Object.entries(value as Record<string, unknown>);
    if (entries.length === 0) out.set(prefix, value);
    for (const [key, v] of entries) leaves(v, prefix === '' ? key : `${prefix}.${key}`, out);
    return out;
  }
  out.set(prefix, value);
  return out;
}

const FIGURE_FIELDS: (keyof VersionFigures)[] = [
  'floorElevation',
  'type',
  'typeName',
  'length',
  'concrete',
  'cost',
  'costStatus',
];

/**
 * The input values (and catalogue options, under `options.`) that differ from `a` to `b`, path
 * by path in path order; a value present on one side only reads `undefined` on the other. Used
 * to compare two versions and a draft with the copy someone else saved.
 */
export function compareInputs(
  a: { input: unknown; options: unknown },
  b: { input: unknown; options: unknown },
): InputChange[] {
  const before = leaves({ input: a.input, options: a.options ?? {} }, '', new Map());
  const after = leaves({ input: b.input, options: b.options ?? {} }, '', new Map());
  const paths = [...new Set([...before.keys(), ...after.keys()])].sort();
  const inputs: InputChange[] = [];
  for (const path of paths) {
    const x = before.get(path);
    const y = after.get(path);
    if (JSON.stringify(x) !== JSON.stringify(y)) {
      inputs.push({ path: path.replace(/^input\./, ''), before: x, after: y });
    }
  }
  return inputs;
}

/** What changed from version `a` to version `b`: the inputs (compareInputs) and the key figures. */
export function compareVersions(
  a: { input: unknown; options: unknown; figures: VersionFigures },
  b: { input: unknown; options: unknown; figures: VersionFigures },
): VersionComparison {
  const figures: FigureChange[] = FIGURE_FIELDS.filter((f) => a.figures[f] !== b.figures[f]).map(
    (field) => ({ field, before: a.figures[field], after: b.figures[field] }),
  );
  return { inputs: compareInputs(a, b), figures };
}

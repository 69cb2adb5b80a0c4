import type {
  DesignStatus,
  ReviewState,
  StudyInput,
  StudyResult,
  VersionFigures,
} from '@basinwright/common';
import type { DesignVersion } from '../../models';

/** A version as the history lists it: key figures and review, no input or result. */
export interface VersionSummary {
  id: string;
  projectId: string;
  number: number;
  designRevision: number;
  engineVersion: string;
  figures: VersionFigures;
  note: string;
  issuedBy: { id: string | null; name: string };
  issuedAt: string;
  reviewState: ReviewState;
  sentBy: { id: string } | null;
  sentAt: string | null;
  review: {
    by: { id: string | null; name: string };
    at: string;
    licenceNumber: string | null;
    jurisdiction: string | null;
    /** printed with the signature (approvals) */
    statement: string | null;
    comments: string | null;
  } | null;
  /** a later version was issued: this one is no longer the current one */
  superseded: boolean;
  supersededBy: number | null;
}

/** One version in full: the summary and the snapshot it keeps. */
export interface VersionView extends VersionSummary {
  /** the input in the project's units, as the draft held it */
  input: StudyInput;
  options: Record<string, unknown> | null;
  /** the result the server computed from it (SI) */
  result: StudyResult;
  computedAt: string;
}

/**
 * The stored figures with the cost filled in: `cost` is the total of the latest issued estimate
 * priced from this version's result (null: none was, and the figures say 'not_priced').
 */
export function figuresWithCost(v: DesignVersion, cost: number | null): VersionFigures {
  return cost === null
    ? { ...v.figures, cost: null, costStatus: 'not_priced' }
    : { ...v.figures, cost, costStatus: 'priced' };
}

export function presentVersionSummary(
  v: DesignVersion,
  latestNumber: number,
  cost: number | null = null,
): VersionSummary {
  const superseded = v.number < latestNumber;
  return {
    id: v.id,
    projectId: v.projectId,
    number: v.number,
    designRevision: v.designRevision,
    engineVersion: v.engineVersion,
    figures: figuresWithCost(v, cost),
    note: v.note,
    issuedBy: { id: v.issuedById, name: v.issuedByName },
    issuedAt: v.issuedAt.toISOString(),
    reviewState: v.reviewState,
    sentBy: v.sentById === null ? null : { id: v.sentById },
    sentAt: v.sentAt?.toISOString() ?? null,
    review:
      v.reviewedAt === null
        ? null
        : {
            by: { id: v.reviewedById, name: v.reviewedByName ?? '' },
            at: v.reviewedAt.toISOString(),
            licenceNumber: v.reviewerLicence,
            jurisdiction: v.reviewerJurisdiction,
            statement: v.reviewerStatement,
            comments: v.reviewComments,
          },
    superseded,
    supersededBy: superseded ? latestNumber : null,
  };
}

export function presentVersion(
  v: DesignVersion,
  latestNumber: number,
  cost: number | null = null,
): VersionView {
  return {
    ...presentVersionSummary(v, latestNumber, cost),
    input: v.input,
    options: v.options,
    result: v.result,
    computedAt: v.computedAt.toISOString(),
  };
}

export interface VersionList {
  items: VersionSummary[];
  status: DesignStatus;
  /** the signed-in member is marked as licensed reviewer (may approve or return others' versions) */
  reviewer: boolean;
}

export function presentVersionList(
  versions: DesignVersion[],
  status: DesignStatus,
  reviewer: boolean,
  costs: Map<string, number> = new Map(),
): VersionList {
  const latest = versions[0]?.number ?? 0;
  return {
    items: versions.map((v) => presentVersionSummary(v, latest, costs.get(v.id) ?? null)),
    status,
    reviewer,
  };
}

import {
  designStatusOf,
  ENGINE_VERSION,
  figuresOf,
  type DesignStatus,
  type ReviewApproveInput,
  type ReviewReturnInput,
  type ReviewState,
  type VersionIssueInput,
} from '@basinwright/common';
import { Op, QueryTypes, type Transaction } from 'sequelize';
import { conflict, forbidden, notFound, StaleCopyError } from '../../errors';
import { Design, DesignVersion, ReviewerCredential, sequelize, User } from '../../models';
import { isUuid } from '../../security';
import { recordAudit } from '../audit/audit.service';
import { issuedEstimateFor, issuedEstimates } from '../estimates/estimates.service';
import { presentDesign } from '../designs/designs.presenter';
import { getProject } from '../projects/projects.service';

const NOT_FOUND = 'No such version.';
const IMMUTABLE =
  'An issued version cannot change. Change the draft and issue a new version instead.';

/** The highest version number of a project (0 when none is issued). */
async function latestNumber(
  firmId: string,
  projectId: string,
  transaction?: Transaction,
): Promise<number> {
  const max = await DesignVersion.max<number | null, DesignVersion>('number', {
    where: { firmId, projectId },
    transaction,
  });
  return max ?? 0;
}

/** The project's issued versions, newest first, the design's status, and whether `userId` is a marked reviewer. */
export async function listVersions(
  firmId: string,
  projectId: string,
  userId: string,
): Promise<{ versions: DesignVersion[]; status: DesignStatus; reviewer: boolean }> {
  await getProject(firmId, projectId); // 404 for a missing or another firm's project
  const versions = await DesignVersion.findAll({
    where: { firmId, projectId },
    order: [['number', 'DESC']],
  });
  const reviewer = (await ReviewerCredential.count({ where: { firmId, userId } })) > 0;
  return { versions, status: designStatusOf(versions[0]?.reviewState ?? null), reviewer };
}

/**
 * The cost of each version that an issued estimate was priced from: version id → the latest
 * such revision's total (versions nobody priced are left out).
 */
export async function costsOf(
  firmId: string,
  projectId: string,
  versions: DesignVersion[],
): Promise<Map<string, number>> {
  const costs = new Map<string, number>();
  if (versions.length === 0) return costs;
  const estimates = await issuedEstimates(firmId, projectId);
  for (const v of versions) {
    const total = issuedEstimateFor(estimates, v)?.totals?.total;
    if (total !== undefined) costs.set(v.id, total);
  }
  return costs;
}

/** One issued version of one of the firm's projects, and the project's latest number. */
export async function getVersion(
  firmId: string,
  projectId: string,
  versionId: string,
): Promise<{ version: DesignVersion; latest: number }> {
  await getProject(firmId, projectId);
  if (!isUuid(versionId)) throw notFound(NOT_FOUND);
  const version = await DesignVersion.findOne({ where: { id: versionId, firmId, projectId } });
  if (version === null) throw notFound(NOT_FOUND);
  return { version, latest: await latestNumber(firmId, projectId) };
}

/** PUT/PATCH/DELETE on an issued version: 404 when there is none, else always 409. */
export async function refuseChange(
  firmId: string,
  projectId: string,
  versionId: string,
): Promise<never> {
  await getVersion(firmId, projectId, versionId);
  throw conflict(IMMUTABLE);
}

/**
 * Issues the stored draft as a new version: a snapshot of its input, options and the result the
 * server computed on its last save. The caller names the draft revision it saw; another one
 * answers 409 with the current draft, so nobody issues a draft they have not seen. A result
 * computed by another engine (or none) answers 409: save the draft first.
 */
export async function issueVersion(
  actor: User,
  projectId: string,
  body: VersionIssueInput,
): Promise<{ version: DesignVersion; latest: number }> {
  const firmId = actor.firmId;
  await getProject(firmId, projectId);
  const id = await sequelize.transaction(async (transaction) => {
    // The draft's row lock orders issues of one project (numbers never collide) and saves.
    const design = await Design.findOne({
      where: { firmId, projectId },
      include: [{ model: User, as: 'updatedBy', attributes: ['id', 'name'] }],
      transaction,
      // the design's row only (the author is an outer join)
      lock: { level: transaction.LOCK.UPDATE, of: Design },
    });
    if (design === null) throw conflict('Save the design before issuing a version of it.');
    if (design.revision !== body.revision) {
      throw new StaleCopyError(
        `The draft has changed since you opened it (it is now at revision ${design.revision}). Reload it or compare before issuing.`,
        presentDesign(projectId, design),
      );
    }
    if (design.result === null || design.engineVersion !== ENGINE_VERSION) {
      throw conflict(
        'The draft was computed by an earlier engine. Open the design and save it, then issue.',
      );
    }
    const number = (await latestNumber(firmId, projectId, transaction)) + 1;
    const version = await DesignVersion.create(
      {
        firmId,
        projectId,
        designId: design.id,
        number,
        designRevision: design.revision,
        input: design.input,
        options: design.options,
        result: design.result,
        engineVersion: design.engineVersion,
        computedAt: design.computedAt ?? new Date(),
        figures: figuresOf(design.result),
        note: body.note,
        issuedById: actor.id,
        issuedByName: actor.name,
      },
      { transaction },
    );
    await recordAudit(
      {
        firmId,
        projectId,
        versionId: version.id,
        actor,
        action: 'version.issued',
        summary: `${actor.name} issued version ${number}${body.note === '' ? '' : `: ${body.note}`}`,
        detail: { number, designRevision: design.revision, engineVersion: design.engineVersion },
      },
      transaction,
    );
    return version.id;
  });
  return getVersion(firmId, projectId, id);
}

/**
 * The version under a row lock, refusing a superseded one for a review step. The caller has
 * checked the project (getProject) before the transaction: every query here uses it.
 */
async function lockVersion(
  firmId: string,
  projectId: string,
  versionId: string,
  transaction: Transaction,
): Promise<DesignVersion> {
  if (!isUuid(versionId)) throw notFound(NOT_FOUND);
  const version = await DesignVersion.findOne({
    where: { id: versionId, firmId, projectId },
    transaction,
    lock: transaction.LOCK.UPDATE,
  });
  if (version === null) throw notFound(NOT_FOUND);
  const later = await DesignVersion.count({
    where: { firmId, projectId, number: { [Op.gt]: version.number } },
    transaction,
  });
  if (later > 0) {
    throw conflict(
      `Version ${version.number} has been superseded by a later version; review the latest one.`,
    );
  }
  return version;
}

const STATE_WORDS: Record<ReviewState, string> = {
  not_sent: 'not sent for review',
  in_review: 'already in review',
  approved: 'already approved',
  returned: 'returned',
};

/** An engineer sends an issued version for review (from not sent, or after a return). */
export async function sendForReview(
  actor: User,
  projectId: string,
  versionId: string,
): Promise<{ version: DesignVersion; latest: number }> {
  const firmId = actor.firmId;
  await getProject(firmId, projectId);
  await sequelize.transaction(async (transaction) => {
    const version = await lockVersion(firmId, projectId, versionId, transaction);
    if (version.reviewState !== 'not_sent' && version.reviewState !== 'returned') {
      throw conflict(
        `Version ${version.number} is ${STATE_WORDS[version.reviewState as ReviewState]}.`,
      );
    }
    await version.update(
      {
        reviewState: 'in_review',
        sentById: actor.id,
        sentAt: new Date(),
        reviewedById: null,
        reviewedByName: null,
        reviewedAt: null,
        reviewerLicence: null,
        reviewerJurisdiction: null,
        reviewerStatement: null,
        reviewComments: null,
      },
      { transaction },
    );
    await recordAudit(
      {
        firmId,
        projectId,
        versionId,
        actor,
        action: 'version.sent',
        summary: `${actor.name} sent version ${version.number} for review`,
        detail: { number: version.number },
      },
      transaction,
    );
  });
  return getVersion(firmId, projectId, versionId);
}

/**
 * A marked reviewer approves or returns a version in review. Not their own: the member who
 * issued it or sent it cannot decide on it. The decision keeps the reviewer's name, licence,
 * jurisdiction and statement as they stand now (a later change of credentials leaves it as
 * signed).
 */
export async function decide(
  actor: User,
  projectId: string,
  versionId: string,
  decision: 'approve' | 'return',
  body: ReviewApproveInput | ReviewReturnInput,
): Promise<{ version: DesignVersion; latest: number }> {
  const firmId = actor.firmId;
  await getProject(firmId, projectId);
  await sequelize.transaction(async (transaction) => {
    const credential = await ReviewerCredential.findOne({
      where: { userId: actor.id, firmId },
      transaction,
    });
    const version = await lockVersion(firmId, projectId, versionId, transaction);
    if (credential === null) {
      throw forbidden('Only a member marked as licensed reviewer can approve or return a version.');
    }
    if (version.issuedById === actor.id || version.sentById === actor.id) {
      throw forbidden('You cannot review a version you issued or sent for review.');
    }
    if (version.reviewState !== 'in_review') {
      throw conflict(
        `Version ${version.number} is ${STATE_WORDS[version.reviewState as ReviewState]}, not waiting for review.`,
      );
    }
    const approved = decision === 'approve';
    await version.update(
      {
        reviewState: approved ? 'approved' : 'returned',
        reviewedById: actor.id,
        reviewedByName: actor.name,
        reviewedAt: new Date(),
        reviewerLicence: credential.licenceNumber,
        reviewerJurisdiction: credential.jurisdiction,
        reviewerStatement: approved ? credential.statement : null,
        reviewComments: body.comments === '' ? null : body.comments,
      },
      { transaction },
    );
    await recordAudit(
      {
        firmId,
        projectId,
        versionId,
        actor,
        action: approved ? 'version.approved' : 'version.returned',
        summary: approved
          ? `${actor.name} approved version ${version.number}`
          : `${actor.name} returned version ${version.number}: ${body.comments}`,
        detail: {
          number: version.number,
          licenceNumber: credential.licenceNumber,
          jurisdiction: credential.jurisdiction,
          ...(body.comments === '' ? {} : { comments: body.comments }),
        },
      },
      transaction,
    );
  });
  return getVersion(firmId, projectId, versionId);
}

export interface LatestVersionRow {
  projectId: string;
  id: string;
  number: number;
  reviewState: ReviewState;
  issuedAt: Date;
}

/** The latest issued version of each of the given projects of the firm (one query). */
export async function latestVersions(
  firmId: string,
  projectIds: string[],
): Promise<Map<string, LatestVersionRow>> {
  if (projectIds.length === 0) return new Map();
  const rows = await sequelize.query<LatestVersionRow>(
    `SELECT DISTINCT ON (project_id) project_id AS "projectId", id, number,
        review_state AS "reviewState", issued_at AS "issuedAt"
      FROM design_versions
      WHERE firm_id = $1 AND project_id = ANY(CAST($2 AS uuid[]))
      ORDER BY project_id, number DESC`,
    { bind: [firmId, projectIds], type: QueryTypes.SELECT },
  );
  return new Map(rows.map((r) => [r.projectId, r]));
}

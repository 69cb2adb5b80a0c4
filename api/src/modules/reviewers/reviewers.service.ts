import { can, type ReviewerMarkInput } from '@basinwright/common';
import { conflict, forbidden, notFound } from '../../errors';
import { ReviewerCredential, sequelize, User } from '../../models';
import { isUuid } from '../../security';
import { recordAudit } from '../audit/audit.service';

const NO_MEMBER = 'No such member.';
const OWNERS_ONLY = "Only an owner can change an owner's reviewer mark.";

/** The firm's reviewer credentials by member id. */
export async function credentialsOf(firmId: string): Promise<Map<string, ReviewerCredential>> {
  const rows = await ReviewerCredential.findAll({ where: { firmId } });
  return new Map(rows.map((r) => [r.userId, r]));
}

/**
 * Marks an active member whose role may review as licensed reviewer, or updates their licence,
 * jurisdiction and statement. Versions already decided keep the credentials they were signed with.
 */
export async function markReviewer(
  actor: User,
  memberId: string,
  input: ReviewerMarkInput,
): Promise<ReviewerCredential> {
  if (!isUuid(memberId)) throw notFound(NO_MEMBER);
  return sequelize.transaction(async (transaction) => {
    const member = await User.findOne({
      where: { id: memberId, firmId: actor.firmId },
      transaction,
    });
    if (member === null) throw notFound(NO_MEMBER);
    if (actor.role !== 'owner' && member.role === 'owner') throw forbidden(OWNERS_ONLY);
    if (!member.active) throw conflict('Reactivate the member before marking them as reviewer.');
    if (!can(member.role, 'versions.approve')) {
      throw conflict('A reviewer needs the owner, admin or engineer role.');
    }
    const existing = await ReviewerCredential.findOne({
      where: { userId: member.id },
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    const values = { ...input, markedById: actor.id };
    const credential = existing
      ? await existing.update(values, { transaction })
      : await ReviewerCredential.create(
          { userId: member.id, firmId: actor.firmId, ...values },
          { transaction },
        );
    await recordAudit(
      {
        firmId: actor.firmId,
        actor,
        action: 'reviewer.marked',
        summary: `${actor.name} marked ${member.name} as licensed reviewer (${input.licenceNumber}, ${input.jurisdiction})`,
        detail: {
          memberId: member.id,
          licenceNumber: input.licenceNumber,
          jurisdiction: input.jurisdiction,
        },
      },
      transaction,
    );
    return credential;
  });
}

/** Takes the reviewer mark off a member (404 when the member is not one of the firm's). */
export async function unmarkReviewer(actor: User, memberId: string): Promise<void> {
  if (!isUuid(memberId)) throw notFound(NO_MEMBER);
  await sequelize.transaction(async (transaction) => {
    const member = await User.findOne({
      where: { id: memberId, firmId: actor.firmId },
      transaction,
    });
    if (member === null) throw notFound(NO_MEMBER);
    if (actor.role !== 'owner' && member.role === 'owner') throw forbidden(OWNERS_ONLY);
    const removed = await ReviewerCredential.destroy({
      where: { userId: member.id, firmId: actor.firmId },
      transaction,
    });
    if (removed === 0) throw notFound(`${member.name} is not marked as reviewer.`);
    await recordAudit(
      {
        firmId: actor.firmId,
        actor,
        action: 'reviewer.unmarked',
        summary: `${actor.name} took the reviewer mark off ${member.name}`,
        detail: { memberId: member.id },
      },
      transaction,
    );
  });
}

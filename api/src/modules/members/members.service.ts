import { seatLimit, type MemberUpdateInput } from '@basinwright/common';
import { Op, type Transaction } from 'sequelize';
import { conflict, forbidden, notFound } from '../../errors';
import { Firm, Invitation, sequelize, User } from '../../models';
import { isUuid } from '../../security';
import { seatLimitError } from '../plans/plans.service';

/** Seats taken: active members plus open (unaccepted, unexpired) invitations. */
export async function seatsInUse(firmId: string, transaction: Transaction): Promise<number> {
  const [members, invitations] = await Promise.all([
    User.count({ where: { firmId, active: true }, transaction }),
    Invitation.count({
      where: { firmId, acceptedAt: { [Op.is]: null }, expiresAt: { [Op.gt]: new Date() } },
      transaction,
    }),
  ]);
  return members + invitations;
}

/**
 * Locks the firm row for the rest of the transaction, so member and seat changes of one firm
 * happen one after another (no two requests can both take the last seat or the last owner).
 */
export async function lockFirm(firmId: string, transaction: Transaction): Promise<Firm> {
  const firm = await Firm.findByPk(firmId, { lock: transaction.LOCK.UPDATE, transaction });
  if (firm === null) throw notFound();
  return firm;
}

export async function listMembers(firmId: string): Promise<User[]> {
  return User.findAll({
    where: { firmId },
    order: [
      ['createdAt', 'ASC'],
      ['id', 'ASC'],
    ],
  });
}

/**
 * Changes a member's role or active flag. An admin cannot touch an owner or make one; nobody
 * can demote or deactivate the last active owner; nobody can deactivate themselves;
 * reactivating needs a free seat.
 */
export async function updateMember(
  actor: User,
  memberId: string,
  input: MemberUpdateInput,
): Promise<User> {
  if (!isUuid(memberId)) throw notFound('No such member.');
  return sequelize.transaction(async (transaction) => {
    const firm = await lockFirm(actor.firmId, transaction);
    const member = await User.findOne({
      where: { id: memberId, firmId: actor.firmId },
      transaction,
    });
    if (member === null) throw notFound('No such member.');

    if (actor.role !== 'owner' && member.role === 'owner')
      throw forbidden('Only an owner can change an owner.');
    if (actor.role !== 'owner' && input.role === 'owner')
      throw forbidden('Only an owner can make someone an owner.');
    if (input.active === false && member.id === actor.id)
      throw forbidden('You cannot deactivate yourself.');

    const losesOwnership =
      member.role === 'owner' &&
      member.active &&
      ((input.role !== undefined && input.role !== 'owner') || input.active === false);
    if (losesOwnership) {
      const owners = await User.count({
        where: { firmId: firm.id, role: 'owner', active: true },
        transaction,
      });
      if (owners <= 1)
        throw conflict('A firm needs at least one active owner. Make someone else an owner first.');
    }

    if (input.active === true && !member.active) {
      if ((await seatsInUse(firm.id, transaction)) >= seatLimit(firm.plan, firm.seats)) {
        throw seatLimitError(firm);
      }
    }

    const changes: Partial<Pick<User, 'role' | 'active' | 'tokenVersion'>> = {};
    if (input.role !== undefined) changes.role = input.role;
    if (input.active !== undefined) changes.active = input.active;
    // A deactivated member's tokens die at once.
    if (input.active === false && member.active) changes.tokenVersion = member.tokenVersion + 1;
    await member.update(changes, { transaction });
    return member;
  });
}

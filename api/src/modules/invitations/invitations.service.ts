import {
  seatLimit,
  TOKEN_TTL_MS,
  type AcceptInvitationInput,
  type InvitationCreateInput,
} from '@basinwright/common';
import { Op } from 'sequelize';
import { conflict, invalidToken, notFound } from '../../errors';
import { invitationMail, invitedElsewhereMail, sendMail } from '../../mail';
import { Firm, Invitation, sequelize, User } from '../../models';
import { hashEmailToken, hashPassword, isUuid, newEmailToken } from '../../security';
import { EMAIL_TAKEN, type Session } from '../auth/auth.service';
import { issueToken } from '../auth/auth.tokens';
import { lockFirm, seatsInUse } from '../members/members.service';
import { seatLimitError } from '../plans/plans.service';

const invitedBy = { model: User, as: 'invitedBy', attributes: ['id', 'name'] };

/** Invitations not yet accepted (open or expired), newest first. */
export async function listInvitations(firmId: string): Promise<Invitation[]> {
  return Invitation.findAll({
    where: { firmId, acceptedAt: { [Op.is]: null } },
    include: [invitedBy],
    order: [
      ['createdAt', 'DESC'],
      ['id', 'DESC'],
    ],
  });
}

/**
 * Invites an address to the firm and e-mails the link. Needs a free seat; the e-mail must not
 * belong to a member or to another open invitation of the firm. An address with an account in
 * another firm gets the same answer (the invitation is recorded, holding its seat until
 * withdrawn) and a notice instead of a link, so inviting does not reveal who has an account.
 * The e-mail is sent inside the transaction: if it cannot be sent, nothing is saved.
 */
export async function createInvitation(
  actor: User,
  input: InvitationCreateInput,
): Promise<Invitation> {
  const { token, tokenHash } = newEmailToken();
  const id = await sequelize.transaction(async (transaction) => {
    const firm = await lockFirm(actor.firmId, transaction);
    // A member of this firm is the firm's own business; an account elsewhere is not: that
    // invitation is answered like any other, and its owner is told by e-mail instead.
    const account = await User.findOne({
      where: { email: input.email },
      attributes: ['id', 'firmId', 'name'],
      transaction,
    });
    if (account !== null && account.firmId === firm.id)
      throw conflict('This person is already a member of your firm.');
    const previous = await Invitation.findOne({
      where: { firmId: firm.id, email: input.email, acceptedAt: { [Op.is]: null } },
      transaction,
    });
    if (previous !== null) {
      if (previous.expiresAt > new Date())
        throw conflict('This address already has an open invitation.');
      await previous.destroy({ transaction });
    }
    if ((await seatsInUse(firm.id, transaction)) >= seatLimit(firm.plan, firm.seats)) {
      throw seatLimitError(firm);
    }
    const invitation = await Invitation.create(
      {
        firmId: firm.id,
        email: input.email,
        role: input.role,
        tokenHash,
        expiresAt: new Date(Date.now() + TOKEN_TTL_MS.invitation),
        invitedById: actor.id,
      },
      { transaction },
    );
    await sendMail(
      account === null
        ? invitationMail(input.email, firm.name, actor.name, input.role, token)
        : invitedElsewhereMail(input.email, account.name, firm.name, actor.name),
    );
    return invitation.id;
  });
  return Invitation.findByPk(id, { include: [invitedBy], rejectOnEmpty: true });
}

/** Withdraws an invitation not yet accepted. */
export async function revokeInvitation(firmId: string, invitationId: string): Promise<void> {
  if (!isUuid(invitationId)) throw notFound('No such invitation.');
  const removed = await Invitation.destroy({
    where: { id: invitationId, firmId, acceptedAt: { [Op.is]: null } },
  });
  if (removed === 0) throw notFound('No such invitation.');
}

/** Not yet accepted and not expired. */
function isOpen(invitation: Invitation | null): invitation is Invitation {
  return invitation !== null && invitation.acceptedAt === null && invitation.expiresAt > new Date();
}

async function openInvitation(token: string): Promise<Invitation | null> {
  const invitation = await Invitation.findOne({ where: { tokenHash: hashEmailToken(token) } });
  return isOpen(invitation) ? invitation : null;
}

/** What an open invitation offers; 404 when the token is unknown, used or expired. */
export async function previewInvitation(
  token: string,
): Promise<{ invitation: Invitation; firmName: string }> {
  const invitation = token.length <= 128 ? await openInvitation(token) : null;
  if (invitation === null) throw notFound('This invitation is invalid or has expired.');
  const firm = await Firm.findByPk(invitation.firmId, { rejectOnEmpty: true });
  return { invitation, firmName: firm.name };
}

/** Creates the member from an open invitation (single use) and signs them in. */
export async function acceptInvitation(input: AcceptInvitationInput): Promise<Session> {
  const passwordHash = await hashPassword(input.password);
  const tokenHash = hashEmailToken(input.token);
  const invalid = () =>
    invalidToken('This invitation is invalid or has expired. Ask for a new one.');
  const ids = await sequelize.transaction(async (transaction) => {
    const found = await Invitation.findOne({ where: { tokenHash }, transaction });
    if (found === null) throw invalid();
    // Lock order firm → invitation, as in createInvitation, so the two cannot deadlock.
    const firm = await lockFirm(found.firmId, transaction);
    const invitation = await Invitation.findByPk(found.id, {
      lock: transaction.LOCK.UPDATE,
      transaction,
    });
    if (!isOpen(invitation)) throw invalid();
    if ((await User.count({ where: { email: invitation.email }, transaction })) > 0)
      throw conflict(EMAIL_TAKEN);
    // The invitation already holds a seat; the plan may have shrunk since it was sent.
    if ((await seatsInUse(firm.id, transaction)) > seatLimit(firm.plan, firm.seats))
      throw seatLimitError(firm);
    const user = await User.create(
      {
        firmId: firm.id,
        name: input.name,
        email: invitation.email,
        passwordHash,
        role: invitation.role,
        lastLoginAt: new Date(),
      },
      { transaction },
    );
    await invitation.update({ acceptedAt: new Date() }, { transaction });
    return { firm: firm.id, user: user.id };
  });
  const user = await User.findByPk(ids.user, { rejectOnEmpty: true });
  const firm = await Firm.findByPk(ids.firm, { rejectOnEmpty: true });
  return { token: issueToken(user), user, firm };
}

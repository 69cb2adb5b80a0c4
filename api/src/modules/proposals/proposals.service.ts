// Proposals: drawn from an issued version by a background job (jobs.ts → the proposal worker
// thread), stored with the version they came from, downloaded, and e-mailed to the client.
import { Op } from 'sequelize';
import type { ProposalSendInput } from '@basinwright/common';
import { getConfig } from '../../config/env';
import { conflict, notFound } from '../../errors';
import { queueProposal } from '../../jobs';
import { logger } from '../../logger';
import { sendMail } from '../../mail';
import {
  DesignVersion,
  Firm,
  Project,
  Proposal,
  ProposalEmail,
  sequelize,
  User,
} from '../../models';
import { isUuid } from '../../security';
import { recordAudit } from '../audit/audit.service';
import { issuedEstimateFor, issuedEstimates } from '../estimates/estimates.service';
import { getProject } from '../projects/projects.service';
import type { ProposalBrand, ProposalSource } from './proposal.document';
import { renderInWorker } from './proposal.pool';

import { brandFor } from '../brand/brand.service';

const NOT_FOUND = 'Proposal not found.';
const emails = { model: ProposalEmail, as: 'emails' };

/** Proposals kept per project in the list (newest first). */
export const PROPOSAL_LIST_LIMIT = 20;

/** The brand of a paid plan (null on Concept, whose proposals carry the watermark instead). */
export function brandOf(firm: Firm): ProposalBrand | null {
  const brand = brandFor(firm);
  if (brand === null) return null;
  return { color: brand.color, logo: brand.logo, footer: brand.footer };
}

async function versionOf(firmId: string, projectId: string, versionId: string) {
  const version = isUuid(versionId)
    ? await DesignVersion.findOne({ where: { id: versionId, firmId, projectId } })
    : null;
  if (version === null) throw notFound('Issued version not found.');
  return version;
}

/**
 * Queues the proposal of an issued version. A proposal of the same version still waiting or
 * being drawn is answered instead of a second one.
 */
export async function createProposal(
  firmId: string,
  projectId: string,
  userId: string,
  versionId: string,
): Promise<{ proposal: Proposal; created: boolean }> {
  await getProject(firmId, projectId);
  const version = await versionOf(firmId, projectId, versionId);
  const pending = await Proposal.findOne({
    where: { firmId, versionId: version.id, status: { [Op.in]: ['queued', 'rendering'] } },
    include: [emails],
  });
  if (pending !== null) return { proposal: pending, created: false };
  const proposal = await Proposal.create({
    firmId,
    projectId,
    versionId: version.id,
    requestedById: userId,
  });
  try {
    await queueProposal(proposal.id);
  } catch (error) {
    await proposal.update({ status: 'failed', error: 'The proposal could not be queued.' });
    throw error;
  }
  proposal.emails = [];
  return { proposal, created: true };
}

export async function listProposals(firmId: string, projectId: string): Promise<Proposal[]> {
  await getProject(firmId, projectId);
  return Proposal.findAll({
    where: { firmId, projectId },
    include: [emails],
    order: [
      ['createdAt', 'DESC'],
      ['id', 'DESC'],
      [{ model: ProposalEmail, as: 'emails' }, 'sentAt', 'ASC'],
    ],
    limit: PROPOSAL_LIST_LIMIT,
  });
}

export async function getProposal(
  firmId: string,
  projectId: string,
  proposalId: string,
): Promise<Proposal> {
  await getProject(firmId, projectId);
  const proposal = isUuid(proposalId)
    ? await Proposal.findOne({
        where: { id: proposalId, firmId, projectId },
        include: [emails],
        order: [[{ model: ProposalEmail, as: 'emails' }, 'sentAt', 'ASC']],
      })
    : null;
  if (proposal === null) throw notFound(NOT_FOUND);
  return proposal;
}

/** The PDF of a finished proposal, with a file name; 409 while it is not ready. */
export async function proposalPdf(
  firmId: string,
  projectId: string,
  proposalId: string,
): Promise<{ pdf: Buffer; filename: string }> {
  const proposal = await getProposal(firmId, projectId, proposalId);
  if (proposal.status !== 'done')
    throw conflict(
      proposal.status === 'failed'
        ? 'This proposal could not be made, so there is nothing to download.'
        : 'This proposal is still being drawn. Try again when it says Ready.',
    );
  const row = await Proposal.unscoped().findByPk(proposal.id, { attributes: ['pdf'] });
  const version = await DesignVersion.findByPk(proposal.versionId, { attributes: ['number'] });
  const project = await Project.findByPk(projectId, { attributes: ['name'] });
  if (row?.pdf == null) throw notFound(NOT_FOUND);
  return { pdf: row.pdf, filename: fileName(project?.name ?? 'proposal', version?.number ?? 0) };
}

/** "fenwick-mill-pond-auxiliary-spillway-outlet-proposal-v2.pdf" */
export function fileName(projectName: string, versionNumber: number): string {
  const slug = projectName
    .normalize('NFKD')
    .replace(/[^\w\s-]/g, '')
    .trim()
    .toLowerCase()
    .replace(/[\s_-]+/g, '-')
    .slice(0, 80);
  return `${slug || 'project'}-proposal-v${versionNumber}.pdf`;
}

/** Everything the PDF prints, read from the database now. */
export async function proposalSource(proposal: Proposal, now: Date): Promise<ProposalSource> {
  const [firm, project, version] = await Promise.all([
    Firm.findByPk(proposal.firmId),
    Project.findByPk(proposal.projectId),
    DesignVersion.findByPk(proposal.versionId),
  ]);
  if (firm === null || project === null || version === null)
    throw new Error('the proposal’s firm, project or version is gone');
  const cost = issuedEstimateFor(await issuedEstimates(firm.id, project.id), version);
  return {
    firm: {
      name: firm.name,
      plan: firm.plan,
      brand: brandOf(firm),
      sealStatement: firm.sealStatement,
    },
    project: {
      name: project.name,
      client: project.client,
      location: project.location,
      units: project.units,
    },
    version: {
      number: version.number,
      input: version.input,
      result: version.result,
      engineVersion: version.engineVersion,
      computedAt: version.computedAt,
      issuedByName: version.issuedByName,
      issuedAt: version.issuedAt,
      note: version.note,
    },
    review: {
      state: version.reviewState,
      reviewedByName: version.reviewedByName,
      reviewedAt: version.reviewedAt,
      licence: version.reviewerLicence,
      jurisdiction: version.reviewerJurisdiction,
      statement: version.reviewerStatement,
    },
    cost,
    generatedAt: now,
  };
}

/**
 * The job: marks the proposal as being drawn, draws it in the worker thread and stores the
 * PDF, or records why it could not be made (the page cap, or an error). Never throws for a
 * proposal's own failure, so the queue does not retry what would fail again.
 */
export async function runProposalJob(proposalId: string): Promise<void> {
  const [claimed] = await Proposal.update(
    { status: 'rendering', startedAt: new Date() },
    { where: { id: proposalId, status: { [Op.in]: ['queued', 'rendering'] } } },
  );
  if (claimed === 0) return; // gone, or already finished
  const proposal = await Proposal.findByPk(proposalId);
  if (proposal === null) return;
  try {
    const source = await proposalSource(proposal, new Date());
    const reply = await renderInWorker({ source, maxPages: getConfig().proposalMaxPages });
    if (reply.ok) {
      const pdf = Buffer.from(reply.pdf);
      const requester =
        proposal.requestedById === null
          ? null
          : await User.findByPk(proposal.requestedById, { attributes: ['id', 'name'] });
      await sequelize.transaction(async (transaction) => {
        await proposal.update(
          {
            status: 'done',
            pdf,
            pages: reply.pages,
            byteSize: pdf.length,
            renderedAt: new Date(),
            error: null,
          },
          { transaction },
        );
        await recordAudit(
          {
            firmId: proposal.firmId,
            projectId: proposal.projectId,
            versionId: proposal.versionId,
            actor: { id: requester?.id ?? null, name: requester?.name ?? 'A former member' },
            action: 'proposal.rendered',
            summary: `Proposal of version ${source.version.number} drawn (${reply.pages} pages), as ${requester?.name ?? 'a former member'} asked`,
            detail: {
              number: source.version.number,
              proposalId: proposal.id,
              pages: reply.pages,
              byteSize: pdf.length,
            },
          },
          transaction,
        );
      });
    } else await proposal.update({ status: 'failed', error: reply.message });
  } catch (error) {
    logger().error({ err: error, proposalId }, 'proposal not drawn');
    await proposal.update({
      status: 'failed',
      error: 'The proposal could not be drawn. Try again; if it keeps failing, tell us.',
    });
  }
}

function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (ch) => `&#${ch.charCodeAt(0)};`);
}

/** E-mails a finished proposal to the client, the firm as sender name, and records it. */
export async function sendProposal(
  firmId: string,
  projectId: string,
  proposalId: string,
  sender: User,
  body: ProposalSendInput,
): Promise<Proposal> {
  const { pdf, filename } = await proposalPdf(firmId, projectId, proposalId);
  const proposal = await getProposal(firmId, projectId, proposalId);
  const [firm, project, version] = await Promise.all([
    Firm.findByPk(firmId),
    Project.findByPk(projectId),
    DesignVersion.findByPk(proposal.versionId),
  ]);
  if (firm === null || project === null || version === null) throw notFound(NOT_FOUND);
  const subject = `${project.name} — concept proposal, version ${version.number}`;
  const intro = body.message
    ? body.message
    : `Please find attached our concept proposal for ${project.name} (version ${version.number}).`;
  const text = `${intro}\n\n${sender.name}\n${firm.name}\n`;
  await sendMail({
    to: body.to,
    subject,
    text,
    html: `${intro
      .split(/\n{2,}/)
      .map((p) => `<p>${escapeHtml(p).replace(/\n/g, '<br>')}</p>`)
      .join('')}<p>${escapeHtml(sender.name)}<br>${escapeHtml(firm.name)}</p>`,
    fromName: firm.name,
    attachments: [{ filename, content: pdf, contentType: 'application/pdf' }],
  });
  await sequelize.transaction(async (transaction) => {
    await ProposalEmail.create(
      {
        firmId,
        proposalId: proposal.id,
        versionId: proposal.versionId,
        recipient: body.to,
        subject,
        sentById: sender.id,
        sentByName: sender.name,
      },
      { transaction },
    );
    await recordAudit(
      {
        firmId,
        projectId,
        versionId: proposal.versionId,
        actor: sender,
        action: 'proposal.sent',
        summary: `${sender.name} e-mailed the proposal of version ${version.number} to ${body.to}`,
        detail: { number: version.number, proposalId: proposal.id, to: body.to, subject },
      },
      transaction,
    );
  });
  return getProposal(firmId, projectId, proposalId);
}

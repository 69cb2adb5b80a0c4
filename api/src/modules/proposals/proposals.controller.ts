import type { Request, Response } from 'express';
import type { ProposalCreateInput, ProposalSendInput } from '@basinwright/common';
import { authOf } from '../../middlewares/auth';
import { presentProposal } from './proposals.presenter';
import * as proposals from './proposals.service';

type Params = { id: string; proposalId: string };

export async function list(req: Request<{ id: string }>, res: Response): Promise<void> {
  const items = await proposals.listProposals(authOf(req).firm.id, req.params.id);
  res.json({ items: items.map(presentProposal) });
}

export async function create(req: Request<{ id: string }>, res: Response): Promise<void> {
  const { user, firm } = authOf(req);
  const { versionId } = req.body as ProposalCreateInput;
  const { proposal, created } = await proposals.createProposal(
    firm.id,
    req.params.id,
    user.id,
    versionId,
  );
  res.status(created ? 202 : 200).json(presentProposal(proposal));
}

export async function read(req: Request<Params>, res: Response): Promise<void> {
  const p = await proposals.getProposal(authOf(req).firm.id, req.params.id, req.params.proposalId);
  res.json(presentProposal(p));
}

export async function pdf(req: Request<Params>, res: Response): Promise<void> {
  const file = await proposals.proposalPdf(
    authOf(req).firm.id,
    req.params.id,
    req.params.proposalId,
  );
  res
    .type('application/pdf')
    .set('Content-Disposition', `attachment; filename="${file.filename}"`)
    .set('Cache-Control', 'private, no-store')
    .send(file.pdf);
}

export async function send(req: Request<Params>, res: Response): Promise<void> {
  const { user, firm } = authOf(req);
  const p = await proposals.sendProposal(
    firm.id,
    req.params.id,
    req.params.proposalId,
    user,
    req.body as ProposalSendInput,
  );
  res.json(presentProposal(p));
}

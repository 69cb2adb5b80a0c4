import type { Request, Response } from 'express';
import type { ReviewApproveInput, ReviewReturnInput, VersionIssueInput } from '@basinwright/common';
import { authOf } from '../../middlewares/auth';
import { presentVersion, presentVersionList } from './versions.presenter';
import * as versions from './versions.service';
import type { DesignVersion } from '../../models';

/** A version as the API shows it, its cost filled in from the issued estimates. */
async function present(version: DesignVersion, latest: number) {
  const costs = await versions.costsOf(version.firmId, version.projectId, [version]);
  return presentVersion(version, latest, costs.get(version.id) ?? null);
}

type VersionParams = { id: string; versionId: string };

export async function list(req: Request<{ id: string }>, res: Response): Promise<void> {
  const { user, firm } = authOf(req);
  const {
    versions: items,
    status,
    reviewer,
  } = await versions.listVersions(firm.id, req.params.id, user.id);
  const costs = await versions.costsOf(firm.id, req.params.id, items);
  res.json(presentVersionList(items, status, reviewer, costs));
}

export async function issue(req: Request<{ id: string }>, res: Response): Promise<void> {
  const { version, latest } = await versions.issueVersion(
    authOf(req).user,
    req.params.id,
    req.body as VersionIssueInput,
  );
  res.status(201).json(await present(version, latest));
}

export async function read(req: Request<VersionParams>, res: Response): Promise<void> {
  const { id, versionId } = req.params;
  const { version, latest } = await versions.getVersion(authOf(req).firm.id, id, versionId);
  res.json(await present(version, latest));
}

export async function refuseChange(req: Request<VersionParams>): Promise<void> {
  await versions.refuseChange(authOf(req).firm.id, req.params.id, req.params.versionId);
}

export async function send(req: Request<VersionParams>, res: Response): Promise<void> {
  const { id, versionId } = req.params;
  const { version, latest } = await versions.sendForReview(authOf(req).user, id, versionId);
  res.json(await present(version, latest));
}

export async function approve(req: Request<VersionParams>, res: Response): Promise<void> {
  const { id, versionId } = req.params;
  const body = req.body as ReviewApproveInput;
  const { version, latest } = await versions.decide(
    authOf(req).user,
    id,
    versionId,
    'approve',
    body,
  );
  res.json(await present(version, latest));
}

export async function giveBack(req: Request<VersionParams>, res: Response): Promise<void> {
  const { id, versionId } = req.params;
  const body = req.body as ReviewReturnInput;
  const { version, latest } = await versions.decide(
    authOf(req).user,
    id,
    versionId,
    'return',
    body,
  );
  res.json(await present(version, latest));
}

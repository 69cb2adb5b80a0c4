import type { Request, Response } from 'express';
import { authOf } from '../../middlewares/auth';
import { presentAuditEvents } from './audit.presenter';
import * as audit from './audit.service';

export async function listFirm(req: Request, res: Response): Promise<void> {
  res.json(presentAuditEvents(await audit.listFirmAudit(authOf(req).firm.id)));
}

export async function listProject(req: Request<{ id: string }>, res: Response): Promise<void> {
  res.json(presentAuditEvents(await audit.listProjectAudit(authOf(req).firm.id, req.params.id)));
}

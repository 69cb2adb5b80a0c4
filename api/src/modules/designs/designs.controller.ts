import type { Request, Response } from 'express';
import type { DesignSaveInput } from '@basinwright/common';
import { authOf } from '../../middlewares/auth';
import { presentDesign } from './designs.presenter';
import * as designs from './designs.service';
import { requireProjectWritable } from '../plans/plans.service';

export async function read(req: Request<{ id: string }>, res: Response): Promise<void> {
  const design = await designs.getDesign(authOf(req).firm.id, req.params.id);
  res.json(presentDesign(req.params.id, design));
}

export async function save(req: Request<{ id: string }>, res: Response): Promise<void> {
  const { user, firm } = authOf(req);
  await requireProjectWritable(firm, req.params.id);
  const design = await designs.saveDesign(
    firm.id,
    req.params.id,
    user.id,
    req.body as DesignSaveInput,
  );
  res.json(presentDesign(req.params.id, design));
}

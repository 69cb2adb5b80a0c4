import type { Request, Response } from 'express';
import type { MemberUpdateInput } from '@basinwright/common';
import { authOf } from '../../middlewares/auth';
import { presentMember, presentMembers } from './members.presenter';
import * as members from './members.service';

export async function list(req: Request, res: Response): Promise<void> {
  res.json(presentMembers(await members.listMembers(authOf(req).firm.id)));
}

export async function update(req: Request<{ id: string }>, res: Response): Promise<void> {
  const member = await members.updateMember(
    authOf(req).user,
    req.params.id,
    req.body as MemberUpdateInput,
  );
  res.json(presentMember(member));
}

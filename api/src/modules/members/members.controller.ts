import type { Request, Response } from 'express';
import type { MemberUpdateInput } from '@basinwright/common';
import { authOf } from '../../middlewares/auth';
import { presentMember, presentMembers } from './members.presenter';
import * as members from './members.service';
import { credentialsOf } from '../reviewers/reviewers.service';

export async function list(req: Request, res: Response): Promise<void> {
  const firmId = authOf(req).firm.id;
  const [users, reviewers] = await Promise.all([
    members.listMembers(firmId),
    credentialsOf(firmId),
  ]);
  res.json(presentMembers(users, reviewers));
}

export async function update(req: Request<{ id: string }>, res: Response): Promise<void> {
  const member = await members.updateMember(
    authOf(req).user,
    req.params.id,
    req.body as MemberUpdateInput,
  );
  res.json(presentMember(member));
}

import type { Request, Response } from 'express';
import type { ReviewerMarkInput } from '@basinwright/common';
import { authOf } from '../../middlewares/auth';
import { presentReviewer } from './reviewers.presenter';
import * as reviewers from './reviewers.service';

export async function mark(req: Request<{ id: string }>, res: Response): Promise<void> {
  const credential = await reviewers.markReviewer(
    authOf(req).user,
    req.params.id,
    req.body as ReviewerMarkInput,
  );
  res.json(presentReviewer(credential));
}

export async function unmark(req: Request<{ id: string }>, res: Response): Promise<void> {
  await reviewers.unmarkReviewer(authOf(req).user, req.params.id);
  res.status(204).end();
}

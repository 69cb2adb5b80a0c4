import type { Request, Response } from 'express';
import type { JumpSituation, StudyInput } from '@basinwright/common';
import { presentJump, presentStudy } from './calc.presenter';
import * as calc from './calc.service';

export function jump(req: Request, res: Response): void {
  // Cast by validate(jumpRequestSchema).
  res.json(presentJump(calc.calculateJump(req.body as calc.JumpRequest)));
}

export function study(req: Request, res: Response): void {
  // Cast by validate(studyInputSchema).
  res.json(presentStudy(calc.calculateStudy(req.body as StudyInput)));
}

export function jumpPosition(req: Request, res: Response): void {
  // Cast by validate(jumpSituationSchema).
  res.json(calc.calculateJumpPosition(req.body as JumpSituation));
}

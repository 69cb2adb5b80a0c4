import type { Request, Response } from 'express';
import type { StudyInput } from '@basinwright/common';
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

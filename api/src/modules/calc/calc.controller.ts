import type { Request, Response } from 'express';
import type { CheapestRequest, JumpSituation, StudyInput } from '@basinwright/common';
import * as calc from './calc.service';

// The worker presents the results (calc.worker.ts): the controllers only send them.

export async function jump(req: Request, res: Response): Promise<void> {
  // Cast by validate(jumpRequestSchema).
  res.json(await calc.calculateJump(req.body as calc.JumpRequest));
}

export async function study(req: Request, res: Response): Promise<void> {
  // Cast by validate(studyInputSchema).
  res.type('application/json').send(await calc.calculateStudyJson(req.body as StudyInput));
}

export async function jumpPosition(req: Request, res: Response): Promise<void> {
  // Cast by validate(jumpSituationSchema).
  res.json(await calc.calculateJumpPosition(req.body as JumpSituation));
}

export async function cheapest(req: Request, res: Response): Promise<void> {
  // Cast by validate(cheapestRequestSchema).
  res.json(await calc.calculateCheapest(req.body as CheapestRequest));
}

import type { Request, Response } from 'express';
import type { Sequelize } from 'sequelize';
import { presentHealth } from './health.presenter';
import { checkHealth } from './health.service';

export function healthController(sequelize: Sequelize) {
  return async (_req: Request, res: Response): Promise<void> => {
    const health = await checkHealth(sequelize);
    res.setHeader('Cache-Control', 'no-store');
    res.status(health.db === 'ok' ? 200 : 503).json(presentHealth(health));
  };
}

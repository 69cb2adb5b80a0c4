import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { healthController } from './health.controller';

export function healthRouter(sequelize: Sequelize): Router {
  const router = Router();
  router.get('/', healthController(sequelize));
  return router;
}

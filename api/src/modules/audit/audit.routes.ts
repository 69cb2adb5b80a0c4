import { Router } from 'express';
import { guard } from '../../middlewares/auth';
import * as controller from './audit.controller';

/** The firm's audit trail: GET /audit (the firm's latest steps). */
export function auditRouter(): Router {
  const router = Router();
  router.get('/', guard('audit.firm'), controller.listFirm);
  return router;
}

/** GET /projects/:id/audit: every step on one project. */
export function projectAuditRouter(): Router {
  const router = Router();
  router.get('/:id/audit', guard('audit.project'), controller.listProject);
  return router;
}

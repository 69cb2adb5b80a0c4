import { Router } from 'express';
import {
  estimateCreateSchema,
  estimateOverrideSchema,
  estimateUpdateSchema,
  priceExportQuerySchema,
} from '@basinwright/common';
import { guard } from '../../middlewares/auth';
import { validate } from '../../middlewares/validate';
import * as controller from './estimates.controller';

/** Mounted under /projects: a project's take-off and its estimate revisions. */
export function projectEstimatesRouter(): Router {
  const router = Router();
  router.get('/:id/takeoff', guard('takeoff.read'), controller.readTakeoff);
  router.put('/:id/takeoff/overrides', guard('takeoff.write'), controller.saveTakeoffOverrides);
  router.get(
    '/:id/alternatives/export',
    guard('alternatives.export'),
    validate(priceExportQuerySchema, 'query'),
    controller.exportAlternatives,
  );
  router.get('/:id/estimates', guard('estimates.list'), controller.list);
  router.post(
    '/:id/estimates',
    guard('estimates.create'),
    validate(estimateCreateSchema),
    controller.create,
  );
  return router;
}

/** Mounted under /estimates: one revision. */
export function estimatesRouter(): Router {
  const router = Router();
  router.get('/:id', guard('estimates.read'), controller.read);
  router.patch(
    '/:id',
    guard('estimates.update'),
    validate(estimateUpdateSchema),
    controller.update,
  );
  router.post(
    '/:id/overrides',
    guard('estimates.override'),
    validate(estimateOverrideSchema),
    controller.override,
  );
  router.post('/:id/issue', guard('estimates.issue'), controller.issue);
  router.get(
    '/:id/export',
    guard('estimates.export'),
    validate(priceExportQuerySchema, 'query'),
    controller.exportEstimate,
  );
  return router;
}

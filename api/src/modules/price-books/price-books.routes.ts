import { Router } from 'express';
import {
  priceBookCreateSchema,
  priceBookUpdateSchema,
  priceExportQuerySchema,
  priceItemsSchema,
} from '@basinwright/common';
import { guard } from '../../middlewares/auth';
import { validate } from '../../middlewares/validate';
import * as controller from './price-books.controller';
import { spreadsheetUpload } from './price-books.upload';

export function priceBooksRouter(): Router {
  const router = Router();
  router.get('/', guard('priceBooks.list'), controller.list);
  router.post('/', guard('priceBooks.create'), validate(priceBookCreateSchema), controller.create);
  router.post(
    '/import/preview',
    guard('priceBooks.preview'),
    spreadsheetUpload,
    controller.preview,
  );
  router.get('/:id', guard('priceBooks.read'), controller.read);
  router.patch(
    '/:id',
    guard('priceBooks.update'),
    validate(priceBookUpdateSchema),
    controller.update,
  );
  router.put(
    '/:id/items',
    guard('priceBooks.items'),
    validate(priceItemsSchema),
    controller.replaceItems,
  );
  router.post('/:id/copy', guard('priceBooks.copy'), controller.copy);
  router.post('/:id/import', guard('priceBooks.import'), spreadsheetUpload, controller.importItems);
  router.get(
    '/:id/export',
    guard('priceBooks.export'),
    validate(priceExportQuerySchema, 'query'),
    controller.exportBook,
  );
  return router;
}

import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { LOGO_LIMITS, brandUpdateSchema } from '@basinwright/common';
import { ApiError, badRequest, payloadTooLarge } from '../../errors';
import { guard } from '../../middlewares/auth';
import { validate } from '../../middlewares/validate';
import * as controller from './brand.controller';

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: LOGO_LIMITS.maxBytes, files: 1, fields: 0, parts: 2 },
});

/** One file in the field `logo`, held in memory; multer's refusals become our 4xx errors. */
const logoFile: RequestHandler = (req, res, next) => {
  if (!req.is('multipart/form-data'))
    throw new ApiError(
      415,
      'unsupported_media_type',
      'Send the logo as multipart/form-data in the field "logo".',
    );
  upload.single('logo')(req, res, (error: unknown) => {
    if (error === undefined || error === null) return next();
    if (error instanceof multer.MulterError) {
      if (error.code === 'LIMIT_FILE_SIZE')
        return next(payloadTooLarge('The logo is larger than 1 MB.'));
      return next(badRequest('Send one file, in the field "logo", and nothing else.'));
    }
    next(badRequest('The upload could not be read.'));
  });
};

/** The firm's brand, under /firm/brand. */
export function brandRouter(): Router {
  const router = Router();
  router.get('/', guard('brand.read'), controller.read);
  router.put('/', guard('brand.update'), validate(brandUpdateSchema), controller.update);
  router.get('/logo', guard('brand.logo.read'), controller.readLogo);
  router.put('/logo', guard('brand.logo.upload'), logoFile, controller.uploadLogo);
  router.delete('/logo', guard('brand.logo.remove'), controller.removeLogo);
  return router;
}

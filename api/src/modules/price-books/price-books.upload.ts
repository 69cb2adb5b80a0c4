import type { RequestHandler } from 'express';
import multer from 'multer';
import {
  PRICE_BOOK_LIMITS,
  priceImportMappingSchema,
  type PriceImportMapping,
} from '@basinwright/common';
import { ValidationError } from 'yup';
import { ApiError, badRequest, payloadTooLarge, validationError } from '../../errors';
import { detailsOf } from '../../middlewares/validate';

const L = PRICE_BOOK_LIMITS;
const MB = L.maxFileBytes / (1024 * 1024);

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: L.maxFileBytes, files: 1, fields: 4, fieldSize: 16 * 1024, parts: 6 },
}).single('file');

/**
 * One spreadsheet in the multipart field `file` (held in memory, at most 5 MB) and text fields
 * beside it. Every way an upload can be wrong is a 4xx that says what to send.
 */
export const spreadsheetUpload: RequestHandler = (req, res, next) => {
  if (!req.is('multipart/form-data')) {
    next(
      new ApiError(
        415,
        'unsupported_media_type',
        'Send the spreadsheet as multipart/form-data, in a field named file.',
      ),
    );
    return;
  }
  upload(req, res, (error: unknown) => {
    if (error === undefined || error === null) {
      if (req.file === undefined) {
        next(validationError({ file: 'Choose a CSV or XLSX file (field "file").' }));
        return;
      }
      next();
      return;
    }
    if (error instanceof multer.MulterError) {
      if (error.code === 'LIMIT_FILE_SIZE')
        next(payloadTooLarge(`The file is larger than ${MB} MB, the most an import takes.`));
      else if (error.code === 'LIMIT_UNEXPECTED_FILE')
        next(badRequest('Send one file, in a field named file.'));
      else next(badRequest(`The upload could not be read (${error.message}).`));
      return;
    }
    // busboy: a truncated or malformed multipart body.
    next(badRequest('The upload could not be read: the multipart body is malformed.'));
  });
};

/** The `mapping` text field: JSON naming the column of each field. */
export function mappingField(body: unknown, required: boolean): PriceImportMapping | undefined {
  const raw = (body as Record<string, unknown> | undefined)?.mapping;
  if (raw === undefined || raw === '') {
    if (!required) return undefined;
    throw validationError({ mapping: 'Send the column mapping (field "mapping", JSON).' });
  }
  if (typeof raw !== 'string')
    throw validationError({ mapping: 'Send the mapping once, as JSON text.' });
  let parsed: unknown;
  try {
    parsed = JSON.parse(raw);
  } catch {
    throw validationError({ mapping: 'The mapping is not valid JSON.' });
  }
  if (typeof parsed !== 'object' || parsed === null || Array.isArray(parsed))
    throw validationError({ mapping: 'The mapping is a JSON object: field → column name.' });
  try {
    return priceImportMappingSchema.validateSync(parsed, {
      abortEarly: false,
    }) as PriceImportMapping;
  } catch (error) {
    if (error instanceof TypeError) throw validationError({ mapping: 'Each column name is text.' });
    if (!(error instanceof ValidationError)) throw error;
    const details = Object.fromEntries(
      Object.entries(detailsOf(error, 'body')).map(([k, v]) => [
        k === 'body' ? 'mapping' : `mapping.${k}`,
        v,
      ]),
    );
    throw validationError(details, Object.values(details)[0]);
  }
}

/** The `mode` text field of an import: merge (default) or replace. */
export function modeField(body: unknown): 'merge' | 'replace' {
  const raw = (body as Record<string, unknown> | undefined)?.mode;
  if (raw === undefined || raw === '' || raw === 'merge') return 'merge';
  if (raw === 'replace') return 'replace';
  throw validationError({ mode: 'The mode is merge or replace.' });
}

// The manifest arrives as one multipart file in the field `file`, held in memory (2 MB at most) and decoded as UTF-8.
// Every refusal is a 400 that names the rule, never multer's own error text.
import type { Request, RequestHandler } from 'express';
import multer from 'multer';
import { MANIFEST_MAX_BYTES } from '@shared/schemas/manifest';
import { badRequest, DomainError } from '../../domain/errors';

export const MANIFEST_FIELD = 'file';

const isCsv = (file: Express.Multer.File) => file.mimetype === 'text/csv' || /\.csv$/i.test(file.originalname);

const single = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MANIFEST_MAX_BYTES, files: 1, fields: 10 },
  fileFilter: (_req, file, cb) => {
    if (isCsv(file)) cb(null, true);
    else cb(badRequest('file: must be a CSV file (text/csv or a name ending in .csv)', [{ field: 'file', rule: 'must be a CSV file (text/csv or a name ending in .csv)' }]));
  },
}).single(MANIFEST_FIELD);

const MULTER_RULES: Record<string, string> = {
  LIMIT_FILE_SIZE: `must be at most ${MANIFEST_MAX_BYTES / 1024 / 1024} MB`,
  LIMIT_FILE_COUNT: 'must be a single file',
  LIMIT_UNEXPECTED_FILE: `must be sent in the multipart field "${MANIFEST_FIELD}"`,
};

/** Parses the upload; multer's errors become field-named 400s. */
export const manifestUpload: RequestHandler = (req, res, next) => {
  single(req, res, (err?: unknown) => {
    if (!err || err instanceof DomainError) return next(err);
    // A broken multipart body (busboy) is the client's fault like any multer limit.
    const rule = (err instanceof multer.MulterError && MULTER_RULES[err.code]) || 'could not be read as a multipart/form-data upload';
    next(badRequest(`file: ${rule}`, [{ field: 'file', rule }]));
  });
};

/** The uploaded file's text; refuses a missing file and bytes that are not UTF-8. */
export function uploadedText(req: Request): { text: string; fileName: string } {
  const file = req.file;
  if (!file) throw badRequest(`file: is required, as a CSV in the multipart field "${MANIFEST_FIELD}"`, [{ field: 'file', rule: `is required, as a CSV in the multipart field "${MANIFEST_FIELD}"` }]);
  try {
    return { text: new TextDecoder('utf-8', { fatal: true }).decode(file.buffer), fileName: file.originalname.slice(0, 200) };
  } catch {
    throw badRequest('file: must be UTF-8 text', [{ field: 'file', rule: 'must be UTF-8 text (save the CSV as UTF-8)' }]);
  }
}

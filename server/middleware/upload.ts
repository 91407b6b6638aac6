import type { RequestHandler } from 'express';
import multer from 'multer';
import { AppError, badRequest } from '../errors';

/**
 * One file from a multipart/form-data body, held in memory (never on disk), at most `maxBytes`.
 * Too large → 413 "too_large"; no file, another field name, or a broken body → 400. Put it after
 * authorize(), so a caller without the permission is refused before the body is read.
 */
export function singleFile(field: string, maxBytes: number): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    // Browsers send the file name as raw UTF-8 in the part header; busboy's default reads it as Latin-1.
    defParamCharset: 'utf8',
    limits: { fileSize: maxBytes, files: 1, fields: 4, parts: 5, fieldSize: 4096, headerPairs: 50 },
  }).single(field);
  const megabytes = Math.round((maxBytes / 1024 / 1024) * 10) / 10;

  return (req, res, next) => {
    if (!req.is('multipart/form-data')) {
      return next(badRequest(`Send the file as multipart/form-data in the field "${field}".`, { [field]: 'is required' }));
    }
    upload(req, res, (err: unknown) => {
      if (!err) {
        if (!req.file) return next(badRequest(`Attach the file in the field "${field}".`, { [field]: 'is required' }));
        return next();
      }
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') {
          return next(new AppError(413, 'too_large', `The file is larger than ${megabytes} MB.`, { [field]: `must be at most ${megabytes} MB` }));
        }
        if (err.code === 'LIMIT_UNEXPECTED_FILE' || err.code === 'LIMIT_FILE_COUNT') {
          return next(badRequest(`Send exactly one file, in the field "${field}".`, { [err.field || field]: 'is not expected' }));
        }
        return next(badRequest('The upload could not be read.', { [field]: err.message }));
      }
      // busboy: a truncated or malformed multipart body (or a client that went away).
      return next(badRequest('The upload could not be read: the multipart body is incomplete or malformed.', { [field]: 'could not be read' }));
    });
  };
}

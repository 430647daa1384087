import type { RequestHandler } from 'express';
import { MulterError } from 'multer';
import { hasNoNul } from '@cc/shared';
import { ValidationError } from '../errors';

/**
 * Wraps a multer middleware so that a broken multipart body (no boundary, cut short, malformed
 * headers) is a 400 with a clear message, never a 500, and a file name holding NUL or other
 * control characters is refused before any code uses it.
 */
export function guardedUpload(upload: RequestHandler, field = 'file'): RequestHandler {
  return (req, res, next) => {
    upload(req, res, (err?: unknown) => {
      if (err) {
        if (err instanceof MulterError) return next(err);
        return next(new ValidationError('The upload could not be read', [{ path: field, message: 'Send the file again (the upload was cut off or malformed)' }]));
      }
      // multer gives names as latin1 bytes; the browser sent UTF-8.
      const name = req.file ? Buffer.from(req.file.originalname, 'latin1').toString('utf8') : '';
      if (req.file && (!hasNoNul(name) || /[\u0001-\u001f\u007f]/.test(name))) {
        return next(new ValidationError('The file name is not valid', [{ path: field, message: 'Rename the file without control characters' }]));
      }
      next();
    });
  };
}

import type { RequestHandler } from 'express';
import multer from 'multer';
import { AppError } from './app-error';

/**
 * Wraps a multer middleware so that a multipart body that cannot be read (no boundary, cut short,
 * a broken part header) is answered 400. busboy raises those as plain errors without a status,
 * which the error handler could not tell from a fault of ours; multer's own limit errors and any
 * error that already carries a status go on unchanged.
 */
export function multipart(upload: RequestHandler): RequestHandler {
  return (req, res, next) =>
    upload(req, res, (err?: unknown) => {
      if (!err || err instanceof multer.MulterError || hasStatus(err)) return next(err);
      next(
        new AppError(
          400,
          'validation_failed',
          'The upload could not be read: the form data is malformed or was cut short.',
        ),
      );
    });
}

function hasStatus(err: unknown) {
  const status = (err as { status?: unknown } | null)?.status;
  return typeof status === 'number';
}

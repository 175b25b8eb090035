import type { ErrorRequestHandler, RequestHandler } from 'express';
import multer from 'multer';
import { ZodError } from 'zod';
import { fieldErrorsFromZod, type ErrorEnvelope } from '@batchproof/shared';
import { AppError } from './app-error';

const send = (status: number, body: ErrorEnvelope) => ({ status, body });

/** Maps anything thrown in a handler to the one error envelope; never leaks details on a 500. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  const { status, body } = toEnvelope(err);
  if (status >= 500) console.error(`[api] ${req.method} ${req.originalUrl} failed:`, err);
  res.status(status).json(body);
};

function toEnvelope(err: unknown) {
  if (err instanceof AppError) {
    return send(err.status, {
      error: {
        code: err.code,
        message: err.message,
        fieldErrors: err.fieldErrors,
        findings: err.findings,
      },
    });
  }
  if (err instanceof ZodError) {
    return send(400, {
      error: {
        code: 'validation_failed',
        message: 'Some fields need attention.',
        fieldErrors: fieldErrorsFromZod(err),
      },
    });
  }
  if (err instanceof multer.MulterError) {
    if (err.code === 'LIMIT_FILE_SIZE') {
      return send(413, { error: { code: 'payload_too_large', message: 'The file is too large.' } });
    }
    return send(400, { error: { code: 'validation_failed', message: err.message } });
  }
  const e = err as { type?: string; status?: number };
  if (e?.type === 'entity.parse.failed') {
    return send(400, {
      error: { code: 'validation_failed', message: 'The request body is not valid JSON.' },
    });
  }
  if (e?.type === 'entity.too.large') {
    return send(413, {
      error: { code: 'payload_too_large', message: 'The request body is too large.' },
    });
  }
  return send(500, { error: { code: 'internal', message: 'Something went wrong on our side.' } });
}

/** 404 in the envelope for any /api path no router answered. */
export const apiNotFound: RequestHandler = (req, res) => {
  res.status(404).json({
    error: { code: 'not_found', message: `No API route for ${req.method} ${req.path}.` },
  } satisfies ErrorEnvelope);
};

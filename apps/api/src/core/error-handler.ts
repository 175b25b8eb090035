import type { ErrorRequestHandler, RequestHandler } from 'express';
import multer from 'multer';
import { ZodError } from 'zod';
import { fieldErrorsFromZod, type ErrorCode, type ErrorEnvelope } from '@batchproof/shared';
import { AppError } from './app-error';
import { databaseFailure, type DatabaseFailure } from './database-errors';

/** `note`: one line for the server log instead of the error's stack. */
const send = (status: number, body: ErrorEnvelope, note?: string) => ({ status, body, note });

/** Maps anything thrown in a handler to the one error envelope; never leaks details on a 500. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  const { status, body, note } = toEnvelope(err);
  if (note) console.error(`[api] ${req.method} ${req.originalUrl}: ${note}`);
  else if (status >= 500) console.error(`[api] ${req.method} ${req.originalUrl} failed:`, err);
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
        ...err.labelRefusal,
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
  const failure = databaseFailure(err);
  if (failure) return fromDatabase(failure);
  const status = Number(e?.status ?? (err as { statusCode?: unknown })?.statusCode);
  if (Number.isInteger(status) && status >= 400 && status < 500) return fromLibrary(status);
  return send(500, { error: { code: 'internal', message: 'Something went wrong on our side.' } });
}

const CONFLICT_MESSAGES: Record<Extract<DatabaseFailure, { kind: 'conflict' }>['reason'], string> =
  {
    duplicate: 'That record already exists: another request may have just created it.',
    'reference-gone':
      'A record this change refers to was removed at the same time. Reload and try again.',
    'still-referenced':
      'That record was just put to use by another change, so it was not deleted. Reload and try again.',
  };

/** Races the database refused (409) and a database that cannot be reached (503, one log line). */
function fromDatabase(failure: DatabaseFailure) {
  if (failure.kind === 'conflict') {
    return send(409, { error: { code: 'conflict', message: CONFLICT_MESSAGES[failure.reason] } });
  }
  return send(
    503,
    {
      error: {
        code: 'service_unavailable',
        message: 'The database is not reachable right now. Try again in a moment.',
      },
    },
    `database unavailable: ${failure.reason}`,
  );
}

/**
 * A 4xx that a library raised with its status (an unsupported Content-Encoding, a body that does
 * not decompress, a path with broken percent-encoding): the client's fault, so it keeps its
 * status; the library's own wording stays in the server's hands.
 */
function fromLibrary(status: number) {
  const known: Partial<Record<number, [ErrorCode, string]>> = {
    401: ['unauthenticated', 'Sign in to continue.'],
    403: ['forbidden', 'This request is not allowed.'],
    404: ['not_found', 'Nothing was found at that address.'],
    413: ['payload_too_large', 'The request body is too large.'],
    415: [
      'unsupported_media_type',
      'The request body is in an encoding or type the API does not read.',
    ],
  };
  const [code, message] = known[status] ?? ['validation_failed', 'The request could not be read.'];
  return send(status, { error: { code, message } });
}

/** 404 in the envelope for any /api path no router answered. */
export const apiNotFound: RequestHandler = (req, res) => {
  res.status(404).json({
    error: { code: 'not_found', message: `No API route for ${req.method} ${req.path}.` },
  } satisfies ErrorEnvelope);
};

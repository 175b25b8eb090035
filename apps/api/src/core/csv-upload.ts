import express, { type Request, type RequestHandler } from 'express';
import multer from 'multer';
import { UTF16_HELP, UTF16_REFUSAL, isUtf16 } from '@batchproof/shared';
import { AppError } from './app-error';
import { multipart } from './multipart';

/** Largest CSV accepted, bytes. */
export const CSV_MAX_BYTES = 5 * 1024 * 1024;

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: CSV_MAX_BYTES, files: 1 },
});

/**
 * Reads a CSV sent either as a multipart file in the field `file` (a form) or as a text/csv body
 * (a script). Put it before the handler, then read the text with {@link uploadedCsvText}.
 */
export const csvBody: RequestHandler[] = [
  express.text({ type: ['text/csv', 'text/plain'], limit: CSV_MAX_BYTES }),
  multipart(upload.single('file')),
];

/**
 * Refuses a file saved as UTF-16 (what Excel calls "Unicode text"): a byte-order mark, or NUL
 * bytes, which UTF-8 text never holds (see `isUtf16`).
 */
export function refuseUtf16(content: Buffer | string): void {
  if (!isUtf16(content)) return;
  throw new AppError(400, 'validation_failed', UTF16_REFUSAL, { file: [UTF16_HELP] });
}

/** The CSV text {@link csvBody} read, UTF-8 only; 400 with `file` when none was sent. */
export function uploadedCsvText(req: Request): string {
  if (req.file) {
    refuseUtf16(req.file.buffer);
    return req.file.buffer.toString('utf8');
  }
  if (typeof req.body === 'string' && req.body.trim()) {
    refuseUtf16(req.body);
    return req.body;
  }
  throw new AppError(400, 'validation_failed', 'Send a CSV file.', {
    file: ['Choose a CSV file, or send the CSV as a text/csv body'],
  });
}

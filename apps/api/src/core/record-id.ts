import * as z from 'zod';
import { notFound } from './app-error';

const idParam = z.uuid();

/** Whether `raw` is a record id (a UUID), e.g. a token's subject before it reaches a query. */
export const isRecordId = (raw: unknown): raw is string => idParam.safeParse(raw).success;

/** Parses a record id from the path; a malformed id is simply not found (never a 400 or 500). */
export function recordId(raw: unknown, what: string): string {
  const parsed = idParam.safeParse(raw);
  if (!parsed.success) throw notFound(what);
  return parsed.data;
}

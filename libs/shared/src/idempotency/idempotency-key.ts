import * as z from 'zod';

/** The request header that makes a create safe to retry (as the IETF Idempotency-Key draft names it). */
export const IDEMPOTENCY_KEY_HEADER = 'Idempotency-Key';

/** How long the API keeps a key's first answer, in hours; a key older than this counts as new. */
export const IDEMPOTENCY_KEY_TTL_HOURS = 24;

/**
 * An `Idempotency-Key` value: 1 to 255 visible ASCII characters, typically a random UUID made
 * when a form is submitted. A retried request with the same key (same workshop and user) gets
 * the first request's answer instead of creating a second record.
 */
export const idempotencyKeySchema = z
  .string()
  .min(1, { error: 'The Idempotency-Key header is empty' })
  .max(255, { error: 'Keep the Idempotency-Key under 256 characters' })
  .regex(/^[\x21-\x7e]+$/, {
    error: 'The Idempotency-Key may hold only visible ASCII characters, such as a UUID',
  });

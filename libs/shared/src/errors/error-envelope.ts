import * as z from 'zod';
import { complianceFindingSchema } from '../compliance/evaluation-result-schema';
import { labelFitProblemSchema, missingLabelElementSchema } from '../labels/label-refusal';

/** Machine-readable error codes the API sends inside the error envelope. */
export const errorCodeSchema = z.enum([
  'validation_failed',
  'unauthenticated',
  'forbidden',
  'not_found',
  'conflict',
  'rate_limited',
  'payload_too_large',
  'unsupported_media_type',
  /** A release refused for blocking findings; the envelope's `findings` lists them. */
  'release_blocked',
  /** A print run refused because a chosen market's label lacks required elements (409); see `missing`. */
  'label_incomplete',
  /** A print run refused because text cannot fit at its legal minimum size (422); see `fitProblems`. */
  'label_does_not_fit',
  /**
   * A batch release refused because the record is not complete (409): lines not weighed, lots not
   * picked, a substitute not approved; `fieldErrors` names each line (`lines.3.lotPicks`).
   */
  'batch_not_ready',
  /**
   * Stock refused (409): a release, an amendment or an adjustment would take a lot below zero;
   * `fieldErrors` names the line or lot and says how much is on hand.
   */
  'stock_short',
  /** A released record cannot be changed (409): batches take amendments instead. */
  'record_released',
  /** A signed assessment cannot be changed (409): share the new version and assess it. */
  'assessment_signed',
  /**
   * Signing refused because the packet changed since the assessor read it (409): the answer's
   * message says so; reload, read again and sign the new content.
   */
  'packet_changed',
  /** An `Idempotency-Key` already used for a different request. */
  'idempotency_key_reused',
  /** The database cannot be reached right now (503); the request may be retried. */
  'service_unavailable',
  /** An invitation link whose token was never issued, or was revoked or replaced (404). */
  'invitation_unknown',
  /** An invitation link already used to join (410). */
  'invitation_used',
  /** An invitation link past its expiry (410). */
  'invitation_expired',
  'internal',
]);
export type ErrorCode = z.infer<typeof errorCodeSchema>;

/**
 * The one error envelope every API error response carries:
 * `{ error: { code, message, fieldErrors?, findings? } }`. `fieldErrors` maps a dotted field path
 * (`email`, `lines.0.grams`) to its messages; `findings` carries the engine's findings behind a
 * refusal (`release_blocked`), so a client never reads them out of the message text.
 */
export const errorEnvelopeSchema = z.object({
  error: z.object({
    code: errorCodeSchema,
    message: z.string(),
    fieldErrors: z.record(z.string(), z.array(z.string())).optional(),
    findings: z.array(complianceFindingSchema).optional(),
    /** What each market's label still lacks (`label_incomplete`), each with the field to fill in. */
    missing: z.array(missingLabelElementSchema).optional(),
    /** Text that cannot fit at its legal minimum size (`label_does_not_fit`). */
    fitProblems: z.array(labelFitProblemSchema).optional(),
  }),
});
export type ErrorEnvelope = z.infer<typeof errorEnvelopeSchema>;

/**
 * Turns a zod error into the envelope's `fieldErrors`, keyed by the dotted path of each issue.
 * Issues without a path are gathered under `_form`.
 */
export function fieldErrorsFromZod(error: z.ZodError): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.map(String).join('.') : '_form';
    (out[key] ??= []).push(issue.message);
  }
  return out;
}

/** Whether a value has the shape of the error envelope. */
export function isErrorEnvelope(value: unknown): value is ErrorEnvelope {
  return errorEnvelopeSchema.safeParse(value).success;
}

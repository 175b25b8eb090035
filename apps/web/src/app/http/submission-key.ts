import { HttpHeaders } from '@angular/common/http';
import { IDEMPOTENCY_KEY_HEADER } from '@batchproof/shared';

/** What identifies a submission's content; a File by name, size and modification time. */
function fingerprint(content: unknown): string {
  return JSON.stringify(content, (_key, value: unknown) =>
    value instanceof File ? `file:${value.name}:${value.size}:${value.lastModified}` : value,
  );
}

/**
 * One `Idempotency-Key` per submitted form. The key is made when the form is first submitted and
 * reused while the same content is submitted again (a retry after a lost answer), so the API
 * answers the retry with the record the first attempt created instead of a second one. Once the
 * submission succeeds, or its content changes, the next submission gets a new key.
 */
export class SubmissionKey {
  private current: { key: string; content: string } | null = null;

  /** The key for submitting `content`: the previous one when the same content is sent again. */
  for(content: unknown): string {
    const print = fingerprint(content);
    if (this.current?.content !== print) {
      this.current = { key: crypto.randomUUID(), content: print };
    }
    return this.current.key;
  }

  /** Marks the submission as answered: the next one is a new create with a new key. */
  done(): void {
    this.current = null;
  }
}

/** The request header carrying a submission's key; none when there is no key. */
export function idempotencyHeaders(key: string | undefined): HttpHeaders {
  return key ? new HttpHeaders({ [IDEMPOTENCY_KEY_HEADER]: key }) : new HttpHeaders();
}

import { httpResource } from '@angular/common/http';
import { Injectable } from '@angular/core';
import { attentionSchema } from '@batchproof/shared';

/** What needs attention in the workshop, as the signed-in member's role may see it. */
@Injectable({ providedIn: 'root' })
export class AttentionApi {
  /** The home page's attention list and the workshop's progress; call in a constructor. */
  attention() {
    return httpResource(() => '/api/attention', { parse: (body) => attentionSchema.parse(body) });
  }
}

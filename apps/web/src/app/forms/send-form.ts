import type { WritableSignal } from '@angular/core';
import type { FormGroup } from '@angular/forms';
import { firstValueFrom, type Observable } from 'rxjs';
import { type PathMap, showRequestError } from './form-errors';

/** A form page's request state: whether a request is on its way, and the notice above the form. */
export interface SendState {
  sending: WritableSignal<boolean>;
  notice: WritableSignal<string>;
}

/**
 * Sends a checked form's request: `sending` while it runs; on success the form is marked
 * pristine and the answer returned; on failure the API's field messages go beside their fields,
 * the rest into `notice`, the typed values stay, and `null` is returned.
 */
export async function sendForm<T>(
  form: FormGroup,
  request: Observable<T>,
  state: SendState,
  mapPath?: PathMap,
): Promise<T | null> {
  state.sending.set(true);
  state.notice.set('');
  try {
    const answer = await firstValueFrom(request);
    form.markAsPristine();
    return answer;
  } catch (err: unknown) {
    // Any failed request (an ApiError from the interceptor): shown on the form, not thrown.
    state.notice.set(showRequestError(form, err, mapPath));
    return null;
  } finally {
    state.sending.set(false);
  }
}

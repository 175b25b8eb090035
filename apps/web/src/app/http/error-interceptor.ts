import { HttpErrorResponse, type HttpInterceptorFn } from '@angular/common/http';
import { catchError, throwError } from 'rxjs';
import { errorEnvelopeSchema } from '@batchproof/shared';
import { ApiError } from './api-error';

/**
 * Reads the API's one error envelope (`{ error: { code, message, fieldErrors?, findings? } }`) and turns
 * every failed request into an {@link ApiError}, so pages handle a single shape.
 */
export const errorInterceptor: HttpInterceptorFn = (req, next) =>
  next(req).pipe(catchError((err: unknown) => throwError(() => toApiError(err))));

/** Maps whatever a request failed with onto an {@link ApiError}. */
export function toApiError(err: unknown): ApiError {
  if (err instanceof ApiError) return err;
  if (!(err instanceof HttpErrorResponse)) {
    return new ApiError(0, 'unexpected', 'Something went wrong. Try again in a moment.');
  }
  if (err.status === 0) {
    return new ApiError(
      0,
      'network',
      'Batchproof cannot be reached. Check the connection and try again.',
    );
  }
  const envelope = errorEnvelopeSchema.safeParse(err.error);
  if (envelope.success) {
    const { code, message, fieldErrors, findings, missing, fitProblems } = envelope.data.error;
    return new ApiError(err.status, code, message, fieldErrors, findings, missing, fitProblems);
  }
  return new ApiError(
    err.status,
    'unexpected',
    `The server answered ${err.status}. Try again in a moment.`,
  );
}

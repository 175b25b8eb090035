import { FormControl, type FormGroup } from '@angular/forms';
import type { z } from 'zod';
import { fieldErrorsFromZod } from '@batchproof/shared';
import { showFieldErrors } from '../forms/form-errors';
import { ApiError, messageOf } from '../http/api-error';

/**
 * Where a field path of the API contract lives in a form shaped for people (e.g. the contract's
 * `byPercent.lines.0.percent` is the editor's `lines.0.percent`). Return the path unchanged when
 * the form mirrors the contract.
 */
export type PathMap = (path: string) => string;

/**
 * Re-keys contract paths onto the form's controls, then hands them to the one form-errors adapter.
 * A message whose path names a group or list rather than a field goes above the form instead of
 * being set on a control nobody sees.
 */
export function showContractErrors(
  form: FormGroup,
  fieldErrors: Record<string, string[]>,
  mapPath: PathMap,
): string[] {
  const mapped: Record<string, string[]> = {};
  for (const [path, messages] of Object.entries(fieldErrors)) {
    const target = mapPath(path);
    const key = form.get(target) instanceof FormControl ? target : '_form';
    (mapped[key] ??= []).push(...messages);
  }
  return showFieldErrors(form, mapped);
}

/**
 * Validates a request body built from a form with the shared schema; on failure shows the
 * messages beside their fields and returns `undefined` with the notice for above the form.
 */
export function validateContract<S extends z.ZodType>(
  form: FormGroup,
  schema: S,
  body: unknown,
  mapPath: PathMap,
): { value?: z.output<S>; notice: string } {
  const result = schema.safeParse(body);
  if (result.success) return { value: result.data, notice: '' };
  const unplaced = showContractErrors(form, fieldErrorsFromZod(result.error), mapPath);
  return { notice: unplaced.join(' ') };
}

/** Shows a failed request on a form: field messages beside fields, the rest as the notice. */
export function showContractRequestError(
  form: FormGroup,
  error: unknown,
  mapPath: PathMap,
): string {
  if (!(error instanceof ApiError)) return messageOf(error);
  const unplaced = showContractErrors(form, error.fieldErrors, mapPath);
  return [error.message, ...unplaced].join(' ');
}

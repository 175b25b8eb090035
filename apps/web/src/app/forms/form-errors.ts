import type { AbstractControl, FormGroup } from '@angular/forms';
import type { z } from 'zod';
import { fieldErrorsFromZod } from '@batchproof/shared';
import { ApiError, messageOf } from '../http/api-error';

/** The error key this adapter sets on a control; its value is the message to show. */
const SCHEMA_ERROR = 'schema';

/**
 * Validates a typed form's raw value with the shared zod schema the API also uses.
 * On success returns the parsed value (trimmed, lower-cased, as the schema says); otherwise
 * puts each message on its control so `<mat-error>` shows it, and returns `undefined`.
 */
export function validateForm<S extends z.ZodType>(
  form: FormGroup,
  schema: S,
): z.output<S> | undefined {
  const result = schema.safeParse(form.getRawValue());
  if (result.success) return result.data;
  showFieldErrors(form, fieldErrorsFromZod(result.error));
  return undefined;
}

/**
 * Puts field messages, keyed by dotted path (from zod on the client or from the API's error
 * envelope), on the matching controls and marks the form touched so they show at once.
 * A control's message clears as soon as its value changes, because it has no validators of
 * its own. Returns the messages that belong to no control, for a notice above the form.
 */
export function showFieldErrors(form: FormGroup, fieldErrors: Record<string, string[]>): string[] {
  const unplaced: string[] = [];
  for (const [path, messages] of Object.entries(fieldErrors)) {
    const control = path === '_form' ? null : form.get(path);
    if (control && messages.length > 0) {
      control.setErrors({ ...control.errors, [SCHEMA_ERROR]: messages[0] });
    } else {
      unplaced.push(...messages);
    }
  }
  form.markAllAsTouched();
  return unplaced;
}

/** The message `<mat-error>` shows for a control, or `''` when it has none. */
export function errorMessage(control: AbstractControl): string {
  const errors = control.errors;
  if (!errors) return '';
  // Text a date field could not read: the field holds no date, so say so before any other message.
  if (errors['matDatepickerParse']) return 'Not a date: pick one from the calendar.';
  const message: unknown = errors[SCHEMA_ERROR];
  if (typeof message === 'string') return message;
  if (errors['required']) return 'This field is required.';
  return 'Check this field.';
}

/**
 * Shows a failed request on its form: the envelope's field messages beside their fields, and
 * returns the notice for above the form (the envelope's message and any message that has no
 * field of its own).
 */
export function showRequestError(form: FormGroup, error: unknown): string {
  if (!(error instanceof ApiError)) return messageOf(error);
  const unplaced = showFieldErrors(form, error.fieldErrors);
  return [error.message, ...unplaced].join(' ');
}

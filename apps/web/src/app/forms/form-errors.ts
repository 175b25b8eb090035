import type { AbstractControl, FormGroup } from '@angular/forms';
import type { Subscription } from 'rxjs';
import type { z } from 'zod';
import { fieldErrorsFromZod } from '@batchproof/shared';
import { ApiError, messageOf } from '../http/api-error';

/**
 * The one place the web app turns field messages (the shared zod contract's, checked in the
 * browser, or the API's `fieldErrors`) into messages on form controls, shown by `<mat-error>`.
 * Every form goes through it, so a message reads the same wherever it is raised.
 */

/** The error key this adapter sets on a control; its value is the message to show. */
const SCHEMA_ERROR = 'schema';

/** Field messages keyed by dotted path, as zod and the API's envelope give them. */
export type FieldErrors = Record<string, string[]>;

/**
 * Where a contract path lives in a form shaped for people (e.g. the contract's
 * `byPercent.lines.0.percent` is the formula editor's `lines.0.percent`). The identity when the
 * form mirrors the contract.
 */
export type PathMap = (path: string) => string;

const samePath: PathMap = (path) => path;

/** How a form's value is checked against the contract. */
export interface ContractCheck<S extends z.ZodType> {
  /** The request body to check; the form's raw value when absent. */
  body?: unknown;
  /** Where the contract's paths live in the form. */
  mapPath?: PathMap;
  /** Messages of checks the schema cannot make (keyed like the contract's). */
  extra?: FieldErrors;
  /** The shared schema the API validates the same body with. */
  schema: S;
}

/** The contract's messages for `body`, keyed by contract path (empty when it passes). */
export function contractErrors(schema: z.ZodType, body: unknown): FieldErrors {
  const result = schema.safeParse(body);
  return result.success ? {} : fieldErrorsFromZod(result.error);
}

/**
 * Validates a form with the shared schema the API also uses (on its raw value, or on the request
 * body built from it). On success returns the parsed value (trimmed, lower-cased, as the schema
 * says); otherwise shows each message beside its field and returns the notice for above the form
 * (the messages that belong to no field).
 */
export function checkForm<S extends z.ZodType>(
  form: FormGroup,
  check: ContractCheck<S>,
): { value?: z.output<S>; notice: string } {
  const result = check.schema.safeParse('body' in check ? check.body : form.getRawValue());
  const errors = { ...check.extra, ...(result.success ? {} : fieldErrorsFromZod(result.error)) };
  if (Object.keys(errors).length === 0 && result.success) return { value: result.data, notice: '' };
  const unplaced = showFieldErrors(form, errors, check.mapPath);
  return { notice: unplaced.join(' ') };
}

/** `checkForm` on the form's own raw value: the value, or `undefined` with messages shown. */
export function validateForm<S extends z.ZodType>(
  form: FormGroup,
  schema: S,
): z.output<S> | undefined {
  return checkForm(form, { schema }).value;
}

/**
 * Puts field messages on the controls their paths name (a field, or a group or list that shows
 * its own message) and marks the form touched so they show at once. A control's message clears
 * as soon as its value changes, because it has no validators of its own. Returns the messages
 * that belong to no control, for a notice above the form.
 */
export function showFieldErrors(
  form: FormGroup,
  fieldErrors: FieldErrors,
  mapPath: PathMap = samePath,
): string[] {
  const unplaced: string[] = [];
  for (const [path, messages] of Object.entries(fieldErrors)) {
    const control = path === '_form' ? null : form.get(mapPath(path));
    if (control && messages.length > 0) setMessage(control, messages[0]!);
    else unplaced.push(...messages);
  }
  form.markAllAsTouched();
  return unplaced;
}

/**
 * Shows a failed request on its form: the envelope's field messages beside their fields, and
 * returns the notice for above the form (the envelope's message and any message that has no
 * field of its own).
 */
export function showRequestError(
  form: FormGroup,
  error: unknown,
  mapPath: PathMap = samePath,
): string {
  if (!(error instanceof ApiError)) return messageOf(error);
  const unplaced = showFieldErrors(form, error.fieldErrors, mapPath);
  return [error.message, ...unplaced].join(' ');
}

/**
 * Judges what is typed while it is typed: after every change of value, `check` gives the
 * contract's messages and each one whose field holds something is put on that field and shown at
 * once, so an impossible amount is refused beside its field before any panel computes with it.
 * A blank field is left alone until the form is sent. Messages set here are taken away when the
 * value they judged is put right. Unsubscribe when the form goes away.
 */
export function checkWhileTyping(
  form: FormGroup,
  check: () => FieldErrors,
  mapPath: PathMap = samePath,
): Subscription {
  let shown = new Set<AbstractControl>();
  return form.valueChanges.subscribe(() => {
    const now = new Set<AbstractControl>();
    for (const [path, messages] of Object.entries(filledInErrors(form, check(), mapPath))) {
      const control = form.get(path)!;
      setMessage(control, messages[0]!);
      control.markAsTouched();
      now.add(control);
    }
    for (const control of shown) if (!now.has(control)) clearMessage(control);
    shown = now;
  });
}

/**
 * The contract's messages for the fields that hold something, keyed by form path: what
 * `checkWhileTyping` shows, for a panel that must not compute with a refused value.
 */
export function filledInErrors(
  form: FormGroup,
  errors: FieldErrors,
  mapPath: PathMap = samePath,
): FieldErrors {
  const out: FieldErrors = {};
  for (const [path, messages] of Object.entries(errors)) {
    const target = mapPath(path);
    const control = path === '_form' ? null : form.get(target);
    if (control && isFilledIn(control.value) && messages.length > 0) {
      (out[target] ??= []).push(...messages);
    }
  }
  return out;
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

/** Whether a field holds something to judge (a group's or a list's value is not a field's). */
const isFilledIn = (value: unknown) =>
  value !== null && value !== undefined && value !== '' && typeof value !== 'object';

function setMessage(control: AbstractControl, message: string): void {
  if (control.errors?.[SCHEMA_ERROR] === message) return;
  control.setErrors({ ...control.errors, [SCHEMA_ERROR]: message });
}

function clearMessage(control: AbstractControl): void {
  if (!control.errors?.[SCHEMA_ERROR]) return;
  const { [SCHEMA_ERROR]: _cleared, ...rest } = control.errors;
  control.setErrors(Object.keys(rest).length > 0 ? rest : null);
}

import { TestBed } from '@angular/core/testing';
import { NonNullableFormBuilder } from '@angular/forms';
import { signUpSchema } from '@batchproof/shared';
import { ApiError } from '../http/api-error';
import { errorMessage, showFieldErrors, showRequestError, validateForm } from './form-errors';

function signUpForm() {
  return TestBed.inject(NonNullableFormBuilder).group({
    workshopName: '',
    name: '',
    email: '',
    password: '',
  });
}

describe('form errors adapter', () => {
  it('returns the value as the shared schema parses it (trimmed, lower-cased) when it is valid', () => {
    const form = signUpForm();
    form.setValue({
      workshopName: '  Hollowmere Bathworks ',
      name: 'Ada',
      email: ' Ada@Example.COM ',
      password: 'long-enough-pass',
    });

    expect(validateForm(form, signUpSchema)).toEqual({
      workshopName: 'Hollowmere Bathworks',
      name: 'Ada',
      email: 'ada@example.com',
      password: 'long-enough-pass',
    });
    expect(form.valid).toBe(true);
  });

  it('puts each zod message on its control and marks the form touched when it is not valid', () => {
    const form = signUpForm();
    form.controls.name.setValue('Ada');
    form.controls.password.setValue('short');

    expect(validateForm(form, signUpSchema)).toBeUndefined();
    expect(errorMessage(form.controls.workshopName)).toBe('Workshop name is required.');
    expect(errorMessage(form.controls.email)).toBe('Enter a valid e-mail address.');
    expect(errorMessage(form.controls.password)).toBe('Use at least 10 characters.');
    expect(errorMessage(form.controls.name)).toBe('');
    expect(form.controls.email.touched).toBe(true);
  });

  it("maps the server's fieldErrors onto controls and returns the messages that have no control", () => {
    const form = signUpForm();

    const unplaced = showFieldErrors(form, {
      email: ['This e-mail already belongs to a Batchproof account.'],
      _form: ['Try again later.'],
      colour: ['No such field here.'],
    });

    expect(errorMessage(form.controls.email)).toBe(
      'This e-mail already belongs to a Batchproof account.',
    );
    expect(unplaced).toEqual(['Try again later.', 'No such field here.']);
  });

  it('clears a field message as soon as the field is edited', () => {
    const form = signUpForm();
    showFieldErrors(form, { email: ['Enter a valid e-mail address.'] });

    form.controls.email.setValue('ada@example.com');

    expect(errorMessage(form.controls.email)).toBe('');
    expect(form.valid).toBe(true);
  });

  it('turns an ApiError into field messages plus a notice for above the form', () => {
    const form = signUpForm();
    const error = new ApiError(400, 'validation_failed', 'Some fields need attention.', {
      password: ['Use at least 10 characters.'],
    });

    expect(showRequestError(form, error)).toBe('Some fields need attention.');
    expect(errorMessage(form.controls.password)).toBe('Use at least 10 characters.');
    expect(showRequestError(form, new Error('boom'))).toBe(
      'Something went wrong. Try again in a moment.',
    );
  });
});

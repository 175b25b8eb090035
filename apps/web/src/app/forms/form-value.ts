import type { Signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import type { FormGroup } from '@angular/forms';
import { map, of, startWith, switchMap } from 'rxjs';

/**
 * A form's raw value as a signal that follows every change, for the parts of a page that compute
 * from what is typed; undefined while there is no form. Follows the form `form` gives, when the
 * page builds a new one. Call in an injection context.
 */
export function formValue<F extends FormGroup>(
  form: Signal<F | undefined>,
): Signal<ReturnType<F['getRawValue']> | undefined> {
  return toSignal(
    toObservable(form).pipe(
      switchMap((f) =>
        f
          ? f.valueChanges.pipe(
              startWith(null),
              map(() => f.getRawValue() as ReturnType<F['getRawValue']>),
            )
          : of(undefined),
      ),
    ),
  );
}

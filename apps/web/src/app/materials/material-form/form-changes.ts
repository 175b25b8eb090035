import { computed, type Signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import type { AbstractControl } from '@angular/forms';
import { scan, startWith, switchMap } from 'rxjs';

/**
 * A counter that moves on every event of a control (value, status, touched, errors set from the
 * server). An OnPush section that reads it in a computed re-renders when its part of a shared
 * form changes, which it would not do on its own: its inputs keep the same control objects.
 * Call in an injection context.
 */
export function formChanges(control: () => AbstractControl): Signal<number> {
  return toSignal(
    toObservable(computed(control)).pipe(
      switchMap((c) => c.events.pipe(startWith(null))),
      scan((n) => n + 1, 0),
    ),
    { initialValue: 0 },
  );
}

import { DOCUMENT } from '@angular/common';
import { DestroyRef, inject } from '@angular/core';
import { MatDialog } from '@angular/material/dialog';
import type { CanDeactivateFn } from '@angular/router';
import { from, map, type Observable, of, switchMap } from 'rxjs';
import { type LeaveChoice, UnsavedChangesDialog } from './unsaved-changes-dialog';

/** A page whose form may hold changes that leaving it would lose. */
export interface LeavesSafely {
  /** Whether the page holds changes that are not saved yet. */
  hasUnsavedChanges(): boolean;
  /**
   * Saves them on the way out. Resolves `true` once saved, so the navigation goes on; `false`
   * when the save was refused or failed (its messages are on the page), so the member stays.
   */
  saveChanges(): Promise<boolean>;
}

/** A form component that can say whether it holds unsaved changes, and save them. */
export interface SavesOnLeaving {
  hasUnsavedChanges(): boolean;
  /** Resolves whether it was saved. */
  save(): Promise<boolean>;
}

/**
 * What a page whose form is a child component answers the guard with: the form's changes, and a
 * save through the form with `leaving` set meanwhile, so a new record's page does not open itself
 * in the middle of the navigation away. Also asks before a reload. Build it in a field initialiser.
 */
export class FormLeaving implements LeavesSafely {
  /** Whether a save on the way out is running. */
  leaving = false;

  constructor(private readonly form: () => SavesOnLeaving | undefined) {
    warnBeforeUnload(() => this.hasUnsavedChanges());
  }

  hasUnsavedChanges(): boolean {
    return this.form()?.hasUnsavedChanges() ?? false;
  }

  saveChanges(): Promise<boolean> {
    this.leaving = true;
    const saving = this.form()?.save() ?? Promise.resolve(true);
    return saving.finally(() => (this.leaving = false));
  }
}

/**
 * Guards a page with a form: leaving it with unsaved changes (a link, the breadcrumb, the back
 * button) first asks whether to save them, discard them or stay. A page without changes is left
 * at once.
 */
export const unsavedChangesGuard: CanDeactivateFn<LeavesSafely> = (page) => {
  if (!page?.hasUnsavedChanges()) return true;
  return askBeforeLeaving(inject(MatDialog)).pipe(
    switchMap((choice): Observable<boolean> => {
      if (choice === 'discard') return of(true);
      if (choice === 'save') return from(page.saveChanges());
      return of(false);
    }),
  );
};

function askBeforeLeaving(dialog: MatDialog): Observable<LeaveChoice> {
  return dialog
    .open<UnsavedChangesDialog, void, LeaveChoice>(UnsavedChangesDialog, {
      width: '28rem',
      autoFocus: 'first-tabbable',
    })
    .afterClosed()
    .pipe(map((choice) => choice ?? 'stay'));
}

/**
 * Asks the browser to confirm a reload or closing the tab while `unsaved()` holds (the browser
 * words that question itself; a page cannot offer to save there). Call in an injection context;
 * the listener goes with the page.
 */
export function warnBeforeUnload(unsaved: () => boolean): void {
  const window = inject(DOCUMENT).defaultView;
  if (!window) return;
  const listener = (event: BeforeUnloadEvent) => {
    if (!unsaved()) return;
    event.preventDefault();
    // Older browsers ask only when returnValue is set.
    event.returnValue = '';
  };
  window.addEventListener('beforeunload', listener);
  inject(DestroyRef).onDestroy(() => window.removeEventListener('beforeunload', listener));
}

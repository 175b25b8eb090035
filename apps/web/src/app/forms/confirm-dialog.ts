import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButton } from '@angular/material/button';
import {
  MAT_DIALOG_DATA,
  type MatDialog,
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  type MatDialogConfig,
  MatDialogTitle,
} from '@angular/material/dialog';
import { map, type Observable } from 'rxjs';

/** What a confirm dialog says: the question, what going ahead does, and its two buttons. */
export interface ConfirmData {
  title: string;
  message: string;
  /** The button that changes nothing, e.g. "Keep". */
  keep: string;
  /** The button that goes ahead, e.g. "Delete lot". */
  confirm: string;
}

/** Asks before something that cannot simply be undone; closes with `true` to go ahead. */
@Component({
  selector: 'bp-confirm-dialog',
  imports: [MatButton, MatDialogActions, MatDialogClose, MatDialogContent, MatDialogTitle],
  template: `
    <h2 mat-dialog-title>{{ data.title }}</h2>
    <mat-dialog-content>
      <p>{{ data.message }}</p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="false">{{ data.keep }}</button>
      <button mat-flat-button type="button" [mat-dialog-close]="true">{{ data.confirm }}</button>
    </mat-dialog-actions>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ConfirmDialog {
  protected readonly data = inject<ConfirmData>(MAT_DIALOG_DATA);
}

/**
 * Opens the confirm dialog (focus on the dialog, not on a button) and emits once: true when the
 * member goes ahead, false when they keep things as they are or close the dialog.
 */
export function confirmFirst(
  dialog: MatDialog,
  data: ConfirmData,
  config: Omit<MatDialogConfig<ConfirmData>, 'data'> = {},
): Observable<boolean> {
  return dialog
    .open<ConfirmDialog, ConfirmData, boolean>(ConfirmDialog, {
      autoFocus: 'dialog',
      ...config,
      data,
    })
    .afterClosed()
    .pipe(map((yes) => yes === true));
}

import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButton } from '@angular/material/button';
import {
  MAT_DIALOG_DATA,
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogTitle,
} from '@angular/material/dialog';

/** Asks before a draft batch is deleted; closes with `true` to go ahead. */
@Component({
  selector: 'bp-delete-batch-dialog',
  imports: [MatButton, MatDialogActions, MatDialogClose, MatDialogContent, MatDialogTitle],
  template: `
    <h2 mat-dialog-title>Delete draft batch {{ data.batchCode }}?</h2>
    <mat-dialog-content>
      <p>
        Its weigh sheet and everything recorded on it go away. No stock was taken yet: lots are
        drawn down only when a batch is released.
      </p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="false">Keep</button>
      <button mat-flat-button type="button" [mat-dialog-close]="true">Delete draft</button>
    </mat-dialog-actions>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DeleteBatchDialog {
  protected readonly data = inject<{ batchCode: string }>(MAT_DIALOG_DATA);
}

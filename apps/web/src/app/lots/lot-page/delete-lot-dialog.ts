import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButton } from '@angular/material/button';
import {
  MAT_DIALOG_DATA,
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogTitle,
} from '@angular/material/dialog';

/** What the delete dialog names. */
export interface DeleteLotData {
  supplierLotNumber: string;
  materialName: string;
}

/** Asks before a lot is deleted; closes with `true` to go ahead. */
@Component({
  selector: 'bp-delete-lot-dialog',
  imports: [MatButton, MatDialogActions, MatDialogClose, MatDialogContent, MatDialogTitle],
  template: `
    <h2 mat-dialog-title>Delete lot {{ data.supplierLotNumber }}?</h2>
    <mat-dialog-content>
      <p>
        The record of this delivery of {{ data.materialName }} and its stock on hand go away. A lot
        that a batch has used cannot be deleted, so batch records stay traceable.
      </p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="false">Keep</button>
      <button mat-flat-button type="button" [mat-dialog-close]="true">Delete lot</button>
    </mat-dialog-actions>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DeleteLotDialog {
  protected readonly data = inject<DeleteLotData>(MAT_DIALOG_DATA);
}

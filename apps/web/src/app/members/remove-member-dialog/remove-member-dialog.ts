import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButton } from '@angular/material/button';
import {
  MAT_DIALOG_DATA,
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogTitle,
} from '@angular/material/dialog';

/** What the removal dialog needs to name. */
export interface RemoveMemberData {
  name: string;
  workshopName: string;
}

/** Asks before a member is removed; closes with `true` to go ahead. */
@Component({
  selector: 'bp-remove-member-dialog',
  imports: [MatButton, MatDialogActions, MatDialogClose, MatDialogContent, MatDialogTitle],
  template: `
    <h2 mat-dialog-title>Remove {{ data.name }}?</h2>
    <mat-dialog-content>
      <p>
        {{ data.name }} will no longer be able to work in {{ data.workshopName }}; any other
        workshops they belong to keep them. The records they made stay as they are.
      </p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="false">Keep</button>
      <button mat-flat-button type="button" [mat-dialog-close]="true">Remove</button>
    </mat-dialog-actions>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RemoveMemberDialog {
  protected readonly data = inject<RemoveMemberData>(MAT_DIALOG_DATA);
}

import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButton } from '@angular/material/button';
import {
  MAT_DIALOG_DATA,
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogTitle,
} from '@angular/material/dialog';
import type { ShareRecord } from '@batchproof/shared';

/** Asks before a share is taken back; closes with `true` to go ahead. */
@Component({
  selector: 'bp-unshare-dialog',
  imports: [MatButton, MatDialogActions, MatDialogClose, MatDialogContent, MatDialogTitle],
  template: `
    <h2 mat-dialog-title>Stop sharing with {{ share.assessorName }}?</h2>
    <mat-dialog-content>
      <p>
        {{ share.assessorName }} will no longer see {{ share.formulaName }} version
        {{ share.versionNumber }} or the assessment written from it. What they wrote is kept; share
        the version again to give it back.
      </p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="false">Keep sharing</button>
      <button mat-flat-button type="button" [mat-dialog-close]="true">Unshare</button>
    </mat-dialog-actions>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UnshareDialog {
  protected readonly share = inject<ShareRecord>(MAT_DIALOG_DATA);
}

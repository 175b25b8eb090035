import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatButton } from '@angular/material/button';
import {
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogTitle,
} from '@angular/material/dialog';
import { MatIcon } from '@angular/material/icon';

/** What the member chose when leaving a page with unsaved changes. */
export type LeaveChoice = 'save' | 'discard' | 'stay';

/** Asks what to do with unsaved changes before leaving a page; closes with the choice. */
@Component({
  selector: 'bp-unsaved-changes-dialog',
  imports: [MatButton, MatDialogActions, MatDialogClose, MatDialogContent, MatDialogTitle, MatIcon],
  template: `
    <h2 mat-dialog-title>Save your changes?</h2>
    <mat-dialog-content>
      <p>This page has changes that are not saved yet. Leaving it now would lose them.</p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="'stay'">Stay on this page</button>
      <button mat-button type="button" [mat-dialog-close]="'discard'">Discard changes</button>
      <button mat-flat-button type="button" [mat-dialog-close]="'save'">
        <mat-icon>save</mat-icon>
        Save and leave
      </button>
    </mat-dialog-actions>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UnsavedChangesDialog {}

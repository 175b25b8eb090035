import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButton } from '@angular/material/button';
import {
  MAT_DIALOG_DATA,
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogTitle,
} from '@angular/material/dialog';

/** What the confirmation counts. */
export interface SendNoticesData {
  drill: boolean;
  /** Customers who will get an e-mail now. */
  toMail: number;
  /** Customers with no e-mail, who need a phone call instead. */
  toCall: number;
}

/** Asks before recall notices go out; closes with `true` to send. */
@Component({
  selector: 'bp-send-notices-dialog',
  imports: [MatButton, MatDialogActions, MatDialogClose, MatDialogContent, MatDialogTitle],
  template: `
    <h2 mat-dialog-title>
      {{ data.drill ? 'Write the drill notices?' : 'Send the recall notices?' }}
    </h2>
    <mat-dialog-content>
      @if (data.drill) {
        <p>
          This is a drill: the notices are written and kept with the drill, and nothing is sent to
          anyone.
        </p>
      } @else {
        <p>
          {{ data.toMail }} customer(s) get the notice by e-mail now. An e-mail cannot be taken
          back.
        </p>
        @if (data.toCall > 0) {
          <p>{{ data.toCall }} customer(s) have no e-mail address: call them yourself.</p>
        }
      }
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="false">Not now</button>
      <button mat-flat-button type="button" [mat-dialog-close]="true">
        {{ data.drill ? 'Write notices' : 'Send notices' }}
      </button>
    </mat-dialog-actions>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SendNoticesDialog {
  protected readonly data = inject<SendNoticesData>(MAT_DIALOG_DATA);
}

import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatCheckbox } from '@angular/material/checkbox';
import {
  MAT_DIALOG_DATA,
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogTitle,
} from '@angular/material/dialog';
import { MatIcon } from '@angular/material/icon';

/** What the signing dialog shows. */
export interface SignDialogData {
  productName: string;
  versionNumber: number;
  /** Who signs: the signed-in assessor. */
  signerName: string;
  /** SHA-256 of the packet content the assessor read (64 hex digits). */
  contentHash: string;
}

/**
 * The assessor's signature: what is signed (the product version and the SHA-256 of the packet on
 * screen), who signs, what signing means, and a confirmation. Closes with `true` to sign.
 */
@Component({
  selector: 'bp-sign-dialog',
  imports: [
    MatButton,
    MatCheckbox,
    MatDialogActions,
    MatDialogClose,
    MatDialogContent,
    MatDialogTitle,
    MatIcon,
  ],
  template: `
    <h2 mat-dialog-title>Sign the safety assessment?</h2>
    <mat-dialog-content>
      <dl class="facts">
        <dt>Product</dt>
        <dd>{{ data.productName }}, version {{ data.versionNumber }}</dd>
        <dt>Signed by</dt>
        <dd>{{ data.signerName }}</dd>
        <dt>Packet SHA-256</dt>
        <dd>
          <code class="hash" data-testid="sign-hash">{{ data.contentHash }}</code>
        </dd>
      </dl>
      <p class="statement">
        <mat-icon aria-hidden="true">gavel</mat-icon>
        <span>
          I have read the safety information of this exact formula version as shown, and I sign this
          assessment (Part B) as the qualified safety assessor. Once signed it can no longer change;
          a later formula version needs its own assessment.
        </span>
      </p>
      <mat-checkbox [checked]="confirmed()" (change)="confirmed.set($event.checked)">
        I sign as the qualified safety assessor
      </mat-checkbox>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="false">Not yet</button>
      <button mat-flat-button type="button" [disabled]="!confirmed()" [mat-dialog-close]="true">
        <mat-icon>verified</mat-icon>
        Sign
      </button>
    </mat-dialog-actions>
  `,
  styles: `
    .facts {
      display: grid;
      grid-template-columns: auto minmax(0, 1fr);
      gap: 4px 16px;
      margin: 0 0 16px;
    }
    dt {
      font-weight: 600;
    }
    dd {
      margin: 0;
      min-width: 0;
    }
    .hash {
      overflow-wrap: anywhere;
      font-size: 0.85em;
    }
    .statement {
      display: flex;
      gap: 8px;
      align-items: flex-start;
    }
    .statement mat-icon {
      /* Kept whole beside a long statement at phone width (it shrank to a sliver). */
      flex: none;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignDialog {
  protected readonly data = inject<SignDialogData>(MAT_DIALOG_DATA);
  protected readonly confirmed = signal(false);
}

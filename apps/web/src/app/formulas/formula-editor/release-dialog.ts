import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import {
  MAT_DIALOG_DATA,
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogRef,
  MatDialogTitle,
} from '@angular/material/dialog';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { type ComplianceFinding, releaseSchema } from '@batchproof/shared';
import { checkForm, errorMessage } from '../../forms/form-errors';
import { InterpretationNote } from '../live-checks/interpretation-note';
import { SeverityLabel } from '../severity/severity-label';

/** What the override dialog shows. */
export interface ReleaseOverrideData {
  version: number;
  /** The server's refusal, naming the blocking findings. */
  refusal: string;
  blocking: ComplianceFinding[];
}

/** The contract's `override.reason` is this form's `reason`. */
const mapPath = (path: string) => path.replace(/^override\./, '');

/**
 * The owner's release over blocking findings: each block is listed again, and the reason is kept
 * on the version and in the audit log. Closes with the reason, or undefined to step back.
 */
@Component({
  selector: 'bp-release-dialog',
  imports: [
    ReactiveFormsModule,
    MatButton,
    MatDialogActions,
    MatDialogClose,
    MatDialogContent,
    MatDialogTitle,
    MatError,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    InterpretationNote,
    SeverityLabel,
  ],
  template: `
    <h2 mat-dialog-title>Release version {{ data.version }} over its blocks?</h2>
    <form [formGroup]="form" (ngSubmit)="submit()" novalidate>
      <mat-dialog-content class="bp-form">
        <p>{{ data.refusal }}</p>
        @if (data.blocking.length > 0) {
          <ul class="blocks" aria-label="Blocking findings">
            @for (f of data.blocking; track $index) {
              <li>
                <bp-severity-label severity="block" />
                <strong>{{ f.market ?? 'Every market' }} · {{ f.subject }}</strong>
                <span class="source">{{ f.source }}</span>
                @if (f.status === 'interpretation') {
                  <bp-interpretation-note class="interpretation" />
                }
              </li>
            }
          </ul>
        }
        <p class="weight">
          <mat-icon aria-hidden="true">gavel</mat-icon>
          As the owner you answer for this label. Your reason is recorded with the version and in
          the workshop's audit log.
        </p>
        @if (notice()) {
          <p class="bp-form-error" role="alert">{{ notice() }}</p>
        }
        <mat-form-field>
          <mat-label>Reason for the override</mat-label>
          <textarea matInput formControlName="reason" rows="4"></textarea>
          <mat-hint>At least 10 characters, e.g. who confirmed it and on what evidence</mat-hint>
          <mat-error>{{ errorMessage(form.controls.reason) }}</mat-error>
        </mat-form-field>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" [mat-dialog-close]="undefined">Keep as draft</button>
        <button mat-flat-button type="submit">Release with this reason</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .blocks {
      list-style: none;
      margin: 0 0 12px;
      padding: 0;
      display: grid;
      gap: 6px;
    }
    .blocks li {
      display: flex;
      flex-wrap: wrap;
      gap: 4px 8px;
      align-items: center;
    }
    .source,
    .interpretation {
      flex-basis: 100%;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .weight {
      display: flex;
      gap: 8px;
      align-items: flex-start;
    }
    .weight mat-icon {
      flex: none;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReleaseDialog {
  protected readonly data = inject<ReleaseOverrideData>(MAT_DIALOG_DATA);
  private readonly ref = inject<MatDialogRef<ReleaseDialog, string>>(MatDialogRef);
  protected readonly form = inject(NonNullableFormBuilder).group({ reason: '' });
  protected readonly notice = signal('');
  protected readonly errorMessage = errorMessage;

  protected submit(): void {
    const body = { override: { reason: this.form.controls.reason.value } };
    const { value, notice } = checkForm(this.form, { schema: releaseSchema, body, mapPath });
    this.notice.set(notice);
    if (value?.override) this.ref.close(value.override.reason);
  }
}

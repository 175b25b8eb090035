import { ChangeDetectionStrategy, Component, inject, input, output, signal } from '@angular/core';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatSnackBar } from '@angular/material/snack-bar';
import { type Recall, recallCloseSchema } from '@batchproof/shared';
import { errorMessage, validateForm } from '../../forms/form-errors';
import { sendForm } from '../../forms/send-form';
import { RecallsApi } from '../recalls-api';

/** Closes a recall with a summary of what was found, done and recovered. */
@Component({
  selector: 'bp-recall-close-form',
  imports: [
    MatButton,
    MatError,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    ReactiveFormsModule,
  ],
  template: `
    <form
      class="bp-form"
      [formGroup]="form"
      (ngSubmit)="submit()"
      novalidate
      aria-label="Close the recall"
      [attr.aria-busy]="sending()"
    >
      @if (notice()) {
        <p class="bp-form-error" role="alert">
          <mat-icon aria-hidden="true">error_outline</mat-icon>{{ notice() }}
        </p>
      }
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>Summary</mat-label>
        <textarea matInput formControlName="summary" rows="4"></textarea>
        <mat-hint>
          What was found, what was done and how much came back. It goes on the summary PDF.
        </mat-hint>
        <mat-error>{{ errorMessage(form.controls.summary) }}</mat-error>
      </mat-form-field>
      <div>
        <button mat-flat-button type="submit" [disabled]="sending()">
          <mat-icon>task_alt</mat-icon>Close {{ recall().drill ? 'the drill' : 'the recall' }}
        </button>
      </div>
    </form>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RecallCloseForm {
  readonly recall = input.required<Recall>();
  readonly changed = output<Recall>();

  private readonly api = inject(RecallsApi);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly errorMessage = errorMessage;
  protected readonly sending = signal(false);
  protected readonly notice = signal('');
  protected readonly form = inject(FormBuilder).nonNullable.group({ summary: '' });

  protected async submit(): Promise<void> {
    if (this.sending()) return;
    const value = validateForm(this.form, recallCloseSchema);
    if (!value) return;
    const recall = await sendForm(this.form, this.api.close(this.recall().id, value), {
      sending: this.sending,
      notice: this.notice,
    });
    if (!recall) return;
    this.snackBar.open('Closed. The summary PDF has everything.', 'OK', { duration: 5000 });
    this.changed.emit(recall);
  }
}

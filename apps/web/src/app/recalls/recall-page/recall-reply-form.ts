import { ChangeDetectionStrategy, Component, inject, input, output, signal } from '@angular/core';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { type Recall, recallReplyCreateSchema, todayIso } from '@batchproof/shared';
import { errorMessage, validateForm } from '../../forms/form-errors';
import { sendForm } from '../../forms/send-form';
import { RecallsApi } from '../recalls-api';

/** Records a customer's answer to a notice: units still on hand and units sent back. */
@Component({
  selector: 'bp-recall-reply-form',
  imports: [
    MatButton,
    MatError,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    MatOption,
    MatSelect,
    ReactiveFormsModule,
  ],
  template: `
    <form
      class="bp-form"
      [formGroup]="form"
      (ngSubmit)="submit()"
      novalidate
      aria-label="Record a reply"
      [attr.aria-busy]="sending()"
    >
      @if (notice()) {
        <p class="bp-form-error" role="alert">
          <mat-icon aria-hidden="true">error_outline</mat-icon>{{ notice() }}
        </p>
      }
      <div class="row">
        <mat-form-field subscriptSizing="dynamic">
          <mat-label>Customer</mat-label>
          <mat-select formControlName="customerId">
            @for (c of recall().affected; track c.customerId) {
              <mat-option [value]="c.customerId">{{ c.customerName }}</mat-option>
            }
          </mat-select>
          <mat-error>{{ errorMessage(form.controls.customerId) }}</mat-error>
        </mat-form-field>
        <mat-form-field subscriptSizing="dynamic">
          <mat-label>Day of the reply</mat-label>
          <input matInput type="date" formControlName="repliedOn" />
          <mat-error>{{ errorMessage(form.controls.repliedOn) }}</mat-error>
        </mat-form-field>
      </div>
      <div class="row">
        <mat-form-field subscriptSizing="dynamic">
          <mat-label>Units on hand</mat-label>
          <input matInput type="number" min="0" step="1" formControlName="unitsOnHand" />
          <mat-hint>Still on their shelf or in their store.</mat-hint>
          <mat-error>{{ errorMessage(form.controls.unitsOnHand) }}</mat-error>
        </mat-form-field>
        <mat-form-field subscriptSizing="dynamic">
          <mat-label>Units returned</mat-label>
          <input matInput type="number" min="0" step="1" formControlName="unitsReturned" />
          <mat-hint>Sent or brought back to you with this reply.</mat-hint>
          <mat-error>{{ errorMessage(form.controls.unitsReturned) }}</mat-error>
        </mat-form-field>
      </div>
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>Notes (optional)</mat-label>
        <textarea matInput formControlName="notes" rows="2"></textarea>
        <mat-error>{{ errorMessage(form.controls.notes) }}</mat-error>
      </mat-form-field>
      <div>
        <button mat-flat-button type="submit" [disabled]="sending()">
          <mat-icon>reply</mat-icon>Record the reply
        </button>
      </div>
    </form>
  `,
  styles: `
    .row {
      display: flex;
      flex-wrap: wrap;
      gap: 4px 12px;
    }
    .row > * {
      flex: 1 1 12rem;
      min-width: 0;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RecallReplyForm {
  readonly recall = input.required<Recall>();
  readonly changed = output<Recall>();

  private readonly api = inject(RecallsApi);
  private readonly snackBar = inject(MatSnackBar);
  private readonly fb = inject(FormBuilder).nonNullable;
  protected readonly errorMessage = errorMessage;
  protected readonly sending = signal(false);
  protected readonly notice = signal('');
  protected readonly form = this.fb.group({
    customerId: '',
    repliedOn: todayIso(),
    unitsOnHand: this.fb.control<number | null>(null),
    unitsReturned: this.fb.control<number | null>(0),
    notes: '',
  });

  protected async submit(): Promise<void> {
    if (this.sending()) return;
    const value = validateForm(this.form, recallReplyCreateSchema);
    if (!value) return;
    const recall = await sendForm(this.form, this.api.reply(this.recall().id, value), {
      sending: this.sending,
      notice: this.notice,
    });
    if (!recall) return;
    this.form.reset();
    this.snackBar.open('The reply is recorded.', 'OK', { duration: 5000 });
    this.changed.emit(recall);
  }
}

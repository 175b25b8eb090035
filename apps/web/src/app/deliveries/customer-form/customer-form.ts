import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  linkedSignal,
  output,
  signal,
  untracked,
} from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import {
  CUSTOMER_KIND_LABELS,
  CUSTOMER_KINDS,
  type Customer,
  type CustomerKind,
  type FieldWarning,
  ROLE_SETS,
  customerCreateSchema,
} from '@batchproof/shared';
import { Session } from '../../auth/session';
import { FieldWarnings } from '../../forms/field-warnings';
import { errorMessage, validateForm } from '../../forms/form-errors';
import { sendForm } from '../../forms/send-form';
import { SubmissionKey } from '../../http/submission-key';
import { CustomersApi } from '../customers-api';

/**
 * A customer's kind, name and contact details, checked with the shared `customerCreateSchema`
 * the API also uses; read-only for members who may not write.
 */
@Component({
  selector: 'bp-customer-form',
  imports: [
    FieldWarnings,
    MatButton,
    MatError,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    MatOption,
    MatProgressBar,
    MatSelect,
    ReactiveFormsModule,
  ],
  template: `
    @let f = form();
    <form
      class="bp-form"
      [formGroup]="f"
      (ngSubmit)="save()"
      novalidate
      aria-label="Customer"
      [attr.aria-busy]="sending()"
    >
      @if (notice()) {
        <p class="bp-form-error" role="alert">
          <mat-icon aria-hidden="true">error_outline</mat-icon>{{ notice() }}
        </p>
      }
      <mat-form-field>
        <mat-label>Kind of customer</mat-label>
        <mat-select formControlName="kind">
          @for (k of kinds; track k) {
            <mat-option [value]="k">{{ kindLabels[k] }}</mat-option>
          }
        </mat-select>
        <mat-error>{{ errorMessage(f.controls.kind) }}</mat-error>
      </mat-form-field>
      <mat-form-field>
        <mat-label>Customer name</mat-label>
        <input matInput formControlName="name" autocomplete="organization" />
        <mat-error>{{ errorMessage(f.controls.name) }}</mat-error>
      </mat-form-field>
      <bp-field-warnings [warnings]="nameWarnings()" />
      <mat-form-field>
        <mat-label>Contact person</mat-label>
        <input matInput formControlName="contact" autocomplete="off" />
        <mat-error>{{ errorMessage(f.controls.contact) }}</mat-error>
      </mat-form-field>
      <mat-form-field>
        <mat-label>E-mail</mat-label>
        <input matInput type="email" formControlName="email" autocomplete="off" />
        <mat-hint>Where a recall notice goes. Without one, the recall lists them to call.</mat-hint>
        <mat-error>{{ errorMessage(f.controls.email) }}</mat-error>
      </mat-form-field>
      <mat-form-field>
        <mat-label>Phone</mat-label>
        <input matInput type="tel" formControlName="phone" autocomplete="off" />
        <mat-error>{{ errorMessage(f.controls.phone) }}</mat-error>
      </mat-form-field>
      <mat-form-field>
        <mat-label>Address</mat-label>
        <textarea matInput formControlName="address" rows="3"></textarea>
        <mat-error>{{ errorMessage(f.controls.address) }}</mat-error>
      </mat-form-field>
      <mat-form-field>
        <mat-label>Notes</mat-label>
        <textarea matInput formControlName="notes" rows="3"></textarea>
        <mat-error>{{ errorMessage(f.controls.notes) }}</mat-error>
      </mat-form-field>
      @if (canWrite()) {
        <div class="progress">
          @if (sending()) {
            <mat-progress-bar mode="indeterminate" aria-label="Saving the customer" />
          }
        </div>
        <div>
          <button mat-flat-button type="submit" [disabled]="sending()">
            <mat-icon>save</mat-icon>{{ customer() ? 'Save customer' : 'Add customer' }}
          </button>
        </div>
      }
    </form>
  `,
  styles: `
    :host {
      display: block;
      max-width: 40rem;
    }
    .progress {
      height: 4px;
      margin-bottom: 8px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CustomerForm {
  /** The customer to edit, or null for a new one. */
  readonly customer = input<Customer | null>(null);
  /** Warnings of the save that created the customer, shown until the next save. */
  readonly initialWarnings = input<readonly FieldWarning[]>([]);
  /** Emits the customer as the API stored it after each save. */
  readonly saved = output<Customer>();

  private readonly fb = inject(NonNullableFormBuilder);
  private readonly api = inject(CustomersApi);
  private readonly snackBar = inject(MatSnackBar);
  private readonly session = inject(Session);
  private readonly submission = new SubmissionKey();

  protected readonly kinds = CUSTOMER_KINDS;
  protected readonly kindLabels = CUSTOMER_KIND_LABELS;
  protected readonly errorMessage = errorMessage;
  /** Whether the signed-in member may change customers. */
  protected readonly canWrite = computed(() => this.session.hasRole(ROLE_SETS.goodsIn));
  /** The form, built once per customer shown; disabled for readers. */
  protected readonly form = computed(() => {
    const c = this.customer();
    const canWrite = this.canWrite();
    return untracked(() => {
      const form = this.fb.group({
        kind: this.fb.control<CustomerKind>(c?.kind ?? 'stockist'),
        name: c?.name ?? '',
        contact: c?.contact ?? '',
        email: c?.email ?? '',
        phone: c?.phone ?? '',
        address: c?.address ?? '',
        notes: c?.notes ?? '',
      });
      if (!canWrite) form.disable();
      return form;
    });
  });
  protected readonly sending = signal(false);
  protected readonly notice = signal('');
  /** What the last save said about the name (another customer has it); never blocks. */
  protected readonly nameWarnings = linkedSignal(() => this.initialWarnings());

  /** Whether the form holds changes not saved yet. */
  hasUnsavedChanges(): boolean {
    return this.canWrite() && this.form().dirty;
  }

  /** Checks and saves the customer; resolves whether it was saved. */
  async save(): Promise<boolean> {
    if (this.sending() || !this.canWrite()) return false;
    this.notice.set('');
    const form = this.form();
    const value = validateForm(form, customerCreateSchema);
    if (!value) return false;
    const id = this.customer()?.id;
    const request = id
      ? this.api.update(id, value)
      : this.api.create(value, this.submission.for(value));
    const customer = await sendForm(form, request, {
      sending: this.sending,
      notice: this.notice,
    });
    if (!customer) return false;
    this.submission.done();
    this.nameWarnings.set(customer.warnings ?? []);
    this.snackBar.open(`Saved ${customer.name}.`, 'OK', { duration: 4000 });
    this.saved.emit(customer);
    return true;
  }
}

import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  linkedSignal,
  output,
  signal,
} from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import {
  type FieldWarning,
  ROLE_SETS,
  type Supplier,
  supplierCreateSchema,
} from '@batchproof/shared';
import { Session } from '../../auth/session';
import { errorMessage, showRequestError, validateForm } from '../../forms/form-errors';
import { SuppliersApi } from '../suppliers-api';
import { FieldWarnings } from '../../forms/field-warnings';

/** A supplier's name and contact details; read-only for members who may not write. */
@Component({
  selector: 'bp-supplier-form',
  imports: [
    ReactiveFormsModule,
    MatButton,
    MatError,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    MatProgressBar,
    FieldWarnings,
  ],
  template: `
    @let f = form();
    <form
      class="bp-form"
      [formGroup]="f"
      (ngSubmit)="save()"
      novalidate
      aria-label="Supplier"
      [attr.aria-busy]="saving()"
    >
      @if (notice()) {
        <p class="bp-form-error" role="alert">
          <mat-icon aria-hidden="true">error_outline</mat-icon>{{ notice() }}
        </p>
      }
      <mat-form-field>
        <mat-label>Supplier name</mat-label>
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
        <mat-hint>Where you ask for certificates and safety data sheets.</mat-hint>
        <mat-error>{{ errorMessage(f.controls.email) }}</mat-error>
      </mat-form-field>
      <mat-form-field>
        <mat-label>Website</mat-label>
        <input matInput type="url" formControlName="website" autocomplete="off" />
        <mat-error>{{ errorMessage(f.controls.website) }}</mat-error>
      </mat-form-field>
      <mat-form-field>
        <mat-label>Notes</mat-label>
        <textarea matInput formControlName="notes" rows="3"></textarea>
        <mat-error>{{ errorMessage(f.controls.notes) }}</mat-error>
      </mat-form-field>
      @if (canWrite()) {
        <div class="progress">
          @if (saving()) {
            <mat-progress-bar mode="indeterminate" aria-label="Saving the supplier" />
          }
        </div>
        <div>
          <button mat-flat-button type="submit" [disabled]="saving()">
            <mat-icon>save</mat-icon>{{ supplier() ? 'Save supplier' : 'Create supplier' }}
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
export class SupplierForm {
  /** The supplier to edit, or null for a new one. */
  readonly supplier = input<Supplier | null>(null);
  /** Emits the supplier as the API stored it after each save. */
  readonly saved = output<Supplier>();
  /** Warnings of the save that created the supplier, shown until the next save. */
  readonly initialWarnings = input<readonly FieldWarning[]>([]);

  private readonly fb = inject(NonNullableFormBuilder);
  private readonly api = inject(SuppliersApi);
  private readonly snackBar = inject(MatSnackBar);
  private readonly session = inject(Session);

  /** Whether the signed-in member may change suppliers. */
  protected readonly canWrite = computed(() => this.session.hasRole(ROLE_SETS.writers));
  /** The form, built once per supplier shown; disabled for readers. */
  protected readonly form = computed(() => {
    const s = this.supplier();
    const form = this.fb.group({
      name: s?.name ?? '',
      contact: s?.contact ?? '',
      email: s?.email ?? '',
      website: s?.website ?? '',
      notes: s?.notes ?? '',
    });
    if (!this.canWrite()) form.disable();
    return form;
  });
  protected readonly errorMessage = errorMessage;
  protected readonly saving = signal(false);
  protected readonly notice = signal('');
  /** What the last save said about the name (another supplier has it); never blocks. */
  protected readonly nameWarnings = linkedSignal(() => this.initialWarnings());

  /** Whether the form holds changes not saved yet. */
  hasUnsavedChanges(): boolean {
    return this.canWrite() && this.form().dirty;
  }

  /** Checks and saves the supplier; resolves whether it was saved. */
  save(): Promise<boolean> {
    if (this.saving() || !this.canWrite()) return Promise.resolve(false);
    this.notice.set('');
    const form = this.form();
    const value = validateForm(form, supplierCreateSchema);
    if (!value) return Promise.resolve(false);
    this.saving.set(true);
    const id = this.supplier()?.id;
    return new Promise((resolve) => {
      (id ? this.api.update(id, value) : this.api.create(value)).subscribe({
        next: (supplier) => {
          this.saving.set(false);
          form.markAsPristine();
          this.nameWarnings.set(supplier.warnings ?? []);
          this.snackBar.open(`Saved ${supplier.name}.`, 'OK', { duration: 4000 });
          this.saved.emit(supplier);
          resolve(true);
        },
        error: (err: unknown) => {
          this.saving.set(false);
          this.notice.set(showRequestError(form, err));
          resolve(false);
        },
      });
    });
  }
}

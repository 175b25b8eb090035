import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  signal,
  untracked,
} from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { ROLE_SETS, workshopLabelDetailsSchema } from '@batchproof/shared';
import { Session } from '../../auth/session';
import { focusFragment } from '../../forms/focus-fragment';
import { errorMessage, validateForm } from '../../forms/form-errors';
import { sendForm } from '../../forms/send-form';
import { messageOf } from '../../http/api-error';
import { LabelDetailsApi } from '../../labels/label-details-api';

/**
 * The workshop's name and business address as every label prints them. The owner edits; others
 * read. The address field's id is `workshop.address`, so a refused print run links to it.
 */
@Component({
  selector: 'bp-workshop-label-details',
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
  ],
  template: `
    <section class="details" aria-labelledby="label-details-heading">
      <h2 id="label-details-heading">Name and address on labels</h2>
      <div class="progress">
        @if (details.isLoading() || saving()) {
          <mat-progress-bar mode="indeterminate" aria-label="Loading the business address" />
        }
      </div>
      @if (loadError()) {
        <p class="bp-form-error" role="alert">
          <mat-icon aria-hidden="true">error_outline</mat-icon>{{ loadError() }}
        </p>
      }
      @if (notice()) {
        <p class="bp-form-error" role="alert">
          <mat-icon aria-hidden="true">error_outline</mat-icon>{{ notice() }}
        </p>
      }
      @if (form(); as f) {
        <form
          [formGroup]="f"
          (ngSubmit)="save()"
          novalidate
          aria-label="Name and address on labels"
        >
          <mat-form-field>
            <mat-label>Business name</mat-label>
            <input matInput id="workshop.name" formControlName="name" autocomplete="organization" />
            <mat-error>{{ errorMessage(f.controls.name) }}</mat-error>
          </mat-form-field>
          <mat-form-field>
            <mat-label>Business address</mat-label>
            <textarea
              matInput
              id="workshop.address"
              rows="3"
              formControlName="address"
              autocomplete="street-address"
            ></textarea>
            <mat-hint>The name and place of business every label carries.</mat-hint>
            <mat-error>{{ errorMessage(f.controls.address) }}</mat-error>
          </mat-form-field>
          @if (isOwner()) {
            <div>
              <button mat-flat-button type="submit" [disabled]="saving()">
                <mat-icon>save</mat-icon>Save
              </button>
            </div>
          } @else {
            <p class="hint">The workshop's owner changes these.</p>
          }
        </form>
      }
    </section>
  `,
  styles: `
    .details form {
      display: grid;
      gap: 4px;
      max-width: 40rem;
    }
    .progress {
      height: 4px;
    }
    .hint {
      margin: 0;
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WorkshopLabelDetails {
  private readonly api = inject(LabelDetailsApi);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly snackBar = inject(MatSnackBar);
  private readonly session = inject(Session);
  protected readonly errorMessage = errorMessage;
  protected readonly isOwner = computed(() => this.session.hasRole(ROLE_SETS.ownerOnly));
  protected readonly details = this.api.workshopDetails();
  protected readonly saving = signal(false);
  protected readonly notice = signal('');
  private readonly state = { sending: this.saving, notice: this.notice };
  protected readonly loadError = computed(() => {
    const error = this.details.error();
    return error ? messageOf(error) : '';
  });
  protected readonly form = computed(() => {
    if (!this.details.hasValue()) return undefined;
    const d = this.details.value();
    return untracked(() => {
      const form = this.fb.group({ name: d.name, address: d.address ?? '' });
      if (!this.isOwner()) form.disable();
      return form;
    });
  });

  constructor() {
    focusFragment(computed(() => this.form() !== undefined));
  }

  /** Whether the form holds changes not saved yet. */
  hasUnsavedChanges(): boolean {
    return this.isOwner() && !!this.form()?.dirty;
  }

  protected async save(): Promise<void> {
    const form = this.form();
    if (!form || this.saving()) return;
    this.notice.set('');
    const value = validateForm(form, workshopLabelDetailsSchema);
    if (!value) return;
    const saved = await sendForm(form, this.api.saveWorkshopDetails(value), this.state);
    if (saved) {
      this.snackBar.open('The name and address on labels are saved.', 'OK', { duration: 4000 });
    }
  }
}

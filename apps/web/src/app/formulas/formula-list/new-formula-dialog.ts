import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import {
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogRef,
  MatDialogTitle,
} from '@angular/material/dialog';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect } from '@angular/material/select';
import {
  type ComplianceMarket,
  type Formula,
  formulaCreateSchema,
  PRODUCT_TYPES,
  type ProductType,
} from '@batchproof/shared';
import { checkForm, errorMessage, showRequestError } from '../../forms/form-errors';
import { SubmissionKey } from '../../http/submission-key';
import { FormulasApi } from '../formulas-api';
import { MARKETS, PRODUCT_TYPE_LABELS, startingProfile } from '../product-types';

/** The contract's `draft.profile.markets` is this form's `markets`. */
const mapPath = (path: string) => (path.startsWith('draft.profile.markets') ? 'markets' : path);

/**
 * Starts a formula: a name, what it makes and where it sells. The first draft gets a starting
 * profile for that product type, to confirm in the editor. Closes with the new formula.
 */
@Component({
  selector: 'bp-new-formula-dialog',
  imports: [
    ReactiveFormsModule,
    MatButton,
    MatButtonToggle,
    MatButtonToggleGroup,
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
    MatOption,
    MatProgressBar,
    MatSelect,
  ],
  template: `
    <h2 mat-dialog-title>New formula</h2>
    <form [formGroup]="form" (ngSubmit)="submit()" novalidate [attr.aria-busy]="saving()">
      <mat-dialog-content class="bp-form">
        <div class="progress">
          @if (saving()) {
            <mat-progress-bar mode="indeterminate" aria-label="Creating the formula" />
          }
        </div>
        @if (notice()) {
          <p class="bp-form-error" role="alert">
            <mat-icon aria-hidden="true">error_outline</mat-icon>{{ notice() }}
          </p>
        }
        <mat-form-field>
          <mat-label>Formula name</mat-label>
          <input matInput formControlName="name" autocomplete="off" />
          <mat-error>{{ errorMessage(form.controls.name) }}</mat-error>
        </mat-form-field>
        <mat-form-field>
          <mat-label>Product type</mat-label>
          <mat-select formControlName="productType">
            @for (t of productTypes; track t) {
              <mat-option [value]="t">{{ typeLabels[t] }}</mat-option>
            }
          </mat-select>
          <mat-hint>Sets a starting profile (in the bath, IFRA category) to confirm.</mat-hint>
          <mat-error>{{ errorMessage(form.controls.productType) }}</mat-error>
        </mat-form-field>
        <fieldset class="markets">
          <legend>Markets</legend>
          <mat-button-toggle-group formControlName="markets" multiple aria-label="Markets">
            @for (m of markets; track m.code) {
              <mat-button-toggle [value]="m.code" [attr.title]="m.name">{{
                m.code
              }}</mat-button-toggle>
            }
          </mat-button-toggle-group>
          @if (errorMessage(form.controls.markets); as message) {
            @if (form.controls.markets.touched) {
              <p class="field-error" role="alert">{{ message }}</p>
            }
          }
        </fieldset>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" [mat-dialog-close]="undefined">Cancel</button>
        <button mat-flat-button type="submit" [disabled]="saving()">Create formula</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .progress {
      height: 4px;
    }
    .markets {
      border: 0;
      margin: 8px 0 0;
      padding: 0;
    }
    legend {
      font: var(--mat-sys-body-medium);
      color: var(--mat-sys-on-surface-variant);
      margin-bottom: 8px;
    }
    .field-error {
      color: var(--mat-sys-error);
      font: var(--mat-sys-body-small);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NewFormulaDialog {
  private readonly api = inject(FormulasApi);
  private readonly ref = inject<MatDialogRef<NewFormulaDialog, Formula>>(MatDialogRef);
  protected readonly form = inject(NonNullableFormBuilder).group({
    name: '',
    productType: 'fizzer' as ProductType,
    markets: [['US', 'EU'] as ComplianceMarket[]],
  });
  protected readonly productTypes = PRODUCT_TYPES;
  protected readonly typeLabels = PRODUCT_TYPE_LABELS;
  protected readonly markets = MARKETS;
  protected readonly saving = signal(false);
  /** The Idempotency-Key of this dialog's submission, kept while it is retried. */
  private readonly submission = new SubmissionKey();
  protected readonly notice = signal('');
  protected readonly errorMessage = errorMessage;

  protected submit(): void {
    if (this.saving()) return;
    const { name, productType, markets } = this.form.getRawValue();
    const body = {
      name,
      productType,
      notes: null,
      draft: { lines: [], profile: startingProfile(productType, markets), notes: null },
    };
    const { value, notice } = checkForm(this.form, {
      schema: formulaCreateSchema,
      body,
      mapPath,
    });
    this.notice.set(notice);
    if (!value) return;
    this.saving.set(true);
    this.api.create(value, this.submission.for(value)).subscribe({
      next: (formula) => {
        this.submission.done();
        this.ref.close(formula);
      },
      error: (err: unknown) => {
        this.saving.set(false);
        this.notice.set(showRequestError(this.form, err, mapPath));
      },
    });
  }
}

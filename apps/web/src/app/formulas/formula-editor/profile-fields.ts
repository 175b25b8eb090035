import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import { MatCheckbox } from '@angular/material/checkbox';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { PRODUCT_TYPES } from '@batchproof/shared';
import { errorMessage } from '../../forms/form-errors';
import { IFRA_CATEGORIES, MARKETS, PRODUCT_TYPE_LABELS } from '../product-types';
import type { FormulaForm } from './formula-form';

/**
 * What the product is and how it is used: these decide which rules the checks apply (in the
 * bath means mucous-membrane contact; the IFRA category picks the fragrance maximum).
 */
@Component({
  selector: 'bp-profile-fields',
  imports: [
    ReactiveFormsModule,
    MatButtonToggle,
    MatButtonToggleGroup,
    MatCheckbox,
    MatError,
    MatFormField,
    MatHint,
    MatInput,
    MatLabel,
    MatOption,
    MatSelect,
    MatSuffix,
  ],
  template: `
    @let f = form();
    @let p = profile();
    <div class="grid">
      <mat-form-field>
        <mat-label>Product type</mat-label>
        <mat-select [formControl]="f.controls.productType">
          @for (t of productTypes; track t) {
            <mat-option [value]="t">{{ typeLabels[t] }}</mat-option>
          }
        </mat-select>
        <mat-error>{{ errorMessage(f.controls.productType) }}</mat-error>
      </mat-form-field>
      <mat-form-field>
        <mat-label>Use</mat-label>
        <mat-select [formControl]="p.controls.use">
          <mat-option value="rinse-off">Rinse-off</mat-option>
          <mat-option value="leave-on">Leave-on</mat-option>
        </mat-select>
        <mat-error>{{ errorMessage(p.controls.use) }}</mat-error>
      </mat-form-field>
      <mat-form-field>
        <mat-label>IFRA category</mat-label>
        <mat-select [formControl]="p.controls.ifraCategory">
          @for (c of ifraCategories; track c) {
            <mat-option [value]="c">Category {{ c }}</mat-option>
          }
        </mat-select>
        <mat-hint>As the fragrance certificate names it</mat-hint>
        <mat-error>{{ errorMessage(p.controls.ifraCategory) }}</mat-error>
      </mat-form-field>
    </div>

    <fieldset>
      <legend>Contact and exposure</legend>
      <div class="checks">
        <mat-checkbox [formControl]="p.controls.inBath">Used in the bath</mat-checkbox>
        <mat-checkbox [formControl]="p.controls.contact.controls.mucousMembranes"
          >Mucous membranes</mat-checkbox
        >
        <mat-checkbox [formControl]="p.controls.contact.controls.eyeArea">Eye area</mat-checkbox>
        <mat-checkbox [formControl]="p.controls.contact.controls.lips">Lips</mat-checkbox>
        <mat-checkbox [formControl]="p.controls.adultsOnly">For adults only</mat-checkbox>
      </div>
    </fieldset>

    @if (isSoap()) {
      <div class="sold-as-soap">
        <mat-checkbox [formControl]="p.controls.soldAsSoap" aria-describedby="sold-as-soap-hint"
          >Sold as soap</mat-checkbox
        >
        <p id="sold-as-soap-hint" class="check-hint">
          Labelled and sold only as soap: in the US such a soap is not a cosmetic (21 CFR 701.20)
        </p>
      </div>
    }

    <fieldset>
      <legend>Markets</legend>
      <mat-button-toggle-group [formControl]="p.controls.markets" multiple aria-label="Markets">
        @for (m of markets; track m.code) {
          <mat-button-toggle [value]="m.code" [attr.title]="m.name">{{ m.code }}</mat-button-toggle>
        }
      </mat-button-toggle-group>
      @if (p.controls.markets.touched && marketsError()) {
        <p class="field-error" role="alert">{{ marketsError() }}</p>
      }
    </fieldset>

    <div class="grid">
      <mat-form-field>
        <mat-label>Unit mass</mat-label>
        <input matInput type="number" min="0" step="any" [formControl]="p.controls.unitMassGrams" />
        <span matTextSuffix class="unit">g</span>
        <mat-hint>One finished piece, for scaling</mat-hint>
        <mat-error>{{ errorMessage(p.controls.unitMassGrams) }}</mat-error>
      </mat-form-field>
      <mat-form-field>
        <mat-label>Net quantity</mat-label>
        <input
          matInput
          type="number"
          min="0"
          step="any"
          [formControl]="p.controls.netQuantity.controls.amount"
        />
        <mat-hint>As printed on the label</mat-hint>
        <mat-error>{{ errorMessage(p.controls.netQuantity.controls.amount) }}</mat-error>
      </mat-form-field>
      <mat-form-field>
        <mat-label>Net quantity unit</mat-label>
        <mat-select [formControl]="p.controls.netQuantity.controls.unit">
          <mat-option value="g">g</mat-option>
          <mat-option value="mL">mL</mat-option>
        </mat-select>
      </mat-form-field>
    </div>
  `,
  styles: `
    :host {
      display: grid;
      gap: 8px;
    }
    .grid {
      display: grid;
      grid-template-columns: repeat(auto-fit, minmax(11rem, 1fr));
      gap: 4px 12px;
    }
    fieldset {
      border: 0;
      margin: 0 0 8px;
      padding: 0;
    }
    legend {
      margin-bottom: 4px;
      font: var(--mat-sys-label-large);
      color: var(--mat-sys-on-surface-variant);
    }
    .checks {
      display: flex;
      flex-wrap: wrap;
      gap: 0 16px;
    }
    .sold-as-soap {
      margin: 0 0 8px;
    }
    .check-hint {
      margin: 0 0 0 40px;
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-body-small);
    }
    .unit {
      font-weight: 300;
      color: var(--mat-sys-on-surface-variant);
    }
    .field-error {
      margin: 4px 0 0;
      color: var(--mat-sys-error);
      font: var(--mat-sys-body-small);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProfileFields {
  readonly form = input.required<FormulaForm>();
  /** The form's value revision, so the markets message and the soap box follow edits. */
  readonly revision = input(0);

  protected readonly profile = computed(() => this.form().controls.profile);
  /** Whether the product is a soap, the only type "sold as soap" applies to (21 CFR 701.20). */
  protected readonly isSoap = computed(() => {
    this.revision();
    return this.form().controls.productType.value === 'soap';
  });
  protected readonly marketsError = computed(() => {
    this.revision();
    return errorMessage(this.profile().controls.markets);
  });
  protected readonly productTypes = PRODUCT_TYPES;
  protected readonly typeLabels = PRODUCT_TYPE_LABELS;
  protected readonly ifraCategories = IFRA_CATEGORIES;
  protected readonly markets = MARKETS;
  protected readonly errorMessage = errorMessage;
}

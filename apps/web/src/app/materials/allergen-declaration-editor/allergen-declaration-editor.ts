import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { EditableRow } from '../../forms/editable-row';
import { errorMessage } from '../../forms/form-errors';
import { formChanges } from '../material-form/form-changes';
import { type AllergenGroup, MaterialFormModel } from '../material-form/material-form-model';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { provideCalendarDays } from '../../dates/calendar-day-adapter';

const round = (n: number) => Math.round(n * 1000) / 1000;

/**
 * The supplier's allergen declaration for a fragrance or essential oil: each allergen with its
 * CAS number and percent of the neat oil, and the declaration's date.
 */
@Component({
  selector: 'bp-allergen-declaration-editor',
  imports: [
    MatDatepickerModule,
    EditableRow,
    ReactiveFormsModule,
    MatButton,
    MatError,
    MatFormField,
    MatIcon,
    MatInput,
    MatLabel,
    MatSuffix,
  ],
  // Dates typed and shown in the browser's locale, held as YYYY-MM-DD.
  providers: [provideCalendarDays()],
  template: `
    @let s = state();
    <section [formGroup]="group()" aria-labelledby="allergen-heading">
      <h3 id="allergen-heading">Allergen declaration</h3>
      <mat-form-field class="date">
        <mat-label>Declaration date</mat-label>
        <input matInput [matDatepicker]="documentDatePicker" formControlName="documentDate" />
        <mat-datepicker-toggle matIconSuffix [for]="documentDatePicker" />
        <mat-datepicker #documentDatePicker />
        <mat-error>{{ errorMessage(group().controls.documentDate) }}</mat-error>
      </mat-form-field>
      @if (s.count === 0) {
        <p class="empty">
          No allergens yet. Copy each allergen the supplier declares, with its percent in the oil.
        </p>
      }
      <ol class="rows" aria-label="Declared allergens">
        @for (row of group().controls.allergens.controls; track row; let i = $index) {
          <li [formGroup]="row">
            <bp-editable-row
              [removeLabel]="'Remove allergen row ' + (i + 1)"
              [removable]="!s.disabled"
              (remove)="remove(i)"
            >
              <mat-form-field class="name">
                <mat-label>Allergen</mat-label>
                <input matInput formControlName="inci" autocomplete="off" />
                <mat-error>{{ errorMessage(row.controls.inci) }}</mat-error>
              </mat-form-field>
              <mat-form-field class="cas">
                <mat-label>CAS number</mat-label>
                <input matInput formControlName="cas" autocomplete="off" />
                <mat-error>{{ errorMessage(row.controls.cas) }}</mat-error>
              </mat-form-field>
              <mat-form-field class="percent">
                <mat-label>Percent in oil</mat-label>
                <input
                  matInput
                  type="number"
                  min="0"
                  max="100"
                  step="any"
                  formControlName="percent"
                />
                <span matTextSuffix class="unit">%</span>
                <mat-error>{{ errorMessage(row.controls.percent) }}</mat-error>
              </mat-form-field>
            </bp-editable-row>
          </li>
        }
      </ol>
      @if (s.count > 0) {
        <p class="total">
          Declared allergens total <span class="bp-numeric">{{ s.total }}</span><span class="unit">
            %</span
          >
          of the oil.
        </p>
      }
      @if (s.error) {
        <p class="list-error" role="alert">{{ s.error }}</p>
      }
      @if (!s.disabled) {
        <button mat-stroked-button type="button" (click)="add()">
          <mat-icon>add</mat-icon>Add allergen
        </button>
      }
    </section>
  `,
  styleUrl: './allergen-declaration-editor.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AllergenDeclarationEditor {
  /** The material form's `allergenDeclaration` group. */
  readonly group = input.required<AllergenGroup>();

  private readonly model = new MaterialFormModel(inject(NonNullableFormBuilder));
  private readonly changes = formChanges(this.group);
  protected readonly errorMessage = errorMessage;
  protected readonly state = computed(() => {
    this.changes();
    const allergens = this.group().controls.allergens;
    return {
      count: allergens.length,
      total: round(allergens.getRawValue().reduce((t, a) => t + (a.percent ?? 0), 0)),
      error: allergens.touched ? errorMessage(allergens) : '',
      disabled: allergens.disabled,
    };
  });

  protected add(): void {
    this.group().controls.allergens.push(this.model.allergen());
  }

  protected remove(index: number): void {
    this.group().controls.allergens.removeAt(index);
    this.group().markAsDirty();
  }
}

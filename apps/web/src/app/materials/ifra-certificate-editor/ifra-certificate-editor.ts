import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { EditableRow } from '../../forms/editable-row';
import { errorMessage } from '../../forms/form-errors';
import { formChanges } from '../material-form/form-changes';
import { type IfraGroup, MaterialFormModel } from '../material-form/material-form-model';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { provideCalendarDays } from '../../dates/calendar-day-adapter';

/**
 * The supplier's IFRA conformity certificate for a fragrance or essential oil: the maximum
 * percent of the finished product per IFRA category, the issue date and the amendment number.
 */
@Component({
  selector: 'bp-ifra-certificate-editor',
  imports: [
    MatDatepickerModule,
    EditableRow,
    ReactiveFormsModule,
    MatButton,
    MatError,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    MatSuffix,
  ],
  // Dates typed and shown in the browser's locale, held as YYYY-MM-DD.
  providers: [provideCalendarDays()],
  template: `
    @let s = state();
    <section [formGroup]="group()" aria-labelledby="ifra-heading">
      <h3 id="ifra-heading">IFRA conformity certificate</h3>
      <div class="dates">
        <mat-form-field>
          <mat-label>Certificate issue date</mat-label>
          <input matInput [matDatepicker]="issuedOnPicker" formControlName="issuedOn" />
          <mat-datepicker-toggle matIconSuffix [for]="issuedOnPicker" />
          <mat-datepicker #issuedOnPicker />
          <mat-error>{{ errorMessage(group().controls.issuedOn) }}</mat-error>
        </mat-form-field>
        <mat-form-field>
          <mat-label>IFRA amendment</mat-label>
          <input matInput type="number" min="1" step="1" formControlName="amendment" />
          <mat-hint>The amendment the certificate follows, e.g. 51.</mat-hint>
          <mat-error>{{ errorMessage(group().controls.amendment) }}</mat-error>
        </mat-form-field>
      </div>
      @if (s.count === 0) {
        <p class="empty">
          No maxima yet. Add a row per IFRA category from the certificate (category 9 covers most
          bath products; check the certificate's own table).
        </p>
      }
      <ol class="rows" aria-label="Maximum per IFRA category">
        @for (row of group().controls.limits.controls; track row; let i = $index) {
          <li [formGroup]="row">
            <bp-editable-row
              [removeLabel]="'Remove IFRA category row ' + (i + 1)"
              [removable]="!s.disabled"
              (remove)="remove(i)"
            >
              <mat-form-field class="category">
                <mat-label>IFRA category</mat-label>
                <input matInput formControlName="category" autocomplete="off" />
                <mat-error>{{ errorMessage(row.controls.category) }}</mat-error>
              </mat-form-field>
              <mat-form-field class="max">
                <mat-label>Maximum in product</mat-label>
                <input
                  matInput
                  type="number"
                  min="0"
                  max="100"
                  step="any"
                  formControlName="maxPercent"
                />
                <span matTextSuffix class="unit">%</span>
                <mat-error>{{ errorMessage(row.controls.maxPercent) }}</mat-error>
              </mat-form-field>
            </bp-editable-row>
          </li>
        }
      </ol>
      @if (s.error) {
        <p class="list-error" role="alert">{{ s.error }}</p>
      }
      @if (!s.disabled) {
        <button mat-stroked-button type="button" (click)="add()">
          <mat-icon>add</mat-icon>Add IFRA category
        </button>
      }
    </section>
  `,
  styleUrl: './ifra-certificate-editor.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class IfraCertificateEditor {
  /** The material form's `ifraCertificate` group. */
  readonly group = input.required<IfraGroup>();

  private readonly model = new MaterialFormModel(inject(NonNullableFormBuilder));
  private readonly changes = formChanges(this.group);
  protected readonly errorMessage = errorMessage;
  protected readonly state = computed(() => {
    this.changes();
    const limits = this.group().controls.limits;
    return {
      count: limits.length,
      error: limits.touched ? errorMessage(limits) : '',
      disabled: limits.disabled,
    };
  });

  protected add(): void {
    // Category 9 (rinse-off bath products) is the one most bath makers look up first.
    const first = this.group().controls.limits.length === 0;
    this.group().controls.limits.push(this.model.ifraLimit(first ? '9' : ''));
  }

  protected remove(index: number): void {
    this.group().controls.limits.removeAt(index);
    this.group().markAsDirty();
  }
}

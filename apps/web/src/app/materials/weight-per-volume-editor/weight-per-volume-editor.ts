import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { type FormArray, NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import type { CalibrationSummary } from '@batchproof/shared';
import { EditableRow } from '../../forms/editable-row';
import { errorMessage } from '../../forms/form-errors';
import { formChanges } from '../material-form/form-changes';
import {
  type CalibrationRow,
  MaterialFormModel,
  MEASURE_LABELS,
  MEASURES,
  type WeightPerVolumeGroup,
} from '../material-form/material-form-model';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { provideCalendarDays } from '../../dates/calendar-day-adapter';

/**
 * Grams per cup, spoon, millilitre and drop, and the maker's own calibrations (a weighed amount
 * of a measured volume) with the average and spread the API works out from them.
 */
@Component({
  selector: 'bp-weight-per-volume-editor',
  imports: [
    MatDatepickerModule,
    EditableRow,
    DecimalPipe,
    ReactiveFormsModule,
    MatButton,
    MatError,
    MatFormField,
    MatIcon,
    MatInput,
    MatLabel,
    MatOption,
    MatSelect,
    MatSuffix,
  ],
  // Dates typed and shown in the browser's locale, held as YYYY-MM-DD.
  providers: [provideCalendarDays()],
  templateUrl: './weight-per-volume-editor.html',
  styleUrl: './weight-per-volume-editor.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WeightPerVolumeEditor {
  /** The material form's `weightPerVolume` group. */
  readonly weights = input.required<WeightPerVolumeGroup>();
  /** The material form's `calibrations` rows. */
  readonly calibrations = input.required<FormArray<CalibrationRow>>();
  /** Average and spread per measure, as the API last worked them out. */
  readonly summary = input<CalibrationSummary[]>([]);

  private readonly model = new MaterialFormModel(inject(NonNullableFormBuilder));
  private readonly changes = formChanges(this.calibrations);
  private readonly weightChanges = formChanges(this.weights);
  protected readonly measures = MEASURES;
  protected readonly labels = MEASURE_LABELS;
  protected readonly errorMessage = errorMessage;
  protected readonly state = computed(() => {
    this.changes();
    this.weightChanges();
    const rows = this.calibrations();
    return {
      count: rows.length,
      disabled: rows.disabled,
      /** Whether rows were changed since the summary was worked out. */
      unsaved: rows.dirty,
      error: rows.touched ? errorMessage(rows) : '',
    };
  });

  protected add(): void {
    this.calibrations().push(this.model.calibration());
    this.calibrations().markAsDirty();
  }

  protected remove(index: number): void {
    this.calibrations().removeAt(index);
    this.calibrations().markAsDirty();
  }
}

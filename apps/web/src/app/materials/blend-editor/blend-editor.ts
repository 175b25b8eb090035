import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { type FormArray, NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatCheckbox } from '@angular/material/checkbox';
import { MatError, MatFormField, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { BLEND_TOLERANCE_PERCENT } from '@batchproof/shared';
import { EditableRow } from '../../forms/editable-row';
import { errorMessage } from '../../forms/form-errors';
import { formChanges } from '../material-form/form-changes';
import { type ComponentRow, MaterialFormModel } from '../material-form/material-form-model';

const round = (n: number) => Math.round(n * 1000) / 1000;

/**
 * The components of a blend (a mica blend, a pre-made base) as rows of INCI name, US name,
 * Colour Index, percent and whether it is a nanomaterial, with a running sum that must reach 100 %.
 */
@Component({
  selector: 'bp-blend-editor',
  imports: [
    EditableRow,
    ReactiveFormsModule,
    MatButton,
    MatCheckbox,
    MatError,
    MatFormField,
    MatIcon,
    MatInput,
    MatLabel,
    MatSuffix,
  ],
  templateUrl: './blend-editor.html',
  styleUrl: './blend-editor.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BlendEditor {
  /** The material form's `components` rows. */
  readonly rows = input.required<FormArray<ComponentRow>>();

  private readonly model = new MaterialFormModel(inject(NonNullableFormBuilder));
  private readonly changes = formChanges(this.rows);
  protected readonly errorMessage = errorMessage;

  /** The running sum, what is left to reach 100 %, and the list's own message. */
  protected readonly totals = computed(() => {
    this.changes();
    const rows = this.rows();
    const sum = round(rows.getRawValue().reduce((total, r) => total + (r.percent ?? 0), 0));
    const remaining = round(100 - sum);
    return {
      count: rows.length,
      sum,
      remaining,
      complete: Math.abs(remaining) <= BLEND_TOLERANCE_PERCENT,
      over: remaining < -BLEND_TOLERANCE_PERCENT,
      error: rows.touched || rows.dirty ? errorMessage(rows) : '',
      disabled: rows.disabled,
    };
  });

  protected add(): void {
    const remaining = this.totals().remaining;
    const row = this.model.component();
    if (remaining > 0) row.controls.percent.setValue(remaining);
    this.rows().push(row);
  }

  protected remove(index: number): void {
    this.rows().removeAt(index);
    this.rows().markAsDirty();
  }
}

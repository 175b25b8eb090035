import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
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
import { of } from 'rxjs';
import {
  type KitchenMeasure,
  kitchenMeasureSchema,
  type Material,
  volumeToGrams,
  volumeToGramsInputSchema,
} from '@batchproof/shared';
import { checkForm, errorMessage } from '../../forms/form-errors';
import { MaterialPicker } from '../../materials/material-picker/material-picker';
import { MaterialsApi } from '../../materials/materials-api';
import { MEASURE_NAMES, weightReferences } from './weight-references';

/** A line measured by volume and converted to grams. */
export interface VolumeLine {
  materialId: string;
  materialName: string;
  grams: number;
}

/** The schema's `weightPerVolume.*` is the reference select here. */
const mapPath = (path: string) => (path.startsWith('weightPerVolume') ? 'reference' : path);

/**
 * Converts an old recipe's cups, spoons, fluid ounces, millilitres or drops into grams through the
 * material's weight per volume (its specification or the maker's own weighings). Closes with the
 * line to add. The warning that scooped volumes vary stays in view.
 */
@Component({
  selector: 'bp-volume-dialog',
  imports: [
    DecimalPipe,
    ReactiveFormsModule,
    MatButton,
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
    MaterialPicker,
  ],
  templateUrl: './volume-dialog.html',
  styleUrl: './volume-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class VolumeDialog {
  private readonly materials = inject(MaterialsApi);
  private readonly ref = inject<MatDialogRef<VolumeDialog, VolumeLine>>(MatDialogRef);
  private readonly fb = inject(NonNullableFormBuilder);

  protected readonly form = this.fb.group({
    amount: this.fb.control<number | null>(null),
    unit: 'cup' as KitchenMeasure,
    reference: '',
  });
  protected readonly measures = kitchenMeasureSchema.options;
  protected readonly measureNames = MEASURE_NAMES;
  protected readonly errorMessage = errorMessage;
  protected readonly notice = signal('');

  private readonly pickedId = signal<string | undefined>(undefined);
  protected readonly material = rxResource<Material | undefined, string | undefined>({
    params: () => this.pickedId(),
    stream: ({ params }) => (params ? this.materials.record(params) : of(undefined)),
  });
  /** Weights per volume the material carries, the maker's own weighings first. */
  protected readonly references = computed(() => {
    const m = this.material.hasValue() ? this.material.value() : undefined;
    return m ? weightReferences(m) : [];
  });
  /** Changes with every keystroke, so the conversion below follows the form. */
  private readonly value = toSignal(this.form.valueChanges, { initialValue: this.form.value });
  /** The weight per volume the conversion uses: the one chosen, else the first. */
  protected readonly usedReference = computed(() => {
    const chosen = this.value().reference;
    const refs = this.references();
    return refs.find((r) => r.key === chosen) ?? refs[0];
  });
  /** The conversion of what is entered now, or null until it can be made. */
  protected readonly converted = computed(() => {
    this.value();
    const input = this.request();
    const parsed = volumeToGramsInputSchema.safeParse(input);
    return parsed.success ? volumeToGrams(parsed.data) : null;
  });

  protected choose(id: string | undefined): void {
    this.pickedId.set(id);
    this.form.controls.reference.setValue('');
  }

  protected submit(): void {
    const material = this.material.hasValue() ? this.material.value() : undefined;
    if (!material) {
      this.notice.set('Choose a material first.');
      return;
    }
    const { value, notice } = checkForm(this.form, {
      schema: volumeToGramsInputSchema,
      body: this.request(),
      mapPath,
    });
    this.notice.set(notice);
    if (!value) return;
    const grams = Math.round(volumeToGrams(value).grams * 100) / 100;
    this.ref.close({ materialId: material.id, materialName: material.tradeName, grams });
  }

  /** The conversion request for what is entered; the reference defaults to the first one. */
  private request() {
    const v = this.form.getRawValue();
    const ref = this.usedReference();
    return {
      amount: v.amount,
      unit: v.unit,
      weightPerVolume: ref ? { grams: ref.grams, amount: 1, unit: ref.unit } : undefined,
    };
  }
}

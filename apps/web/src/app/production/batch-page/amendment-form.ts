import {
  ChangeDetectionStrategy,
  Component,
  computed,
  ElementRef,
  inject,
  Injector,
  input,
  output,
  signal,
} from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import {
  AMENDMENT_REASON_MIN,
  type Batch,
  type BatchAmendment,
  batchAmendmentSchema,
} from '@batchproof/shared';
import { checkForm, errorMessage } from '../../forms/form-errors';
import { sendForm } from '../../forms/send-form';
import { BatchesApi } from '../batches-api';
import { focusFirstError } from '../focus-first-error';
import { amendableFields, type FieldKind } from './amendable-fields';
import { type CheckResult, readUnitWeights } from './batch-form';

/** The control that holds each kind of value, where the contract's `value` messages go. */
const VALUE_CONTROL: Record<FieldKind, string> = {
  number: 'number',
  text: 'text',
  check: 'result',
  weights: 'text',
  material: 'material',
};

/**
 * "Correct a field" of a released batch: the field, its new value and the reason (at least
 * `AMENDMENT_REASON_MIN` characters). The original stays; the amendment is shown beside it.
 */
@Component({
  selector: 'bp-amendment-form',
  imports: [
    MatButton,
    MatError,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    MatOption,
    MatSelect,
    MatSuffix,
    ReactiveFormsModule,
  ],
  templateUrl: './amendment-form.html',
  styleUrl: './amendment-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AmendmentForm {
  readonly batch = input.required<Batch>();
  /** Emits the batch with the amendment, once the API recorded it. */
  readonly amended = output<Batch>();
  readonly cancelled = output<void>();

  private readonly api = inject(BatchesApi);
  private readonly snackBar = inject(MatSnackBar);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  private readonly injector = inject(Injector);
  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly errorMessage = errorMessage;
  protected readonly reasonMin = AMENDMENT_REASON_MIN;
  protected readonly sending = signal(false);
  protected readonly notice = signal('');

  protected readonly form = this.fb.group({
    field: '',
    number: this.fb.control<number | null>(null),
    text: '',
    result: this.fb.control<CheckResult>('not-checked'),
    note: '',
    material: '',
    reason: '',
  });
  protected readonly fields = computed(() => amendableFields(this.batch()));
  private readonly fieldValue = toSignal(this.form.controls.field.valueChanges, {
    initialValue: '',
  });
  protected readonly chosen = computed(
    () => this.fields().find((f) => f.field === this.fieldValue()) ?? null,
  );
  /** The materials a line may be corrected to: its own and its approved substitutes. */
  protected readonly materials = computed(() => {
    const field = this.chosen();
    const line = this.batch().lines.find(
      (l) => field?.field === `lines.${l.lineNumber}.usedMaterialId`,
    );
    return line
      ? [{ materialId: line.materialId, materialName: line.materialName }, ...line.substitutes]
      : [];
  });

  /** The request body the form stands for. */
  private body(): BatchAmendment {
    const v = this.form.getRawValue();
    const kind = this.chosen()?.kind;
    const value =
      kind === 'number'
        ? v.number
        : kind === 'check'
          ? { result: v.result, note: v.note }
          : kind === 'weights'
            ? readUnitWeights(v.text)
            : kind === 'material'
              ? v.material
              : v.text;
    return { field: v.field, value, reason: v.reason };
  }

  /** Where the contract's paths live in this form. */
  private readonly mapPath = (path: string) => {
    if (path === 'value.note') return 'note';
    if (path === 'value.result') return 'result';
    if (path === 'value' || path.startsWith('value.'))
      return VALUE_CONTROL[this.chosen()?.kind ?? 'text'];
    return path;
  };

  protected async submit(): Promise<void> {
    if (this.sending()) return;
    this.notice.set('');
    const body = this.body();
    const { value, notice } = checkForm(this.form, {
      schema: batchAmendmentSchema,
      body,
      mapPath: this.mapPath,
    });
    this.notice.set(notice);
    if (!value) {
      focusFirstError(this.host.nativeElement, this.injector);
      return;
    }
    const batch = await sendForm(
      this.form,
      this.api.amend(this.batch().id, body),
      { sending: this.sending, notice: this.notice },
      this.mapPath,
    );
    if (!batch) {
      focusFirstError(this.host.nativeElement, this.injector);
      return;
    }
    this.snackBar.open(`The correction to batch ${batch.batchCode} is recorded.`, 'OK', {
      duration: 5000,
    });
    this.amended.emit(batch);
  }
}

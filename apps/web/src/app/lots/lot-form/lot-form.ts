import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  linkedSignal,
  output,
  signal,
  untracked,
} from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { type Lot, lotCreateSchema, LOT_UNITS, type LotUnit } from '@batchproof/shared';
import { errorMessage, showRequestError, validateForm } from '../../forms/form-errors';
import { SubmissionKey } from '../../http/submission-key';
import { MaterialPicker } from '../../materials/material-picker/material-picker';
import { isoDay } from '../lot-expiry';
import { LotsApi } from '../lots-api';
import { FieldWarnings } from '../../forms/field-warnings';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { provideCalendarDays } from '../../dates/calendar-day-adapter';

/**
 * Records a delivery (goods-in) or corrects one. The form is validated with the shared
 * `lotCreateSchema` the API also uses, and the server's field messages land beside the fields.
 */
@Component({
  selector: 'bp-lot-form',
  imports: [
    MatDatepickerModule,
    MatSuffix,
    ReactiveFormsModule,
    MatButton,
    MatError,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    MatOption,
    MatProgressBar,
    FieldWarnings,
    MatSelect,
    MaterialPicker,
  ],
  // Dates typed and shown in the browser's locale, held as YYYY-MM-DD.
  providers: [provideCalendarDays()],
  templateUrl: './lot-form.html',
  styleUrl: './lot-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LotForm {
  /** The lot to correct, or null to record a new delivery. */
  readonly lot = input<Lot | null>(null);
  /** The material a new lot starts with (from `/lots/new?materialId=…`). */
  readonly presetMaterialId = input<string | undefined>();
  /** Emits the lot as the API stored it, after each save. */
  readonly saved = output<Lot>();
  /** Warnings of the save that recorded the lot, shown until the next save. */
  readonly initialWarnings = input<Lot['warnings']>([]);

  private readonly api = inject(LotsApi);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly units = LOT_UNITS;
  protected readonly errorMessage = errorMessage;
  protected readonly submitting = signal(false);
  protected readonly notice = signal('');
  /** What the last save said about the lot number (already received); never blocks. */
  protected readonly lotNumberWarnings = linkedSignal(() => this.initialWarnings() ?? []);
  /** The Idempotency-Key of a new lot's submission, kept while it is retried. */
  private readonly submission = new SubmissionKey();

  /**
   * The form, built from the lot it edits: a new lot (after a save, or another id) gives a fresh
   * form, so nothing has to copy values in after the fact. Built untracked because creating
   * controls writes their own status signals.
   */
  protected readonly form = computed(() => {
    const lot = this.lot();
    const preset = this.presetMaterialId();
    return untracked(() => this.build(lot, preset));
  });

  private build(lot: Lot | null, presetMaterialId: string | undefined) {
    return this.fb.group({
      materialId: lot?.materialId ?? presetMaterialId ?? '',
      supplierLotNumber: lot?.supplierLotNumber ?? '',
      quantity: this.fb.control<number | null>(lot?.quantity ?? null),
      unit: this.fb.control<LotUnit>(lot?.unit ?? 'g'),
      receivedOn: lot?.receivedOn ?? isoDay(new Date()),
      expiresOn: lot?.expiresOn ?? '',
      unitCost: this.fb.control<number | null>(lot?.unitCost ?? null),
      notes: lot?.notes ?? '',
    });
  }

  /** Whether the form holds changes not saved yet. */
  hasUnsavedChanges(): boolean {
    return this.form().dirty;
  }

  /** Checks and records (or corrects) the lot; resolves whether it was saved. */
  submit(): Promise<boolean> {
    if (this.submitting()) return Promise.resolve(false);
    this.notice.set('');
    const form = this.form();
    const value = validateForm(form, lotCreateSchema);
    if (!value) return Promise.resolve(false);
    const existing = this.lot();
    this.submitting.set(true);
    const request = existing
      ? this.api.update(existing.id, value)
      : this.api.create(value, this.submission.for(value));
    return new Promise((resolve) => {
      request.subscribe({
        next: (lot) => {
          this.submitting.set(false);
          this.submission.done();
          form.markAsPristine();
          const what = `Lot ${lot.supplierLotNumber} of ${lot.materialName}`;
          this.snackBar.open(existing ? `${what} is saved.` : `${what} is recorded.`, 'OK', {
            duration: 5000,
          });
          this.lotNumberWarnings.set(lot.warnings ?? []);
          this.saved.emit(lot);
          resolve(true);
        },
        error: (err: unknown) => {
          this.submitting.set(false);
          // The form keeps every value typed; only the messages are added.
          this.notice.set(showRequestError(form, err));
          resolve(false);
        },
      });
    });
  }
}

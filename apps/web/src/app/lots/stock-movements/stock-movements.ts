import { DecimalPipe } from '@angular/common';
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
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { RouterLink } from '@angular/router';
import {
  type Lot,
  ROLE_SETS,
  STOCK_ADJUSTMENT_REASONS,
  type StockAdjustment,
  stockAdjustmentSchema,
  type StockMovement,
} from '@batchproof/shared';
import { Session } from '../../auth/session';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';
import { checkForm, errorMessage } from '../../forms/form-errors';
import { sendForm } from '../../forms/send-form';
import { messageOf } from '../../http/api-error';
import { SubmissionKey } from '../../http/submission-key';
import { focusFirstError } from '../../production/focus-first-error';
import { StockMovementsApi } from './stock-movements-api';

/** The adjustment reasons in words. */
const REASON_WORDS: Record<(typeof STOCK_ADJUSTMENT_REASONS)[number], string> = {
  spillage: 'Spillage',
  'count-correction': 'Count correction',
  disposal: 'Disposal',
  other: 'Other',
};

const KIND_WORDS: Record<StockMovement['kind'], string> = {
  batch: 'Batch',
  adjustment: 'Adjustment',
  amendment: 'Batch correction',
};

/**
 * A lot's stock movements (what batches took, adjustments and corrections, newest first) and,
 * for those who record goods-in, a form to adjust its stock with a reason: a signed quantity in
 * the lot's own unit, negative to take stock away.
 */
@Component({
  selector: 'bp-stock-movements',
  imports: [
    CalendarDayPipe,
    DecimalPipe,
    MatButton,
    MatError,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    MatOption,
    MatProgressBar,
    MatSelect,
    MatSuffix,
    ReactiveFormsModule,
    RouterLink,
  ],
  templateUrl: './stock-movements.html',
  styleUrl: './stock-movements.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StockMovements {
  readonly lot = input.required<Lot>();
  /** Emits after an adjustment, so the page reads the lot's stock on hand again. */
  readonly adjusted = output<void>();

  private readonly api = inject(StockMovementsApi);
  private readonly session = inject(Session);
  private readonly snackBar = inject(MatSnackBar);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  private readonly injector = inject(Injector);
  protected readonly errorMessage = errorMessage;
  protected readonly reasons = STOCK_ADJUSTMENT_REASONS;
  protected readonly reasonWords = REASON_WORDS;
  protected readonly canAdjust = computed(() => this.session.hasRole(ROLE_SETS.goodsIn));
  protected readonly movements = this.api.movements(() => this.lot().id);
  protected readonly rows = computed(() =>
    this.movements.hasValue()
      ? this.movements.value().map((m) => ({
          ...m,
          kindWord: KIND_WORDS[m.kind],
          reasonWord: m.reason ? REASON_WORDS[m.reason] : null,
          // Movements store stock taken out as positive; shown as the change to stock on hand.
          change: -m.quantity,
        }))
      : [],
  );
  protected readonly loadError = computed(() => {
    const error = this.movements.error();
    return error ? messageOf(error) : '';
  });
  protected readonly sending = signal(false);
  protected readonly notice = signal('');
  private readonly submission = new SubmissionKey();

  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly form = this.fb.group({
    quantity: this.fb.control<number | null>(null),
    reason: '',
    note: '',
  });

  protected async submit(): Promise<void> {
    if (this.sending()) return;
    this.notice.set('');
    const lot = this.lot();
    const v = this.form.getRawValue();
    const body = { quantity: v.quantity, reason: v.reason, note: v.note } as Omit<
      StockAdjustment,
      'lotId'
    >;
    const { value, notice } = checkForm(this.form, {
      schema: stockAdjustmentSchema,
      body: { ...body, lotId: lot.id },
    });
    this.notice.set(notice);
    if (!value) {
      focusFirstError(this.host.nativeElement, this.injector);
      return;
    }
    const moved = await sendForm(
      this.form,
      this.api.adjust(lot.id, body, this.submission.for(body)),
      { sending: this.sending, notice: this.notice },
    );
    if (!moved) {
      focusFirstError(this.host.nativeElement, this.injector);
      return;
    }
    this.submission.done();
    this.form.reset();
    this.movements.reload();
    this.adjusted.emit();
    this.snackBar.open(`The stock of lot ${lot.supplierLotNumber} is adjusted.`, 'OK', {
      duration: 5000,
    });
  }
}

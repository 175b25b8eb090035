import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatDatepickerModule } from '@angular/material/datepicker';
import {
  MAT_DIALOG_DATA,
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogRef,
  MatDialogTitle,
} from '@angular/material/dialog';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatRadioButton, MatRadioGroup } from '@angular/material/radio';
import {
  isCalendarDay,
  type MarketRecord,
  marketRecordInputSchema,
  type MarketRecordKind,
  todayIso,
} from '@batchproof/shared';
import { provideCalendarDays } from '../../dates/calendar-day-adapter';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';
import { checkForm, errorMessage } from '../../forms/form-errors';
import { sendForm } from '../../forms/send-form';
import { ReadinessApi } from '../readiness-api';
import {
  CANADA_CLOCK_SOURCE,
  canadaClock,
  RECORD_TITLES,
  REFERENCE_HINTS,
} from '../readiness-words';

/** What the record dialog edits. */
export interface MarketRecordDialogData {
  formulaId: string;
  formulaName: string;
  kind: MarketRecordKind;
  /** The record as last saved, or null when none is recorded yet. */
  record: MarketRecord | null;
}

/** The small-business answer as the radio group holds it: yes, no, or not answered. */
type Answer = 'yes' | 'no' | '';

const answerOf = (value: boolean | null | undefined): Answer =>
  value === true ? 'yes' : value === false ? 'no' : '';

/**
 * Records one notification or listing reference of a product (`PUT
 * /api/readiness/:formulaId/records/:kind`): the reference the portal gave, the day, notes, and
 * where they apply Canada's first sale (with its 10-day clock) or the US small-business answer.
 * Closes with the saved record; the API's field messages stay beside their fields.
 */
@Component({
  selector: 'bp-market-record-dialog',
  imports: [
    CalendarDayPipe,
    MatButton,
    MatDatepickerModule,
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
    MatRadioButton,
    MatRadioGroup,
    MatSuffix,
    ReactiveFormsModule,
  ],
  providers: [provideCalendarDays()],
  templateUrl: './market-record-dialog.html',
  styleUrl: './market-record-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MarketRecordDialog {
  protected readonly data = inject<MarketRecordDialogData>(MAT_DIALOG_DATA);
  private readonly ref = inject<MatDialogRef<MarketRecordDialog, MarketRecord>>(MatDialogRef);
  private readonly api = inject(ReadinessApi);

  protected readonly title = RECORD_TITLES[this.data.kind];
  protected readonly referenceHint = REFERENCE_HINTS[this.data.kind];
  protected readonly isCanada = this.data.kind === 'ca-notification';
  protected readonly isListing = this.data.kind === 'us-listing';
  protected readonly clockSource = CANADA_CLOCK_SOURCE;
  protected readonly errorMessage = errorMessage;
  protected readonly sending = signal(false);
  protected readonly notice = signal('');

  protected readonly form = inject(NonNullableFormBuilder).group({
    reference: this.data.record?.reference ?? '',
    recordedOn: this.data.record?.recordedOn ?? '',
    firstSaleOn: this.data.record?.firstSaleOn ?? '',
    smallBusinessExempt: answerOf(this.data.record?.smallBusinessExempt) as Answer,
    notes: this.data.record?.notes ?? '',
  });

  private readonly firstSaleOn = toSignal(this.form.controls.firstSaleOn.valueChanges, {
    initialValue: this.form.controls.firstSaleOn.value,
  });
  /** Canada's 10-day clock from the first sale typed so far, when it is a day. */
  protected readonly clock = computed(() => {
    const day = this.firstSaleOn();
    return this.isCanada && day && isCalendarDay(day) ? canadaClock(day, todayIso()) : null;
  });

  /** The request body: only the fields this kind has; the others are sent as not given. */
  private body() {
    const v = this.form.getRawValue();
    return {
      reference: v.reference,
      recordedOn: v.recordedOn,
      firstSaleOn: this.isCanada ? v.firstSaleOn : null,
      smallBusinessExempt: this.isListing
        ? v.smallBusinessExempt === ''
          ? null
          : v.smallBusinessExempt === 'yes'
        : null,
      notes: v.notes,
    };
  }

  protected async submit(): Promise<void> {
    if (this.sending()) return;
    const { value, notice } = checkForm(this.form, {
      schema: marketRecordInputSchema,
      body: this.body(),
    });
    this.notice.set(notice);
    if (!value) return;
    const saved = await sendForm(
      this.form,
      this.api.saveRecord(this.data.formulaId, this.data.kind, value),
      { sending: this.sending, notice: this.notice },
    );
    if (saved) this.ref.close(saved);
  }
}

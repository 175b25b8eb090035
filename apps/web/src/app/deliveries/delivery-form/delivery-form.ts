import {
  afterNextRender,
  ChangeDetectionStrategy,
  Component,
  computed,
  ElementRef,
  inject,
  Injector,
  input,
  output,
  signal,
  untracked,
} from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { RouterLink } from '@angular/router';
import { type Delivery, ROLE_SETS, deliveryCreateSchema } from '@batchproof/shared';
import { Session } from '../../auth/session';
import { provideCalendarDays } from '../../dates/calendar-day-adapter';
import { errorMessage, validateForm } from '../../forms/form-errors';
import { sendForm } from '../../forms/send-form';
import { SubmissionKey } from '../../http/submission-key';
import { isoDay } from '../../lots/lot-expiry';
import { focusFirstError } from '../../production/focus-first-error';
import { CustomersApi } from '../customers-api';
import { DeliveriesApi } from '../deliveries-api';

/**
 * Records a delivery or corrects one: the customer, the day, the reference and the finished lots
 * with their units. Checked with the shared `deliveryCreateSchema` the API also uses; the API's
 * messages (a lot code that is no released batch, more units than are left) land beside the
 * line they are about.
 */
@Component({
  selector: 'bp-delivery-form',
  imports: [
    MatButton,
    MatDatepickerModule,
    MatError,
    MatFormField,
    MatHint,
    MatIcon,
    MatIconButton,
    MatInput,
    MatLabel,
    MatOption,
    MatProgressBar,
    MatSelect,
    MatSuffix,
    ReactiveFormsModule,
    RouterLink,
  ],
  // Dates typed and shown in the browser's locale, held as YYYY-MM-DD.
  providers: [provideCalendarDays()],
  templateUrl: './delivery-form.html',
  styleUrl: './delivery-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DeliveryForm {
  /** The delivery to correct, or null to record a new one. */
  readonly delivery = input<Delivery | null>(null);
  /** Emits the delivery as the API stored it, after each save. */
  readonly saved = output<Delivery>();

  private readonly fb = inject(NonNullableFormBuilder);
  private readonly api = inject(DeliveriesApi);
  private readonly snackBar = inject(MatSnackBar);
  private readonly session = inject(Session);
  private readonly submission = new SubmissionKey();
  private readonly customers = inject(CustomersApi).options();
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef).nativeElement;
  private readonly injector = inject(Injector);

  protected readonly errorMessage = errorMessage;
  protected readonly sending = signal(false);
  protected readonly notice = signal('');
  /** Whether the signed-in member may record deliveries. */
  protected readonly canWrite = computed(() => this.session.hasRole(ROLE_SETS.goodsIn));
  /** The customers to pick from, with the delivery's own even when it is archived. */
  protected readonly customerOptions = computed(() => {
    const list = this.customers.hasValue() ? this.customers.value() : [];
    const d = this.delivery();
    if (!d || list.some((c) => c.id === d.customerId)) return list;
    return [{ id: d.customerId, name: d.customerName }, ...list];
  });
  /** The form, built from the delivery it edits; untracked, as building writes control signals. */
  protected readonly form = computed(() => {
    const d = this.delivery();
    const canWrite = this.canWrite();
    return untracked(() => {
      const form = this.fb.group({
        customerId: d?.customerId ?? '',
        deliveredOn: d?.deliveredOn ?? isoDay(new Date()),
        reference: d?.reference ?? '',
        lines: this.fb.array(
          (d?.lines.length ? d.lines : [{ lotCode: '', units: null }]).map((l) =>
            this.line(l.lotCode, l.units),
          ),
        ),
        notes: d?.notes ?? '',
      });
      if (!canWrite) form.disable();
      return form;
    });
  });
  private line(lotCode = '', units: number | null = null) {
    return this.fb.group({ lotCode, units: this.fb.control<number | null>(units) });
  }

  /** The product a saved line's lot is a batch of, to show under its code. */
  protected productOf(lotCode: string): string | null {
    return this.delivery()?.lines.find((l) => l.lotCode === lotCode.trim())?.productName ?? null;
  }

  protected addLine(): void {
    const lines = this.form().controls.lines;
    lines.push(this.line());
    lines.markAsDirty();
    // The new line's code field takes the focus, so typing carries on without the mouse.
    afterNextRender(
      () =>
        this.host
          .querySelectorAll<HTMLInputElement>('.lot-code input')
          .item(lines.length - 1)
          ?.focus(),
      { injector: this.injector },
    );
  }

  protected removeLine(index: number): void {
    const lines = this.form().controls.lines;
    if (lines.length <= 1) return;
    lines.removeAt(index);
    lines.markAsDirty();
  }

  /** Whether the form holds changes not saved yet. */
  hasUnsavedChanges(): boolean {
    return this.canWrite() && this.form().dirty;
  }

  /** Checks and saves the delivery; resolves whether it was saved. */
  async save(): Promise<boolean> {
    if (this.sending() || !this.canWrite()) return false;
    this.notice.set('');
    const form = this.form();
    const value = validateForm(form, deliveryCreateSchema);
    if (!value) {
      focusFirstError(this.host, this.injector);
      return false;
    }
    const existing = this.delivery();
    const request = existing
      ? this.api.update(existing.id, value)
      : this.api.create(value, this.submission.for(value));
    const delivery = await sendForm(form, request, {
      sending: this.sending,
      notice: this.notice,
    });
    if (!delivery) {
      focusFirstError(this.host, this.injector);
      return false;
    }
    this.submission.done();
    this.snackBar.open(
      `${existing ? 'Saved' : 'Recorded'} the delivery to ${delivery.customerName}.`,
      'OK',
      { duration: 5000 },
    );
    this.saved.emit(delivery);
    return true;
  }
}

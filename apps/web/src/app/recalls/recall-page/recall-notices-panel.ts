import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  output,
  signal,
} from '@angular/core';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import { type Recall, type RecallNotice, recallNoticesSendSchema } from '@batchproof/shared';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';
import { errorMessage, validateForm } from '../../forms/form-errors';
import { sendForm } from '../../forms/send-form';
import { NOTICE_WORDS } from '../recall-words';
import { RecallsApi } from '../recalls-api';
import { SendNoticesDialog, type SendNoticesData } from './send-notices-dialog';

/**
 * A recall's notices and their status, and (for the owner, while open) sending the ones not sent
 * yet after a confirmation. Sending again only retries the failed ones.
 */
@Component({
  selector: 'bp-recall-notices-panel',
  imports: [
    CalendarDayPipe,
    MatButton,
    MatError,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    MatProgressBar,
    MatTableModule,
    ReactiveFormsModule,
  ],
  templateUrl: './recall-notices-panel.html',
  styleUrl: './recall-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RecallNoticesPanel {
  readonly recall = input.required<Recall>();
  /** Whether the signed-in member may send (the owner, on an open recall). */
  readonly canSend = input(false);
  readonly changed = output<Recall>();

  private readonly api = inject(RecallsApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly columns = ['customer', 'to', 'status', 'sentAt', 'note'];
  protected readonly errorMessage = errorMessage;
  protected readonly form = inject(FormBuilder).nonNullable.group({ whatToDo: '' });
  protected readonly sending = signal(false);
  protected readonly notice = signal('');

  protected readonly names = computed(
    () => new Map(this.recall().affected.map((c) => [c.customerId, c.customerName])),
  );
  /** Customers with no notice yet, or a failed one: those a send reaches. */
  protected readonly waiting = computed(() => {
    const done = new Map(this.recall().notices.map((n) => [n.customerId, n.status]));
    return this.recall().affected.filter((c) => {
      const status = done.get(c.customerId);
      return status === undefined || status === 'failed';
    });
  });

  protected statusOf(notice: RecallNotice) {
    return NOTICE_WORDS[notice.status];
  }

  protected confirmSend(): void {
    const value = validateForm(this.form, recallNoticesSendSchema);
    if (!value) return;
    const waiting = this.waiting();
    const data: SendNoticesData = {
      drill: this.recall().drill,
      toMail: waiting.filter((c) => c.email).length,
      toCall: waiting.filter((c) => !c.email).length,
    };
    this.dialog
      .open<SendNoticesDialog, SendNoticesData, boolean>(SendNoticesDialog, { data })
      .afterClosed()
      .subscribe((confirmed) => {
        if (confirmed) void this.send(value);
      });
  }

  private async send(value: { whatToDo: string | null }): Promise<void> {
    const recall = await sendForm(this.form, this.api.sendNotices(this.recall().id, value), {
      sending: this.sending,
      notice: this.notice,
    });
    if (!recall) return;
    const failed = recall.notices.filter((n) => n.status === 'failed').length;
    this.snackBar.open(
      recall.drill
        ? 'The drill notices are written; nothing was sent.'
        : failed > 0
          ? `${failed} notice(s) could not be sent; see why below and send again.`
          : 'The notices are sent.',
      'OK',
      { duration: 6000 },
    );
    this.changed.emit(recall);
  }
}

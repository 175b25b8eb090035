import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { MatAnchor, MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import {
  RECALL_AUTHORITY_NOTE,
  RECALL_SEVERITY_LABELS,
  recallConcernsHarm,
  type Recall,
  ROLE_SETS,
} from '@batchproof/shared';
import { Session } from '../../auth/session';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';
import { saveFile } from '../../documents/save-file';
import { messageOf } from '../../http/api-error';
import { AffectedCustomers } from '../affected-customers';
import { RecallsApi } from '../recalls-api';
import { RecallCloseForm } from './recall-close-form';
import { RecallNoticesPanel } from './recall-notices-panel';
import { RecallReplyForm } from './recall-reply-form';

/**
 * One recall or drill (`/recalls/:id`): what it covers, the customers it reaches, notices and
 * replies, closing it, and its summary PDF. Members read; the owner acts on an open one.
 */
@Component({
  selector: 'bp-recall-page',
  imports: [
    AffectedCustomers,
    CalendarDayPipe,
    MatAnchor,
    MatButton,
    MatIcon,
    MatProgressBar,
    MatTableModule,
    RecallCloseForm,
    RecallNoticesPanel,
    RecallReplyForm,
    RouterLink,
  ],
  templateUrl: './recall-page.html',
  styleUrl: './recall-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class RecallPage {
  /** The recall's id from the path. */
  readonly id = input.required<string>();

  private readonly api = inject(RecallsApi);
  private readonly session = inject(Session);
  protected readonly severityLabels = RECALL_SEVERITY_LABELS;
  protected readonly authorityNote = RECALL_AUTHORITY_NOTE;
  protected readonly replyColumns = ['repliedOn', 'customer', 'onHand', 'returned', 'notes'];

  protected readonly resource = this.api.recall(this.id);
  protected readonly recall = computed<Recall | null>(() =>
    this.resource.hasValue() ? this.resource.value() : null,
  );
  protected readonly loadError = computed(() => {
    const error = this.resource.error();
    return error ? messageOf(error) : '';
  });
  /** Whether the owner may act on it now: only the owner, only while open. */
  protected readonly canAct = computed(
    () => this.session.hasRole(ROLE_SETS.ownerOnly) && this.recall()?.state === 'open',
  );
  protected readonly concernsHarm = computed(() => {
    const r = this.recall();
    return !!r && recallConcernsHarm(r.severity);
  });
  protected readonly names = computed(
    () => new Map((this.recall()?.affected ?? []).map((c) => [c.customerId, c.customerName])),
  );
  protected readonly downloading = signal(false);
  protected readonly downloadError = signal('');

  protected onChanged(recall: Recall): void {
    this.resource.set(recall);
  }

  protected download(recall: Recall): void {
    this.downloading.set(true);
    this.downloadError.set('');
    this.api.summaryPdf(recall.id).subscribe({
      next: (pdf) => {
        this.downloading.set(false);
        const kind = recall.drill ? 'recall-drill' : 'recall';
        saveFile(pdf, `${kind}-${recall.openedAt.slice(0, 10)}.pdf`);
      },
      error: (err: unknown) => {
        this.downloading.set(false);
        this.downloadError.set(messageOf(err));
      },
    });
  }
}

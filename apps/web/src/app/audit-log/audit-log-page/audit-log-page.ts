import { HttpClient, httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatButton } from '@angular/material/button';
import { MatFormField, MatLabel, MatPrefix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatPaginator } from '@angular/material/paginator';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import {
  AUDIT_SUBJECT_LABELS,
  auditListQuerySchema,
  auditPageSchema,
  auditSubjectLabel,
} from '@batchproof/shared';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';
import { messageOf } from '../../http/api-error';
import { saveFile } from '../../documents/save-file';
import { ListCard } from '../../lists/list-card';
import { injectUrlListQuery, keepLastValue } from '../../lists/url-list-query';

/**
 * The audit log (owner only): who changed what and when, newest first, filtered on the server,
 * with the filtered log as a CSV download.
 */
@Component({
  selector: 'bp-audit-log-page',
  imports: [
    CalendarDayPipe,
    ListCard,
    MatButton,
    MatFormField,
    MatIcon,
    MatInput,
    MatLabel,
    MatOption,
    MatPaginator,
    MatPrefix,
    MatSelect,
    MatTableModule,
  ],
  templateUrl: './audit-log-page.html',
  styleUrl: '../../lots/lot-list/lot-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class AuditLogPage {
  protected readonly columns = ['at', 'who', 'action', 'subject', 'detail'];
  protected readonly subjectTypes = Object.entries(AUDIT_SUBJECT_LABELS);
  protected readonly subjectLabel = auditSubjectLabel;
  protected readonly list = injectUrlListQuery(auditListQuerySchema);
  protected readonly query = this.list.query;
  /** The filters as query parameters, shared by the page and the CSV link. */
  private readonly filterParams = computed(() => {
    const q = this.query();
    const params: Record<string, string> = {};
    if (q.q) params['q'] = q.q;
    if (q.subjectType) params['subjectType'] = q.subjectType;
    if (q.from) params['from'] = q.from;
    if (q.to) params['to'] = q.to;
    return params;
  });
  protected readonly result = httpResource(
    () => ({
      url: '/api/audit-events',
      params: { ...this.filterParams(), page: this.query().page, pageSize: this.query().pageSize },
    }),
    { parse: (body) => auditPageSchema.parse(body) },
  );
  protected readonly pageData = keepLastValue(this.result);
  private readonly http = inject(HttpClient);
  private readonly snackBar = inject(MatSnackBar);
  /** Whether the export is on its way. */
  protected readonly exporting = signal(false);

  /** Downloads the filtered log as CSV (through the API client, which carries the sign-in). */
  protected exportCsv(): void {
    this.exporting.set(true);
    this.http
      .get('/api/audit-events/export.csv', { params: this.filterParams(), responseType: 'blob' })
      .subscribe({
        next: (blob) => {
          this.exporting.set(false);
          saveFile(blob, 'audit-log.csv');
          this.snackBar.open('Audit log exported as audit-log.csv.', 'OK', { duration: 4000 });
        },
        error: (err: unknown) => {
          this.exporting.set(false);
          this.snackBar.open(messageOf(err), 'OK', { duration: 8000 });
        },
      });
  }

  protected detailText(detail: Record<string, unknown> | null): string {
    return detail ? JSON.stringify(detail) : '';
  }
}

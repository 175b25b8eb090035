import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatAnchor, MatButton } from '@angular/material/button';
import { MatFormField, MatLabel, MatPrefix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatPaginator } from '@angular/material/paginator';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSort, MatSortHeader } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { type Complaint, complaintListQuerySchema, ROLE_SETS } from '@batchproof/shared';
import { Session } from '../../auth/session';
import { browserLocale } from '../../dates/calendar-day-adapter';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';
import { ListCard } from '../../lists/list-card';
import { injectUrlListQuery, keepLastValue } from '../../lists/url-list-query';
import { ComplaintsApi } from '../complaints-api';
import { reportingDeadline } from '../reporting-deadline';

/**
 * Every complaint the workshop logged, with its US reporting clock, filtered, sorted and paged on
 * the server through the URL's query parameters.
 */
@Component({
  selector: 'bp-complaint-list',
  imports: [
    CalendarDayPipe,
    ListCard,
    MatAnchor,
    MatButton,
    MatFormField,
    MatIcon,
    MatInput,
    MatLabel,
    MatOption,
    MatPaginator,
    MatPrefix,
    MatSelect,
    MatSort,
    MatSortHeader,
    MatTableModule,
    RouterLink,
  ],
  templateUrl: './complaint-list.html',
  styleUrl: '../../lots/lot-list/lot-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class ComplaintList {
  private readonly session = inject(Session);
  /** Dates read in the browser's language, as the day pipe shows them. */
  private readonly locale = browserLocale();
  protected readonly canRecord = computed(() => this.session.hasRole(ROLE_SETS.goodsIn));
  protected readonly columns = [
    'receivedOn',
    'productName',
    'batchCode',
    'serious',
    'status',
    'clock',
  ];
  protected readonly api = inject(ComplaintsApi);
  protected readonly products = this.api.products();
  protected readonly list = injectUrlListQuery(complaintListQuerySchema, {
    fromUrl: (params) => ({
      ...params,
      // With no sort chosen, the latest received come first.
      dir: params['dir'] ?? (params['sort'] ? undefined : 'desc'),
    }),
  });
  protected readonly query = this.list.query;
  protected readonly filtered = computed(() => {
    const q = this.query();
    return !!(q.q || q.formulaId || q.status || q.serious !== undefined);
  });
  protected readonly seriousFilter = computed(() => {
    const serious = this.query().serious;
    return serious === undefined ? '' : String(serious);
  });
  protected readonly result = this.api.complaints(this.query);
  protected readonly pageData = keepLastValue(this.result);

  /** The clock in words, or why there is none. */
  protected clockText(c: Complaint): string {
    if (c.usReportingClock) return reportingDeadline(c.usReportingClock, this.locale);
    return c.serious ? 'No US clock: the product is not sold in the US' : '—';
  }
}

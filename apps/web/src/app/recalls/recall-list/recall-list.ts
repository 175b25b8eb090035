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
import { type RecallListItem, recallListQuerySchema, ROLE_SETS } from '@batchproof/shared';
import { Session } from '../../auth/session';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';
import { ListCard } from '../../lists/list-card';
import { injectUrlListQuery, keepLastValue } from '../../lists/url-list-query';
import { SEVERITY_WORDS } from '../recall-words';
import { RecallsApi } from '../recalls-api';

/**
 * Every recall and drill of the workshop: open ones first, newest first, with units returned of
 * those delivered. A recall is opened from a trace, so the page points there.
 */
@Component({
  selector: 'bp-recall-list',
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
  templateUrl: './recall-list.html',
  styleUrl: './recall-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class RecallList {
  private readonly session = inject(Session);
  /** Whether the signed-in member may open recalls (the owner). */
  protected readonly canOpen = computed(() => this.session.hasRole(ROLE_SETS.ownerOnly));
  protected readonly columns = [
    'openedAt',
    'batchCodes',
    'severity',
    'drill',
    'state',
    'unitsReturned',
  ];
  protected readonly list = injectUrlListQuery(recallListQuerySchema);
  protected readonly query = this.list.query;
  protected readonly filtered = computed(() => !!(this.query().q || this.query().state));
  protected readonly result = inject(RecallsApi).recalls(this.query);
  protected readonly pageData = keepLastValue(this.result);

  protected severityOf(recall: RecallListItem) {
    return SEVERITY_WORDS[recall.severity];
  }
}

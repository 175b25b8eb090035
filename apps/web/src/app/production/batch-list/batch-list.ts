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
import {
  BATCH_STATES,
  type BatchListItem,
  batchListQuerySchema,
  ROLE_SETS,
} from '@batchproof/shared';
import { Session } from '../../auth/session';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';
import { ListCard } from '../../lists/list-card';
import { injectUrlListQuery, keepLastValue } from '../../lists/url-list-query';
import { BatchesApi } from '../batches-api';
import { STATE_WORDS } from '../batch-words';

/**
 * Production: every batch the workshop made or is making, filtered, sorted and paged on the
 * server through the URL's query parameters.
 */
@Component({
  selector: 'bp-batch-list',
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
  templateUrl: './batch-list.html',
  styleUrl: './batch-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class BatchList {
  private readonly session = inject(Session);
  /** Whether the signed-in member may start and record batches. */
  protected readonly canStart = computed(() => this.session.hasRole(ROLE_SETS.goodsIn));
  protected readonly states = BATCH_STATES;
  protected readonly stateWords = STATE_WORDS;
  protected readonly columns = [
    'madeOn',
    'batchCode',
    'formulaName',
    'version',
    'state',
    'readyOn',
    'unitsMade',
    'outOfTolerance',
  ];

  /** The URL's filter, sort and page; with no sort chosen, the latest batches come first. */
  protected readonly list = injectUrlListQuery(batchListQuerySchema, {
    fromUrl: (params) => ({
      ...params,
      dir: params['dir'] ?? (params['sort'] ? undefined : 'desc'),
    }),
  });
  protected readonly query = this.list.query;
  protected readonly filtered = computed(() => !!(this.query().q || this.query().state));
  protected readonly result = inject(BatchesApi).list(this.query);
  protected readonly pageData = keepLastValue(this.result);

  protected stateOf(batch: BatchListItem) {
    return STATE_WORDS[batch.state];
  }
}

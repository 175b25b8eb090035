import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatFormField, MatLabel, MatPrefix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatPaginator } from '@angular/material/paginator';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSort, MatSortHeader } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { referenceRowsQuerySchema, type ReferenceRowView } from '@batchproof/shared';
import { messageOf } from '../../http/api-error';
import { injectUrlListQuery, keepLastValue } from '../../lists/url-list-query';
import { referenceDetails } from '../reference-details';
import { ReferenceListsApi } from '../reference-lists-api';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';

/**
 * How sure we are of a row, in words that say what it rests on and, for an unconfirmed row, what
 * the engine does with it (the tags of the regulatory sources file).
 */
const STATUS_WORDS: Record<ReferenceRowView['status'], string> = {
  C: "Confirmed in the regulation's text",
  C2: 'Confirmed in a secondary source',
  CALC: 'Derived from confirmed values',
  M: 'Not yet confirmed: warns, never blocks',
};

/** One reference list as a table filtered, sorted and paged on the server via the URL. */
@Component({
  selector: 'bp-reference-list-page',
  imports: [
    CalendarDayPipe,
    MatFormField,
    MatIcon,
    MatInput,
    MatLabel,
    MatOption,
    MatPaginator,
    MatPrefix,
    MatProgressBar,
    MatSelect,
    MatSort,
    MatSortHeader,
    MatTableModule,
    RouterLink,
  ],
  templateUrl: './reference-list-page.html',
  styleUrl: './reference-list-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class ReferenceListPage {
  /** The list's key, from the path. */
  readonly key = input<string>();

  protected readonly statuses = Object.keys(STATUS_WORDS) as ReferenceRowView['status'][];
  protected readonly statusWords = STATUS_WORDS;
  protected readonly columns = ['label', 'details', 'source', 'status', 'effectiveFrom'];
  protected readonly list = injectUrlListQuery(referenceRowsQuerySchema);
  protected readonly query = this.list.query;
  protected readonly result = inject(ReferenceListsApi).rows(this.key, this.query);
  protected readonly pageData = keepLastValue(this.result);
  protected readonly loadError = computed(() => {
    const error = this.result.error();
    return error ? messageOf(error) : '';
  });

  protected statusWord(row: ReferenceRowView): string {
    return STATUS_WORDS[row.status];
  }

  protected details(row: ReferenceRowView) {
    return referenceDetails(row.data);
  }
}

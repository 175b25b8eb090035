import {
  ChangeDetectionStrategy,
  Component,
  computed,
  DestroyRef,
  inject,
  input,
  linkedSignal,
} from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { MatFormField, MatLabel, MatPrefix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatPaginator, type PageEvent } from '@angular/material/paginator';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSort, MatSortHeader, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { debounceTime, distinctUntilChanged, skip } from 'rxjs';
import {
  referenceRowsQuerySchema,
  type ReferenceRowsPage,
  type ReferenceRowView,
} from '@batchproof/shared';
import { messageOf } from '../../http/api-error';
import { referenceDetails } from '../reference-details';
import { ReferenceListsApi } from '../reference-lists-api';

/** How sure we are of a row, in words (the tags of the regulatory sources file). */
const STATUS_WORDS: Record<ReferenceRowView['status'], string> = {
  C: 'Confirmed in the primary text',
  C2: 'Confirmed in a secondary source',
  CALC: 'Computed from confirmed values',
  M: 'From memory, not yet confirmed',
};

/** One reference list as a table filtered, sorted and paged on the server via the URL. */
@Component({
  selector: 'bp-reference-list-page',
  imports: [
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
  readonly q = input<string>();
  readonly status = input<string>();
  readonly sort = input<string>();
  readonly dir = input<string>();
  readonly page = input<string>();
  readonly pageSize = input<string>();

  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  protected readonly statusWords = STATUS_WORDS;
  protected readonly statuses = Object.keys(STATUS_WORDS) as ReferenceRowView['status'][];
  protected readonly columns = ['label', 'details', 'source', 'status', 'effectiveFrom'];

  protected readonly query = computed(() => {
    const raw = {
      q: this.q(),
      status: this.status() || undefined,
      sort: this.sort(),
      dir: this.dir(),
      page: this.page(),
      pageSize: this.pageSize(),
    };
    const parsed = referenceRowsQuerySchema.safeParse(raw);
    return parsed.success ? parsed.data : referenceRowsQuerySchema.parse({});
  });
  protected readonly result = inject(ReferenceListsApi).rows(this.key, this.query);
  /** The last page loaded, kept while the next loads so the table does not flicker. */
  protected readonly pageData = linkedSignal<
    ReferenceRowsPage | undefined,
    ReferenceRowsPage | undefined
  >({
    source: () => (this.result.hasValue() ? this.result.value() : undefined),
    computation: (value, previous) => value ?? previous?.value,
  });
  protected readonly loadError = computed(() => {
    const error = this.result.error();
    return error ? messageOf(error) : '';
  });
  /** What the filter box shows; the URL follows it after a short pause in typing. */
  protected readonly filterText = linkedSignal(() => this.query().q);

  constructor() {
    toObservable(this.filterText)
      .pipe(
        skip(1),
        debounceTime(300),
        distinctUntilChanged(),
        takeUntilDestroyed(inject(DestroyRef)),
      )
      .subscribe((q) => this.navigate({ q: q || null, page: null }));
  }

  protected statusWord(row: ReferenceRowView): string {
    return STATUS_WORDS[row.status];
  }

  protected details(row: ReferenceRowView) {
    return referenceDetails(row.data);
  }

  protected sortBy(sort: Sort): void {
    this.navigate({
      sort: sort.direction ? sort.active : null,
      dir: sort.direction || null,
      page: null,
    });
  }

  protected filterStatus(status: string): void {
    this.navigate({ status: status || null, page: null });
  }

  protected changePage(event: PageEvent): void {
    this.navigate({ page: event.pageIndex + 1, pageSize: event.pageSize });
  }

  private navigate(queryParams: Record<string, string | number | null>): void {
    void this.router.navigate([], {
      relativeTo: this.route,
      queryParams,
      queryParamsHandling: 'merge',
      replaceUrl: true,
    });
  }
}

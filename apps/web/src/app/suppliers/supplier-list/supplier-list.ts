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
import { MatAnchor, MatButton } from '@angular/material/button';
import { MatFormField, MatLabel, MatPrefix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatPaginator, type PageEvent } from '@angular/material/paginator';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatSort, MatSortHeader, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { debounceTime, distinctUntilChanged, skip } from 'rxjs';
import { ROLE_SETS, supplierListQuerySchema, type SupplierPage } from '@batchproof/shared';
import { Session } from '../../auth/session';
import { messageOf } from '../../http/api-error';
import { SuppliersApi } from '../suppliers-api';

/** The workshop's suppliers, filtered, sorted and paged on the server through the URL. */
@Component({
  selector: 'bp-supplier-list',
  imports: [
    MatAnchor,
    MatButton,
    MatFormField,
    MatIcon,
    MatInput,
    MatLabel,
    MatPaginator,
    MatPrefix,
    MatProgressBar,
    MatSort,
    MatSortHeader,
    MatTableModule,
    RouterLink,
  ],
  templateUrl: './supplier-list.html',
  styleUrl: './supplier-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class SupplierList {
  readonly q = input<string>();
  readonly sort = input<string>();
  readonly dir = input<string>();
  readonly page = input<string>();
  readonly pageSize = input<string>();

  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly session = inject(Session);

  /** Whether the signed-in member may add suppliers. */
  protected readonly canWrite = computed(() => this.session.hasRole(ROLE_SETS.writers));
  protected readonly columns = ['name', 'contact', 'email', 'materialCount', 'updatedAt'];
  protected readonly query = computed(() => {
    const parsed = supplierListQuerySchema.safeParse({
      q: this.q(),
      sort: this.sort(),
      dir: this.dir(),
      page: this.page(),
      pageSize: this.pageSize(),
    });
    return parsed.success ? parsed.data : supplierListQuerySchema.parse({});
  });
  protected readonly result = inject(SuppliersApi).page(this.query);
  /** The last page loaded, kept while the next loads so the table does not flicker. */
  protected readonly pageData = linkedSignal<SupplierPage | undefined, SupplierPage | undefined>({
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

  protected sortBy(sort: Sort): void {
    this.navigate({
      sort: sort.direction ? sort.active : null,
      dir: sort.direction || null,
      page: null,
    });
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

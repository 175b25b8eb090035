import { DatePipe, DecimalPipe } from '@angular/common';
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
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSort, MatSortHeader, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { debounceTime, distinctUntilChanged, skip } from 'rxjs';
import {
  type Lot,
  lotListQuerySchema,
  type LotPage,
  type MaterialSummary,
  ROLE_SETS,
} from '@batchproof/shared';
import { Session } from '../../auth/session';
import { messageOf } from '../../http/api-error';
import { EXPIRY_FILTERS, EXPIRY_FLAGS, expiresBeforeFor, expiryState } from '../lot-expiry';
import { LotsApi } from '../lots-api';
import { MaterialPicker } from '../material-picker/material-picker';

/**
 * Goods-in: every lot the workshop received, with its stock on hand, filtered, sorted and paged
 * on the server through the URL's query parameters.
 */
@Component({
  selector: 'bp-lot-list',
  imports: [
    DatePipe,
    DecimalPipe,
    MatAnchor,
    MatButton,
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
    MaterialPicker,
    RouterLink,
  ],
  templateUrl: './lot-list.html',
  styleUrl: './lot-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class LotList {
  /** Text filter on the supplier lot number and the material's name. */
  readonly q = input<string>();
  /** Only lots of this material. */
  readonly materialId = input<string>();
  /** One of the {@link EXPIRY_FILTERS} values. */
  readonly expiry = input<string>();
  readonly sort = input<string>();
  readonly dir = input<string>();
  readonly page = input<string>();
  readonly pageSize = input<string>();

  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly session = inject(Session);
  /** Whether the signed-in member may record and change lots. */
  protected readonly canWrite = computed(() => this.session.hasRole(ROLE_SETS.writers));
  protected readonly expiryFilters = EXPIRY_FILTERS;
  protected readonly flags = EXPIRY_FLAGS;
  protected readonly columns = [
    'materialName',
    'supplierLotNumber',
    'receivedOn',
    'expiresOn',
    'quantity',
    'stockOnHand',
    'unitCost',
  ];
  private readonly today = new Date();

  protected readonly query = computed(() => {
    const parsed = lotListQuerySchema.safeParse({
      q: this.q(),
      materialId: this.materialId() || undefined,
      expiresBefore: expiresBeforeFor(this.expiry(), this.today),
      sort: this.sort(),
      // With no sort chosen, the latest deliveries come first.
      dir: this.dir() ?? (this.sort() ? undefined : 'desc'),
      page: this.page(),
      pageSize: this.pageSize(),
    });
    return parsed.success ? parsed.data : lotListQuerySchema.parse({});
  });
  /** The expiry filter in force (one the list knows, or none). */
  protected readonly expiryFilter = computed(() =>
    this.query().expiresBefore ? (this.expiry() ?? '') : '',
  );
  protected readonly filtered = computed(
    () => !!(this.query().q || this.query().materialId || this.query().expiresBefore),
  );
  protected readonly result = inject(LotsApi).lots(this.query);
  /** The last page loaded, kept while the next loads so the table does not flicker. */
  protected readonly pageData = linkedSignal<LotPage | undefined, LotPage | undefined>({
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

  protected expiryOf(lot: Lot) {
    const state = expiryState(lot.expiresOn, this.today);
    return state === 'soon' || state === 'expired' ? { state, ...EXPIRY_FLAGS[state] } : null;
  }

  protected sortBy(sort: Sort): void {
    this.navigate({
      sort: sort.direction ? sort.active : null,
      dir: sort.direction || null,
      page: null,
    });
  }

  protected filterMaterial(material: MaterialSummary | null): void {
    this.navigate({ materialId: material?.id ?? null, page: null });
  }

  protected filterExpiry(value: string): void {
    this.navigate({ expiry: value || null, page: null });
  }

  protected clearFilters(): void {
    this.navigate({ q: null, materialId: null, expiry: null, page: null });
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

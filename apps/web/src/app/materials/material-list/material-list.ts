import {
  ChangeDetectionStrategy,
  Component,
  computed,
  DestroyRef,
  inject,
  input,
  linkedSignal,
  signal,
} from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { MatAnchor, MatButton } from '@angular/material/button';
import { MatFormField, MatLabel, MatPrefix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatPaginator, type PageEvent } from '@angular/material/paginator';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatSort, MatSortHeader, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { debounceTime, distinctUntilChanged, skip } from 'rxjs';
import {
  materialListQuerySchema,
  type MaterialPage,
  type MaterialImportResult,
  type MaterialSummary,
  ROLE_SETS,
} from '@batchproof/shared';
import { Session } from '../../auth/session';
import { saveFile } from '../../documents/save-file';
import { messageOf } from '../../http/api-error';
import { MaterialImport } from '../material-import/material-import';
import { CATEGORY_LABELS, CATEGORY_OPTIONS } from '../material-labels';
import { MaterialsApi } from '../materials-api';

/**
 * The workshop's materials, filtered, sorted and paged on the server through the URL's query
 * parameters, with CSV export for everyone and new material and CSV import for writers.
 */
@Component({
  selector: 'bp-material-list',
  imports: [
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
    RouterLink,
    MaterialImport,
  ],
  templateUrl: './material-list.html',
  styleUrl: './material-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class MaterialList {
  readonly q = input<string>();
  readonly category = input<string>();
  /** Only the materials of this supplier (from a supplier's page). */
  readonly supplierId = input<string>();
  readonly sort = input<string>();
  readonly dir = input<string>();
  readonly page = input<string>();
  readonly pageSize = input<string>();

  private readonly api = inject(MaterialsApi);
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly snackBar = inject(MatSnackBar);
  private readonly session = inject(Session);

  /** Whether the signed-in member may add and import materials. */
  protected readonly canWrite = computed(() => this.session.hasRole(ROLE_SETS.writers));
  protected readonly categories = CATEGORY_OPTIONS;
  protected readonly columns = [
    'tradeName',
    'inci',
    'category',
    'supplier',
    'numbers',
    'updatedAt',
  ];

  protected readonly query = computed(() => {
    const parsed = materialListQuerySchema.safeParse({
      q: this.q(),
      category: this.category() || undefined,
      supplierId: this.supplierId() || undefined,
      sort: this.sort(),
      dir: this.dir(),
      page: this.page(),
      pageSize: this.pageSize(),
    });
    return parsed.success ? parsed.data : materialListQuerySchema.parse({});
  });
  protected readonly result = this.api.page(this.query);
  /** The last page loaded, kept while the next loads so the table does not flicker. */
  protected readonly pageData = linkedSignal<MaterialPage | undefined, MaterialPage | undefined>({
    source: () => (this.result.hasValue() ? this.result.value() : undefined),
    computation: (value, previous) => value ?? previous?.value,
  });
  /** Whether the list is filtered, so an empty table can say why. */
  protected readonly filtered = computed(
    () => !!this.query().q || !!this.query().category || !!this.query().supplierId,
  );
  protected readonly loadError = computed(() => {
    const error = this.result.error();
    return error ? messageOf(error) : '';
  });
  /** What the filter box shows; the URL follows it after a short pause in typing. */
  protected readonly filterText = linkedSignal(() => this.query().q);
  protected readonly importing = signal(false);
  protected readonly exporting = signal(false);

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

  protected categoryLabel(m: MaterialSummary): string {
    return CATEGORY_LABELS[m.category];
  }

  protected sortBy(sort: Sort): void {
    this.navigate({
      sort: sort.direction ? sort.active : null,
      dir: sort.direction || null,
      page: null,
    });
  }

  protected filterCategory(category: string): void {
    this.navigate({ category: category || null, page: null });
  }

  protected clearFilters(): void {
    this.filterText.set('');
    this.navigate({ q: null, category: null, supplierId: null, page: null });
  }

  protected clearSupplier(): void {
    this.navigate({ supplierId: null, page: null });
  }

  protected changePage(event: PageEvent): void {
    this.navigate({ page: event.pageIndex + 1, pageSize: event.pageSize });
  }

  protected exportCsv(): void {
    this.exporting.set(true);
    this.api.exportCsv().subscribe({
      next: (blob) => {
        this.exporting.set(false);
        saveFile(blob, 'materials.csv');
        this.snackBar.open('Materials exported as materials.csv.', 'OK', { duration: 4000 });
      },
      error: (err: unknown) => {
        this.exporting.set(false);
        this.snackBar.open(messageOf(err), 'OK', { duration: 8000 });
      },
    });
  }

  protected onImported(result: MaterialImportResult): void {
    this.importing.set(false);
    this.snackBar.open(`Imported ${result.imported} material(s).`, 'OK', { duration: 5000 });
    this.result.reload();
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

import { DatePipe } from '@angular/common';
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
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
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
  type Formula,
  formulaListQuerySchema,
  PRODUCT_TYPES,
  type ProductType,
  ROLE_SETS,
} from '@batchproof/shared';
import { Session } from '../../auth/session';
import { messageOf } from '../../http/api-error';
import { FormulasApi, type FormulaRowPage } from '../formulas-api';
import { PRODUCT_TYPE_LABELS } from '../product-types';
import { SEVERITIES, SeverityLabel } from '../severity/severity-label';
import { NewFormulaDialog } from './new-formula-dialog';

/** The workshop's formulas, filtered, sorted and paged on the server through the URL. */
@Component({
  selector: 'bp-formula-list-page',
  imports: [
    DatePipe,
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
    SeverityLabel,
  ],
  templateUrl: './formula-list-page.html',
  styleUrl: './formula-list-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class FormulaListPage {
  readonly q = input<string>();
  readonly productType = input<string>();
  readonly sort = input<string>();
  readonly dir = input<string>();
  readonly page = input<string>();
  readonly pageSize = input<string>();

  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly session = inject(Session);
  /** Whether the signed-in member may create and edit formulas. */
  protected readonly canWrite = computed(() => this.session.hasRole(ROLE_SETS.writers));
  protected readonly typeLabels = PRODUCT_TYPE_LABELS;
  protected readonly productTypes = PRODUCT_TYPES;
  protected readonly severities = SEVERITIES;
  protected readonly columns = ['name', 'productType', 'latest', 'findings', 'updatedAt'];

  protected readonly query = computed(() => {
    const parsed = formulaListQuerySchema.safeParse({
      q: this.q(),
      productType: this.productType() || undefined,
      sort: this.sort(),
      dir: this.dir(),
      page: this.page(),
      pageSize: this.pageSize(),
    });
    return parsed.success ? parsed.data : formulaListQuerySchema.parse({});
  });
  protected readonly result = inject(FormulasApi).list(this.query);
  /** The last page loaded, kept while the next loads so the table does not flicker. */
  protected readonly pageData = linkedSignal<
    FormulaRowPage | undefined,
    FormulaRowPage | undefined
  >({
    source: () => (this.result.hasValue() ? this.result.value() : undefined),
    computation: (value, previous) => value ?? previous?.value,
  });
  protected readonly loadError = computed(() => {
    const error = this.result.error();
    return error ? messageOf(error) : '';
  });
  /** Whether the workshop has no formulas at all (not merely none matching the filter). */
  protected readonly noFormulasYet = computed(
    () => this.pageData()?.total === 0 && !this.query().q && !this.query().productType,
  );
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

  protected typeLabel(type: ProductType): string {
    return PRODUCT_TYPE_LABELS[type];
  }

  protected openNewFormula(): void {
    this.dialog
      .open<NewFormulaDialog, void, Formula>(NewFormulaDialog, { width: '32rem' })
      .afterClosed()
      .subscribe((formula) => {
        if (!formula) return;
        this.snackBar.open(`${formula.name} is created as draft version 1.`, 'OK', {
          duration: 4000,
        });
        void this.router.navigate(['/formulas', formula.id]);
      });
  }

  protected sortBy(sort: Sort): void {
    this.navigate({
      sort: sort.direction ? sort.active : null,
      dir: sort.direction || null,
      page: null,
    });
  }

  protected filterType(type: string): void {
    this.navigate({ productType: type || null, page: null });
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

import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormField, MatLabel, MatPrefix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatPaginator } from '@angular/material/paginator';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatSort, MatSortHeader } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import {
  type Formula,
  formulaListQuerySchema,
  PRODUCT_TYPES,
  type ProductType,
  ROLE_SETS,
} from '@batchproof/shared';
import { Session } from '../../auth/session';
import { ListCard } from '../../lists/list-card';
import { injectUrlListQuery, keepLastValue } from '../../lists/url-list-query';
import { FormulasApi } from '../formulas-api';
import { ArchivedToggle } from '../../housekeeping/archived-toggle';
import { PRODUCT_TYPE_LABELS } from '../product-types';
import { SEVERITIES, SeverityLabel } from '../severity/severity-label';
import { NewFormulaDialog } from './new-formula-dialog';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';

/** The workshop's formulas, filtered, sorted and paged on the server through the URL. */
@Component({
  selector: 'bp-formula-list-page',
  imports: [
    ArchivedToggle,
    CalendarDayPipe,
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
    ListCard,
    SeverityLabel,
  ],
  templateUrl: './formula-list-page.html',
  styleUrl: './formula-list-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class FormulaListPage {
  private readonly router = inject(Router);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly session = inject(Session);
  /** Whether the signed-in member may create and edit formulas. */
  protected readonly canWrite = computed(() => this.session.hasRole(ROLE_SETS.writers));
  protected readonly typeLabels = PRODUCT_TYPE_LABELS;
  protected readonly productTypes = PRODUCT_TYPES;
  protected readonly severities = SEVERITIES;
  protected readonly columns = ['name', 'productType', 'latest', 'findings', 'updatedAt'];

  protected readonly list = injectUrlListQuery(formulaListQuerySchema);
  protected readonly query = this.list.query;
  protected readonly result = inject(FormulasApi).list(this.query);
  protected readonly pageData = keepLastValue(this.result);
  /** Whether the workshop has no formulas at all (not merely none matching the filter). */
  protected readonly noFormulasYet = computed(
    () => this.pageData()?.total === 0 && !this.query().q && !this.query().productType,
  );

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
}

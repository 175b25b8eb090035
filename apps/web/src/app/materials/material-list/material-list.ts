import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatAnchor, MatButton } from '@angular/material/button';
import { MatFormField, MatLabel, MatPrefix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatPaginator } from '@angular/material/paginator';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatSort, MatSortHeader } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import {
  materialListQuerySchema,
  type MaterialImportResult,
  type MaterialSummary,
  ROLE_SETS,
} from '@batchproof/shared';
import { Session } from '../../auth/session';
import { saveFile } from '../../documents/save-file';
import { messageOf } from '../../http/api-error';
import { ListCard } from '../../lists/list-card';
import { injectUrlListQuery, keepLastValue } from '../../lists/url-list-query';
import { MaterialImport } from '../material-import/material-import';
import { CATEGORY_LABELS, CATEGORY_OPTIONS } from '../material-labels';
import { MaterialsApi } from '../materials-api';
import { ArchivedToggle } from '../../housekeeping/archived-toggle';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';

/**
 * The workshop's materials, filtered, sorted and paged on the server through the URL's query
 * parameters, with CSV export for everyone and new material and CSV import for writers.
 */
@Component({
  selector: 'bp-material-list',
  imports: [
    ArchivedToggle,
    CalendarDayPipe,
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
    ListCard,
    MaterialImport,
  ],
  templateUrl: './material-list.html',
  styleUrl: './material-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class MaterialList {
  private readonly api = inject(MaterialsApi);
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

  /** The URL's filter, sort and page; `supplierId` comes from a supplier's page. */
  protected readonly list = injectUrlListQuery(materialListQuerySchema);
  protected readonly query = this.list.query;
  protected readonly result = this.api.page(this.query);
  protected readonly pageData = keepLastValue(this.result);
  /** Whether the list is filtered, so an empty table can say why. */
  protected readonly filtered = computed(
    () => !!this.query().q || !!this.query().category || !!this.query().supplierId,
  );
  protected readonly importing = signal(false);
  protected readonly exporting = signal(false);

  protected categoryLabel(m: MaterialSummary): string {
    return CATEGORY_LABELS[m.category];
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
}

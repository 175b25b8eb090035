import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatAnchor, MatButton } from '@angular/material/button';
import { MatFormField, MatLabel, MatPrefix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatPaginator } from '@angular/material/paginator';
import { MatSort, MatSortHeader } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { ROLE_SETS, supplierListQuerySchema } from '@batchproof/shared';
import { Session } from '../../auth/session';
import { ListCard } from '../../lists/list-card';
import { injectUrlListQuery, keepLastValue } from '../../lists/url-list-query';
import { SuppliersApi } from '../suppliers-api';
import { ArchivedToggle } from '../../housekeeping/archived-toggle';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';

/** The workshop's suppliers, filtered, sorted and paged on the server through the URL. */
@Component({
  selector: 'bp-supplier-list',
  imports: [
    ArchivedToggle,
    CalendarDayPipe,
    MatAnchor,
    MatButton,
    MatFormField,
    MatIcon,
    MatInput,
    MatLabel,
    MatPaginator,
    MatPrefix,
    MatSort,
    MatSortHeader,
    MatTableModule,
    RouterLink,
    ListCard,
  ],
  templateUrl: './supplier-list.html',
  styleUrl: './supplier-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class SupplierList {
  private readonly session = inject(Session);

  /** Whether the signed-in member may add suppliers. */
  protected readonly canWrite = computed(() => this.session.hasRole(ROLE_SETS.writers));
  protected readonly columns = ['name', 'contact', 'email', 'materialCount', 'updatedAt'];
  protected readonly list = injectUrlListQuery(supplierListQuerySchema);
  protected readonly query = this.list.query;
  protected readonly result = inject(SuppliersApi).page(this.query);
  protected readonly pageData = keepLastValue(this.result);
}

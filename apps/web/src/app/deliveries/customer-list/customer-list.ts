import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatAnchor } from '@angular/material/button';
import { MatFormField, MatLabel, MatPrefix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatPaginator } from '@angular/material/paginator';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSort, MatSortHeader } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import {
  CUSTOMER_KIND_LABELS,
  CUSTOMER_KINDS,
  ROLE_SETS,
  type CustomerKind,
  customerListQuerySchema,
} from '@batchproof/shared';
import { Session } from '../../auth/session';
import { ArchivedToggle } from '../../housekeeping/archived-toggle';
import { ListCard } from '../../lists/list-card';
import { injectUrlListQuery, keepLastValue } from '../../lists/url-list-query';
import { CustomersApi } from '../customers-api';

/** The workshop's customers, filtered, sorted and paged on the server through the URL. */
@Component({
  selector: 'bp-customer-list',
  imports: [
    ArchivedToggle,
    ListCard,
    MatAnchor,
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
  templateUrl: './customer-list.html',
  styleUrl: '../deliveries-list-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class CustomerList {
  private readonly session = inject(Session);

  /** Whether the signed-in member may add customers. */
  protected readonly canWrite = computed(() => this.session.hasRole(ROLE_SETS.goodsIn));
  protected readonly kinds = CUSTOMER_KINDS;
  protected readonly kindLabels = CUSTOMER_KIND_LABELS;
  protected readonly columns = ['name', 'kind', 'contact', 'email', 'phone', 'deliveryCount'];
  protected readonly list = injectUrlListQuery(customerListQuerySchema);
  protected readonly query = this.list.query;
  protected readonly result = inject(CustomersApi).page(this.query);
  protected readonly pageData = keepLastValue(this.result);

  /** A kind as the screens name it. */
  protected kindLabel(kind: CustomerKind): string {
    return CUSTOMER_KIND_LABELS[kind];
  }
}

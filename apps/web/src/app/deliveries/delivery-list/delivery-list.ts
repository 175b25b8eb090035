import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatAnchor, MatButton } from '@angular/material/button';
import { MatFormField, MatLabel, MatPrefix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatPaginator } from '@angular/material/paginator';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSort, MatSortHeader } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { ROLE_SETS, deliveryListQuerySchema } from '@batchproof/shared';
import { Session } from '../../auth/session';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';
import { ListCard } from '../../lists/list-card';
import { injectUrlListQuery, keepLastValue } from '../../lists/url-list-query';
import { CustomersApi } from '../customers-api';
import { DeliveriesApi } from '../deliveries-api';

/**
 * Every delivery of finished lots, with its lots and units, filtered, sorted and paged on the
 * server through the URL (`?customerId=…` and `?lotCode=…` narrow it, as links from a customer
 * or a trace do).
 */
@Component({
  selector: 'bp-delivery-list',
  imports: [
    CalendarDayPipe,
    ListCard,
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
  ],
  templateUrl: './delivery-list.html',
  styleUrl: '../deliveries-list-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class DeliveryList {
  private readonly session = inject(Session);
  private readonly customers = inject(CustomersApi).options();

  /** Whether the signed-in member may record and import deliveries. */
  protected readonly canWrite = computed(() => this.session.hasRole(ROLE_SETS.goodsIn));
  protected readonly columns = ['deliveredOn', 'customerName', 'reference', 'lots', 'totalUnits'];
  protected readonly list = injectUrlListQuery(deliveryListQuerySchema, {
    fromUrl: (params) => ({
      ...params,
      // With no sort chosen, the latest deliveries come first.
      dir: params['dir'] ?? (params['sort'] ? undefined : 'desc'),
    }),
  });
  protected readonly query = this.list.query;
  protected readonly result = inject(DeliveriesApi).page(this.query);
  protected readonly pageData = keepLastValue(this.result);
  protected readonly customerOptions = computed(() =>
    this.customers.hasValue() ? this.customers.value() : [],
  );
}

import { DecimalPipe } from '@angular/common';
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
import { type Lot, lotListQuerySchema, ROLE_SETS } from '@batchproof/shared';
import { Session } from '../../auth/session';
import { ListCard } from '../../lists/list-card';
import { MaterialPicker } from '../../materials/material-picker/material-picker';
import { injectUrlListQuery, keepLastValue } from '../../lists/url-list-query';
import { EXPIRY_FILTERS, EXPIRY_FLAGS, expiresBeforeFor, expiryState } from '../lot-expiry';
import { LotsApi } from '../lots-api';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';

/**
 * Goods-in: every lot the workshop received, with its stock on hand, filtered, sorted and paged
 * on the server through the URL's query parameters.
 */
@Component({
  selector: 'bp-lot-list',
  imports: [
    CalendarDayPipe,
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
    MatSelect,
    MatSort,
    MatSortHeader,
    MatTableModule,
    MaterialPicker,
    RouterLink,
    ListCard,
  ],
  templateUrl: './lot-list.html',
  styleUrl: './lot-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class LotList {
  private readonly session = inject(Session);
  /** Whether the signed-in member may record goods-in. */
  protected readonly canRecord = computed(() => this.session.hasRole(ROLE_SETS.goodsIn));
  protected readonly expiryFilters = EXPIRY_FILTERS;
  protected readonly flags = EXPIRY_FLAGS;
  protected readonly columns = [
    'materialName',
    'supplierName',
    'supplierLotNumber',
    'receivedOn',
    'expiresOn',
    'quantity',
    'stockOnHand',
    'unitCost',
  ];
  private readonly today = new Date();

  /**
   * The URL's filter, sort and page. `q` matches the supplier lot number and the material's
   * name; `expiry` is one of the {@link EXPIRY_FILTERS} values, sent as an `expiresBefore` day.
   */
  protected readonly list = injectUrlListQuery(lotListQuerySchema, {
    fromUrl: (params) => ({
      ...params,
      expiresBefore: expiresBeforeFor(params['expiry'], this.today),
      // With no sort chosen, the latest deliveries come first.
      dir: params['dir'] ?? (params['sort'] ? undefined : 'desc'),
    }),
  });
  protected readonly query = this.list.query;
  /** The expiry filter in force (one the list knows, or none). */
  protected readonly expiryFilter = computed(() =>
    this.query().expiresBefore ? (this.list.params()['expiry'] ?? '') : '',
  );
  protected readonly filtered = computed(
    () => !!(this.query().q || this.query().materialId || this.query().expiresBefore),
  );
  protected readonly result = inject(LotsApi).lots(this.query);
  protected readonly pageData = keepLastValue(this.result);

  protected expiryOf(lot: Lot) {
    const state = expiryState(lot.expiresOn, this.today);
    return state === 'soon' || state === 'expired' ? { state, ...EXPIRY_FLAGS[state] } : null;
  }
}

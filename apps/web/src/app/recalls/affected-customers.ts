import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import { MatTableModule } from '@angular/material/table';
import type { RecallAffectedCustomer, RecallReply } from '@batchproof/shared';

/**
 * The customers a recall reaches: how to reach them (e-mail, else phone), the lots and units
 * they received and, once replies come in, the units returned.
 */
@Component({
  selector: 'bp-affected-customers',
  imports: [MatIcon, MatTableModule],
  template: `
    <div class="scroller">
      <table
        mat-table
        class="bp-dense-table"
        [dataSource]="customers()"
        [attr.aria-label]="label()"
      >
        <ng-container matColumnDef="customer">
          <th mat-header-cell *matHeaderCellDef>Customer</th>
          <td mat-cell *matCellDef="let c">{{ c.customerName }}</td>
        </ng-container>
        <ng-container matColumnDef="reach">
          <th mat-header-cell *matHeaderCellDef>E-mail and phone</th>
          <td mat-cell *matCellDef="let c">
            @if (c.email) {
              <span class="line">{{ c.email }}</span>
            } @else {
              <span class="line missing">
                <mat-icon aria-hidden="true">warning</mat-icon>No e-mail: call them
              </span>
            }
            <span class="line muted">{{ c.phone ?? 'No phone number' }}</span>
          </td>
        </ng-container>
        <ng-container matColumnDef="lots">
          <th mat-header-cell *matHeaderCellDef>Lots received</th>
          <td mat-cell *matCellDef="let c">
            @for (l of c.lots; track l.finishedLotId) {
              <span class="line"
                >{{ l.lotCode }} <span class="muted">× {{ l.unitsDelivered }}</span></span
              >
            }
          </td>
        </ng-container>
        <ng-container matColumnDef="delivered">
          <th mat-header-cell *matHeaderCellDef class="num">Delivered</th>
          <td mat-cell *matCellDef="let c" class="num">{{ c.unitsDelivered }}</td>
        </ng-container>
        <ng-container matColumnDef="returned">
          <th mat-header-cell *matHeaderCellDef class="num">Returned</th>
          <td mat-cell *matCellDef="let c" class="num">{{ returned().get(c.customerId) ?? 0 }}</td>
        </ng-container>
        <tr mat-header-row *matHeaderRowDef="columns()"></tr>
        <tr mat-row *matRowDef="let c; columns: columns()"></tr>
        <tr class="mat-row" *matNoDataRow>
          <td class="no-data" [attr.colspan]="columns().length">
            No delivery of these lots is recorded, so no customer is known to have them.
          </td>
        </tr>
      </table>
    </div>
  `,
  styles: `
    :host {
      display: block;
    }
    .scroller {
      overflow-x: auto;
    }
    table {
      width: 100%;
    }
    /* Addresses and lot codes stay whole; the table scrolls sideways in its card instead. */
    .line {
      display: block;
      white-space: nowrap;
    }
    .muted {
      color: var(--mat-sys-on-surface-variant);
    }
    .missing {
      display: inline-flex;
      gap: 4px;
      align-items: center;
      color: var(--mat-sys-error);
    }
    .missing mat-icon {
      width: 16px;
      height: 16px;
      font-size: 16px;
    }
    .num {
      text-align: end;
      font-variant-numeric: tabular-nums;
    }
    .no-data {
      padding: 16px;
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AffectedCustomers {
  readonly customers = input.required<RecallAffectedCustomer[]>();
  /** The replies so far; without them the returned column is left out. */
  readonly replies = input<RecallReply[] | null>(null);
  readonly label = input('Affected customers');

  protected readonly columns = computed(() =>
    this.replies()
      ? ['customer', 'reach', 'lots', 'delivered', 'returned']
      : ['customer', 'reach', 'lots', 'delivered'],
  );
  protected readonly returned = computed(() => {
    const totals = new Map<string, number>();
    for (const r of this.replies() ?? []) {
      totals.set(r.customerId, (totals.get(r.customerId) ?? 0) + r.unitsReturned);
    }
    return totals;
  });
}

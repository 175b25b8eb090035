import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import type { AllergenResult, ComplianceMarket } from '@batchproof/shared';

/** One market's allergens, as the live evaluation and the safety packet both hold them. */
export interface MarketAllergens {
  market: ComplianceMarket;
  allergens: readonly AllergenResult[];
}

interface AllergenRow {
  inci: string;
  percent: number;
  byMarket: { market: ComplianceMarket; result: AllergenResult | undefined }[];
}

/**
 * Fragrance allergens in the product: the percent of the finished product, and per market
 * whether the label must name it and the threshold used (0.001 % leave-on, 0.01 % rinse-off).
 * Shown in the formula's live checks (every market) and in the safety packet (one market each).
 */
@Component({
  selector: 'bp-allergen-table',
  imports: [DecimalPipe, MatIcon],
  template: `
    @if (rows().length === 0) {
      <p class="none">No fragrance allergens declared by the suppliers of these materials.</p>
    } @else {
      <div class="scroller">
        <table [attr.aria-label]="label()">
          <thead>
            <tr>
              <th scope="col">Allergen</th>
              <th scope="col" class="num">In product</th>
              @for (m of markets(); track m) {
                <th scope="col">{{ m }}</th>
              }
            </tr>
          </thead>
          <tbody>
            @for (row of rows(); track row.inci) {
              <tr>
                <th scope="row">{{ row.inci }}</th>
                <td class="num">{{ row.percent | number: '1.3-4' }}<span class="unit"> %</span></td>
                @for (cell of row.byMarket; track cell.market) {
                  <td [attr.data-market]="cell.market">
                    @if (cell.result; as r) {
                      <span class="declared" [class.yes]="r.declared">
                        <mat-icon aria-hidden="true">{{
                          r.declared ? 'label' : 'label_off'
                        }}</mat-icon>
                        {{ r.declared ? 'Named' : 'Not named' }}
                      </span>
                      <span class="threshold">
                        @if (r.thresholdPercent !== null) {
                          over {{ r.thresholdPercent }} %
                        } @else {
                          no rule yet
                        }
                      </span>
                    }
                  </td>
                }
              </tr>
            }
          </tbody>
        </table>
      </div>
    }
  `,
  styles: `
    .scroller {
      overflow-x: auto;
    }
    table {
      width: 100%;
      border-collapse: collapse;
      font: var(--mat-sys-body-medium);
    }
    th,
    td {
      padding: 4px 8px;
      text-align: start;
      vertical-align: top;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    thead th {
      font-weight: 600;
      color: var(--mat-sys-on-surface-variant);
    }
    tbody th {
      font-weight: 400;
    }
    .num {
      text-align: end;
      font-variant-numeric: tabular-nums;
      white-space: nowrap;
    }
    .unit,
    .threshold {
      font-weight: 300;
      color: var(--mat-sys-on-surface-variant);
    }
    .threshold {
      display: block;
      font-size: 0.8em;
    }
    .declared {
      display: inline-flex;
      align-items: center;
      gap: 2px;
      white-space: nowrap;
    }
    .declared.yes {
      font-weight: 600;
    }
    mat-icon {
      font-size: 16px;
      width: 16px;
      height: 16px;
    }
    .none {
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AllergenTable {
  /** The markets, in column order, each with its allergens. */
  readonly byMarket = input.required<readonly MarketAllergens[]>();
  /** The table's accessible name. */
  readonly label = input('Fragrance allergens');

  protected readonly markets = computed(() => this.byMarket().map((m) => m.market));
  protected readonly rows = computed<AllergenRow[]>(() => {
    const byMarket = this.byMarket();
    const names = new Map<string, number>();
    for (const m of byMarket) for (const a of m.allergens) names.set(a.inci, a.percent);
    return [...names.entries()]
      .sort((a, b) => b[1] - a[1])
      .map(([inci, percent]) => ({
        inci,
        percent,
        byMarket: byMarket.map(({ market, allergens }) => ({
          market,
          result: allergens.find((a) => a.inci === inci),
        })),
      }));
  });
}

import { ChangeDetectionStrategy, Component, computed, input, signal } from '@angular/core';
import { MatSort, MatSortHeader, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';

/** One column of a trace table: what it shows, how it sorts, and where its cell links. */
export interface TraceColumn<T> {
  key: string;
  header: string;
  /** The value the column sorts by (numbers numerically, text alphabetically, empty last). */
  value: (row: T) => string | number | null;
  /** The cell's text; the value as it is when not given. */
  text?: (row: T) => string;
  /** A lighter unit after the text (design direction: units in a lighter weight). */
  unit?: (row: T) => string;
  /** The page the cell's text links to. */
  link?: (row: T) => string | null;
  /** Right-aligned with tabular figures. */
  numeric?: boolean;
}

type SortValue = string | number | null;
const isEmpty = (v: SortValue) => v === null || v === '';

/**
 * Orders two sort values in a direction (1 ascending, -1 descending): numbers as numbers, text in
 * the reader's order with numbers inside it as numbers; empty values last either way.
 */
export function compareTraceValues(a: SortValue, b: SortValue, direction: 1 | -1 = 1): number {
  if (isEmpty(a) || isEmpty(b)) return Number(isEmpty(a)) - Number(isEmpty(b));
  if (typeof a === 'number' && typeof b === 'number') return direction * (a - b);
  return direction * String(a).localeCompare(String(b), undefined, { numeric: true });
}

/**
 * A trace's rows as a table, sorted in the browser (a trace answers whole): the primary reading
 * of a trace, beside its graph. Each column sorts by its header; links open the record.
 */
@Component({
  selector: 'bp-trace-table',
  imports: [MatSort, MatSortHeader, MatTableModule, RouterLink],
  template: `
    <div class="scroller">
      <table
        mat-table
        class="bp-dense-table"
        [dataSource]="sorted()"
        matSort
        (matSortChange)="sort.set($event)"
        [attr.aria-label]="label()"
      >
        @for (column of columns(); track column.key) {
          <ng-container [matColumnDef]="column.key">
            <th
              mat-header-cell
              *matHeaderCellDef
              mat-sort-header
              [arrowPosition]="column.numeric ? 'before' : 'after'"
              [class.num]="column.numeric"
            >
              {{ column.header }}
            </th>
            <td mat-cell *matCellDef="let row" [class.num]="column.numeric">
              @let text = column.text ? column.text(row) : (column.value(row) ?? '');
              @if (column.link?.(row); as link) {
                <a [routerLink]="link">{{ text }}</a>
              } @else {
                {{ text }}
              }
              @if (column.unit) {
                <span class="unit">{{ column.unit(row) }}</span>
              }
            </td>
          </ng-container>
        }
        <tr mat-header-row *matHeaderRowDef="keys()"></tr>
        <tr mat-row *matRowDef="let row; columns: keys()"></tr>
        <tr class="mat-mdc-row" *matNoDataRow>
          <td class="empty" [attr.colspan]="keys().length">{{ empty() }}</td>
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
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: var(--mat-sys-corner-medium);
    }
    table {
      width: 100%;
    }
    .num {
      text-align: end;
      font-variant-numeric: tabular-nums;
      white-space: nowrap;
    }
    .unit {
      margin-inline-start: 3px;
      color: var(--mat-sys-on-surface-variant);
      font-weight: 300;
    }
    .empty {
      padding: 16px;
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TraceTable<T> {
  readonly rows = input.required<readonly T[]>();
  readonly columns = input.required<readonly TraceColumn<T>[]>();
  /** The table's accessible name. */
  readonly label = input.required<string>();
  /** What an empty table says. */
  readonly empty = input('Nothing to show.');

  protected readonly sort = signal<Sort>({ active: '', direction: '' });
  protected readonly keys = computed(() => this.columns().map((c) => c.key));
  protected readonly sorted = computed(() => {
    const { active, direction } = this.sort();
    const column = this.columns().find((c) => c.key === active);
    if (!column || !direction) return [...this.rows()];
    const sign = direction === 'asc' ? 1 : -1;
    return [...this.rows()].sort((a, b) =>
      compareTraceValues(column.value(a), column.value(b), sign),
    );
  });
}

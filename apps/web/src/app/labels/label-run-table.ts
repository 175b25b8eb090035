import { DecimalPipe } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  output,
  signal,
} from '@angular/core';
import { MatAnchor, MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatSort, MatSortHeader, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { MatSnackBar } from '@angular/material/snack-bar';
import { RouterLink } from '@angular/router';
import { type LabelRunRecord, ROLE_SETS } from '@batchproof/shared';
import { Session } from '../auth/session';
import { CalendarDayPipe } from '../dates/calendar-day-pipe';
import { saveFile } from '../documents/save-file';
import { messageOf } from '../http/api-error';
import { fileSafe } from './calibration-download';
import { LabelRunsApi } from './label-runs-api';
import { runStatus } from './label-run-words';

const COLUMNS = [
  'formulaName',
  'markets',
  'stock',
  'labelCount',
  'lotCode',
  'createdAt',
  'status',
  'pdf',
];

type SortKey = 'formulaName' | 'labelCount' | 'lotCode' | 'createdAt';

const compare: Record<SortKey, (a: LabelRunRecord, b: LabelRunRecord) => number> = {
  formulaName: (a, b) => a.formulaName.localeCompare(b.formulaName) || a.version - b.version,
  labelCount: (a, b) => a.labelCount - b.labelCount,
  lotCode: (a, b) => (a.lotCode ?? '').localeCompare(b.lotCode ?? ''),
  createdAt: (a, b) => a.createdAt.localeCompare(b.createdAt),
};

/**
 * Print runs in a table: what was printed, for which markets, on which stock, with which lot
 * code, by whom and when, and whether a newer version has been released since ("Out of date",
 * with an icon and a word). Sorts in the browser: the API answers a workshop's recent runs whole.
 */
@Component({
  selector: 'bp-label-run-table',
  imports: [
    CalendarDayPipe,
    DecimalPipe,
    MatAnchor,
    MatButton,
    MatIcon,
    MatSort,
    MatSortHeader,
    MatTableModule,
    RouterLink,
  ],
  template: `
    <table
      mat-table
      class="bp-dense-table"
      [dataSource]="sorted()"
      matSort
      [matSortActive]="sort().active"
      [matSortDirection]="sort().direction"
      (matSortChange)="sort.set($event)"
      [attr.aria-label]="label()"
    >
      <ng-container matColumnDef="formulaName">
        <th mat-header-cell *matHeaderCellDef mat-sort-header>Formula</th>
        <td mat-cell *matCellDef="let r">
          <a [routerLink]="['/formulas', r.formulaId, 'versions', r.version]"
            >{{ r.formulaName }} · v{{ r.version }}</a
          >
          @if (r.outOfDate) {
            <span class="flag out-of-date">
              <mat-icon aria-hidden="true">update</mat-icon>Out of date
            </span>
          }
        </td>
      </ng-container>
      <ng-container matColumnDef="markets">
        <th mat-header-cell *matHeaderCellDef>Markets</th>
        <td mat-cell *matCellDef="let r">{{ r.markets.join(', ') }}</td>
      </ng-container>
      <ng-container matColumnDef="stock">
        <th mat-header-cell *matHeaderCellDef>Stock</th>
        <td mat-cell *matCellDef="let r">{{ r.stock.name }}</td>
      </ng-container>
      <ng-container matColumnDef="labelCount">
        <th mat-header-cell *matHeaderCellDef mat-sort-header arrowPosition="before" class="num">
          Labels
        </th>
        <td mat-cell *matCellDef="let r" class="num">{{ r.labelCount | number }}</td>
      </ng-container>
      <ng-container matColumnDef="lotCode">
        <th mat-header-cell *matHeaderCellDef mat-sort-header>Lot code</th>
        <td mat-cell *matCellDef="let r">
          @if (r.lotCode) {
            {{ r.lotCode }}
          } @else {
            <span class="muted">none</span>
          }
        </td>
      </ng-container>
      <ng-container matColumnDef="createdAt">
        <th mat-header-cell *matHeaderCellDef mat-sort-header>Printed</th>
        <td mat-cell *matCellDef="let r">
          {{ r.createdBy.name }},
          <time [attr.datetime]="r.createdAt">{{ r.createdAt | day: 'time' }}</time>
        </td>
      </ng-container>
      <ng-container matColumnDef="status">
        <th mat-header-cell *matHeaderCellDef>Status</th>
        <td mat-cell *matCellDef="let r">
          @let s = status(r);
          <span class="flag"
            ><mat-icon aria-hidden="true">{{ s.icon }}</mat-icon
            >{{ s.word }}</span
          >
          @if (r.overrideReason) {
            <span class="flag" [title]="r.overrideReason">
              <mat-icon aria-hidden="true">gavel</mat-icon>Printed anyway
            </span>
          }
        </td>
      </ng-container>
      <ng-container matColumnDef="pdf">
        <th mat-header-cell *matHeaderCellDef><span class="bp-visually-hidden">PDF</span></th>
        <td mat-cell *matCellDef="let r">
          @if (r.status === 'ready') {
            <button
              mat-button
              type="button"
              [disabled]="busy()"
              [attr.aria-label]="
                'PDF of ' + r.formulaName + ' printed ' + (r.createdAt | day: 'time')
              "
              (click)="download(r)"
            >
              <mat-icon>picture_as_pdf</mat-icon>PDF
            </button>
          }
          @if (r.publicPage && !r.publicPage.withdrawnAt) {
            <a mat-button [href]="r.publicPage.path" target="_blank" rel="noopener">
              <mat-icon>public</mat-icon>Public page
            </a>
            @if (isOwner()) {
              <button
                mat-button
                type="button"
                [disabled]="busy()"
                [attr.aria-label]="
                  'Withdraw the public page of ' + r.formulaName + ', lot ' + (r.lotCode ?? 'none')
                "
                (click)="withdraw(r)"
              >
                <mat-icon>public_off</mat-icon>Withdraw
              </button>
            }
          } @else if (r.publicPage?.withdrawnAt) {
            <span class="flag"
              ><mat-icon aria-hidden="true">public_off</mat-icon>Page withdrawn</span
            >
          }
        </td>
      </ng-container>

      <tr mat-header-row *matHeaderRowDef="columns"></tr>
      <tr mat-row *matRowDef="let r; columns: columns"></tr>
      <tr class="mat-row" *matNoDataRow>
        <td class="no-data" [attr.colspan]="columns.length">{{ empty() }}</td>
      </tr>
    </table>
  `,
  styles: `
    :host {
      display: block;
    }
    .num {
      text-align: end;
      font-variant-numeric: tabular-nums;
    }
    .flag {
      display: inline-flex;
      gap: 4px;
      align-items: center;
      margin-inline-start: 8px;
      font: var(--mat-sys-label-medium);
    }
    .flag mat-icon {
      width: 18px;
      height: 18px;
      font-size: 18px;
    }
    .out-of-date {
      color: var(--mat-sys-tertiary);
    }
    .muted {
      color: var(--mat-sys-on-surface-variant);
    }
    .no-data {
      padding: 16px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LabelRunTable {
  /** The runs to show. */
  readonly runs = input.required<readonly LabelRunRecord[]>();
  /** The table's accessible name. */
  readonly label = input('Print runs');
  /** What the table says when there is no run. */
  readonly empty = input('No labels printed yet.');

  /** Emits after a run changed here (its public page withdrawn), so the list can be read again. */
  readonly changed = output<void>();

  private readonly api = inject(LabelRunsApi);
  private readonly session = inject(Session);
  protected readonly isOwner = computed(() => this.session.hasRole(ROLE_SETS.ownerOnly));
  private readonly snackBar = inject(MatSnackBar);
  protected readonly status = runStatus;
  protected readonly busy = signal(false);
  protected readonly sort = signal<Sort>({ active: 'createdAt', direction: 'desc' });
  protected readonly columns = COLUMNS;
  protected readonly sorted = computed(() => {
    const { active, direction } = this.sort();
    const by = compare[active as SortKey];
    if (!by || !direction) return [...this.runs()];
    const sign = direction === 'asc' ? 1 : -1;
    return [...this.runs()].sort((a, b) => sign * by(a, b));
  });

  /** Takes the run's public ingredients page down: its QR code then leads to a plain 404. */
  protected withdraw(run: LabelRunRecord): void {
    this.busy.set(true);
    this.api.withdraw(run.id).subscribe({
      next: () => {
        this.busy.set(false);
        this.snackBar.open('The public page is withdrawn; its QR code now leads nowhere.', 'OK', {
          duration: 6000,
        });
        this.changed.emit();
      },
      error: (err: unknown) => {
        this.busy.set(false);
        this.snackBar.open(messageOf(err), 'OK', { duration: 8000 });
      },
    });
  }

  protected download(run: LabelRunRecord): void {
    this.busy.set(true);
    this.api.pdf(run.id).subscribe({
      next: (pdf) => {
        this.busy.set(false);
        saveFile(pdf, `labels-${fileSafe(run.formulaName)}-v${run.version}.pdf`);
      },
      error: (err: unknown) => {
        this.busy.set(false);
        this.snackBar.open(messageOf(err), 'OK', { duration: 8000 });
      },
    });
  }
}

import { DecimalPipe } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  linkedSignal,
  signal,
} from '@angular/core';
import { MatAnchor, MatButton } from '@angular/material/button';
import { MatFormField, MatHint, MatLabel, MatPrefix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { type LabelStockRecord, ROLE_SETS } from '@batchproof/shared';
import { Session } from '../../auth/session';
import { ArchivedToggle } from '../../housekeeping/archived-toggle';
import { messageOf } from '../../http/api-error';
import { ListCard } from '../../lists/list-card';
import { CalibrationDownload } from '../calibration-download';
import { LabelRunTable } from '../label-run-table';
import { runSearchText } from '../label-run-words';
import { LabelRunsApi } from '../label-runs-api';
import { LabelStocksApi } from '../label-stocks-api';

/**
 * Labels: the workshop's recent print runs (filtered by what is typed and by status, kept in the
 * URL), and the label stocks it prints on, built in and its own, each with its calibration page.
 * Printing starts from a released formula version ("Print labels" on the formula's page).
 */
@Component({
  selector: 'bp-labels-page',
  imports: [
    ArchivedToggle,
    CalibrationDownload,
    DecimalPipe,
    LabelRunTable,
    ListCard,
    MatAnchor,
    MatButton,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    MatOption,
    MatPrefix,
    MatSelect,
    MatTableModule,
    RouterLink,
  ],
  templateUrl: './labels-page.html',
  styleUrl: './labels-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class LabelsPage {
  /** The runs' filter text, from the `q` query parameter. */
  readonly q = input<string>();
  /** `outOfDate` to list only runs of versions since replaced, from the `show` parameter. */
  readonly show = input<string>();
  /** `true` to list archived stocks too, from the `includeArchived` parameter. */
  readonly includeArchived = input<string>();

  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly session = inject(Session);
  private readonly stocksApi = inject(LabelStocksApi);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly canWrite = computed(() => this.session.hasRole(ROLE_SETS.writers));

  protected readonly runs = inject(LabelRunsApi).runs();
  protected readonly filterText = linkedSignal(() => this.q() ?? '');
  protected readonly outOfDateOnly = computed(() => this.show() === 'outOfDate');
  protected readonly shownRuns = computed(() => {
    const all = this.runs.hasValue() ? this.runs.value() : [];
    const words = this.filterText().trim().toLowerCase().split(/\s+/).filter(Boolean);
    return all.filter(
      (run) =>
        (!this.outOfDateOnly() || run.outOfDate) &&
        words.every((w) => runSearchText(run).includes(w)),
    );
  });
  protected readonly runsEmpty = computed(() =>
    this.runs.hasValue() && this.runs.value().length > 0
      ? 'No print run matches these filters.'
      : 'No labels printed yet. Open a released formula version and choose Print labels.',
  );

  protected readonly withArchived = computed(() => this.includeArchived() === 'true');
  protected readonly stocks = this.stocksApi.stocks(this.withArchived);
  protected readonly stockColumns = ['name', 'kind', 'size', 'perSheet', 'actions'];
  protected readonly busy = signal(false);

  protected setParam(key: string, value: string | null): void {
    void this.router.navigate([], {
      relativeTo: this.route,
      queryParams: { [key]: value || null },
      queryParamsHandling: 'merge',
      replaceUrl: true,
    });
  }

  protected filter(text: string): void {
    this.filterText.set(text);
    this.setParam('q', text || null);
  }

  protected size(record: LabelStockRecord): string {
    const s = record.stock;
    const mm = (n: number) => String(Math.round(n * 10) / 10);
    const shape = s.shape.kind === 'circle' ? ' circle' : s.shape.kind === 'oval' ? ' oval' : '';
    return `${mm(s.labelWidthMm)} × ${mm(s.labelHeightMm)} mm${shape}`;
  }

  protected perSheet(record: LabelStockRecord): number | null {
    const s = record.stock;
    return s.kind === 'sheet' ? s.across * s.down : null;
  }

  protected setArchived(record: LabelStockRecord, archived: boolean): void {
    this.busy.set(true);
    this.stocksApi.setArchived(record.id, archived).subscribe({
      next: () => {
        this.busy.set(false);
        this.snackBar.open(
          `${record.stock.name} is ${archived ? 'archived' : 'back in the list'}.`,
          'OK',
          { duration: 4000 },
        );
        this.stocks.reload();
      },
      error: (err: unknown) => {
        this.busy.set(false);
        this.snackBar.open(messageOf(err), 'OK', { duration: 8000 });
      },
    });
  }
}

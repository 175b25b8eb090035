import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatCheckbox } from '@angular/material/checkbox';
import { MatDialog } from '@angular/material/dialog';
import { MatFormField, MatLabel, MatPrefix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, RouterLink, type UrlTree } from '@angular/router';
import {
  type ComplianceMarket,
  type MarketReadiness,
  type MarketRecord,
  type MarketRecordKind,
  type ProductReadiness,
  type ProductType,
  type ReadinessItem,
  ROLE_SETS,
} from '@batchproof/shared';
import { Session } from '../../auth/session';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';
import { PRODUCT_TYPE_LABELS } from '../../formulas/product-types';
import { messageOf } from '../../http/api-error';
import {
  MarketRecordDialog,
  type MarketRecordDialogData,
} from '../market-record-dialog/market-record-dialog';
import { ReadinessApi } from '../readiness-api';
import { marketName, RECORD_TITLES, recordKindOfItem, recordKindsOf } from '../readiness-words';

/**
 * Market readiness (`/readiness`): product by product, each market it sells in with what is in
 * place and what is missing, a link to where each missing thing is done, and the notification and
 * listing references the maker records here (writers record; everyone else reads).
 */
@Component({
  selector: 'bp-readiness-page',
  imports: [
    CalendarDayPipe,
    MatButton,
    MatCheckbox,
    MatFormField,
    MatIcon,
    MatInput,
    MatLabel,
    MatPrefix,
    MatProgressBar,
    RouterLink,
  ],
  templateUrl: './readiness-page.html',
  styleUrl: './readiness-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class ReadinessPage {
  private readonly api = inject(ReadinessApi);
  private readonly session = inject(Session);
  private readonly router = inject(Router);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);

  protected readonly canRecord = computed(() => this.session.hasRole(ROLE_SETS.writers));
  protected readonly readiness = this.api.readiness();
  protected readonly loadError = computed(() => {
    const error = this.readiness.error();
    return error ? messageOf(error) : '';
  });

  /** The product-name filter, as typed. */
  protected readonly nameFilter = signal('');
  /** Whether only products with a market still incomplete are shown. */
  protected readonly onlyIncomplete = signal(false);

  /** Every product, by name. */
  private readonly products = computed(() =>
    [...(this.readiness.value()?.items ?? [])].sort((a, b) =>
      a.formulaName.localeCompare(b.formulaName, undefined, { sensitivity: 'base' }),
    ),
  );
  /** The products the filters let through, by name. */
  protected readonly shown = computed(() => {
    const name = this.nameFilter().trim().toLocaleLowerCase();
    const onlyIncomplete = this.onlyIncomplete();
    return this.products().filter(
      (p) =>
        (!name || p.formulaName.toLocaleLowerCase().includes(name)) &&
        (!onlyIncomplete || !isComplete(p)),
    );
  });
  protected readonly total = computed(() => this.products().length);
  protected readonly filtered = computed(() => !!this.nameFilter().trim() || this.onlyIncomplete());

  protected readonly marketName = marketName;
  protected readonly recordKindsOf = recordKindsOf;
  protected readonly recordTitle = (kind: MarketRecordKind) => RECORD_TITLES[kind];
  protected readonly isComplete = isComplete;

  protected productTypeLabel(type: string): string {
    return PRODUCT_TYPE_LABELS[type as ProductType] ?? type;
  }

  /** The product's state in words: ready everywhere, or how many markets still lack something. */
  protected productState(p: ProductReadiness): string {
    if (p.markets.length === 0) return 'No markets chosen';
    const open = p.markets.filter((m) => !m.complete).length;
    if (open === 0) return 'Ready in every market it sells in';
    return `Incomplete in ${open} of ${p.markets.length} market${p.markets.length === 1 ? '' : 's'}`;
  }

  protected missingCount(m: MarketReadiness): number {
    return m.items.filter((i) => !i.done).length;
  }

  /** The app path an item links to, as a tree so its query and fragment survive. */
  protected linkOf(link: string): UrlTree {
    return this.router.parseUrl(link);
  }

  /** The record an item is done with on this page, if any (then its dialog opens instead). */
  protected recordKindOf(item: ReadinessItem, market: ComplianceMarket): MarketRecordKind | null {
    return recordKindOfItem(item, market);
  }

  protected recordOf(p: ProductReadiness, kind: MarketRecordKind): MarketRecord | null {
    return p.records.find((r) => r.kind === kind) ?? null;
  }

  /** Opens a record's dialog; after a save the readiness is read again. */
  protected openRecord(p: ProductReadiness, kind: MarketRecordKind): void {
    const data: MarketRecordDialogData = {
      formulaId: p.formulaId,
      formulaName: p.formulaName,
      kind,
      record: this.recordOf(p, kind),
    };
    this.dialog
      .open<MarketRecordDialog, MarketRecordDialogData, MarketRecord>(MarketRecordDialog, {
        data,
        width: '36rem',
        maxWidth: 'calc(100vw - 32px)',
      })
      .afterClosed()
      .subscribe((saved) => {
        if (!saved) return;
        this.snackBar.open(`${RECORD_TITLES[kind]} saved for ${p.formulaName}.`, 'OK', {
          duration: 5000,
        });
        this.readiness.reload();
      });
  }
}

/** Whether every market of a product is complete (a product with no market is not). */
function isComplete(p: ProductReadiness): boolean {
  return p.markets.length > 0 && p.markets.every((m) => m.complete);
}

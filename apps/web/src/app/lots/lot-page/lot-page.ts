import { DecimalPipe } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  signal,
  viewChild,
} from '@angular/core';
import { MatAnchor, MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, RouterLink } from '@angular/router';
import { type Lot, ROLE_SETS } from '@batchproof/shared';
import { Session } from '../../auth/session';
import { DocumentPanel } from '../../documents/document-panel/document-panel';
import { FormLeaving, type LeavesSafely } from '../../forms/unsaved-changes';
import { messageOf } from '../../http/api-error';
import { LotForm } from '../lot-form/lot-form';
import { StockMovements } from '../stock-movements/stock-movements';
import { EXPIRY_FLAGS, expiryState } from '../lot-expiry';
import { LotsApi } from '../lots-api';
import { confirmFirst } from '../../forms/confirm-dialog';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';

/**
 * One lot (`/lots/:id`) or a new delivery (`/lots/new`, optionally `?materialId=…`): the form for
 * those who record goods-in (owner, formulator, production), the recorded details for everyone
 * else, with its stock on hand. Only owners and formulators delete a lot.
 */
@Component({
  selector: 'bp-lot-page',
  imports: [
    CalendarDayPipe,
    DecimalPipe,
    DocumentPanel,
    LotForm,
    MatAnchor,
    MatButton,
    MatIcon,
    MatProgressBar,
    RouterLink,
    StockMovements,
  ],
  templateUrl: './lot-page.html',
  styleUrl: './lot-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class LotPage implements LeavesSafely {
  /** The lot's id from the path; absent on `/lots/new`. */
  readonly id = input<string>();
  /** The material a new lot starts with, from the query. */
  readonly materialId = input<string>();

  private readonly api = inject(LotsApi);
  private readonly session = inject(Session);
  private readonly router = inject(Router);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly lotForm = viewChild(LotForm);
  private readonly leaving = new FormLeaving(() => {
    const form = this.lotForm();
    return form && { hasUnsavedChanges: () => form.hasUnsavedChanges(), save: () => form.submit() };
  });
  /** Whether the lot is deleted, so nothing typed in its form is left to save. */
  private deleted = false;

  /** Whether the signed-in member may record and correct lots. */
  protected readonly canRecord = computed(() => this.session.hasRole(ROLE_SETS.goodsIn));
  /** Whether the signed-in member may delete lots and attach their documents. */
  protected readonly canWrite = computed(() => this.session.hasRole(ROLE_SETS.writers));
  /** Warnings of the save that opened this page (the lot number was already received). */
  protected readonly createdWarnings: Lot['warnings'] =
    (this.router.currentNavigation()?.extras.state?.['warnings'] as Lot['warnings']) ?? [];
  protected readonly lotResource = this.api.lot(this.id);
  protected readonly lot = computed<Lot | null>(() =>
    this.lotResource.hasValue() ? this.lotResource.value() : null,
  );
  protected readonly loadError = computed(() => {
    const error = this.lotResource.error();
    return error ? messageOf(error) : '';
  });
  protected readonly expiry = computed(() => {
    const lot = this.lot();
    const state = lot ? expiryState(lot.expiresOn, new Date()) : 'none';
    return state === 'soon' || state === 'expired' ? { state, ...EXPIRY_FLAGS[state] } : null;
  });
  /** Whether a delete is on its way to the server. */
  protected readonly deleting = signal(false);
  /** Why the last delete failed, shown plainly above the lot. */
  protected readonly notice = signal('');

  hasUnsavedChanges(): boolean {
    return !this.deleted && this.leaving.hasUnsavedChanges();
  }

  saveChanges(): Promise<boolean> {
    return this.leaving.saveChanges();
  }

  protected onSaved(lot: Lot): void {
    if (this.leaving.leaving) return;
    if (this.id()) {
      this.lotResource.set(lot);
    } else {
      // The lot page is where its documents are attached, so a new lot opens there.
      // The warnings of the save go along, so the lot's own page shows them.
      void this.router.navigate(['/lots', lot.id], {
        replaceUrl: true,
        state: { warnings: lot.warnings ?? [] },
      });
    }
  }

  protected confirmDelete(lot: Lot): void {
    this.notice.set('');
    confirmFirst(this.dialog, {
      title: `Delete lot ${lot.supplierLotNumber}?`,
      message:
        `The record of this delivery of ${lot.materialName} and its stock on hand go away. A lot ` +
        'that a batch has used cannot be deleted, so batch records stay traceable.',
      keep: 'Keep',
      confirm: 'Delete lot',
    }).subscribe((confirmed) => {
      if (confirmed) this.delete(lot);
    });
  }

  private delete(lot: Lot): void {
    this.deleting.set(true);
    this.api.remove(lot.id).subscribe({
      next: () => {
        this.deleting.set(false);
        this.deleted = true;
        this.snackBar.open(`Lot ${lot.supplierLotNumber} is deleted.`, 'OK', { duration: 5000 });
        void this.router.navigateByUrl('/lots');
      },
      error: (err: unknown) => {
        this.deleting.set(false);
        this.notice.set(messageOf(err));
      },
    });
  }
}

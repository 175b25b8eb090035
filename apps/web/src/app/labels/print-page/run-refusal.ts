import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input, output, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import { labelRunCreateSchema } from '@batchproof/shared';
import type { ApiError } from '../../http/api-error';
import { missingByMarket } from './missing-links';

const reasonSchema = labelRunCreateSchema.shape.overrideReason.unwrap();

/**
 * Why a print run was refused, plainly: per market, each missing element with its rule and a
 * link to the field that supplies it (409 `label_incomplete`); or each field that cannot fit at
 * its legal minimum letter height, on which label (422 `label_does_not_fit`). The owner may print
 * anyway over missing elements, with a recorded reason.
 */
@Component({
  selector: 'bp-run-refusal',
  imports: [DecimalPipe, MatButton, MatFormField, MatHint, MatIcon, MatInput, MatLabel, RouterLink],
  templateUrl: './run-refusal.html',
  styleUrl: './run-refusal.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RunRefusal {
  /** The refusal the API answered. */
  readonly error = input.required<ApiError>();
  readonly formulaId = input.required<string>();
  readonly version = input.required<number>();
  /** Whether the signed-in member is the owner, who may print anyway. */
  readonly isOwner = input(false);
  /** Whether a print is on its way (the override button waits). */
  readonly busy = input(false);
  /** The owner's reason for printing anyway. */
  readonly override = output<string>();
  /** A field of the print form to go to (the lot code). */
  readonly goToField = output<string>();

  protected readonly groups = computed(() =>
    missingByMarket(this.error().missing, this.formulaId(), this.version()),
  );
  protected readonly reason = signal('');
  protected readonly reasonError = signal('');

  protected printAnyway(): void {
    const checked = reasonSchema.safeParse(this.reason());
    if (!checked.success) {
      this.reasonError.set(checked.error.issues[0]?.message ?? 'Enter a reason');
      return;
    }
    this.reasonError.set('');
    this.override.emit(checked.data);
  }
}

import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatAnchor } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { ListCard } from '../lists/list-card';
import { LabelRunTable } from './label-run-table';
import { LabelRunsApi } from './label-runs-api';

/**
 * A formula's labels on its page: the way to its product identity and the formula's print runs,
 * marked "Out of date" once a newer version is released ("Print labels" is in the page's title).
 */
@Component({
  selector: 'bp-formula-label-runs',
  imports: [LabelRunTable, ListCard, MatAnchor, MatIcon, RouterLink],
  template: `
    <div class="actions">
      <a mat-stroked-button [routerLink]="['/formulas', formulaId(), 'identity']">
        <mat-icon>badge</mat-icon>Product identity
      </a>
    </div>
    @if (!released()) {
      <p class="hint">Labels print from a released version (Print labels at its top).</p>
    }
    @if (outOfDate() > 0) {
      <p class="hint" role="note">
        <mat-icon aria-hidden="true">update</mat-icon>
        {{ outOfDate() }} {{ outOfDate() === 1 ? 'run was' : 'runs were' }} printed from an older
        version: check the labels still on the shelf.
      </p>
    }
    <bp-list-card [resource]="runs" loadingLabel="Loading print runs">
      <bp-label-run-table
        [runs]="runs.hasValue() ? runs.value() : []"
        label="Print runs of this formula"
        empty="No labels printed from this formula yet."
        (changed)="runs.reload()"
      />
    </bp-list-card>
  `,
  styles: `
    :host {
      display: grid;
      gap: 12px;
    }
    .actions {
      display: flex;
      flex-wrap: wrap;
      gap: 12px;
    }
    .hint {
      display: flex;
      gap: 8px;
      align-items: flex-start;
      margin: 0;
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FormulaLabelRuns {
  readonly formulaId = input.required<string>();
  /** Whether the version on screen is released (labels print only from it). */
  readonly released = input(false);

  protected readonly runs = inject(LabelRunsApi).runs(() => this.formulaId());
  protected readonly outOfDate = computed(() =>
    this.runs.hasValue() ? this.runs.value().filter((r) => r.outOfDate).length : 0,
  );
}

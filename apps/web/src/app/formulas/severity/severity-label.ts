import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import type { FindingSeverity } from '@batchproof/shared';

/** Word, icon and tone of each severity: never colour alone (design direction). */
export const SEVERITY: Record<FindingSeverity, { word: string; icon: string }> = {
  block: { word: 'Blocks', icon: 'block' },
  warn: { word: 'Check', icon: 'report_problem' },
  info: { word: 'Note', icon: 'info' },
};

/** The order severities are listed in: the most serious first. */
export const SEVERITIES: readonly FindingSeverity[] = ['block', 'warn', 'info'];

/**
 * A severity as icon + word + colour, optionally with a count ("Blocks 2"). Reads the same in
 * greyscale and to a screen reader.
 */
@Component({
  selector: 'bp-severity-label',
  imports: [MatIcon],
  template: `
    <mat-icon aria-hidden="true">{{ info().icon }}</mat-icon>
    <span class="word">{{ info().word }}</span>
    @if (count() !== undefined) {
      <span class="count">{{ count() }}</span>
    }
  `,
  styles: `
    :host {
      display: inline-flex;
      align-items: center;
      gap: 4px;
      font-weight: 600;
      white-space: nowrap;
      font-variant-numeric: tabular-nums;
    }
    :host(.block) {
      color: var(--mat-sys-error);
    }
    :host(.warn) {
      color: var(--mat-sys-tertiary);
    }
    :host(.info) {
      color: var(--mat-sys-on-surface-variant);
    }
    :host(.none) {
      color: var(--mat-sys-on-surface-variant);
      font-weight: 400;
    }
    mat-icon {
      font-size: 18px;
      width: 18px;
      height: 18px;
    }
  `,
  host: { '[class]': 'severity()', '[class.none]': 'count() === 0' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SeverityLabel {
  readonly severity = input.required<FindingSeverity>();
  /** A count to show after the word. */
  readonly count = input<number>();

  protected readonly info = computed(() => SEVERITY[this.severity()]);
}

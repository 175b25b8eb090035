import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import type { FieldWarning } from '@batchproof/shared';

/**
 * Warnings the API sent with a save that went through (a second supplier with the same name, a
 * lot number already received): shown beside the field they are about, never blocking.
 */
@Component({
  selector: 'bp-field-warnings',
  imports: [MatIcon],
  template: `
    @for (w of warnings(); track $index) {
      <p class="warning" role="status">
        <mat-icon aria-hidden="true">warning_amber</mat-icon><span>{{ w.message }}</span>
      </p>
    }
  `,
  styles: `
    :host {
      display: block;
    }
    .warning {
      display: flex;
      gap: 8px;
      align-items: flex-start;
      margin: 0 0 12px;
      font: var(--mat-sys-body-medium);
      color: var(--mat-sys-on-surface);
    }
    mat-icon {
      flex: none;
      color: var(--mat-sys-tertiary);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FieldWarnings {
  /** The warnings to show: those of the save about this field. */
  readonly warnings = input<readonly FieldWarning[]>([]);
}

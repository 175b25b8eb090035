import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatIcon } from '@angular/material/icon';

/** What a finding with status `interpretation` rests on, in the maker's words. */
export const INTERPRETATION_NOTE =
  'Batchproof’s reading, not the regulation’s words — the owner can record a reasoned override at release.';

/**
 * The note under a finding that rests on Batchproof's own reading of a rule (status
 * `interpretation`), such as "a product used in the bath touches mucous membranes". Said in words
 * with a label, never by colour or icon alone, so it reads the same to a screen reader.
 */
@Component({
  selector: 'bp-interpretation-note',
  imports: [MatIcon],
  template: `
    <mat-icon aria-hidden="true">lightbulb</mat-icon>
    <span><strong>Interpretation:</strong> {{ note }}</span>
  `,
  styles: `
    :host {
      display: flex;
      gap: 6px;
      align-items: flex-start;
      margin: 4px 0 0;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    mat-icon {
      flex: none;
      font-size: 18px;
      width: 18px;
      height: 18px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InterpretationNote {
  protected readonly note = INTERPRETATION_NOTE;
}

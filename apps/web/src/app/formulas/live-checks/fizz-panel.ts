import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import type { FizzBalance } from '@batchproof/shared';

const LIMITING_WORDS: Record<FizzBalance['limiting'], string> = {
  acid: 'The acid runs out first: some sodium bicarbonate is left unreacted.',
  base: 'The sodium bicarbonate runs out first: some acid is left unreacted.',
  balanced: 'Acid and base balance exactly.',
  none: 'Needs both sodium bicarbonate and an acid to fizz.',
};

/**
 * Acid/base balance of an effervescent product from the shared `fizzBalance`: grams on each side,
 * which runs out first, what is left over and the carbon dioxide released.
 */
@Component({
  selector: 'bp-fizz-panel',
  imports: [DecimalPipe, MatIcon],
  template: `
    @let b = balance();
    <p class="verdict">
      <mat-icon aria-hidden="true">{{
        b.limiting === 'none' ? 'help_outline' : 'bubble_chart'
      }}</mat-icon>
      {{ verdict() }}
    </p>
    <dl>
      <div>
        <dt>Base (sodium bicarbonate)</dt>
        <dd>{{ b.baseGrams | number: '1.0-2' }}<span class="unit"> g</span></dd>
      </div>
      <div>
        <dt>Acids</dt>
        <dd>{{ b.acidGrams | number: '1.0-2' }}<span class="unit"> g</span></dd>
      </div>
      <div>
        <dt>Acid to match the base</dt>
        <dd>{{ b.acidGramsForBase | number: '1.0-2' }}<span class="unit"> g</span></dd>
      </div>
      @if (b.limiting === 'acid' || b.limiting === 'base') {
        <div>
          <dt>Left unreacted</dt>
          <dd>{{ b.excessGrams | number: '1.0-2' }}<span class="unit"> g</span></dd>
        </div>
      }
      <div>
        <dt>Carbon dioxide released</dt>
        <dd>{{ b.co2Grams | number: '1.0-2' }}<span class="unit"> g</span></dd>
      </div>
    </dl>
    @for (note of b.notes; track $index) {
      <p class="note">{{ note }}</p>
    }
    <p class="note">
      Many makers leave some bicarbonate over on purpose (2 : 1 by weight is common); this is the
      chemistry, not a rule.
    </p>
  `,
  styles: `
    .verdict {
      display: flex;
      gap: 6px;
      align-items: flex-start;
      margin: 0 0 8px;
      font-weight: 600;
    }
    dl {
      margin: 0;
      display: grid;
      gap: 2px;
    }
    dl div {
      display: flex;
      justify-content: space-between;
      gap: 12px;
    }
    dd {
      margin: 0;
      text-align: end;
      font-variant-numeric: tabular-nums;
    }
    .unit {
      font-weight: 300;
      color: var(--mat-sys-on-surface-variant);
    }
    .note {
      margin: 6px 0 0;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FizzPanel {
  readonly balance = input.required<FizzBalance>();

  protected readonly verdict = computed(() => LIMITING_WORDS[this.balance().limiting]);
}

import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect } from '@angular/material/select';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { compareQuerySchema, type LineChange } from '@batchproof/shared';
import { messageOf } from '../../http/api-error';
import { FormulasApi } from '../formulas-api';
import { MARKETS } from '../product-types';
import { SeverityLabel } from '../severity/severity-label';

/** How each kind of line change reads: icon and word, never colour alone. */
const CHANGE_WORDS: Record<LineChange['change'], { word: string; icon: string }> = {
  added: { word: 'Added', icon: 'add_circle_outline' },
  removed: { word: 'Removed', icon: 'remove_circle_outline' },
  changed: { word: 'Changed', icon: 'change_circle' },
  unchanged: { word: 'Same', icon: 'radio_button_unchecked' },
};

/**
 * Two versions side by side: which lines were added, removed or changed (grams and percent), and
 * per market how the ingredient declaration and the findings moved. The versions come from the
 * URL (`?from=&to=`), so a comparison can be bookmarked and shared.
 */
@Component({
  selector: 'bp-formula-compare-page',
  imports: [
    DecimalPipe,
    MatButton,
    MatFormField,
    MatIcon,
    MatLabel,
    MatOption,
    MatProgressBar,
    MatSelect,
    RouterLink,
    SeverityLabel,
  ],
  templateUrl: './formula-compare-page.html',
  styleUrl: './formula-compare-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class FormulaComparePage {
  readonly id = input.required<string>();
  readonly from = input<string>();
  readonly to = input<string>();

  private readonly api = inject(FormulasApi);
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  protected readonly changeWords = CHANGE_WORDS;
  protected readonly marketNames = new Map(MARKETS.map((m) => [m.code, m.name]));

  protected readonly query = computed(() => {
    const parsed = compareQuerySchema.safeParse({ from: this.from(), to: this.to() });
    return parsed.success ? parsed.data : undefined;
  });
  protected readonly formula = this.api.formula(() => this.id());
  protected readonly comparison = this.api.compare(() => {
    const q = this.query();
    return q ? { id: this.id(), ...q } : undefined;
  });
  protected readonly versions = computed(() =>
    this.formula.hasValue()
      ? [...this.formula.value().versions].sort((a, b) => a.number - b.number)
      : [],
  );
  protected readonly loadError = computed(() => {
    const error = this.comparison.error() ?? this.formula.error();
    return error ? messageOf(error) : '';
  });
  /** Lines that moved first; unchanged lines after them. */
  protected readonly lines = computed(() => {
    const c = this.comparison.hasValue() ? this.comparison.value() : undefined;
    const order = { added: 0, removed: 1, changed: 2, unchanged: 3 };
    return [...(c?.lines ?? [])].sort((a, b) => order[a.change] - order[b.change]);
  });

  protected choose(which: 'from' | 'to', n: number): void {
    void this.router.navigate([], {
      relativeTo: this.route,
      queryParams: { [which]: n },
      queryParamsHandling: 'merge',
      replaceUrl: true,
    });
  }
}

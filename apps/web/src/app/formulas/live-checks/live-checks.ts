import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MARKETS } from '../product-types';
import { SEVERITIES, SeverityLabel } from '../severity/severity-label';
import { AllergenTable } from './allergen-table';
import { CompositionChart } from './composition-chart';
import { FindingList } from './finding-list';
import { FizzPanel } from './fizz-panel';
import type { LiveEvaluation } from './live-evaluation';

const MARKET_NAMES = new Map(MARKETS.map((m) => [m.code, m.name]));

/**
 * The consequences of what is typed, beside the editor: findings per market with their sources,
 * the declaration per market, the allergen table, fizz balance and the composition. Computed in
 * the browser by the same engine the server runs on save.
 */
@Component({
  selector: 'bp-live-checks',
  imports: [
    AllergenTable,
    CompositionChart,
    FindingList,
    FizzPanel,
    MatIcon,
    MatProgressBar,
    SeverityLabel,
  ],
  template: `
    @let live = evaluation();
    <p class="caution" role="note">
      <mat-icon aria-hidden="true">health_and_safety</mat-icon>
      <span>
        These checks support your qualified safety assessor and the rules where you sell; they do
        not replace them. A finding names the rule it rests on, so you can read it yourself.
      </span>
    </p>
    @if (live.pending) {
      <mat-progress-bar mode="indeterminate" aria-label="Loading the lines' materials" />
    }
    @if (live.problems.length > 0) {
      <div class="problems" role="status">
        <strong>{{ live.result ? 'Left out of the check:' : 'Not checked yet:' }}</strong>
        <ul>
          @for (p of live.problems; track $index) {
            <li>{{ p }}</li>
          }
        </ul>
      </div>
    }
    @if (live.result; as result) {
      <section aria-labelledby="live-findings">
        <h3 id="live-findings">
          Findings
          <span class="counts" aria-live="polite">
            @for (s of severities; track s) {
              <bp-severity-label [severity]="s" [count]="counts()[s]" />
            }
          </span>
        </h3>
        <bp-finding-list [findings]="result.findings" [markets]="result.markets" />
        @if (substitutesChecked().length > 0) {
          <ul class="substitutes" aria-label="Approved substitutes checked">
            @for (s of substitutesChecked(); track s.key) {
              <li>
                <mat-icon aria-hidden="true">swap_horiz</mat-icon>
                <span>{{ s.text }}</span>
              </li>
            }
          </ul>
        }
      </section>
      <section aria-labelledby="live-declarations">
        <h3 id="live-declarations">Ingredient declaration</h3>
        <dl class="declarations">
          @for (m of result.markets; track m) {
            <div [attr.data-market]="m">
              <dt>{{ m }} · {{ marketNames.get(m) }}</dt>
              <dd>{{ result.declarations[m]?.text }}</dd>
            </div>
          }
        </dl>
      </section>
      <section aria-labelledby="live-allergens">
        <h3 id="live-allergens">Fragrance allergens</h3>
        <bp-allergen-table [byMarket]="allergens()" />
      </section>
    }
    @if (live.fizz; as fizz) {
      <section aria-labelledby="live-fizz">
        <h3 id="live-fizz">Fizz balance</h3>
        <bp-fizz-panel [balance]="fizz" />
      </section>
    }
    <section aria-labelledby="live-composition">
      <h3 id="live-composition">Composition</h3>
      <bp-composition-chart [lines]="live.composition" />
    </section>
  `,
  styles: `
    :host {
      display: grid;
      grid-template-columns: minmax(0, 1fr);
      gap: 16px;
      align-content: start;
    }
    h3 {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 8px 16px;
      margin: 0 0 8px;
      font: var(--mat-sys-title-medium);
    }
    .counts {
      display: inline-flex;
      gap: 12px;
      font: var(--mat-sys-body-medium);
    }
    .caution {
      display: flex;
      gap: 8px;
      margin: 0;
      padding: 12px;
      border-radius: var(--mat-sys-corner-small);
      background: var(--mat-sys-secondary-container);
      color: var(--mat-sys-on-secondary-container);
      font: var(--mat-sys-body-medium);
    }
    .caution mat-icon {
      flex: none;
    }
    .problems {
      padding: 8px 12px;
      border-radius: var(--mat-sys-corner-small);
      background: var(--mat-sys-surface-container);
      font: var(--mat-sys-body-medium);
    }
    .problems ul {
      margin: 4px 0 0;
      padding-left: 20px;
    }
    .substitutes {
      list-style: none;
      margin: 8px 0 0;
      padding: 0;
      display: grid;
      gap: 4px;
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-body-medium);
    }
    .substitutes li {
      display: flex;
      gap: 6px;
      align-items: flex-start;
    }
    .substitutes mat-icon {
      flex: none;
      font-size: 18px;
      width: 18px;
      height: 18px;
    }
    .declarations {
      margin: 0;
      display: grid;
      gap: 8px;
    }
    dt {
      font-weight: 600;
      font: var(--mat-sys-label-large);
      color: var(--mat-sys-on-surface-variant);
    }
    dd {
      margin: 0;
      overflow-wrap: anywhere;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LiveChecks {
  readonly evaluation = input.required<LiveEvaluation>();

  protected readonly severities = SEVERITIES;
  protected readonly marketNames = MARKET_NAMES;
  protected readonly counts = computed(() => {
    const findings = this.evaluation().result?.findings ?? [];
    return {
      block: findings.filter((f) => f.severity === 'block').length,
      warn: findings.filter((f) => f.severity === 'warn').length,
      info: findings.filter((f) => f.severity === 'info').length,
    };
  });
  /** The allergens of each market checked, for the allergen table. */
  protected readonly allergens = computed(() => {
    const result = this.evaluation().result;
    return (result?.markets ?? []).map((market) => ({
      market,
      allergens: result?.allergens[market] ?? [],
    }));
  });
  /** Each approved substitute checked, and what it adds to the formula's own findings. */
  protected readonly substitutesChecked = computed(() => {
    const result = this.evaluation().result;
    return (result?.substitutes ?? []).map((s) => {
      const own = result!.findings.filter(
        (f) =>
          f.substitute?.lineNumber === s.lineNumber && f.substitute.materialId === s.materialId,
      );
      const blocks = own.filter((f) => f.severity === 'block').length;
      const adds =
        own.length === 0
          ? 'adds no finding'
          : `adds ${own.length} finding${own.length === 1 ? '' : 's'}` +
            (blocks > 0 ? `, ${blocks} blocking` : '');
      return {
        key: `${s.lineNumber}|${s.materialId}`,
        text: `${s.materialName} in place of ${s.replacesName} (line ${s.lineNumber}) checked: ${adds}.`,
      };
    });
  });
}

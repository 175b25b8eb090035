import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { CompositionLine } from './live-evaluation';

/**
 * The composition as horizontal bars, largest first: plain CSS, each bar labelled with its
 * material and percent so it reads without colour and to a screen reader (it is a list).
 */
@Component({
  selector: 'bp-composition-chart',
  imports: [DecimalPipe],
  template: `
    @if (bars().length === 0) {
      <p class="none">Add lines with amounts to see the composition.</p>
    } @else {
      <ol aria-label="Composition by weight">
        @for (bar of bars(); track $index) {
          <li>
            <span class="label">{{ bar.name }}</span>
            <span class="value"
              >{{ bar.percent | number: '1.1-2' }}<span class="unit"> %</span></span
            >
            <span class="track" aria-hidden="true">
              <span class="bar" [style.width.%]="bar.width"></span>
            </span>
          </li>
        }
      </ol>
    }
  `,
  styles: `
    ol {
      list-style: none;
      margin: 0;
      padding: 0;
      display: grid;
      gap: 6px;
    }
    li {
      display: grid;
      grid-template-columns: minmax(0, 1fr) auto;
      gap: 2px 8px;
      font: var(--mat-sys-body-medium);
    }
    .label {
      overflow-wrap: anywhere;
    }
    .value {
      text-align: end;
      font-variant-numeric: tabular-nums;
    }
    .unit {
      font-weight: 300;
      color: var(--mat-sys-on-surface-variant);
    }
    .track {
      grid-column: 1 / -1;
      height: 8px;
      border-radius: 4px;
      background: var(--mat-sys-surface-container-high);
      overflow: hidden;
    }
    .bar {
      display: block;
      height: 100%;
      background: var(--mat-sys-primary);
    }
    .none {
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CompositionChart {
  readonly lines = input.required<readonly CompositionLine[]>();

  /** Bars scaled so the largest fills the track; tiny amounts still show a sliver. */
  protected readonly bars = computed(() => {
    const lines = [...this.lines()]
      .filter((l) => l.grams > 0)
      .sort((a, b) => b.percent - a.percent);
    const max = lines[0]?.percent ?? 0;
    return lines.map((l) => ({
      ...l,
      width: max > 0 ? Math.max(0.5, (l.percent / max) * 100) : 0,
    }));
  });
}

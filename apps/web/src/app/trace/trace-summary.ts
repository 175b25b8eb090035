import { ChangeDetectionStrategy, Component, input } from '@angular/core';

/** One figure of a trace's summary. */
export interface TraceFact {
  label: string;
  value: string;
}

/** A trace's summary: its figures side by side, wrapping on a narrow screen. */
@Component({
  selector: 'bp-trace-summary',
  template: `
    <dl class="facts">
      @for (fact of facts(); track fact.label) {
        <div>
          <dt>{{ fact.label }}</dt>
          <dd>{{ fact.value }}</dd>
        </div>
      }
    </dl>
  `,
  styles: `
    .facts {
      display: grid;
      grid-template-columns: repeat(auto-fill, minmax(140px, 1fr));
      gap: 12px;
      margin: 0 0 24px;
    }
    .facts div {
      padding: 12px 16px;
      border-radius: var(--mat-sys-corner-medium);
      background: var(--mat-sys-surface-container);
    }
    dt {
      font: var(--mat-sys-label-medium);
      color: var(--mat-sys-on-surface-variant);
    }
    dd {
      margin: 4px 0 0;
      font: var(--mat-sys-title-large);
      font-variant-numeric: tabular-nums;
      overflow-wrap: anywhere;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TraceSummary {
  readonly facts = input.required<readonly TraceFact[]>();
}

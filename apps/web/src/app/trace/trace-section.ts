import { ChangeDetectionStrategy, Component, input } from '@angular/core';

let nextId = 0;

/** One part of a trace page: a heading, an optional line saying what it holds, then its content. */
@Component({
  selector: 'bp-trace-section',
  template: `
    <section [attr.aria-labelledby]="headingId">
      <h2 [id]="headingId">{{ heading() }}</h2>
      @if (lead()) {
        <p class="lead">{{ lead() }}</p>
      }
      <ng-content />
    </section>
  `,
  styles: `
    section {
      margin-bottom: 32px;
    }
    h2 {
      margin: 0 0 4px;
      font: var(--mat-sys-title-large);
    }
    .lead {
      margin: 0 0 12px;
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TraceSection {
  readonly heading = input.required<string>();
  readonly lead = input('');
  protected readonly headingId = `bp-trace-section-${++nextId}`;
}

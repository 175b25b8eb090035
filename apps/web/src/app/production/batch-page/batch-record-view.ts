import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import type { Batch } from '@batchproof/shared';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';
import { BATCH_FIELDS, fieldLabel, releasedValue, valueText } from './amendable-fields';

/**
 * A batch's record as read-only facts: conditions, mould, timing, checks and notes as recorded,
 * each with its corrections (amendments) beside the original value, and every amendment listed
 * below with its reason, who made it and when.
 */
@Component({
  selector: 'bp-batch-record-view',
  imports: [CalendarDayPipe, MatIcon],
  template: `
    @let b = batch();
    <section class="card" aria-labelledby="record-heading">
      <h2 id="record-heading">Record</h2>
      <dl class="record">
        @for (row of rows(); track row.field) {
          <div>
            <dt>{{ row.label }}</dt>
            <dd>
              <span [class.superseded]="row.corrections.length > 0">{{ row.value }}</span>
              @for (c of row.corrections; track c.id) {
                <span class="correction">
                  <mat-icon aria-hidden="true">edit</mat-icon>
                  <span
                    >Corrected to <strong>{{ c.value }}</strong> on
                    <time [attr.datetime]="c.amendedAt">{{ c.amendedAt | day }}</time> by
                    {{ c.amendedBy }}: {{ c.reason }}</span
                  >
                </span>
              }
            </dd>
          </div>
        }
      </dl>
      @if (unitWeight(); as check) {
        @for (m of check.messages; track $index) {
          <p class="bad"><mat-icon aria-hidden="true">warning</mat-icon>{{ m }}</p>
        }
      }
    </section>

    @if (b.state === 'released') {
      <section class="card" aria-labelledby="amendments-heading">
        <h2 id="amendments-heading">Amendments</h2>
        @if (b.amendments.length === 0) {
          <p class="muted">
            None. A released batch never changes; a correction is recorded here with its reason.
          </p>
        } @else {
          <ol class="amendments">
            @for (a of amendments(); track a.id) {
              <li>
                <strong>{{ a.label }}</strong>: {{ a.previous }} → {{ a.value }}
                <span class="muted">
                  · <time [attr.datetime]="a.amendedAt">{{ a.amendedAt | day }}</time> ·
                  {{ a.amendedBy }}</span
                >
                <span class="reason">{{ a.reason }}</span>
              </li>
            }
          </ol>
        }
      </section>
    }
  `,
  styles: `
    :host {
      display: block;
    }
    .card {
      margin-bottom: 16px;
      padding: 16px 20px;
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: var(--mat-sys-corner-medium);
    }
    h2 {
      margin: 0 0 12px;
      font: var(--mat-sys-title-medium);
    }
    .record {
      display: grid;
      grid-template-columns: repeat(auto-fill, minmax(16rem, 1fr));
      gap: 12px 24px;
      margin: 0;
    }
    dt {
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-label-medium);
    }
    dd {
      margin: 0;
      overflow-wrap: anywhere;
    }
    .superseded {
      text-decoration: line-through;
      color: var(--mat-sys-on-surface-variant);
    }
    .correction {
      display: flex;
      gap: 4px;
      margin-top: 4px;
      color: var(--mat-sys-tertiary);
      font: var(--mat-sys-body-small);
    }
    .correction mat-icon,
    .bad mat-icon {
      flex: none;
      width: 16px;
      height: 16px;
      font-size: 16px;
    }
    .bad {
      display: flex;
      gap: 4px;
      margin: 8px 0 0;
      color: var(--mat-sys-error);
    }
    .muted {
      color: var(--mat-sys-on-surface-variant);
    }
    .amendments {
      margin: 0;
      padding-inline-start: 20px;
    }
    .amendments li + li {
      margin-top: 8px;
    }
    .reason {
      display: block;
      font: var(--mat-sys-body-small);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BatchRecordView {
  readonly batch = input.required<Batch>();
  /** The unit weights against the declared net quantity, when weighed. */
  readonly unitWeight = input<{ messages: string[] } | null>(null);

  /** Each batch-wide field as released, with its corrections. */
  protected readonly rows = computed(() => {
    const b = this.batch();
    return BATCH_FIELDS.map(({ field, label }) => ({
      field,
      label,
      value: valueText(b, field, releasedValue(b, field)),
      corrections: b.amendments
        .filter((a) => a.field === field)
        .map((a) => ({ ...a, value: valueText(b, field, a.value) })),
    }));
  });

  protected readonly amendments = computed(() => {
    const b = this.batch();
    return b.amendments.map((a) => ({
      ...a,
      label: fieldLabel(b, a.field),
      previous: valueText(b, a.field, a.previousValue),
      value: valueText(b, a.field, a.value),
    }));
  });
}

import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import type { DocumentStatus } from '@batchproof/shared';
import { browserLocale } from '../../dates/calendar-day-adapter';
import { formatDay } from '../../dates/calendar-day-pipe';
import { DOCUMENT_KIND_LABELS } from '../document-kinds';

type State = DocumentStatus['entries'][number]['state'];

/** Icon and word per state, so the state reads without colour. */
const STATES: Record<State, { icon: string; word: string }> = {
  current: { icon: 'check_circle', word: 'On file' },
  'out-of-date': { icon: 'history', word: 'Out of date' },
  'future-dated': { icon: 'event_busy', word: 'Dated in the future' },
  missing: { icon: 'report', word: 'Missing' },
};

/** A material's expected documents: on file, missing, out of date or dated ahead. */
@Component({
  selector: 'bp-document-status-list',
  imports: [MatIcon],
  template: `
    @let s = status();
    <section class="status" aria-labelledby="document-status-heading">
      <h3 id="document-status-heading">
        Expected documents
        @if (s.complete) {
          <span class="summary ok">all on file and current</span>
        } @else {
          <span class="summary">some need attention</span>
        }
      </h3>
      <ul aria-label="Expected documents">
        @for (e of s.entries; track e.kind) {
          <li [class]="e.state">
            <mat-icon aria-hidden="true">{{ states[e.state].icon }}</mat-icon>
            <span class="text">
              <span class="kind"
                >{{ labels[e.kind] }}: <strong>{{ states[e.state].word }}</strong></span
              >
              <span class="message">{{ message(e) }}</span>
            </span>
          </li>
        }
      </ul>
    </section>
  `,
  styles: `
    h3 {
      margin: 0 0 8px;
      font: var(--mat-sys-title-small);
    }
    .summary {
      margin-left: 4px;
      font: var(--mat-sys-body-medium);
      color: var(--mat-sys-tertiary);
    }
    .summary.ok {
      color: var(--mat-sys-primary);
    }
    ul {
      margin: 0;
      padding: 0;
      list-style: none;
      display: grid;
      gap: 8px;
    }
    li {
      display: flex;
      gap: 8px;
      align-items: flex-start;
    }
    .current mat-icon {
      color: var(--mat-sys-primary);
    }
    .out-of-date mat-icon,
    .future-dated mat-icon {
      color: var(--mat-sys-tertiary);
    }
    .missing mat-icon {
      color: var(--mat-sys-error);
    }
    .text {
      display: flex;
      flex-direction: column;
    }
    .message {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DocumentStatusList {
  /** The status the API worked out for the material. */
  readonly status = input.required<DocumentStatus>();

  protected readonly labels = DOCUMENT_KIND_LABELS;
  protected readonly states = STATES;
  private readonly locale = browserLocale();

  /** The API's sentence with its issue date written the way every date on screen is. */
  protected message(entry: DocumentStatus['entries'][number]): string {
    const day = entry.latest?.issuedOn;
    return day ? entry.message.replace(day, formatDay(day, this.locale)) : entry.message;
  }
}

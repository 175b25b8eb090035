import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  type Resource,
} from '@angular/core';
import { MatAnchor, MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { ROLE_SETS } from '@batchproof/shared';
import { Session } from '../auth/session';
import { messageOf } from '../http/api-error';

/** A link in a trace page's title row. */
export interface TraceRecordLink {
  label: string;
  icon: string;
  link: string;
}

/**
 * The frame both trace pages share: the breadcrumb back to Trace, the title with its subtitle
 * (projected `[subtitle]`), a link to the traced record, "Open a recall" for the owner (to
 * `/recalls/new` with `recallParams`), the progress bar and the load error with Try again. The
 * trace itself is the projected content.
 */
@Component({
  selector: 'bp-trace-page-frame',
  imports: [MatAnchor, MatButton, MatIcon, MatProgressBar, RouterLink],
  template: `
    <nav class="crumbs" aria-label="Breadcrumb">
      <a routerLink="/trace">Trace</a>
    </nav>
    <header class="title-row">
      <div>
        <h1>{{ heading() }}</h1>
        <p class="subtitle"><ng-content select="[subtitle]" /></p>
      </div>
      <div class="actions">
        @if (recordLink(); as record) {
          <a mat-stroked-button [routerLink]="record.link">
            <mat-icon>{{ record.icon }}</mat-icon>
            {{ record.label }}
          </a>
        }
        @if (canRecall() && recallParams(); as params) {
          <a mat-flat-button routerLink="/recalls/new" [queryParams]="params">
            <mat-icon>campaign</mat-icon>
            Open a recall
          </a>
        }
      </div>
    </header>

    <div class="progress">
      @if (resource().isLoading()) {
        <mat-progress-bar mode="indeterminate" [attr.aria-label]="loadingLabel()" />
      }
    </div>
    @if (loadError()) {
      <p class="bp-form-error" role="alert">
        <mat-icon aria-hidden="true">error_outline</mat-icon>{{ loadError() }}
        <button mat-button type="button" (click)="resource().reload()">Try again</button>
      </p>
    }
    <ng-content />
  `,
  styles: `
    :host {
      display: block;
    }
    .crumbs {
      margin-bottom: 4px;
      font: var(--mat-sys-body-medium);
    }
    .title-row {
      display: flex;
      flex-wrap: wrap;
      align-items: flex-start;
      justify-content: space-between;
      gap: 12px 24px;
    }
    .title-row h1 {
      margin: 0;
      font: var(--mat-sys-headline-medium);
      overflow-wrap: anywhere;
    }
    .subtitle {
      margin: 2px 0 0;
      color: var(--mat-sys-on-surface-variant);
    }
    .actions {
      display: flex;
      flex-wrap: wrap;
      gap: 8px;
    }
    .progress {
      height: 4px;
      margin: 12px 0;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TracePageFrame {
  readonly heading = input.required<string>();
  /** The trace being read: its loading state, its error and `reload`. */
  readonly resource = input.required<Resource<unknown> & { reload(): boolean }>();
  readonly loadingLabel = input.required<string>();
  /** The traced record's own page; none until the trace has loaded. */
  readonly recordLink = input<TraceRecordLink | null>(null);
  /** The query of `/recalls/new` that opens a recall of what is traced; none until loaded. */
  readonly recallParams = input<Record<string, string> | null>(null);

  private readonly session = inject(Session);
  /** Only the owner opens recalls. */
  protected readonly canRecall = computed(() => this.session.hasRole(ROLE_SETS.ownerOnly));
  protected readonly loadError = computed(() => {
    const error = this.resource().error();
    return error ? messageOf(error) : '';
  });
}

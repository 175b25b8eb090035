import { ChangeDetectionStrategy, Component, computed, input, type Resource } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { messageOf } from '../http/api-error';

let nextId = 0;

/**
 * The frame of a table paged on the server: a progress bar while a page loads, the load error
 * with a way to try again, a scroller around the projected table and, below it, the projected
 * `mat-paginator`.
 */
@Component({
  selector: 'bp-list-card',
  imports: [MatButton, MatIcon, MatProgressBar],
  template: `
    <section
      class="table-card"
      [attr.aria-labelledby]="heading() ? headingId : null"
      [attr.aria-busy]="resource().isLoading()"
    >
      @if (heading()) {
        <h2 [id]="headingId" class="bp-visually-hidden">{{ heading() }}</h2>
      }
      <div class="progress">
        @if (resource().isLoading() || busy()) {
          <mat-progress-bar mode="indeterminate" [attr.aria-label]="loadingLabel()" />
        }
      </div>
      @if (loadError()) {
        <p class="bp-form-error" role="alert">
          <mat-icon aria-hidden="true">error_outline</mat-icon>{{ loadError() }}
          <button mat-button type="button" (click)="resource().reload()">Try again</button>
        </p>
      }
      <div class="scroller"><ng-content /></div>
      <ng-content select="mat-paginator" />
    </section>
  `,
  styles: `
    :host {
      display: block;
    }
    .table-card {
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: var(--mat-sys-corner-medium);
      overflow: hidden;
    }
    .progress {
      height: 4px;
    }
    .scroller {
      overflow-x: auto;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ListCard {
  /** The page being shown: its loading state and error, and `reload` to try again. */
  readonly resource = input.required<Resource<unknown> & { reload(): boolean }>();
  /** What the progress bar says while a page loads, e.g. "Loading lots". */
  readonly loadingLabel = input.required<string>();
  /** A heading for screen readers that names the card as a region; none by default. */
  readonly heading = input('');
  /** Whether to show the progress bar for other work too (an export, say). */
  readonly busy = input(false);

  protected readonly headingId = `bp-list-card-heading-${nextId++}`;
  protected readonly loadError = computed(() => {
    const error = this.resource().error();
    return error ? messageOf(error) : '';
  });
}

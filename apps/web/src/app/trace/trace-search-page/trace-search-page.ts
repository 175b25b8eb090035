import {
  ChangeDetectionStrategy,
  Component,
  computed,
  DestroyRef,
  inject,
  input,
} from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatFormField, MatLabel, MatPrefix, MatHint } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';
import { messageOf } from '../../http/api-error';
import { TraceApi } from '../trace-api';

/** Milliseconds the search waits after the last key before it asks. */
const SEARCH_PAUSE_MS = 250;

/**
 * `/trace`: pick what to trace. A supplier lot traces forward to the batches that used it and the
 * customers who received them; a finished lot traces back to every supplier lot it used. The
 * search is kept in the address (`?q=`), so Back returns to the same results.
 */
@Component({
  selector: 'bp-trace-search-page',
  imports: [
    CalendarDayPipe,
    MatButton,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    MatPrefix,
    MatProgressBar,
    RouterLink,
  ],
  templateUrl: './trace-search-page.html',
  styleUrl: './trace-search-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class TraceSearchPage {
  /** The search, from the address. */
  readonly q = input<string>();

  private readonly api = inject(TraceApi);
  private readonly router = inject(Router);
  private timer: ReturnType<typeof setTimeout> | undefined;

  protected readonly query = computed(() => (this.q() ?? '').trim());
  protected readonly results = this.api.search(this.query);
  protected readonly found = computed(() =>
    this.results.hasValue() ? this.results.value() : null,
  );
  protected readonly loadError = computed(() => {
    const error = this.results.error();
    return error ? messageOf(error) : '';
  });

  constructor() {
    inject(DestroyRef).onDestroy(() => clearTimeout(this.timer));
  }

  /** Puts the search in the address once typing pauses. */
  protected typed(value: string): void {
    clearTimeout(this.timer);
    this.timer = setTimeout(() => {
      void this.router.navigate([], {
        queryParams: { q: value.trim() || null },
        replaceUrl: true,
      });
    }, SEARCH_PAUSE_MS);
  }
}

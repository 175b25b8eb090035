import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { messageOf } from '../../http/api-error';
import { ReferenceListsApi } from '../reference-lists-api';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';

/** The reference lists Batchproof's checks rest on, each with where its rows come from. */
@Component({
  selector: 'bp-reference-list-index',
  imports: [CalendarDayPipe, MatIcon, MatProgressBar, RouterLink],
  templateUrl: './reference-list-index.html',
  styleUrl: './reference-list-index.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class ReferenceListIndex {
  protected readonly lists = inject(ReferenceListsApi).lists();
  protected readonly loadError = computed(() => {
    const error = this.lists.error();
    return error ? messageOf(error) : '';
  });
}

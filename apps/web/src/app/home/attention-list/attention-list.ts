import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  LOCALE_ID,
} from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import type { Attention } from '@batchproof/shared';
import { browserLocale } from '../../dates/calendar-day-adapter';
import { allClearSentence, attentionGroups } from './attention-rows';

/**
 * What needs attention, one group per kind: a heading that counts them, then a row per record
 * with an icon, a plain sentence and a link, so nothing rests on colour. Says plainly when
 * nothing does.
 */
@Component({
  selector: 'bp-attention-list',
  imports: [MatIcon, RouterLink],
  template: `
    @for (group of groups(); track group.kind) {
      <section class="group" [attr.aria-labelledby]="'attention-' + group.kind">
        <h3 [id]="'attention-' + group.kind">
          <mat-icon aria-hidden="true">{{ group.icon }}</mat-icon>{{ group.heading }}
        </h3>
        <ul>
          @for (row of group.rows; track row.key) {
            <li [attr.data-kind]="group.kind">
              <mat-icon aria-hidden="true">{{ row.icon }}</mat-icon>
              <a [routerLink]="row.link">{{ row.text }}</a>
            </li>
          }
        </ul>
        @if (group.more > 0) {
          <p class="more">
            {{ group.more }} more not listed here.
            <a [routerLink]="group.all.link" [queryParams]="group.all.queryParams">{{
              group.all.label
            }}</a>
          </p>
        }
      </section>
    } @empty {
      <p class="all-clear" data-testid="attention-empty">
        <mat-icon aria-hidden="true">check_circle</mat-icon>{{ allClear() }}
      </p>
    }
  `,
  styles: `
    :host {
      display: grid;
      gap: 16px;
    }
    h3 {
      display: flex;
      gap: 8px;
      align-items: center;
      margin: 0 0 8px;
      font: var(--mat-sys-title-medium);
    }
    ul {
      display: grid;
      gap: 8px;
      margin: 0;
      padding: 0;
      list-style: none;
    }
    li,
    .all-clear {
      display: flex;
      gap: 12px;
      align-items: flex-start;
      margin: 0;
      overflow-wrap: anywhere;
    }
    li {
      padding: 12px 16px;
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: var(--mat-sys-corner-medium);
    }
    mat-icon {
      flex: none;
    }
    .more {
      margin: 8px 0 0;
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AttentionList {
  /** The API's answer for the signed-in member. */
  readonly attention = input.required<Attention>();

  private readonly locale = inject(LOCALE_ID);
  /** Dates follow the browser's language, as everywhere (dates/calendar-day-adapter). */
  private readonly dateLocale = browserLocale();
  protected readonly groups = computed(() =>
    attentionGroups(this.attention(), this.locale, this.dateLocale),
  );
  protected readonly allClear = computed(() => allClearSentence(this.attention()));
}

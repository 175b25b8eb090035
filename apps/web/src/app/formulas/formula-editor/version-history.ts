import { ChangeDetectionStrategy, Component, computed, input, linkedSignal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatAnchor } from '@angular/material/button';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatOption, MatSelect } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import type { Formula, FormulaVersion } from '@batchproof/shared';
import { SEVERITIES, SeverityLabel } from '../severity/severity-label';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';

/**
 * A formula's versions, newest first, with their state and the server's finding counts; and a
 * chooser to compare any two of them. The version on screen is listed from the page's latest
 * answer about it, so a save shows its new counts here at once.
 */
@Component({
  selector: 'bp-version-history',
  imports: [
    CalendarDayPipe,
    FormsModule,
    MatAnchor,
    MatFormField,
    MatIcon,
    MatLabel,
    MatOption,
    MatSelect,
    RouterLink,
    SeverityLabel,
  ],
  template: `
    <ol class="versions" aria-label="Versions">
      @for (v of versions(); track v.number) {
        <li [class.current]="v.number === current()">
          <a
            [routerLink]="['/formulas', formula().id, 'versions', v.number]"
            [attr.aria-current]="v.number === current() ? 'page' : null"
            >Version {{ v.number }}</a
          >
          <span class="state" [class]="v.state">
            <mat-icon aria-hidden="true">{{ icons[v.state] }}</mat-icon>
            {{ v.state }}
          </span>
          <span class="when">
            @if (v.releasedAt) {
              released
              <time [attr.datetime]="v.releasedAt">{{ v.releasedAt | day }}</time>
            } @else {
              changed
              <time [attr.datetime]="v.updatedAt">{{ v.updatedAt | day: 'time' }}</time>
            }
          </span>
          @if (v.counts; as counts) {
            <span class="counts">
              @for (s of severities; track s) {
                <bp-severity-label [severity]="s" [count]="counts[s]" />
              }
            </span>
          }
        </li>
      }
    </ol>
    @if (versions().length > 1) {
      <div class="compare">
        <mat-form-field subscriptSizing="dynamic">
          <mat-label>Compare from</mat-label>
          <mat-select [(ngModel)]="from">
            @for (v of versions(); track v.number) {
              <mat-option [value]="v.number">Version {{ v.number }}</mat-option>
            }
          </mat-select>
        </mat-form-field>
        <mat-form-field subscriptSizing="dynamic">
          <mat-label>Compare to</mat-label>
          <mat-select [(ngModel)]="to">
            @for (v of versions(); track v.number) {
              <mat-option [value]="v.number">Version {{ v.number }}</mat-option>
            }
          </mat-select>
        </mat-form-field>
        <a
          mat-stroked-button
          [routerLink]="['/formulas', formula().id, 'compare']"
          [queryParams]="{ from: from(), to: to() }"
        >
          <mat-icon>compare_arrows</mat-icon>
          Compare
        </a>
      </div>
    }
  `,
  styles: `
    .versions {
      list-style: none;
      margin: 0;
      padding: 0;
      display: grid;
      gap: 4px;
    }
    li {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 4px 12px;
      padding: 6px 8px;
      border-radius: var(--mat-sys-corner-small);
    }
    li.current {
      background: var(--mat-sys-secondary-container);
      color: var(--mat-sys-on-secondary-container);
    }
    .state {
      display: inline-flex;
      align-items: center;
      gap: 2px;
      text-transform: capitalize;
    }
    .state mat-icon {
      font-size: 18px;
      width: 18px;
      height: 18px;
    }
    .state.released {
      color: var(--mat-sys-primary);
    }
    .when {
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-body-small);
    }
    .counts {
      display: inline-flex;
      gap: 10px;
      font: var(--mat-sys-body-small);
    }
    .compare {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 8px 12px;
      margin-top: 12px;
    }
    .compare mat-form-field {
      width: 10rem;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class VersionHistory {
  readonly formula = input.required<Formula>();
  /** The version on screen. */
  readonly current = input.required<number>();
  /** The server's latest answer about a version (a read, a save, a release), newer than the history. */
  readonly latest = input<FormulaVersion>();

  protected readonly severities = SEVERITIES;
  protected readonly icons = { draft: 'edit_note', released: 'verified', superseded: 'history' };
  protected readonly versions = computed(() => {
    const latest = this.latest();
    return this.formula()
      .versions.map((v) =>
        v.number === latest?.number
          ? {
              number: v.number,
              state: latest.state,
              counts: latest.counts,
              releasedAt: latest.releasedAt,
              updatedAt: latest.updatedAt,
            }
          : v,
      )
      .sort((a, b) => b.number - a.number);
  });
  /** Compare the version before the one on screen with it, unless the maker picks others. */
  protected readonly from = linkedSignal(() => {
    const older = this.versions().find((v) => v.number < this.current());
    return older?.number ?? this.versions().at(-1)?.number ?? 1;
  });
  protected readonly to = linkedSignal(() => this.current());
}

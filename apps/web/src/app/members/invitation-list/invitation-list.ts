import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import type { Invitation } from '@batchproof/shared';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';

/** Invitations sent but not yet accepted, each with a way to take it back. */
@Component({
  selector: 'bp-invitation-list',
  imports: [CalendarDayPipe, MatButton, MatIcon],
  template: `
    <h2 id="pending-heading">Pending invitations</h2>
    @if (invitations().length === 0) {
      <p class="empty">
        No invitations are waiting. People you invite show up here until they join.
      </p>
    } @else {
      <ul aria-labelledby="pending-heading">
        @for (invitation of invitations(); track invitation.id) {
          <li>
            <div class="who">
              <span class="email">{{ invitation.email }}</span>
              <span class="meta">
                <span class="role">{{ invitation.role }}</span> · link expires
                <time [attr.datetime]="invitation.expiresAt">{{ invitation.expiresAt | day }}</time>
              </span>
            </div>
            <button
              mat-button
              type="button"
              [disabled]="busy()"
              [attr.aria-label]="'Revoke the invitation for ' + invitation.email"
              (click)="revoke.emit(invitation)"
            >
              <mat-icon>block</mat-icon>
              Revoke
            </button>
          </li>
        }
      </ul>
    }
  `,
  styleUrl: './invitation-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InvitationList {
  readonly invitations = input.required<readonly Invitation[]>();
  /** Whether a change is under way; the revoke buttons wait for it. */
  readonly busy = input(false);
  /** Emits the invitation the owner wants to take back. */
  readonly revoke = output<Invitation>();
}

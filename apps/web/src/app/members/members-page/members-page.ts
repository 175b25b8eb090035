import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  linkedSignal,
  signal,
} from '@angular/core';
import { MatAnchor, MatButton, MatIconButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import {
  MatOption,
  MatSelect,
  type MatSelectChange,
  MatSelectTrigger,
} from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatSort, MatSortHeader, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import {
  type Invitation,
  type Member,
  memberListQuerySchema,
  ROLE_SETS,
  ROLES,
  type Role,
} from '@batchproof/shared';
import { Session } from '../../auth/session';
import { messageOf } from '../../http/api-error';
import { InvitationList } from '../invitation-list/invitation-list';
import { InviteForm } from '../invite-form/invite-form';
import { MembersApi } from '../members-api';
import { confirmFirst } from '../../forms/confirm-dialog';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';
import { ProductionSettingsCard } from '../production-settings/production-settings';
import { WorkshopLabelDetails } from '../workshop-label-details/workshop-label-details';

/**
 * The workshop's members and their roles, sorted on the server. Owners also change roles,
 * remove members, invite people and revoke invitations; everyone else reads.
 */
@Component({
  selector: 'bp-members-page',
  imports: [
    CalendarDayPipe,
    MatAnchor,
    MatButton,
    MatIcon,
    MatIconButton,
    MatOption,
    MatProgressBar,
    MatSelect,
    MatSelectTrigger,
    MatSort,
    MatSortHeader,
    MatTableModule,
    InvitationList,
    InviteForm,
    ProductionSettingsCard,
    RouterLink,
    WorkshopLabelDetails,
  ],
  templateUrl: './members-page.html',
  styleUrl: './members-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class MembersPage {
  /** Sort column from the `sort` query parameter. */
  readonly sort = input<string>();
  /** Sort direction from the `dir` query parameter. */
  readonly dir = input<string>();

  private readonly api = inject(MembersApi);
  private readonly session = inject(Session);
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);

  /** Whether the signed-in member may change the workshop's membership. */
  protected readonly isOwner = computed(() => this.session.hasRole(ROLE_SETS.ownerOnly));
  protected readonly me = this.session.user;
  protected readonly roles = ROLES;
  protected readonly query = computed(() => {
    const parsed = memberListQuerySchema.safeParse({ sort: this.sort(), dir: this.dir() });
    return parsed.success ? parsed.data : memberListQuerySchema.parse({});
  });
  protected readonly members = this.api.members(this.query);
  protected readonly invitations = this.api.invitations(this.isOwner);
  /** The last rows loaded, kept while a new sort loads so the table does not flicker. */
  protected readonly rows = linkedSignal<Member[] | undefined, Member[]>({
    source: () => (this.members.hasValue() ? this.members.value() : undefined),
    computation: (rows, previous) => rows ?? previous?.value ?? [],
  });
  protected readonly columns = computed(() =>
    this.isOwner()
      ? ['name', 'email', 'role', 'joinedAt', 'actions']
      : ['name', 'email', 'role', 'joinedAt'],
  );
  /** Whether a change the owner asked for is on its way to the server. */
  protected readonly saving = signal(false);
  protected readonly loadError = computed(() => {
    const error = this.members.error();
    return error ? messageOf(error) : '';
  });

  protected sortBy(sort: Sort): void {
    void this.router.navigate([], {
      relativeTo: this.route,
      queryParams: { sort: sort.active, dir: sort.direction || 'asc' },
      queryParamsHandling: 'merge',
      replaceUrl: true,
    });
  }

  protected changeRole(member: Member, change: MatSelectChange<Role>): void {
    this.saving.set(true);
    this.api.changeRole(member.id, change.value).subscribe({
      next: (updated) => {
        this.saving.set(false);
        this.snackBar.open(`${updated.name} is now ${updated.role}.`, 'OK', { duration: 4000 });
        // A member who changed their own role needs a token that carries the new one.
        if (updated.id === this.me()?.id) this.session.refresh().subscribe();
        this.members.reload();
      },
      error: (err: unknown) => {
        this.saving.set(false);
        change.source.value = member.role;
        this.snackBar.open(messageOf(err), 'OK', { duration: 8000 });
      },
    });
  }

  protected confirmRemoval(member: Member): void {
    const workshopName = this.me()?.workshop.name ?? 'the workshop';
    confirmFirst(this.dialog, {
      title: `Remove ${member.name}?`,
      message:
        `${member.name} will no longer be able to work in ${workshopName}; any other ` +
        'workshops they belong to keep them. The records they made stay as they are.',
      keep: 'Keep',
      confirm: 'Remove',
    }).subscribe((confirmed) => {
      if (confirmed) this.remove(member);
    });
  }

  protected revoke(invitation: Invitation): void {
    this.saving.set(true);
    this.api.revokeInvitation(invitation.id).subscribe({
      next: () => {
        this.saving.set(false);
        this.snackBar.open(`The invitation for ${invitation.email} is revoked.`, 'OK', {
          duration: 4000,
        });
        this.invitations.reload();
      },
      error: (err: unknown) => {
        this.saving.set(false);
        this.snackBar.open(messageOf(err), 'OK', { duration: 8000 });
      },
    });
  }

  protected onInvited(): void {
    this.invitations.reload();
  }

  private remove(member: Member): void {
    this.saving.set(true);
    this.api.remove(member.id).subscribe({
      next: () => {
        this.saving.set(false);
        this.snackBar.open(`${member.name} is removed from the workshop.`, 'OK', {
          duration: 4000,
        });
        this.members.reload();
      },
      error: (err: unknown) => {
        this.saving.set(false);
        this.snackBar.open(messageOf(err), 'OK', { duration: 8000 });
      },
    });
  }
}

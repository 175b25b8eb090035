import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, RouterLink } from '@angular/router';
import { acceptInvitationSchema, ROLE_DESCRIPTIONS } from '@batchproof/shared';
import { errorMessage, showRequestError, validateForm } from '../../forms/form-errors';
import { ApiError, messageOf } from '../../http/api-error';
import { AuthApi } from '../auth-api';
import { AuthCard } from '../auth-card/auth-card';
import { Session } from '../session';

/** Where an invitation link lands: shows who invited whom, then takes a name and password. */
@Component({
  selector: 'bp-accept-invite-page',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButton,
    MatError,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    AuthCard,
  ],
  templateUrl: './accept-invite-page.html',
  styleUrl: './accept-invite-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class AcceptInvitePage {
  /** The invitation token from the link (route parameter). */
  readonly token = input.required<string>();

  private readonly session = inject(Session);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly invitation = inject(AuthApi).invitation(this.token);
  protected readonly form = inject(NonNullableFormBuilder).group({ name: '', password: '' });
  protected readonly submitting = signal(false);
  protected readonly notice = signal('');
  protected readonly errorMessage = errorMessage;
  protected readonly roleDescriptions = ROLE_DESCRIPTIONS;

  /** Why the invitation cannot be shown, in words for the invitee. */
  protected readonly loadError = computed(() => {
    const error = this.invitation.error();
    if (!error) return '';
    return error instanceof ApiError && error.status === 404
      ? 'This invitation has expired or has already been used. Ask the workshop owner to send a new one.'
      : messageOf(error);
  });

  protected submit(): void {
    if (this.submitting()) return;
    this.notice.set('');
    const value = validateForm(this.form, acceptInvitationSchema.omit({ token: true }));
    if (!value) return;
    this.submitting.set(true);
    this.session.acceptInvitation({ ...value, token: this.token() }).subscribe({
      next: (user) => {
        this.snackBar.open(`Welcome to ${user.workshop.name}.`, 'OK', { duration: 5000 });
        void this.router.navigateByUrl('/');
      },
      error: (err: unknown) => {
        this.submitting.set(false);
        this.notice.set(showRequestError(this.form, err));
      },
    });
  }
}

import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, RouterLink } from '@angular/router';
import type { Observable } from 'rxjs';
import {
  acceptInvitationExistingSchema,
  acceptInvitationSchema,
  type ErrorCode,
  ROLE_DESCRIPTIONS,
  type User,
} from '@batchproof/shared';
import { errorMessage, showRequestError, validateForm } from '../../forms/form-errors';
import { ApiError, messageOf } from '../../http/api-error';
import { AuthApi } from '../auth-api';
import { AuthCard } from '../auth-card/auth-card';
import { Session } from '../session';

/** What the page says for each reason an invitation link cannot be used, keyed by the API's code. */
const LINK_REFUSALS: Partial<Record<ErrorCode, { heading: string; advice: string }>> = {
  invitation_used: {
    heading: 'This invitation has already been used.',
    advice:
      'If you joined with it, sign in with the invited e-mail and the password you chose. ' +
      'If you did not, ask the workshop owner to invite you again.',
  },
  invitation_expired: {
    heading: 'This invitation has expired.',
    advice: 'Ask the workshop owner to send a new invitation.',
  },
  invitation_unknown: {
    heading: 'This invitation link is not valid.',
    advice:
      'It may be incomplete, withdrawn, or replaced by a newer one. Open the link in the latest ' +
      'invitation e-mail, or ask the workshop owner to invite you again.',
  },
};

/** The refusal words for an error, when it is one of the invitation link's refusals. */
const refusalOf = (error: unknown) =>
  error instanceof ApiError ? LINK_REFUSALS[error.code as ErrorCode] : undefined;

/**
 * Where an invitation link lands: shows who invited whom, then takes a name and a new password,
 * or, when the address already has an account, only that account's password (the invitation
 * then adds a membership to it).
 */
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

  /** Why the link cannot be used, from opening it or from a refused acceptance. */
  protected readonly refusal = computed(
    () => this.submitRefusal() ?? refusalOf(this.invitation.error()),
  );
  /** Why the invitation cannot be shown when it is not the link's fault (network, too many tries). */
  protected readonly loadError = computed(() => {
    const error = this.invitation.error();
    return error ? messageOf(error) : '';
  });
  private readonly submitRefusal = signal<{ heading: string; advice: string } | undefined>(
    undefined,
  );

  /** Whether the invited address already has an account (then only its password is asked). */
  protected readonly existingAccount = computed(
    () => this.invitation.hasValue() && this.invitation.value().existingAccount,
  );

  protected submit(): void {
    if (this.submitting()) return;
    this.notice.set('');
    const accepting = this.existingAccount() ? this.joinWithAccount() : this.joinAsNew();
    if (!accepting) return;
    this.submitting.set(true);
    accepting.subscribe({
      next: (user) => {
        this.snackBar.open(`Welcome to ${user.workshop.name}.`, 'OK', { duration: 5000 });
        void this.router.navigateByUrl('/');
      },
      error: (err: unknown) => {
        this.submitting.set(false);
        const refusal = refusalOf(err);
        if (refusal) this.submitRefusal.set(refusal);
        else this.notice.set(showRequestError(this.form, err));
      },
    });
  }

  /** A new account: a name and a new password. */
  private joinAsNew(): Observable<User> | undefined {
    const value = validateForm(this.form, acceptInvitationSchema.omit({ token: true }));
    return value && this.session.acceptInvitation({ ...value, token: this.token() });
  }

  /** The account the address already has: its password; the name is already known. */
  private joinWithAccount(): Observable<User> | undefined {
    const value = validateForm(this.form, acceptInvitationExistingSchema.omit({ token: true }));
    return value && this.session.acceptInvitationExisting({ ...value, token: this.token() });
  }
}

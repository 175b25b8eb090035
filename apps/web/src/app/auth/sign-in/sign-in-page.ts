import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { Router, RouterLink } from '@angular/router';
import { signInSchema } from '@batchproof/shared';
import { errorMessage, showRequestError, validateForm } from '../../forms/form-errors';
import { AuthCard } from '../auth-card/auth-card';
import { Session } from '../session';

/** Sign-in with e-mail and password; returns to the page that asked for it. */
@Component({
  selector: 'bp-sign-in-page',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButton,
    MatError,
    MatFormField,
    MatIcon,
    MatInput,
    MatLabel,
    AuthCard,
  ],
  templateUrl: './sign-in-page.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class SignInPage {
  /** Where to go after signing in (the `next` query parameter). */
  readonly next = input<string>();

  private readonly session = inject(Session);
  private readonly router = inject(Router);
  protected readonly form = inject(NonNullableFormBuilder).group({ email: '', password: '' });
  protected readonly submitting = signal(false);
  protected readonly notice = signal('');
  protected readonly errorMessage = errorMessage;

  protected submit(): void {
    if (this.submitting()) return;
    this.notice.set('');
    const value = validateForm(this.form, signInSchema);
    if (!value) return;
    this.submitting.set(true);
    this.session.signIn(value).subscribe({
      next: () => void this.router.navigateByUrl(returnUrl(this.next())),
      error: (err: unknown) => {
        this.submitting.set(false);
        this.notice.set(showRequestError(this.form, err));
      },
    });
  }
}

/** Only paths inside the app are followed, so a crafted link cannot send people elsewhere. */
function returnUrl(next: string | undefined): string {
  return next && next.startsWith('/') && !next.startsWith('//') ? next : '/';
}

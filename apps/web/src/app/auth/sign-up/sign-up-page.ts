import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import { signUpSchema } from '@batchproof/shared';
import { errorMessage, showRequestError, validateForm } from '../../forms/form-errors';
import { AuthCard } from '../auth-card/auth-card';
import { Session } from '../session';

/** Asks for a new workshop; the link e-mailed to the owner creates it (confirm-sign-up-page). */
@Component({
  selector: 'bp-sign-up-page',
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
  templateUrl: './sign-up-page.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class SignUpPage {
  private readonly session = inject(Session);
  protected readonly form = inject(NonNullableFormBuilder).group({
    workshopName: '',
    name: '',
    email: '',
    password: '',
  });
  protected readonly submitting = signal(false);
  protected readonly notice = signal('');
  /** The API's answer once the request is in: where the confirmation link went. */
  protected readonly sent = signal('');
  protected readonly errorMessage = errorMessage;

  protected submit(): void {
    if (this.submitting()) return;
    this.notice.set('');
    const value = validateForm(this.form, signUpSchema);
    if (!value) return;
    this.submitting.set(true);
    this.session.signUp(value).subscribe({
      next: (answer) => {
        this.submitting.set(false);
        this.sent.set(answer.message);
      },
      error: (err: unknown) => {
        this.submitting.set(false);
        this.notice.set(showRequestError(this.form, err));
      },
    });
  }
}

import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, RouterLink } from '@angular/router';
import { signUpSchema } from '@batchproof/shared';
import { errorMessage, showRequestError, validateForm } from '../../forms/form-errors';
import { AuthCard } from '../auth-card/auth-card';
import { Session } from '../session';

/** Sets up a new workshop and its first owner. */
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
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly form = inject(NonNullableFormBuilder).group({
    workshopName: '',
    name: '',
    email: '',
    password: '',
  });
  protected readonly submitting = signal(false);
  protected readonly notice = signal('');
  protected readonly errorMessage = errorMessage;

  protected submit(): void {
    if (this.submitting()) return;
    this.notice.set('');
    const value = validateForm(this.form, signUpSchema);
    if (!value) return;
    this.submitting.set(true);
    this.session.signUp(value).subscribe({
      next: (user) => {
        this.snackBar.open(`${user.workshop.name} is set up. Welcome to Batchproof.`, 'OK', {
          duration: 5000,
        });
        void this.router.navigateByUrl('/');
      },
      error: (err: unknown) => {
        this.submitting.set(false);
        this.notice.set(showRequestError(this.form, err));
      },
    });
  }
}

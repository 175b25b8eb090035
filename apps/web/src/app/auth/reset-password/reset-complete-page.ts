import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, RouterLink } from '@angular/router';
import { passwordResetCompleteSchema } from '@batchproof/shared';
import { errorMessage, showRequestError, validateForm } from '../../forms/form-errors';
import { AuthApi } from '../auth-api';
import { AuthCard } from '../auth-card/auth-card';

/** Where a reset link lands: choose a new password, then sign in with it. */
@Component({
  selector: 'bp-reset-complete-page',
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
  template: `
    <bp-auth-card heading="Choose a new password" [busy]="submitting()">
      <form class="bp-form" [formGroup]="form" (ngSubmit)="submit()" novalidate>
        @if (notice()) {
          <p class="bp-form-error" role="alert">
            <mat-icon aria-hidden="true">error_outline</mat-icon>{{ notice() }}
          </p>
        }
        <mat-form-field>
          <mat-label>New password</mat-label>
          <input matInput type="password" formControlName="password" autocomplete="new-password" />
          <mat-hint>At least 10 characters.</mat-hint>
          <mat-error>{{ errorMessage(form.controls.password) }}</mat-error>
        </mat-form-field>
        <div class="bp-form-actions">
          <button mat-flat-button type="submit" [disabled]="submitting()">
            Save the new password
          </button>
        </div>
      </form>
      <p class="bp-form-links">
        <a routerLink="/reset-password">Ask for a new link</a>
        <a routerLink="/sign-in">Back to sign-in</a>
      </p>
    </bp-auth-card>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class ResetCompletePage {
  /** The reset token from the link (route parameter). */
  readonly token = input.required<string>();

  private readonly api = inject(AuthApi);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly form = inject(NonNullableFormBuilder).group({ password: '' });
  protected readonly submitting = signal(false);
  protected readonly notice = signal('');
  protected readonly errorMessage = errorMessage;

  protected submit(): void {
    if (this.submitting()) return;
    this.notice.set('');
    const value = validateForm(this.form, passwordResetCompleteSchema.omit({ token: true }));
    if (!value) return;
    this.submitting.set(true);
    this.api.completePasswordReset({ ...value, token: this.token() }).subscribe({
      next: () => {
        this.snackBar.open('Your password is changed. Sign in with the new one.', 'OK', {
          duration: 6000,
        });
        void this.router.navigateByUrl('/sign-in');
      },
      error: (err: unknown) => {
        this.submitting.set(false);
        this.notice.set(showRequestError(this.form, err));
      },
    });
  }
}

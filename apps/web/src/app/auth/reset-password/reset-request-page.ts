import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import { passwordResetRequestSchema } from '@batchproof/shared';
import { errorMessage, showRequestError, validateForm } from '../../forms/form-errors';
import { AuthApi } from '../auth-api';
import { AuthCard } from '../auth-card/auth-card';

/** Asks for a password-reset link by e-mail. */
@Component({
  selector: 'bp-reset-request-page',
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
  template: `
    <bp-auth-card heading="Reset your password" [busy]="submitting()">
      @if (sentTo(); as email) {
        <p role="status">
          If an account uses <strong>{{ email }}</strong>, a link to choose a new password is on its
          way. It works for a short time only, so open it soon.
        </p>
      } @else {
        <form class="bp-form" [formGroup]="form" (ngSubmit)="submit()" novalidate>
          <p>
            Enter the e-mail you sign in with and we will send you a link to choose a new password.
          </p>
          @if (notice()) {
            <p class="bp-form-error" role="alert">
              <mat-icon aria-hidden="true">error_outline</mat-icon>{{ notice() }}
            </p>
          }
          <mat-form-field>
            <mat-label>E-mail</mat-label>
            <input matInput type="email" formControlName="email" autocomplete="email" />
            <mat-error>{{ errorMessage(form.controls.email) }}</mat-error>
          </mat-form-field>
          <div class="bp-form-actions">
            <button mat-flat-button type="submit" [disabled]="submitting()">Send the link</button>
          </div>
        </form>
      }
      <p class="bp-form-links"><a routerLink="/sign-in">Back to sign-in</a></p>
    </bp-auth-card>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class ResetRequestPage {
  private readonly api = inject(AuthApi);
  protected readonly form = inject(NonNullableFormBuilder).group({ email: '' });
  protected readonly submitting = signal(false);
  protected readonly notice = signal('');
  protected readonly sentTo = signal('');
  protected readonly errorMessage = errorMessage;

  protected submit(): void {
    if (this.submitting()) return;
    this.notice.set('');
    const value = validateForm(this.form, passwordResetRequestSchema);
    if (!value) return;
    this.submitting.set(true);
    this.api.requestPasswordReset(value).subscribe({
      next: () => {
        this.submitting.set(false);
        this.sentTo.set(value.email);
      },
      error: (err: unknown) => {
        this.submitting.set(false);
        this.notice.set(showRequestError(this.form, err));
      },
    });
  }
}

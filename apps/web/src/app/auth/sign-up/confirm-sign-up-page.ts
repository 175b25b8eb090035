import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, RouterLink } from '@angular/router';
import { messageOf } from '../../http/api-error';
import { AuthCard } from '../auth-card/auth-card';
import { Session } from '../session';

/**
 * Where a sign-up confirmation link lands. The workshop is created on the click, not on the page
 * load, so a mail scanner that fetches the link creates nothing.
 */
@Component({
  selector: 'bp-confirm-sign-up-page',
  imports: [RouterLink, MatButton, MatIcon, AuthCard],
  template: `
    <bp-auth-card heading="Confirm your e-mail" [busy]="submitting()">
      @if (notice()) {
        <p class="bp-form-error" role="alert">
          <mat-icon aria-hidden="true">error_outline</mat-icon>{{ notice() }}
        </p>
      }
      <p>Your address is confirmed by this link. Open your workshop to start.</p>
      <div class="bp-form-actions">
        <button mat-flat-button type="button" [disabled]="submitting()" (click)="confirm()">
          Open my workshop
        </button>
      </div>
      <p class="bp-form-links">
        <a routerLink="/sign-up">Start again</a>
        <a routerLink="/sign-in">Sign in</a>
      </p>
    </bp-auth-card>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class ConfirmSignUpPage {
  /** The confirmation token from the link (route parameter). */
  readonly token = input.required<string>();

  private readonly session = inject(Session);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly submitting = signal(false);
  protected readonly notice = signal('');

  protected confirm(): void {
    if (this.submitting()) return;
    this.notice.set('');
    this.submitting.set(true);
    this.session.confirmSignUp(this.token()).subscribe({
      next: (user) => {
        this.snackBar.open(`${user.workshop.name} is set up. Welcome to Batchproof.`, 'OK', {
          duration: 5000,
        });
        void this.router.navigateByUrl('/');
      },
      error: (err: unknown) => {
        this.submitting.set(false);
        this.notice.set(messageOf(err));
      },
    });
  }
}

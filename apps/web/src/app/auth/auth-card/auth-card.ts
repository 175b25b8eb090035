import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatProgressBar } from '@angular/material/progress-bar';

/** The frame of the signed-out pages: the name, a heading, a progress line and the form. */
@Component({
  selector: 'bp-auth-card',
  imports: [MatProgressBar],
  template: `
    <main class="page">
      <p class="brand" aria-hidden="true"><span class="mark">B</span> Batchproof</p>
      <section class="card" [attr.aria-busy]="busy()" aria-labelledby="auth-card-heading">
        <div class="progress">
          @if (busy()) {
            <mat-progress-bar mode="indeterminate" aria-label="Working on it" />
          }
        </div>
        <h1 id="auth-card-heading">{{ heading() }}</h1>
        <ng-content />
      </section>
    </main>
  `,
  styleUrl: './auth-card.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AuthCard {
  /** The page's one heading. */
  readonly heading = input.required<string>();
  /** Whether a request is under way; shows the progress line. */
  readonly busy = input(false);
}

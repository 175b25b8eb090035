import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatAnchor } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { ROLE_DESCRIPTIONS, roleSchema } from '@batchproof/shared';
import { Session } from '../session';

/**
 * Where the role guard sends a member whose role may not open a page (`/not-open?page=…&roles=…`):
 * it names the page, the roles that may open it and what the member's own role can do, instead
 * of dropping them on Home without a word.
 */
@Component({
  selector: 'bp-not-open-page',
  imports: [MatAnchor, MatIcon, RouterLink],
  template: `
    <section class="not-open" aria-labelledby="not-open-heading">
      <mat-icon aria-hidden="true" class="lock">lock</mat-icon>
      <div>
        <h1 id="not-open-heading">{{ pageName() }} is not open to your role</h1>
        @if (allowed().length > 0) {
          <p data-testid="allowed-roles">
            It opens for members whose role is {{ allowedInWords() }}.
          </p>
        }
        @if (role(); as mine) {
          <p>
            You are signed in as <strong class="role">{{ mine }}</strong>. What this role can do:
            {{ ownDescription() }}
          </p>
        }
        <p>If your work needs this page, ask an owner of the workshop to change your role.</p>
        <a mat-flat-button routerLink="/">
          <mat-icon>home</mat-icon>
          Go to Home
        </a>
      </div>
    </section>
  `,
  styles: `
    .not-open {
      display: flex;
      gap: 16px;
      align-items: flex-start;
      max-width: 640px;
    }
    .lock {
      flex: none;
      margin-top: 6px;
    }
    h1 {
      margin: 0 0 12px;
      font: var(--mat-sys-headline-small);
      overflow-wrap: anywhere;
    }
    p {
      margin: 0 0 12px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class NotOpenPage {
  /** The title of the page that was refused, from the query. */
  readonly page = input<string>();
  /** The roles that may open it, space-separated, from the query. */
  readonly roles = input<string>();

  protected readonly role = inject(Session).role;
  protected readonly pageName = computed(() => this.page()?.trim() || 'That page');
  /** Only real role names; anything else in the address is ignored. */
  protected readonly allowed = computed(() =>
    (this.roles() ?? '').split(/[\s,]+/).filter((r) => roleSchema.safeParse(r).success),
  );
  protected readonly allowedInWords = computed(() => {
    const roles = this.allowed();
    return roles.length === 1
      ? roles[0]
      : `${roles.slice(0, -1).join(', ')} or ${roles[roles.length - 1]}`;
  });
  protected readonly ownDescription = computed(() => {
    const role = this.role();
    return role ? ROLE_DESCRIPTIONS[role] : '';
  });
}

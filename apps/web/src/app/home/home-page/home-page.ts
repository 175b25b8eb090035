import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { ROLE_DESCRIPTIONS, ROLE_SETS } from '@batchproof/shared';
import { Session } from '../../auth/session';

/** A first step on the home page; steps without a link are not built yet. */
interface NextStep {
  icon: string;
  title: string;
  detail: string;
  link?: string;
}

/** The home view: which workshop, which role, and what to do next. */
@Component({
  selector: 'bp-home-page',
  imports: [MatIcon, RouterLink],
  templateUrl: './home-page.html',
  styleUrl: './home-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class HomePage {
  private readonly session = inject(Session);
  protected readonly user = this.session.user;
  protected readonly roleDescription = computed(() => {
    const role = this.session.role();
    return role ? ROLE_DESCRIPTIONS[role] : '';
  });

  protected readonly steps = computed<NextStep[]>(() => {
    const steps: NextStep[] = [];
    if (this.session.hasRole(ROLE_SETS.ownerOnly)) {
      steps.push({
        icon: 'group_add',
        title: 'Invite the people you work with',
        detail:
          'Give each person the role that fits what they do, from formulating to bookkeeping.',
        link: '/workshop',
      });
    }
    steps.push(
      {
        icon: 'inventory_2',
        title: 'Add your materials and their supplier papers',
        detail: 'Coming soon: INCI names, lots and certificates kept together.',
      },
      {
        icon: 'science',
        title: 'Write your first formula',
        detail: 'Coming soon: formulas by weight, checked for each market you sell in.',
      },
    );
    return steps;
  });
}

import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { ROLE_DESCRIPTIONS, ROLE_SETS } from '@batchproof/shared';
import { Session } from '../../auth/session';

/** A first step on the home page. */
interface NextStep {
  icon: string;
  title: string;
  detail: string;
  link: string;
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
    if (this.session.hasRole(ROLE_SETS.writers)) {
      steps.push(
        {
          icon: 'inventory_2',
          title: 'Add your materials and their supplier papers',
          detail:
            'INCI names, blends, certificate maximums and allergen declarations, kept together.',
          link: '/materials',
        },
        {
          icon: 'move_to_inbox',
          title: 'Record what arrives',
          detail: 'Each supplier lot with its dates, quantity and certificate of analysis.',
          link: '/lots',
        },
        {
          icon: 'science',
          title: 'Write your first formula',
          detail: 'By weight or percent, checked live for each market you sell in.',
          link: '/formulas',
        },
      );
    } else if (this.session.hasRole(ROLE_SETS.members)) {
      steps.push({
        icon: 'science',
        title: 'Look through the formulas',
        detail: 'Released versions with their declarations and the findings of each check.',
        link: '/formulas',
      });
    }
    steps.push({
      icon: 'menu_book',
      title: 'See what the checks rest on',
      detail: 'The colourant, allergen and warning lists, each row with its published source.',
      link: '/reference',
    });
    return steps;
  });
}

import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { ROLE_DESCRIPTIONS, ROLE_SETS, type Attention } from '@batchproof/shared';
import { Session } from '../../auth/session';
import { messageOf } from '../../http/api-error';
import { AttentionApi } from '../attention-api';
import { AttentionList } from '../attention-list/attention-list';

/** A getting-started step on the home page. */
interface NextStep {
  icon: string;
  title: string;
  detail: string;
  link: string;
}

/**
 * The home view: which workshop and role, what needs attention (worked out by the API), and the
 * getting-started steps that are not done yet.
 */
@Component({
  selector: 'bp-home-page',
  imports: [AttentionList, MatButton, MatIcon, MatProgressBar, RouterLink],
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

  protected readonly attentionResource = inject(AttentionApi).attention();
  protected readonly attention = computed<Attention | null>(() =>
    this.attentionResource.hasValue() ? this.attentionResource.value() : null,
  );
  protected readonly loadError = computed(() => {
    const error = this.attentionResource.error();
    return error ? messageOf(error) : '';
  });

  /** The steps still to do; none until the API has said how far the workshop has got. */
  protected readonly steps = computed<NextStep[]>(() => {
    const attention = this.attention();
    if (!attention) return [];
    const progress = attention.progress;
    const steps: NextStep[] = [];
    const invited = (attention.counts['invitation-pending'] ?? 0) > 0;
    if (this.session.hasRole(ROLE_SETS.ownerOnly) && progress?.members === 1 && !invited) {
      steps.push({
        icon: 'group_add',
        title: 'Invite the people you work with',
        detail:
          'Give each person the role that fits what they do, from formulating to bookkeeping.',
        link: '/workshop',
      });
    }
    const writer = this.session.hasRole(ROLE_SETS.writers);
    if (writer && progress?.materials === 0) {
      steps.push({
        icon: 'inventory_2',
        title: 'Add your materials and their supplier papers',
        detail:
          'INCI names, blends, certificate maximums and allergen declarations, kept together.',
        link: '/materials',
      });
    }
    if (this.session.hasRole(ROLE_SETS.goodsIn) && progress?.lots === 0) {
      steps.push({
        icon: 'move_to_inbox',
        title: 'Record what arrives',
        detail: 'Each supplier lot with its dates and quantity.',
        link: '/lots',
      });
    }
    if (writer && progress?.formulas === 0) {
      steps.push({
        icon: 'science',
        title: 'Write your first formula',
        detail: 'By weight or percent, checked live for each market you sell in.',
        link: '/formulas',
      });
    } else if (!writer && (progress?.formulas ?? 0) > 0) {
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

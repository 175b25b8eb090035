import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import type { ComplianceFinding, ComplianceMarket } from '@batchproof/shared';
import { FindingList } from './finding-list';

/** Said beside a missing safety assessment, whatever the market. */
export const ASSESSMENT_CAUTION =
  'A safety assessment is how a qualified assessor confirms the product is safe for the people who use it. Do not sell this version in these markets until its assessment is signed.';

/**
 * What a formula version lacks in safety assessment (`assessmentFindings` of the version or of a
 * label run), shown like the other findings with the safety caution beside them; nothing when the
 * version's assessment is signed or it is not sold where one is required.
 */
@Component({
  selector: 'bp-assessment-findings',
  imports: [FindingList, MatIcon],
  template: `
    @if (shown().length > 0) {
      <section class="assessment" aria-label="Safety assessment">
        <h3>Safety assessment</h3>
        <p class="caution" role="note">
          <mat-icon aria-hidden="true">health_and_safety</mat-icon>{{ caution }}
        </p>
        <bp-finding-list [findings]="shown()" [markets]="markets()" />
      </section>
    }
  `,
  styles: `
    :host {
      display: block;
    }
    .assessment {
      margin: 8px 0;
    }
    h3 {
      margin: 0;
      font: var(--mat-sys-title-small);
    }
    .caution {
      display: flex;
      gap: 6px;
      align-items: flex-start;
      margin: 4px 0 0;
      font: var(--mat-sys-body-medium);
      font-weight: 600;
    }
    .caution mat-icon {
      flex: none;
      font-size: 18px;
      width: 18px;
      height: 18px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AssessmentFindings {
  /** The findings as answered; absent when the answer did not look them up. */
  readonly findings = input<readonly ComplianceFinding[] | undefined>([]);
  /** Markets to group them by, in order. */
  readonly markets = input.required<readonly ComplianceMarket[]>();

  protected readonly caution = ASSESSMENT_CAUTION;
  protected readonly shown = computed(() => this.findings() ?? []);
}

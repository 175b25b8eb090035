import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import type { ColourantVerdict, SafetyPacket } from '@batchproof/shared';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';
import { AllergenTable } from '../../formulas/live-checks/allergen-table';
import { SeverityLabel } from '../../formulas/severity/severity-label';

const VERDICT_WORDS: Record<ColourantVerdict['verdict'], { word: string; icon: string }> = {
  permitted: { word: 'Permitted', icon: 'check_circle' },
  'permitted-with-conditions': { word: 'Permitted with conditions', icon: 'rule' },
  'not-permitted': { word: 'Not permitted', icon: 'block' },
  'not-listed': { word: 'Not listed', icon: 'help' },
  'not-checked': { word: 'Not checked', icon: 'help_outline' },
};

/**
 * Annex I Part A item 10, information on the cosmetic product: per market the label's ingredient
 * declaration and warnings, the colourant verdicts and the allergen table; the supplier documents
 * on file and those missing; the batches made.
 */
@Component({
  selector: 'bp-packet-information',
  imports: [AllergenTable, CalendarDayPipe, DecimalPipe, MatIcon, SeverityLabel],
  template: `
    @let p = packet();
    @if (p.identity; as id) {
      <dl class="identity" aria-label="Product identity">
        <dt>Product name</dt>
        <dd>{{ id.productName }}</dd>
        <dt>Shelf life</dt>
        <dd>{{ id.shelfLifeMonths !== null ? id.shelfLifeMonths + ' months' : 'Not given' }}</dd>
        <dt>Period after opening</dt>
        <dd>
          {{
            id.periodAfterOpeningMonths !== null
              ? id.periodAfterOpeningMonths + ' months'
              : 'Not given'
          }}
        </dd>
        <dt>EU responsible person</dt>
        <dd>{{ id.euResponsiblePerson ?? 'Not named' }}</dd>
        <dt>UK responsible person</dt>
        <dd>{{ id.ukResponsiblePerson ?? 'Not named' }}</dd>
        <dt>US adverse event contact</dt>
        <dd>{{ id.usAdverseEventContact ?? 'Not named' }}</dd>
      </dl>
    } @else {
      <p class="muted">No product identity entered for the label yet.</p>
    }
    @for (m of p.markets; track m.market) {
      <section class="market" [attr.aria-label]="'Label information for ' + m.market">
        <h4>{{ m.market }}</h4>
        <p class="declaration">{{ m.declaration || 'No ingredient declaration.' }}</p>
        @if (m.warnings.length > 0) {
          <p class="label">Warnings on the label</p>
          <ul>
            @for (w of m.warnings; track $index) {
              <li>{{ w }}</li>
            }
          </ul>
        } @else {
          <p class="muted">No warnings required on the label.</p>
        }
        @if (m.colourants.length > 0) {
          <div class="scroller">
            <table [attr.aria-label]="'Colourants, ' + m.market">
              <thead>
                <tr>
                  <th scope="col">Colourant</th>
                  <th scope="col" class="num">In product</th>
                  <th scope="col">Verdict</th>
                  <th scope="col">Source</th>
                </tr>
              </thead>
              <tbody>
                @for (c of m.colourants; track $index) {
                  <tr>
                    <th scope="row">
                      {{ c.subject }}{{ c.colourIndex ? ' (' + c.colourIndex + ')' : '' }}
                    </th>
                    <td class="num">{{ c.percent | number: '1.0-4' }} %</td>
                    <td>
                      <span class="verdict" [class.bad]="c.verdict === 'not-permitted'">
                        <mat-icon aria-hidden="true">{{ verdict(c).icon }}</mat-icon>
                        {{ verdict(c).word }}
                      </span>
                      @for (cond of c.conditions; track $index) {
                        <span class="condition">{{ cond }}</span>
                      }
                    </td>
                    <td class="source">{{ c.source }}</td>
                  </tr>
                }
              </tbody>
            </table>
          </div>
        }
        <bp-allergen-table [byMarket]="[m]" [label]="'Fragrance allergens, ' + m.market" />
      </section>
    } @empty {
      <p class="muted">No market chosen for this version.</p>
    }

    @if (p.findings.length > 0) {
      <h4>Compliance checks of this version</h4>
      <ul aria-label="Compliance checks">
        @for (f of p.findings; track $index) {
          <li>
            <bp-severity-label [severity]="f.severity" />
            {{ f.market ?? 'Every market' }} · {{ f.subject }}: {{ f.message }}
            <span class="source">{{ f.source }}</span>
          </li>
        }
      </ul>
    }
    <h4>Supplier documents on file</h4>
    @if (p.documentsOnFile.length > 0) {
      <ul aria-label="Documents on file">
        @for (d of p.documentsOnFile; track $index) {
          <li>
            <strong>{{ d.materialName }}</strong>: {{ d.title }} ({{ d.kind }})
            @if (d.issuedOn) {
              · issued {{ d.issuedOn | day }}
            }
            @if (d.expiresOn) {
              · expires {{ d.expiresOn | day }}
            }
          </li>
        }
      </ul>
    } @else {
      <p class="muted">None on file.</p>
    }
    <h4>Documents missing</h4>
    @if (p.documentsMissing.length > 0) {
      <ul aria-label="Documents missing">
        @for (d of p.documentsMissing; track $index) {
          <li>
            <mat-icon class="inline" aria-hidden="true">report</mat-icon>
            <strong>{{ d.materialName }}</strong>: {{ d.what }}
          </li>
        }
      </ul>
    } @else {
      <p class="muted">None missing.</p>
    }
    <h4>Batches made</h4>
    @if (p.batches.length > 0) {
      <ul aria-label="Batches made">
        @for (b of p.batches; track b.code) {
          <li>
            {{ b.code }} · made {{ b.madeOn | day }}
            @if (b.unitsMade !== null) {
              · {{ b.unitsMade }} units
            }
            · {{ b.status }}
          </li>
        }
      </ul>
    } @else {
      <p class="muted">No batches made of this version yet.</p>
    }
  `,
  styles: `
    :host {
      display: block;
      min-width: 0;
    }
    h4 {
      margin: 16px 0 4px;
      font: var(--mat-sys-title-small);
    }
    .declaration,
    li {
      overflow-wrap: anywhere;
    }
    .label {
      margin: 8px 0 0;
      font-weight: 600;
    }
    .scroller {
      overflow-x: auto;
      margin: 8px 0;
    }
    table {
      width: 100%;
      border-collapse: collapse;
      font: var(--mat-sys-body-medium);
    }
    th,
    td {
      padding: 4px 8px;
      text-align: start;
      vertical-align: top;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    .num {
      text-align: end;
      white-space: nowrap;
      font-variant-numeric: tabular-nums;
    }
    .verdict {
      display: inline-flex;
      align-items: center;
      gap: 4px;
    }
    .verdict.bad {
      color: var(--mat-sys-error);
    }
    .verdict mat-icon,
    .inline {
      width: 18px;
      height: 18px;
      font-size: 18px;
      vertical-align: text-bottom;
    }
    .identity {
      display: grid;
      grid-template-columns: minmax(0, auto) minmax(0, 1fr);
      gap: 4px 16px;
      margin: 0 0 8px;
    }
    .identity dt {
      font-weight: 600;
    }
    .identity dd {
      margin: 0;
      overflow-wrap: anywhere;
    }
    .condition {
      display: block;
      font: var(--mat-sys-body-small);
    }
    .source {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .muted {
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PacketInformation {
  readonly packet = input.required<SafetyPacket>();

  protected verdict(c: ColourantVerdict) {
    return VERDICT_WORDS[c.verdict];
  }
}

import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import {
  type ComplianceFinding,
  type ComplianceMarket,
  DEFER_TO_ASSESSOR,
  INTERPRETATION_NOTE as ENGINE_INTERPRETATION_NOTE,
} from '@batchproof/shared';
import { MARKETS } from '../product-types';
import { SeverityLabel } from '../severity/severity-label';
import { InterpretationNote } from './interpretation-note';

/** One finding as shown: the same finding for several markets is shown once, with their sources. */
interface ShownFinding {
  finding: ComplianceFinding;
  text: string;
  harm: boolean;
  sources: string[];
}

/** Findings under one market, under several markets they share, or under every market. */
interface MarketGroup {
  key: string;
  title: string;
  findings: ShownFinding[];
}

const MARKET_CODE = /\b(US|EU|UK|CA)\b/g;

/** Market codes and names in the engine's order, joined: "EU, UK and Canada". */
function joinMarkets(markets: readonly ComplianceMarket[]): string {
  const names = markets.map((m) => `${m} · ${MARKET_NAMES.get(m)}`);
  return names.length < 2
    ? (names[0] ?? '')
    : `${names.slice(0, -1).join(', ')} and ${names.at(-1)}`;
}

const MARKET_NAMES = new Map(MARKETS.map((m) => [m.code, m.name]));

/**
 * Findings grouped by market, each with its severity as icon + word, what it is about, the
 * message and the rule it rests on (with a note when the rule is only remembered, or is
 * Batchproof's own reading of it). The assessor sentence the engine appends to findings that
 * could hurt someone is set apart, so it is read rather than skimmed.
 */
@Component({
  selector: 'bp-finding-list',
  imports: [InterpretationNote, MatIcon, SeverityLabel],
  template: `
    @for (group of groups(); track group.key) {
      <section class="group" [attr.aria-label]="group.title + ' findings'">
        <h4>{{ group.title }}</h4>
        <ul>
          @for (f of group.findings; track $index) {
            <li [class]="f.finding.severity">
              <div class="head">
                <bp-severity-label [severity]="f.finding.severity" />
                <span class="subject">{{ f.finding.subject }}</span>
                @if (f.finding.substitute; as sub) {
                  <span class="substitute">
                    <mat-icon aria-hidden="true">swap_horiz</mat-icon>
                    Substitute {{ sub.materialName }}, line {{ sub.lineNumber }}
                  </span>
                }
              </div>
              <p class="message">{{ f.text }}</p>
              @if (f.harm) {
                <p class="harm">
                  <mat-icon aria-hidden="true">health_and_safety</mat-icon>{{ assessorNote }}
                </p>
              }
              <p class="source">
                Source: {{ f.sources.join('; ') }}
                @if (f.finding.status === 'M') {
                  <span class="weak">(from memory, not yet confirmed)</span>
                }
              </p>
              @if (f.finding.status === 'interpretation') {
                <bp-interpretation-note />
              }
            </li>
          }
        </ul>
      </section>
    } @empty {
      <p class="none">
        <mat-icon aria-hidden="true">check_circle</mat-icon>
        No findings for these markets.
      </p>
    }
  `,
  styles: `
    :host {
      display: block;
    }
    h4 {
      margin: 12px 0 4px;
      font: var(--mat-sys-title-small);
    }
    ul {
      list-style: none;
      margin: 0;
      padding: 0;
      display: grid;
      gap: 8px;
    }
    li {
      padding: 8px 12px;
      border-left: 4px solid var(--mat-sys-outline-variant);
      border-radius: var(--mat-sys-corner-extra-small);
      background: var(--mat-sys-surface-container-low);
    }
    li.block {
      border-left-color: var(--mat-sys-error);
    }
    li.warn {
      border-left-color: var(--mat-sys-tertiary);
    }
    .head {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 8px;
    }
    .subject {
      font-weight: 600;
      overflow-wrap: anywhere;
    }
    .substitute {
      display: inline-flex;
      align-items: center;
      gap: 4px;
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-body-small);
      overflow-wrap: anywhere;
    }
    .substitute mat-icon {
      flex: none;
      font-size: 16px;
      width: 16px;
      height: 16px;
    }
    p {
      margin: 4px 0 0;
      font: var(--mat-sys-body-medium);
    }
    .harm {
      display: flex;
      gap: 6px;
      align-items: flex-start;
      font-weight: 600;
    }
    .harm mat-icon {
      flex: none;
      font-size: 18px;
      width: 18px;
      height: 18px;
    }
    .source,
    .weak {
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-body-small);
    }
    .none {
      display: flex;
      align-items: center;
      gap: 6px;
      color: var(--mat-sys-primary);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FindingList {
  readonly findings = input.required<readonly ComplianceFinding[]>();
  /** Markets to group by, in order; findings for every market come first. */
  readonly markets = input.required<readonly ComplianceMarket[]>();

  protected readonly assessorNote = DEFER_TO_ASSESSOR;
  /**
   * Groups findings by the markets they apply to. A finding the engine raises alike for several
   * markets (same rule, subject, severity and words but for the market's code) is shown once under
   * those markets together, e.g. "EU, UK and Canada", with each market's source.
   */
  protected readonly groups = computed<MarketGroup[]>(() => {
    const order = this.markets();
    const byFinding = new Map<
      string,
      { markets: ComplianceMarket[]; items: ComplianceFinding[] }
    >();
    const everyMarket: ComplianceFinding[] = [];
    for (const finding of this.findings()) {
      if (finding.market === null) {
        everyMarket.push(finding);
        continue;
      }
      const key = [
        finding.code,
        finding.severity,
        finding.status,
        finding.subject,
        finding.message.replace(MARKET_CODE, '·'),
      ].join('|');
      const entry = byFinding.get(key) ?? { markets: [], items: [] };
      entry.markets.push(finding.market);
      entry.items.push(finding);
      byFinding.set(key, entry);
    }
    const shown = (items: ComplianceFinding[], markets: ComplianceMarket[]): ShownFinding => {
      const finding = items[0]!;
      const message =
        markets.length > 1
          ? finding.message.replace(MARKET_CODE, markets.join('/'))
          : finding.message;
      return {
        finding,
        text: message.replace(DEFER_TO_ASSESSOR, '').replace(ENGINE_INTERPRETATION_NOTE, '').trim(),
        harm: finding.message.includes(DEFER_TO_ASSESSOR),
        sources: [...new Set(items.map((f) => f.source))],
      };
    };
    const groups = new Map<string, MarketGroup>();
    if (everyMarket.length > 0)
      groups.set('all', {
        key: 'all',
        title: 'Every market',
        findings: everyMarket.map((f) => shown([f], [])),
      });
    const sorted = [...byFinding.values()].sort(
      (a, b) =>
        order.indexOf(a.markets[0]!) - order.indexOf(b.markets[0]!) ||
        b.markets.length - a.markets.length,
    );
    for (const { markets, items } of sorted) {
      markets.sort((a, b) => order.indexOf(a) - order.indexOf(b));
      const key = markets.join('+');
      const group = groups.get(key) ?? { key, title: joinMarkets(markets), findings: [] };
      group.findings.push(shown(items, markets));
      groups.set(key, group);
    }
    return [...groups.values()];
  });
}

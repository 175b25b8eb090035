import type {
  ColourantVerdict,
  ComplianceFinding,
  FindingStatus,
} from './evaluation-result-schema';
import type { ComplianceMarket, ReferenceStatus } from '../reference-data/reference-row';
import { DEFER_TO_ASSESSOR, INTERPRETATION_NOTE } from './evaluation-result-schema';
import { formatPercent, makeFinding } from './finding-builder';

/** A verdict with the findings it raises. */
export interface VerdictWithFindings {
  verdict: ColourantVerdict;
  findings: ComplianceFinding[];
}

/** The fields of a verdict that do not depend on the rule, and what the rules need to know. */
export type VerdictBase = Pick<
  ColourantVerdict,
  'subject' | 'colourIndex' | 'percent' | 'lines'
> & {
  /** The colour's percent over all its forms; maxima apply to it. */
  readonly totalPercent: number;
  /** Lines of the colour's other forms, named in messages about the total. */
  readonly otherFormLines: readonly number[];
  /** Whether this occurrence is a nanomaterial. */
  readonly nano: boolean;
};

/** The verdict record for a base and the rule's outcome (drops the rule-only fields). */
export function verdictOf(
  base: VerdictBase,
  outcome: Pick<ColourantVerdict, 'listing' | 'verdict' | 'conditions' | 'source'> & {
    status: FindingStatus | null;
  },
): ColourantVerdict {
  return {
    subject: base.subject,
    colourIndex: base.colourIndex,
    percent: base.percent,
    ...(base.otherFormLines.length > 0 ? { totalPercent: base.totalPercent } : {}),
    lines: base.lines,
    ...outcome,
  };
}

/** "2.5 % of the product" or, when other forms add to it, "2.5 % of the product with its other forms (lines 3, 4)". */
export function amountText(base: VerdictBase): string {
  if (base.otherFormLines.length === 0) return `${formatPercent(base.totalPercent)} of the product`;
  const lines = base.otherFormLines.map((l) => l + 1).join(', ');
  return `${formatPercent(base.totalPercent)} of the product counting the same colour on line${base.otherFormLines.length > 1 ? 's' : ''} ${lines}`;
}

type FindingFields = Omit<Parameters<typeof makeFinding>[0], 'market' | 'subject' | 'lines'>;

/**
 * What every market's colourant rules build: findings about this colourant (naming the lines of all
 * its forms), a "not on our list" outcome, and a block whose status is the row's or, for a rule that
 * rests on Batchproof's reading, `interpretation` — unless the row is from memory, which only warns.
 */
export function verdictTools(base: VerdictBase, market: ComplianceMarket) {
  const finding = (f: FindingFields) =>
    makeFinding({
      ...f,
      market,
      subject: base.subject,
      lines: [...base.lines, ...base.otherFormLines],
    });
  const notListed = (
    code: 'COLOURANT_NOT_LISTED' | 'COLOURANT_AMBIGUOUS',
    message: string,
    source: string,
    verdictStatus: FindingStatus | null,
  ): VerdictWithFindings => ({
    verdict: verdictOf(base, {
      listing: null,
      verdict: 'not-listed',
      conditions: [],
      source,
      status: verdictStatus,
    }),
    findings: [finding({ code, severity: 'warn', message, source, status: 'C' })],
  });
  const notPermitted = (
    listing: string,
    rowStatus: ReferenceStatus,
    why: string,
    source: string,
    interpretation = false,
  ): VerdictWithFindings => {
    const status: FindingStatus =
      interpretation && rowStatus !== 'M' ? 'interpretation' : rowStatus;
    return {
      verdict: verdictOf(base, {
        listing,
        verdict: 'not-permitted',
        conditions: [],
        source,
        status,
      }),
      findings: [
        finding({
          code: 'COLOURANT_NOT_PERMITTED',
          severity: 'block',
          message: `${base.subject}: ${why} ${DEFER_TO_ASSESSOR}${interpretation ? ` ${INTERPRETATION_NOTE}` : ''}`,
          source,
          status,
        }),
      ],
    };
  };
  return { finding, notListed, notPermitted };
}

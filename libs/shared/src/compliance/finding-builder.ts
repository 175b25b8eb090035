import type { ComplianceMarket } from '../reference-data/reference-row';
import type {
  ComplianceFinding,
  FindingCode,
  FindingSeverity,
  FindingStatus,
} from './evaluation-result-schema';

/** Appended to a blocking message whose rule is from memory, which therefore only warns. */
export const FROM_MEMORY_NOTE =
  'Batchproof holds this rule from memory and has not yet confirmed it against the published text, so it asks you to check rather than blocking.';

/**
 * Builds a finding. A rule resting on an unconfirmed (`M`) value never blocks: its block is turned
 * into a warning and the message says why.
 */
export function makeFinding(finding: {
  code: FindingCode;
  severity: FindingSeverity;
  market: ComplianceMarket | null;
  subject: string;
  message: string;
  source: string;
  status: FindingStatus;
  lines: readonly number[];
}): ComplianceFinding {
  const demoted = finding.status === 'M' && finding.severity === 'block';
  return {
    ...finding,
    severity: demoted ? 'warn' : finding.severity,
    message: demoted ? `${finding.message} ${FROM_MEMORY_NOTE}` : finding.message,
    lines: [...new Set(finding.lines)].sort((a, b) => a - b),
  };
}

/** Formats a percentage for messages: up to 4 significant decimals, no trailing zeros. */
export function formatPercent(percent: number): string {
  if (percent === 0) return '0 %';
  const digits =
    percent >= 1 ? 2 : Math.min(6, Math.max(2, 1 - Math.floor(Math.log10(percent)) + 1));
  return `${Number(percent.toFixed(digits))} %`;
}

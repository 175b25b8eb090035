import type { ColourantVerdict, ComplianceFinding } from './evaluation-result-schema';

/** A verdict with the findings it raises. */
export interface VerdictWithFindings {
  verdict: ColourantVerdict;
  findings: ComplianceFinding[];
}

/** The fields of a verdict that do not depend on the rule. */
export type VerdictBase = Pick<ColourantVerdict, 'subject' | 'colourIndex' | 'percent' | 'lines'>;

import { evaluateFormula, SEVERITY_ORDER } from '../compliance/evaluate-formula';
import type {
  ComplianceFinding,
  EvaluationResult,
  FindingSubstitute,
} from '../compliance/evaluation-result-schema';
import type { EngineMaterialSource } from '../materials/material-engine-input';
import { prepareEvaluation, type EvaluationSource } from './evaluation-input-builder';

/** An approved substitute for one line of an {@link EvaluationSource}. */
export interface SubstituteSource {
  /** Index into the source's `lines` of the line it may replace. */
  readonly lineIndex: number;
  /** That line's number as the maker sees it (1-based). */
  readonly lineNumber: number;
  readonly materialId: string;
  readonly material: EngineMaterialSource;
}

/** The evaluation with its substitutes' findings, or why the draft cannot be checked yet. */
export type SubstituteEvaluation =
  | {
      ok: true;
      result: EvaluationResult;
      /** Substitutes that could not be checked, in plain words (the rest was). */
      problems: string[];
    }
  | { ok: false; problems: string[] };

/** A finding's identity for "the main formula already says this". */
const sameFinding = (f: ComplianceFinding) =>
  JSON.stringify([f.code, f.severity, f.market, f.subject, f.message, f.source, f.status, f.lines]);

/** "With Tapioca Starch in place of Corn Starch on line 4" */
export function substitutePhrase(
  s: Pick<FindingSubstitute, 'materialName' | 'replacesName' | 'lineNumber'>,
) {
  return `With ${s.materialName} in place of ${s.replacesName} on line ${s.lineNumber}`;
}

/**
 * Evaluates a formula and then, once per approved substitute, the same formula with that line's
 * material replaced by the substitute, through the same `prepareEvaluation` and engine. A finding
 * the substitute's run raises that the formula's own run does not is added, its message starting
 * "With Tapioca Starch in place of Corn Starch on line 4: …" and tagged with `substitute`, so a
 * blocking one blocks the release like the main material's. Declarations, allergens and colourant
 * verdicts stay the formula's own (a batch made with a substitute is evaluated with it in place).
 * The API on save and the editor's live check both call this, so they agree by construction.
 */
export function evaluateWithSubstitutes(
  source: EvaluationSource,
  substitutes: readonly SubstituteSource[] = [],
): SubstituteEvaluation {
  const prepared = prepareEvaluation(source);
  if (!prepared.ok) return prepared;
  const result = evaluateFormula(prepared.input);
  if (substitutes.length === 0) return { ok: true, result, problems: [] };
  const known = new Set(result.findings.map(sameFinding));
  const added: ComplianceFinding[] = [];
  const checked: FindingSubstitute[] = [];
  const problems: string[] = [];
  for (const sub of substitutes) {
    const own = source.lines[sub.lineIndex];
    if (!own) continue;
    const tag: FindingSubstitute = {
      lineNumber: sub.lineNumber,
      materialId: sub.materialId,
      materialName: sub.material.tradeName,
      replacesName: own.material.tradeName,
    };
    const phrase = substitutePhrase(tag);
    const lines = source.lines.map((l, i) =>
      i === sub.lineIndex ? { grams: l.grams, material: sub.material } : l,
    );
    const alternative = prepareEvaluation({ ...source, lines });
    if (!alternative.ok) {
      problems.push(...alternative.problems.map((p) => `${phrase}: ${p}`));
      continue;
    }
    checked.push(tag);
    for (const finding of evaluateFormula(alternative.input).findings) {
      if (known.has(sameFinding(finding))) continue;
      added.push({ ...finding, message: `${phrase}: ${finding.message}`, substitute: tag });
    }
  }
  // A stable sort: the formula's own findings first within each severity, as the engine orders them.
  const findings = [...result.findings, ...added].sort(
    (a, b) => SEVERITY_ORDER[a.severity] - SEVERITY_ORDER[b.severity],
  );
  return { ok: true, result: { ...result, findings, substitutes: checked }, problems };
}

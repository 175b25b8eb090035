import {
  evaluationInputSchema,
  type EvaluationInput,
  type EvaluationInputDraft,
} from '../compliance/evaluation-input-schema';
import type { ProductType } from '../compliance/product-types';
import type { ComplianceMarket } from '../reference-data/reference-row';
import {
  materialToEngineInput,
  type EngineMaterialSource,
} from '../materials/material-engine-input';

/** The product profile as the editor holds it or the server stores it (net quantity may be half-typed). */
export interface ProfileSource {
  readonly use: 'rinse-off' | 'leave-on';
  readonly contact: { mucousMembranes: boolean; eyeArea: boolean; lips: boolean };
  readonly inBath: boolean;
  readonly adultsOnly: boolean;
  readonly soldAsSoap?: boolean | undefined;
  readonly ifraCategory: string;
  readonly markets: readonly ComplianceMarket[];
  readonly netQuantity?: { amount: number | null; unit: 'g' | 'mL' } | null | undefined;
  readonly unitMassGrams?: number | null | undefined;
}

/** Everything a check of one formula version needs. */
export interface EvaluationSource {
  /** Day to check against (YYYY-MM-DD). */
  readonly asOf: string;
  readonly productName: string;
  readonly productType: ProductType;
  readonly profile: ProfileSource;
  /** Lines with their materials, in formula order; lines without a material are left out by the caller. */
  readonly lines: readonly { grams: number; material: EngineMaterialSource }[];
}

/**
 * Builds the compliance engine's input from a formula version: the one mapping used by the API on
 * save and by the editor's live check, so that what a maker sees while typing is, by construction,
 * what the server stores.
 */
export function toEvaluationInput(source: EvaluationSource): EvaluationInputDraft {
  const { profile } = source;
  const amount = profile.netQuantity?.amount;
  return {
    asOf: source.asOf,
    markets: [...profile.markets],
    product: {
      name: source.productName.trim() || 'Untitled formula',
      type: source.productType,
      soldAsSoap: profile.soldAsSoap ?? false,
      use: profile.use,
      contact: { ...profile.contact },
      inBath: profile.inBath,
      adultsOnly: profile.adultsOnly,
      ifraCategory: profile.ifraCategory,
      ...(amount ? { netQuantity: { amount, unit: profile.netQuantity!.unit } } : {}),
      ...(profile.unitMassGrams ? { unitMassGrams: profile.unitMassGrams } : {}),
    },
    lines: source.lines.map((l) => ({
      grams: l.grams,
      material: materialToEngineInput(l.material),
    })),
  };
}

/** The parsed input, or the reasons the draft cannot be checked yet in plain words. */
export type PreparedEvaluation =
  { ok: true; input: EvaluationInput } | { ok: false; problems: string[] };

/** {@link toEvaluationInput} followed by the engine's own schema. */
export function prepareEvaluation(source: EvaluationSource): PreparedEvaluation {
  const parsed = evaluationInputSchema.safeParse(toEvaluationInput(source));
  if (parsed.success) return { ok: true, input: parsed.data };
  return { ok: false, problems: [...new Set(parsed.error.issues.map((i) => i.message))] };
}

import { FormArray, type FormGroup, type NonNullableFormBuilder } from '@angular/forms';
import {
  type AssessmentDetail,
  type AssessmentUpdateInput,
  DEFAULT_BODY_WEIGHT_KG,
  EXPOSURE_DEFAULTS,
  type ExposureDefault,
  exposureDefaultsFor,
  exposureInputSchema,
  type PacketMargin,
  type PacketSubstance,
  productExposure,
  substanceMargins,
} from '@batchproof/shared';

/** The exposure picker's value for the assessor's own values; '' is "not chosen yet". */
export const OWN_VALUES = 'own';

/** The assessor's editable inputs, shaped like `assessmentUpdateSchema` but for people. */
export function createAssessmentForm(fb: NonNullableFormBuilder, detail: AssessmentDetail) {
  const e = detail.exposure;
  const stored = new Map(detail.substances.map((s) => [s.substanceKey, s]));
  return fb.group({
    exposure: fb.group({
      choice: e ? (e.presetKey ?? OWN_VALUES) : '',
      dailyAmountGrams: fb.control<number | null>(e?.dailyAmountGrams ?? null),
      retentionFactor: fb.control<number | null>(e?.retentionFactor ?? null),
      bodyWeightKg: fb.control<number | null>(e?.bodyWeightKg ?? DEFAULT_BODY_WEIGHT_KG),
      source: e && e.presetKey === null ? e.source : '',
    }),
    substances: new FormArray(
      detail.packet.substances.map((s) => {
        const input = stored.get(s.key);
        return fb.group({
          substanceKey: s.key,
          pointOfDepartureMgPerKgDay: fb.control<number | null>(
            input?.pointOfDepartureMgPerKgDay ?? null,
          ),
          pointOfDepartureSource: input?.pointOfDepartureSource ?? '',
          dermalAbsorptionPercent: fb.control<number | null>(
            input?.dermalAbsorptionPercent ?? null,
          ),
          dermalAbsorptionSource: input?.dermalAbsorptionSource ?? '',
        });
      }),
    ),
    partB: fb.group({
      conclusion: detail.partB.conclusion,
      labelWarnings: detail.partB.labelWarnings,
      reasoning: detail.partB.reasoning,
      credentials: detail.partB.credentials,
    }),
  });
}
export type AssessmentForm = ReturnType<typeof createAssessmentForm>;
export type AssessmentFormValue = ReturnType<AssessmentForm['getRawValue']>;

/**
 * The exposure rows offered: those for the product type first, then the rest, and a stored
 * preset Batchproof no longer ships (kept so the picker can show what was chosen).
 */
export function exposureOptions(detail: AssessmentDetail): {
  forType: readonly ExposureDefault[];
  others: readonly ExposureDefault[];
} {
  const forType = exposureDefaultsFor(detail.packet.formula.productType);
  const others = EXPOSURE_DEFAULTS.filter((row) => !forType.some((f) => f.key === row.key));
  return { forType, others };
}

/** The preset row a choice names, if it is one. */
export const presetOf = (choice: string) =>
  choice && choice !== OWN_VALUES ? EXPOSURE_DEFAULTS.find((row) => row.key === choice) : undefined;

/** The `PUT /api/assessments/:id` body for what the form holds. */
export function updateBody(
  value: AssessmentFormValue,
  detail: AssessmentDetail,
): AssessmentUpdateInput {
  const x = value.exposure;
  const preset = presetOf(x.choice);
  let exposure: AssessmentUpdateInput['exposure'] = null;
  if (preset)
    exposure = {
      presetKey: preset.key,
      dailyAmountGrams: preset.dailyAmountGrams,
      retentionFactor: preset.retentionFactor,
      bodyWeightKg: DEFAULT_BODY_WEIGHT_KG,
      source: preset.source,
    };
  else if (x.choice === OWN_VALUES || (x.choice && detail.exposure))
    // Own values, or a stored preset no longer shipped: the numbers as they stand.
    exposure = {
      presetKey: x.choice === OWN_VALUES ? null : x.choice,
      // Null where nothing is typed: the contract then says the field must be a number.
      dailyAmountGrams: x.dailyAmountGrams as number,
      retentionFactor: x.retentionFactor as number,
      bodyWeightKg: x.bodyWeightKg as number,
      source: x.source,
    };
  return {
    exposure,
    substances: value.substances.map((s) => ({ ...s })),
    partB: { ...value.partB },
  };
}

/**
 * Where the contract's paths live in the form: a missing exposure is the picker's message; a
 * substance the packet no longer holds has no field of its own, so its message goes above the form.
 */
export const assessmentPath = (path: string) => {
  if (path === 'exposure' || path === 'exposure.presetKey') return 'exposure.choice';
  if (/^substances\.\d+\.substanceKey$/.test(path)) return 'no field';
  return path;
};

/** A (mg/kg bw/day) for what the form holds, or null while it is not chosen or not valid. */
export function liveExposure(value: AssessmentFormValue, detail: AssessmentDetail): number | null {
  const exposure = updateBody(value, detail).exposure;
  const parsed = exposureInputSchema.safeParse(exposure);
  return parsed.success ? productExposure(parsed.data).exposureMgPerKgDay : null;
}

/**
 * Each substance's SED and MoS for what is typed, so the assessor sees the margin as they enter a
 * point of departure; worked out by the shared `substanceMargins`, as the server does for the
 * saved packet. A value the contract would refuse counts as not entered.
 */
export function liveMargins(
  value: AssessmentFormValue,
  substances: readonly PacketSubstance[],
  exposure: number | null,
): PacketMargin[] {
  return substanceMargins(
    exposure,
    substances,
    value.substances.map((s) => ({
      ...s,
      pointOfDepartureMgPerKgDay: positive(s.pointOfDepartureMgPerKgDay, 1_000_000),
      dermalAbsorptionPercent: positive(s.dermalAbsorptionPercent, 100),
    })),
  );
}

/** A typed number the contract accepts (more than 0, at most `max`), else null. */
function positive(value: number | null | undefined, max: number): number | null {
  return typeof value === 'number' && Number.isFinite(value) && value > 0 && value <= max
    ? value
    : null;
}

/** The form groups of one substance row, typed for the template. */
export type SubstanceGroup = AssessmentForm['controls']['substances']['controls'][number];
export type ExposureGroup = FormGroup<AssessmentForm['controls']['exposure']['controls']>;

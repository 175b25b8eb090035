import { marginOfSafety, MINIMUM_MARGIN_OF_SAFETY } from '../compliance/margin-of-safety';
import type { SubstanceInput } from './assessment-api';
import { DEFAULT_DERMAL_ABSORPTION_PERCENT } from './exposure-defaults';
import type { PacketExposure, PacketMargin, PacketSubstance } from './safety-packet';

/**
 * One substance's SED and margin of safety for Annex I Part A items 7–8, from the shared
 * `marginOfSafety` (SED = A × C/100 × DAp/100, MoS = PoD_sys / SED; SCCS Notes of Guidance,
 * SCCS/1647/22). `exposure` is A in mg/kg bw/day, or null before the assessor chose it; the input
 * is the assessor's values for this substance, if any. A null absorption is the default 100 %.
 */
export function substanceMargin(
  exposure: number | null,
  substance: PacketSubstance,
  input: SubstanceInput | undefined,
): PacketMargin {
  const absorption = input?.dermalAbsorptionPercent ?? null;
  const dermalAbsorptionPercent = absorption ?? DEFAULT_DERMAL_ABSORPTION_PERCENT;
  const pod = input?.pointOfDepartureMgPerKgDay ?? null;
  let sed: number | null = null;
  let mos: number | null = null;
  if (exposure !== null && exposure > 0) {
    // SED = A × C/100 × DAp/100 (SCCS Notes of Guidance)
    sed = exposure * (substance.percent / 100) * (dermalAbsorptionPercent / 100);
    if (pod !== null && substance.percent > 0)
      mos = marginOfSafety({
        exposureMgPerKgDay: exposure,
        concentrationPercent: substance.percent,
        dermalAbsorptionPercent,
        pointOfDepartureMgPerKgDay: pod,
      }).marginOfSafety;
  }
  return {
    substanceKey: substance.key,
    inci: substance.inci,
    percent: substance.percent,
    dermalAbsorptionPercent,
    absorptionDefaulted: absorption === null,
    dermalAbsorptionSource:
      absorption === null
        ? 'Default 100 % when there are no absorption data (SCCS Notes of Guidance)'
        : (input?.dermalAbsorptionSource ?? ''),
    pointOfDepartureMgPerKgDay: pod,
    pointOfDepartureSource: input?.pointOfDepartureSource ?? '',
    sedMgPerKgDay: sed,
    marginOfSafety: mos,
    flagged: mos !== null && mos < MINIMUM_MARGIN_OF_SAFETY,
  };
}

/** Every substance's margin, in the packet's order, each with the assessor's input of the same key. */
export function substanceMargins(
  exposure: number | null,
  substances: readonly PacketSubstance[],
  inputs: readonly SubstanceInput[],
): PacketMargin[] {
  const byKey = new Map(inputs.map((input) => [input.substanceKey, input]));
  return substances.map((substance) =>
    substanceMargin(exposure, substance, byKey.get(substance.key)),
  );
}

/** A margin as people read it: whole above 10, one decimal below (as `marginOfSafety` words it). */
export function formatMargin(mos: number): string {
  return mos >= 10 ? Math.round(mos).toString() : mos.toFixed(1);
}

/**
 * What needs the assessor's attention, in plain words: the exposure taken as shipped (or not chosen),
 * margins under 100, points of departure not entered, absorption left at the default 100 %.
 */
export function marginAttention(
  margins: readonly PacketMargin[],
  exposure: PacketExposure | null,
): string[] {
  const lines: string[] = [];
  if (exposure === null)
    lines.push(
      'Exposure to the product is not chosen yet, so no SED or margin of safety can be worked out.',
    );
  else if (exposure.defaulted && exposure.presetLabel !== null)
    lines.push(
      `Exposure taken from the shipped default for ${exposure.presetLabel.toLowerCase()} ` +
        `(A = ${exposure.exposureMgPerKgDay.toFixed(2)} mg/kg bw/day, ${exposure.source}): ` +
        'confirm it fits how this product is used.',
    );
  for (const m of margins) {
    if (m.flagged && m.marginOfSafety !== null)
      lines.push(
        `MoS ${formatMargin(m.marginOfSafety)} for ${m.inci} is below ${MINIMUM_MARGIN_OF_SAFETY}: ` +
          'the safety assessor must review it before the product is released.',
      );
  }
  const noPod = margins.filter((m) => m.pointOfDepartureMgPerKgDay === null);
  for (const m of noPod) lines.push(`Point of departure not entered for ${m.inci}.`);
  const defaulted = margins.filter((m) => m.absorptionDefaulted);
  for (const m of defaulted)
    lines.push(
      `Dermal absorption left at the default ${DEFAULT_DERMAL_ABSORPTION_PERCENT} % for ${m.inci}.`,
    );
  return lines;
}

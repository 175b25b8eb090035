import * as z from 'zod';
import type { ReferenceStatus } from '../reference-data/reference-row';
import { US_UNITS } from './us-customary-units';

/** Input of {@link netQuantityStatement}. */
export const netQuantityInputSchema = z.object({
  amount: z
    .number({ error: 'Enter the net quantity' })
    .gt(0, { error: 'Net quantity must be more than 0' })
    .max(1e7),
  /** `g` for solids, semi-solids and viscous products (declared by weight); `mL` for liquids (fluid measure). */
  unit: z.enum(['g', 'mL'], { error: 'Choose g (solids) or mL (liquids)' }),
  /** Area of the principal display panel in square inches, to work out the minimum type height. */
  pdpAreaSqIn: z.number().gt(0, { error: 'Panel area must be more than 0' }).optional(),
});
/** Input of {@link netQuantityStatement}. */
export type NetQuantityInput = z.input<typeof netQuantityInputSchema>;

/** A net quantity of contents statement in metric and US units. */
export interface NetQuantityStatement {
  /** `weight` for solids (avoirdupois oz/lb), `fluid` for liquids (US fl oz). */
  readonly kind: 'weight' | 'fluid';
  /** The statement to print, e.g. `Net Wt. 4 oz (113 g)`. */
  readonly text: string;
  /** The metric figure, rounded down. */
  readonly metric: { value: number; unit: 'g' | 'mL' };
  /** The US figure, rounded down. */
  readonly us: { value: number; unit: 'oz' | 'fl oz' };
  /** Minimum height of the figures for the panel area, when given (21 CFR 701.13). */
  readonly minimumTypeHeight: { inches: number; label: string; status: ReferenceStatus } | null;
  /** Things the maker should know. */
  readonly notes: string[];
  /**
   * The statement each market prints: the US dual statement; metric first, on its own, for the EU and
   * UK (Art. 19(1)(b): nominal content by weight or volume); metric for Canada, whose unit symbols
   * serve both languages (words, if added, go in English and French).
   */
  readonly byMarket: { US: string; EU: string; UK: string; CA: string };
}

/** Rounds down to `decimals` places; the tiny nudge keeps 3.99999999 (float noise for 4) at 4. */
function floorTo(value: number, decimals: number): number {
  const factor = 10 ** decimals;
  return Math.floor(value * factor + 1e-7) / factor;
}

/** Rounds down, keeping about three significant figures: 113.39 → 113, 28.35 → 28.3, 3.986 → 3.98. */
export function roundDownForLabel(value: number): number {
  const decimals = value >= 100 ? 0 : value >= 10 ? 1 : 2;
  return floorTo(value, decimals);
}

function format(value: number): string {
  return String(Number(value.toFixed(2)));
}

/**
 * Minimum type height by principal display panel area, 21 CFR 701.13 (same table as 16 CFR 500.21).
 * The first two rows are confirmed secondarily; the larger rows are from memory.
 */
export const netQuantityTypeHeights: readonly {
  maxAreaSqIn: number;
  inches: number;
  label: string;
  status: ReferenceStatus;
}[] = [
  { maxAreaSqIn: 5, inches: 1 / 16, label: '1/16 in', status: 'C2' },
  { maxAreaSqIn: 25, inches: 1 / 8, label: '1/8 in', status: 'C2' },
  { maxAreaSqIn: 100, inches: 3 / 16, label: '3/16 in', status: 'M' }, // from memory
  { maxAreaSqIn: 400, inches: 1 / 4, label: '1/4 in', status: 'M' }, // from memory
  { maxAreaSqIn: Number.POSITIVE_INFINITY, inches: 1 / 2, label: '1/2 in', status: 'M' }, // from memory
];

/**
 * Net quantity of contents statement (FPLA; 21 CFR 701.13): weight for solids, fluid measure for
 * liquids, metric and US units, each rounded down so it never overstates the contents (NIST metric
 * labelling guidance). From 1 lb (16 oz) or 1 pint (16 fl oz) the larger unit is added in brackets.
 * Throws a ZodError with field paths on invalid input.
 */
export function netQuantityStatement(input: NetQuantityInput): NetQuantityStatement {
  const { amount, unit, pdpAreaSqIn } = netQuantityInputSchema.parse(input);
  const notes: string[] = [];
  const metric = { value: roundDownForLabel(amount), unit };
  let text: string;
  let us: NetQuantityStatement['us'];
  if (unit === 'g') {
    const oz = roundDownForLabel(amount / US_UNITS.ounceGrams);
    us = { value: oz, unit: 'oz' };
    if (oz >= 16) {
      const pounds = Math.floor(oz / 16);
      const rest = floorTo(oz - pounds * 16, 1);
      const larger = rest > 0 ? `${pounds} lb ${format(rest)} oz` : `${pounds} lb`;
      // from memory: the dual oz + lb form for 1 lb and over (FPLA).
      text = `Net Wt. ${format(oz)} oz (${larger}) ${format(metric.value)} g`;
    } else text = `Net Wt. ${format(oz)} oz (${format(metric.value)} g)`;
  } else {
    const flOz = roundDownForLabel(amount / US_UNITS.fluidOunceMillilitres);
    us = { value: flOz, unit: 'fl oz' };
    if (flOz >= 16) {
      // from memory: FPLA's "largest whole unit" for liquids (gallons, quarts, pints) with the rest in fl oz.
      text = `Net ${format(flOz)} fl oz (${largestWholeUnits(flOz)}) ${format(metric.value)} mL`;
    } else text = `Net ${format(flOz)} fl oz (${format(metric.value)} mL)`;
  }
  if (amount < 5)
    notes.push(
      'EU/UK: the nominal content need not be given for packages under 5 g or 5 mL (Art. 19(1)(b)).',
    );
  if (unit === 'g' && amount <= US_UNITS.ounceGrams / 4) {
    notes.push(
      'US: a decorative container of 1/4 oz or less may carry the net quantity on a tear-away tag or tape (21 CFR 701.10).',
    );
  }
  let minimumTypeHeight: NetQuantityStatement['minimumTypeHeight'] = null;
  if (pdpAreaSqIn !== undefined) {
    const row = netQuantityTypeHeights.find((r) => pdpAreaSqIn <= r.maxAreaSqIn)!;
    minimumTypeHeight = { inches: row.inches, label: row.label, status: row.status };
    notes.push(
      `Print the figures at least ${row.label} high (measure a lower-case "o"), in the bottom 30 % of the principal display panel.`,
    );
  }
  const metricText = `${format(metric.value)} ${unit === 'g' ? 'g' : 'ml'}`;
  notes.push(
    'Canada: the metric quantity with its symbol reads in both languages; if you add words such as "Net weight", add "Poids net" beside them.',
  );
  return {
    kind: unit === 'g' ? 'weight' : 'fluid',
    text,
    metric,
    us,
    minimumTypeHeight,
    notes,
    byMarket: { US: text, EU: metricText, UK: metricText, CA: `${format(metric.value)} ${unit}` },
  };
}

/** 48 → "1 qt 1 pt", 160 → "1 gal 1 qt", 33.8 → "1 qt 1.8 fl oz": the largest whole US units first. */
export function largestWholeUnits(fluidOunces: number): string {
  const units: [string, number][] = [
    ['gal', 128],
    ['qt', 32],
    ['pt', 16],
  ];
  const parts: string[] = [];
  let rest = fluidOunces;
  for (const [name, size] of units) {
    const whole = Math.floor(rest / size + 1e-9);
    if (whole > 0) {
      parts.push(`${whole} ${name}`);
      rest = floorTo(rest - whole * size, 1);
    }
  }
  if (rest > 0) parts.push(`${format(rest)} fl oz`);
  return parts.join(' ');
}

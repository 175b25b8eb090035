import { netQuantityTypeHeights } from '../compliance/net-quantity-statement';
import type { ComplianceMarket } from '../reference-data/reference-row';
import type {
  LabelAreas,
  LabelFieldKey,
  LetterHeightMinimum,
  LetterHeightStatus,
} from './label-content';
import type { LabelLayout } from './label-run-api';
import { MM_PER_INCH, type LabelStock } from './label-stock';

/**
 * Minimum letter heights per market and label field, as data with their sources. Heights are those
 * of the lower-case letters, measured on a lower-case "o" for mixed-case text (FDA Cosmetic
 * Labeling Guide, C2). Where no published rule gives a number, a house minimum applies and says so.
 */

/** A letter-height minimum with how sure we are of it (always set by {@link letterHeightMinimum}). */
export type LetterHeightRule = LetterHeightMinimum & { readonly status: LetterHeightStatus };

/** US ingredient declarations may drop to 1/32 in below this many square inches of labelling surface. */
export const US_SMALL_PACKAGE_SQ_IN = 12; // 21 CFR 701.3(b)

/** Square millimetres in one square inch. */
const SQ_MM_PER_SQ_IN = MM_PER_INCH * MM_PER_INCH;

/** A height given in inches, as shown to the maker: `1/16 in (1.59 mm)`. */
function rule(
  inches: number,
  fraction: string,
  source: string,
  status: LetterHeightStatus,
): LetterHeightRule {
  const mm = inches * MM_PER_INCH;
  return {
    mm,
    inches,
    label: `${fraction} (${Number(mm.toFixed(2))} mm)`,
    source,
    status,
  };
}

/** Said beside every house minimum. */
const HOUSE = 'house minimum: common practice, no published source';

/**
 * The house minimum, 1/32 in (0.79 mm), wherever no published rule gives a number. It matches the
 * smallest height 21 CFR 701.3(b) allows any declaration, so no label falls below a size some
 * regulator has accepted. Common practice, no published source.
 */
export const HOUSE_MINIMUM_INCHES = 1 / 32;

function house(why: string): LetterHeightRule {
  return rule(HOUSE_MINIMUM_INCHES, '1/32 in', `${why}; ${HOUSE}`, 'house');
}

/** Why each market without a numeric rule falls back to the house minimum. */
const NO_NUMERIC_RULE: Record<ComplianceMarket, string> = {
  US: 'No numeric minimum known for this field (21 CFR 701.11 and 701.12 ask for prominence, not a size; from memory)',
  EU: 'Regulation (EC) No 1223/2009, Art. 19(1): "indelible, easily legible and visible lettering", no numeric minimum',
  UK: 'UK Cosmetics Regulation (retained Regulation (EC) No 1223/2009), Art. 19(1): "easily legible", no numeric minimum',
  CA: 'Cosmetic Regulations (C.R.C., c. 869): no numeric minimum in the text we hold',
};

/**
 * Canada's Consumer Packaging and Labelling Regulations set net-quantity type heights by display
 * surface area; we have not confirmed that table, so the house minimum applies until we do.
 */
const CA_NET_QUANTITY =
  'Consumer Packaging and Labelling Regulations: type heights for the net quantity by display surface area, table not confirmed';

/** 21 CFR 701.13 by principal display panel area: the engine's table, with each row's status. */
function usNetQuantity(pdpAreaSqIn: number): LetterHeightRule {
  const row = netQuantityTypeHeights.find((r) => pdpAreaSqIn <= r.maxAreaSqIn)!;
  const source =
    row.status === 'M'
      ? '21 CFR 701.13 (row for panels over 25 sq in from memory)'
      : '21 CFR 701.13';
  return rule(row.inches, row.label, source, row.status);
}

/**
 * The smallest lower-case letter height allowed for `field` on a label for `market`, with its
 * source. Throws a RangeError when an area is not a positive number.
 */
export function letterHeightMinimum(
  market: ComplianceMarket,
  field: LabelFieldKey,
  areas: LabelAreas,
): LetterHeightRule {
  for (const [name, value] of Object.entries(areas))
    if (!(value > 0) || !Number.isFinite(value))
      throw new RangeError(`${name} must be a positive number of square inches, not ${value}`);
  if (market === 'US') {
    switch (field) {
      case 'netQuantity':
        return usNetQuantity(areas.pdpAreaSqIn);
      case 'ingredients':
        // 21 CFR 701.3(b): 1/16 in, or 1/32 in when the labelling surface is under 12 sq in (C2)
        return areas.labellingAreaSqIn < US_SMALL_PACKAGE_SQ_IN
          ? rule(1 / 32, '1/32 in', '21 CFR 701.3(b), package under 12 sq in', 'C2')
          : rule(1 / 16, '1/16 in', '21 CFR 701.3(b)', 'C2');
      case 'warnings':
        // 21 CFR 740.2(a): bold, not less than 1/16 in, no small-package exemption (C2)
        return rule(1 / 16, '1/16 in', '21 CFR 740.2(a)', 'C2');
      default:
        return house(NO_NUMERIC_RULE.US);
    }
  }
  if (market === 'CA' && field === 'netQuantity') return house(CA_NET_QUANTITY);
  return house(NO_NUMERIC_RULE[market]);
}

/** One label's area in square inches, from its outline (a circle's diameter is its width). */
export function labelAreaSqIn(stock: LabelStock): number {
  const { labelWidthMm: w, labelHeightMm: h, shape } = stock;
  let sqMm: number;
  switch (shape.kind) {
    case 'rectangle':
      sqMm = w * h;
      break;
    case 'rounded-rectangle':
      // Each corner loses a square of side r less a quarter circle: 4r² − πr².
      sqMm = w * h - (4 - Math.PI) * shape.cornerRadiusMm ** 2;
      break;
    case 'circle':
    case 'oval':
      // An ellipse with semi-axes w/2 and h/2 (a circle: w = h = d, so πd²/4).
      sqMm = (Math.PI * w * h) / 4;
      break;
  }
  return sqMm / SQ_MM_PER_SQ_IN;
}

/**
 * The areas a product's minimum letter heights depend on: the principal display panel is the front
 * label; the labelling surface is every label the product carries (two with the `panels` layout).
 * The labels stand in for the package: Batchproof does not know the container's own surface.
 */
export function labelAreas(stock: LabelStock, layout: LabelLayout): LabelAreas {
  const one = labelAreaSqIn(stock);
  return { pdpAreaSqIn: one, labellingAreaSqIn: layout === 'panels' ? 2 * one : one };
}

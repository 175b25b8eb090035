import type { ComplianceMarket } from '../reference-data/reference-row';
import type { LabelContentInput } from './label-content-builder';
import type { MissingLabelElementRecord } from './label-run-api';
import { missingForMarket } from './product-identity';

/**
 * What a market's label still lacks before it may be printed: the product identity's gaps, the
 * business address, the net quantity and, for the EU and UK, the lot code. The 409
 * `label_incomplete` lists these; each names the field to fill in and the rule that asks for it.
 */

/** Where each rule checked here comes from. */
export const LABEL_ELEMENT_SOURCES = {
  netQuantity: {
    US: '21 CFR 701.13 (Fair Packaging and Labeling Act)',
    EU: 'Regulation (EC) No 1223/2009, Art. 19(1)(b)',
    UK: 'UK Cosmetics Regulation (retained Regulation (EC) No 1223/2009), Art. 19(1)(b)',
    CA: 'Consumer Packaging and Labelling Act and Regulations: net quantity on the principal display panel (from memory)',
  },
  businessAddress: {
    US: '21 CFR 701.12',
    CA: 'Cosmetic Regulations (C.R.C., c. 869): name and address of the manufacturer or distributor (from memory)',
  },
  lotCode: {
    EU: 'Regulation (EC) No 1223/2009, Art. 19(1)(e)',
    UK: 'UK Cosmetics Regulation (retained Regulation (EC) No 1223/2009), Art. 19(1)(e)',
  },
  evaluated: 'Batchproof: a label carries the engine’s declaration and warnings for its market',
} as const;

/**
 * The elements `market`'s label lacks, in the order to fill them in; empty when it is complete.
 * The business address is asked for on US and Canadian labels only: on EU and UK labels the name
 * and address the law asks for are the responsible person's (Art. 19(1)(a)).
 */
export function missingLabelElements(input: LabelContentInput): MissingLabelElementRecord[] {
  const { market, evaluation, identity } = input;
  const missing: MissingLabelElementRecord[] = [];
  const add = (field: string, item: string, source: string) =>
    missing.push({ market, field, item, source });

  if (!evaluation.declarations[market])
    add(
      'profile.markets',
      `This version was not checked for ${marketName(market)}: add the market to the product profile and release a new version`,
      LABEL_ELEMENT_SOURCES.evaluated,
    );
  const englishWarnings = evaluation.warnings[market] ?? [];
  for (const gap of missingForMarket(identity, market, { englishWarnings }))
    add(`identity.${gap.field}`, gap.item, gap.source);
  if (!input.workshop.address && (market === 'US' || market === 'CA'))
    add(
      'workshop.address',
      'The business’s postal address (name and place of business)',
      LABEL_ELEMENT_SOURCES.businessAddress[market],
    );
  if (!input.netQuantity)
    add(
      'netQuantity',
      'The net quantity of contents, in the product profile',
      LABEL_ELEMENT_SOURCES.netQuantity[market],
    );
  if (!input.lotCode && (market === 'EU' || market === 'UK'))
    add('lotCode', 'The lot (batch) code', LABEL_ELEMENT_SOURCES.lotCode[market]);
  return missing;
}

function marketName(market: ComplianceMarket): string {
  return { US: 'the US', EU: 'the EU', UK: 'the UK', CA: 'Canada' }[market];
}

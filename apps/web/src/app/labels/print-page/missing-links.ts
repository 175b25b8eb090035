import type { MissingLabelElementRecord } from '@batchproof/shared';
import { MARKETS } from '../../formulas/product-types';

/** Where a missing element is filled in: a page and the id of its field, or nowhere. */
export interface FieldLink {
  commands: unknown[];
  fragment?: string;
}

/** One market's missing elements, each with the link to its field. */
export interface MissingGroup {
  market: string;
  marketName: string;
  items: (MissingLabelElementRecord & { link: FieldLink | null })[];
}

/**
 * The link to the field a missing element names: product identity fields open the identity
 * form at the field (`identity.euResponsiblePerson.address` → `#euResponsiblePerson.address`),
 * the business address opens the workshop page at it, the net quantity opens the version's
 * product profile, and the lot code is a field of the print form itself.
 */
export function fieldLink(field: string, formulaId: string, version: number): FieldLink | null {
  if (field.startsWith('identity.')) {
    return { commands: ['/formulas', formulaId, 'identity'], fragment: field.slice(9) };
  }
  if (field.startsWith('workshop.')) return { commands: ['/workshop'], fragment: field };
  if (field === 'netQuantity' || field.startsWith('profile.')) {
    return { commands: ['/formulas', formulaId, 'versions', version] };
  }
  if (field === 'lotCode' || field === 'expiresOn') return { commands: [], fragment: field };
  return null;
}

/** The refusal's missing elements grouped by market, in the order the markets are listed. */
export function missingByMarket(
  missing: readonly MissingLabelElementRecord[],
  formulaId: string,
  version: number,
): MissingGroup[] {
  const names = new Map(MARKETS.map((m) => [m.code as string, m.name]));
  const groups = new Map<string, MissingGroup>();
  for (const item of missing) {
    const group = groups.get(item.market) ?? {
      market: item.market,
      marketName: names.get(item.market) ?? item.market,
      items: [],
    };
    group.items.push({ ...item, link: fieldLink(item.field, formulaId, version) });
    groups.set(item.market, group);
  }
  return [...groups.values()];
}

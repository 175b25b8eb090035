import type { EvaluationResult } from '../compliance/evaluation-result-schema';
import { gs1ElementString } from '../compliance/gs1-element-string';
import { netQuantityStatement } from '../compliance/net-quantity-statement';
import type { ComplianceMarket } from '../reference-data/reference-row';
import type {
  LabelAreas,
  LabelBarcode,
  LabelContent,
  LabelField,
  LabelFieldKey,
  LabelPanel,
} from './label-content';
import { bestBeforeMonth, durabilityText } from './label-durability';
import { letterHeightMinimum } from './label-minimums';
import type { ProductIdentity } from './product-identity';

/**
 * Builds one market's label content from the engine's result and the product identity. Texts are
 * taken as they are, never re-derived: the declaration and warnings from the evaluation, the net
 * quantity from `netQuantityStatement`, the barcode's element string from `gs1ElementString`.
 */

/** What one market's label is built from. */
export interface LabelContentInput {
  market: ComplianceMarket;
  /** The engine's result for the released version. */
  evaluation: EvaluationResult;
  /** The formula's product identity, parsed. */
  identity: ProductIdentity;
  /** The workshop (the maker) as printed. */
  workshop: { name: string; address: string | null };
  /** From the version's product profile; null when it names none. */
  netQuantity: { amount: number; unit: 'g' | 'mL' } | null;
  lotCode: string | null;
  /** YYYY-MM-DD. */
  expiresOn: string | null;
  /** YYYY-MM-DD, the run's day: a shelf life counts from here. */
  madeOn: string;
  areas: LabelAreas;
}

/** How a field sits on a label, the same in every market. */
interface FieldLayout {
  readonly name: string;
  readonly frontOnly: boolean;
  readonly onSmallLabel: boolean;
}

/**
 * Each field's UI name and placement, in the order of `LABEL_FIELD_KEYS` (the order a single label
 * prints them; read from here so this file needs nothing from label-content.ts at run time). The product name (and its French form) and the net quantity
 * belong on the principal display panel (21 CFR 701.11, 701.13; Canada: CPLR, from memory); the rest
 * may go on either panel. A small label keeps what must be on the pack itself: name, net quantity,
 * lot, durability and who answers for the product; the rest goes on the outer pack, a tag or a card
 * (Regulation (EC) No 1223/2009, Art. 19(2) and (4) for ingredients and precautions).
 */
const LAYOUT: Record<LabelFieldKey, FieldLayout> = {
  productName: { name: 'Product name', frontOnly: true, onSmallLabel: true },
  productNameFr: { name: 'Product name (French)', frontOnly: true, onSmallLabel: true },
  netQuantity: { name: 'Net quantity', frontOnly: true, onSmallLabel: true },
  ingredients: { name: 'Ingredients', frontOnly: false, onSmallLabel: false },
  warnings: { name: 'Warnings', frontOnly: false, onSmallLabel: false },
  warningsFr: { name: 'Warnings (French)', frontOnly: false, onSmallLabel: false },
  directions: { name: 'Directions', frontOnly: false, onSmallLabel: false },
  directionsFr: { name: 'Directions (French)', frontOnly: false, onSmallLabel: false },
  business: { name: 'Business name and address', frontOnly: false, onSmallLabel: true },
  // FD&C Act §609(a): on the label itself, so on a small label too
  adverseEventContact: { name: 'Adverse-event contact', frontOnly: false, onSmallLabel: true },
  // Regulation (EC) No 1223/2009, Art. 19(1)(a): on the container, whatever its size
  responsiblePerson: { name: 'Responsible person', frontOnly: false, onSmallLabel: true },
  lot: { name: 'Lot code', frontOnly: false, onSmallLabel: true },
  durability: { name: 'Durability', frontOnly: false, onSmallLabel: true },
  productCode: { name: 'Product code', frontOnly: false, onSmallLabel: false },
};

const FRONT_ONLY: readonly LabelPanel[] = ['front'];
const EITHER: readonly LabelPanel[] = ['front', 'back'];

/** What a field carries beyond its text, when it differs from the field's usual. */
type FieldText = { text: string; bold?: boolean; name?: string; note?: string };

function joinPresent(parts: readonly (string | null | undefined)[], separator: string): string {
  return parts.filter((p): p is string => !!p).join(separator);
}

/** `Report adverse events: 1-800-555-0100 · 1 Main St, Springfield, IL 62701 · example.com/safety`. */
function adverseEventText(identity: ProductIdentity): string | null {
  const { phone, address, website } = identity.usAdverseEventContact;
  const contact = joinPresent([phone, address, website], ' · ');
  return contact ? `Report adverse events: ${contact}` : null;
}

/** `Responsible person: <name>, <address>` for the EU or UK, or null when neither is known. */
function responsiblePersonText(market: ComplianceMarket, identity: ProductIdentity): string | null {
  const person =
    market === 'EU'
      ? identity.euResponsiblePerson
      : market === 'UK'
        ? identity.ukResponsiblePerson
        : null;
  const text = person ? joinPresent([person.name, person.address], ', ') : '';
  return text ? `Responsible person: ${text}` : null;
}

/** The engine's declaration for the market; a label never makes up its own. */
function declarationText(evaluation: EvaluationResult, market: ComplianceMarket): string {
  const declaration = evaluation.declarations[market];
  if (!declaration)
    throw new RangeError(
      `The evaluation has no declaration for ${market}: evaluate the version for that market first`,
    );
  return declaration.text;
}

/** Every field's text for the market; a field without text is left off the label. */
function fieldTexts(input: LabelContentInput): Partial<Record<LabelFieldKey, FieldText>> {
  const { market, evaluation, identity, workshop } = input;
  const french = market === 'CA' ? identity.canadianFrench : null;
  const warnings = evaluation.warnings[market] ?? [];
  const durability = durabilityText(market, identity, input.expiresOn, input.madeOn);
  const texts: Partial<Record<LabelFieldKey, FieldText | null>> = {
    productName: { text: identity.productName },
    productNameFr: french?.productName ? { text: french.productName } : null,
    netQuantity: input.netQuantity
      ? {
          text: netQuantityStatement({ ...input.netQuantity, pdpAreaSqIn: input.areas.pdpAreaSqIn })
            .byMarket[market],
        }
      : null,
    ingredients: { text: declarationText(evaluation, market) },
    // 21 CFR 740.2(a): warnings in bold
    warnings: warnings.length > 0 ? { text: warnings.join(' '), bold: true } : null,
    warningsFr: french?.warnings ? { text: french.warnings, bold: true } : null,
    directions: identity.directions ? { text: identity.directions } : null,
    directionsFr: french?.directions ? { text: french.directions } : null,
    business: { text: joinPresent([workshop.name, workshop.address], ', ') },
    adverseEventContact: market === 'US' ? toField(adverseEventText(identity)) : null,
    responsiblePerson: toField(responsiblePersonText(market, identity)),
    lot: input.lotCode ? { text: `Lot ${input.lotCode}` } : null,
    durability,
    productCode: { text: `Ref. ${identity.productCode}` },
  };
  return Object.fromEntries(Object.entries(texts).filter(([, v]) => v)) as Partial<
    Record<LabelFieldKey, FieldText>
  >;
}

function toField(text: string | null): FieldText | null {
  return text ? { text } : null;
}

/**
 * On EU and UK labels the name and address the law asks for are the responsible person's
 * (Art. 19(1)(a)); the maker's own stays on the label, but a small label keeps only the responsible
 * person's.
 */
function onSmallLabel(market: ComplianceMarket, key: LabelFieldKey): boolean {
  if (key === 'business' && (market === 'EU' || market === 'UK')) return false;
  return LAYOUT[key].onSmallLabel;
}

/** The lot barcode's element string: (01) GTIN when there is one, (17) expiry or (15) best before, (10) lot. */
function barcode(input: LabelContentInput): LabelBarcode | null {
  const { lotCode, expiresOn, identity, madeOn } = input;
  if (!lotCode) return null;
  const shelfLife = identity.shelfLifeMonths;
  const element = gs1ElementString({
    gtin: identity.gtin ?? undefined,
    lot: lotCode,
    ...(expiresOn
      ? { expiry: expiresOn }
      : shelfLife !== null
        ? { bestBefore: bestBeforeMonth(madeOn, shelfLife) }
        : {}),
  });
  return { hri: element.hri, warnings: element.warnings };
}

/** Everything one market's label carries, in the order a single label prints it. */
export function buildLabelContent(input: LabelContentInput): LabelContent {
  const { market, areas } = input;
  const texts = fieldTexts(input);
  const fields: LabelField[] = [];
  for (const key of Object.keys(LAYOUT) as LabelFieldKey[]) {
    const field = texts[key];
    if (!field) continue;
    const layout = LAYOUT[key];
    fields.push({
      key,
      name: field.name ?? layout.name,
      text: field.text,
      bold: field.bold ?? false,
      allowedPanels: layout.frontOnly ? FRONT_ONLY : EITHER,
      defaultPanel: layout.frontOnly ? 'front' : 'back',
      // 21 CFR 701.13: the US net quantity sits in the bottom 30 % of the principal display panel
      bottomThirtyPercent: key === 'netQuantity' && market === 'US',
      minimum: letterHeightMinimum(market, key, areas),
      onSmallLabel: onSmallLabel(market, key),
      ...(field.note ? { note: field.note } : {}),
    });
  }
  return { market, fields, barcode: barcode(input) };
}

import { addDays } from '../dates/calendar-day';
import { missingForMarket, PRODUCT_IDENTITY_SOURCES } from '../labels/product-identity';
import type { ProductIdentity } from '../labels/product-identity';
import type { ComplianceMarket } from '../reference-data/reference-row';
import type {
  MarketReadiness,
  MarketRecord,
  MarketRecordKind,
  ReadinessItem,
} from './readiness-api';

/** Days after the first sale in Canada by which the notification is due. */
export const CANADA_NOTIFICATION_DAYS = 10; // Cosmetic Regulations (C.R.C., c. 869), s. 30(1) [C]

/** The rule each readiness item rests on, as shown beside it. */
export const READINESS_SOURCES = {
  euAssessment: 'Regulation (EC) No 1223/2009, Art. 10(1) and Annex I (safety report before sale)',
  ukAssessment:
    'UK Cosmetics Regulation (retained Regulation (EC) No 1223/2009), Art. 10 and Annex I',
  euNotification:
    'Regulation (EC) No 1223/2009, Art. 13(1): notified by electronic means (CPNP) prior to placing on the market',
  ukNotification:
    'UK Cosmetics Regulation (Schedule 34 to S.I. 2019/696), Art. 13(1): notified before placing on the market (SCPN)',
  euLabels: 'Regulation (EC) No 1223/2009, Art. 19 (labelling of the product as sold)',
  ukLabels: 'UK Cosmetics Regulation (retained Regulation (EC) No 1223/2009), Art. 19',
  usSubstantiation:
    'FD&C Act §608(a), 21 U.S.C. 364d(a): adequate substantiation of safety, with records',
  usListing:
    'FD&C Act §607(c), 21 U.S.C. 364c(c) (product listing); small businesses exempt under §612, 21 U.S.C. 364h',
  usLabels: 'FD&C Act §602, 21 U.S.C. 362 and 21 CFR Part 701 (labelling of the product as sold)',
  caNotification:
    'Cosmetic Regulations (C.R.C., c. 869), s. 30(1): notification at the latest 10 days after first sale',
  caLabels: 'Cosmetic Regulations (C.R.C., c. 869) (labelling of the product as sold)',
  caNameAddress:
    'Cosmetic Regulations (C.R.C., c. 869), s. 20 (name and address of the manufacturer on the label)',
} as const;

/** What `marketReadiness` needs to know about one product. */
export interface MarketReadinessInput {
  formulaId: string;
  /** The released version's markets. */
  markets: readonly ComplianceMarket[];
  releasedVersionNumber: number;
  /** The formula's latest signed assessment, whichever version it covers; null when none is signed. */
  signedAssessment: { id: string; versionNumber: number } | null;
  /** Markets for which labels were printed from the released version. */
  labelRunMarkets: readonly ComplianceMarket[];
  /** The maker's notification and listing records for this formula. */
  records: readonly MarketRecord[];
  /** The product identity, or null when not entered yet. */
  identity: ProductIdentity | null;
  /** Whether the workshop's postal address is filled in (it prints on every label). */
  workshopAddressPresent: boolean;
  /** Today as `YYYY-MM-DD` (UTC calendar day). */
  today: string;
}

function item(
  key: string,
  label: string,
  done: boolean,
  detail: string | null,
  link: string | null,
  source: string,
): ReadinessItem {
  return { key, label, done, detail: done ? null : detail, link, source };
}

function reference(records: readonly MarketRecord[], kind: MarketRecordKind): MarketRecord | null {
  return records.find((r) => r.kind === kind) ?? null;
}

const hasReference = (record: MarketRecord | null) => (record?.reference ?? '').trim().length > 0;

function assessmentItem(input: MarketReadinessInput, source: string): ReadinessItem {
  const { signedAssessment: signed, releasedVersionNumber: n } = input;
  const done = signed !== null && signed.versionNumber === n;
  const detail =
    signed === null
      ? `Version ${n} has no signed safety assessment: share it with your safety assessor`
      : `Version ${n} has no signed safety assessment (version ${signed.versionNumber} was assessed): share version ${n} with your safety assessor`;
  return item(
    'assessment',
    `Safety assessment signed for version ${n}`,
    done,
    detail,
    done ? `/assessments/${signed.id}` : `/formulas/${input.formulaId}`,
    source,
  );
}

function labelsItem(
  input: MarketReadinessInput,
  market: ComplianceMarket,
  source: string,
): ReadinessItem {
  const n = input.releasedVersionNumber;
  return item(
    'labels',
    `Labels printed from version ${n} for ${market}`,
    input.labelRunMarkets.includes(market),
    `No labels for ${market} printed from version ${n} yet`,
    '/labels',
    source,
  );
}

function identityItem(
  input: MarketReadinessInput,
  market: ComplianceMarket,
  key: string,
  label: string,
  fieldPrefix: string,
  source: string,
): ReadinessItem {
  const link = `/formulas/${input.formulaId}/identity`;
  if (input.identity === null)
    return item(key, label, false, 'Product identity not entered yet', link, source);
  const gaps = missingForMarket(input.identity, market).filter((g) =>
    g.field.startsWith(fieldPrefix),
  );
  return item(key, label, gaps.length === 0, gaps.map((g) => g.item).join('; '), link, source);
}

function notificationItem(
  records: readonly MarketRecord[],
  kind: 'eu-notification' | 'uk-notification',
  label: string,
  source: string,
): ReadinessItem {
  return item(
    'notification',
    label,
    hasReference(reference(records, kind)),
    'Record the notification reference the portal gave you',
    '/readiness',
    source,
  );
}

function euOrUk(input: MarketReadinessInput, market: 'EU' | 'UK'): ReadinessItem[] {
  const eu = market === 'EU';
  const s = READINESS_SOURCES;
  return [
    assessmentItem(input, eu ? s.euAssessment : s.ukAssessment),
    labelsItem(input, market, eu ? s.euLabels : s.ukLabels),
    eu
      ? notificationItem(
          input.records,
          'eu-notification',
          'EU notification (CPNP) recorded',
          s.euNotification,
        )
      : notificationItem(
          input.records,
          'uk-notification',
          'UK notification (SCPN) recorded',
          s.ukNotification,
        ),
    identityItem(
      input,
      market,
      'responsible-person',
      `${market} responsible person named`,
      eu ? 'euResponsiblePerson' : 'ukResponsiblePerson',
      eu
        ? PRODUCT_IDENTITY_SOURCES.euResponsiblePerson
        : PRODUCT_IDENTITY_SOURCES.ukResponsiblePerson,
    ),
  ];
}

function us(input: MarketReadinessInput): ReadinessItem[] {
  const n = input.releasedVersionNumber;
  const signed =
    input.signedAssessment !== null && input.signedAssessment.versionNumber === n
      ? input.signedAssessment
      : null;
  const substantiation = reference(input.records, 'us-substantiation');
  const listing = reference(input.records, 'us-listing');
  const exempt = listing?.smallBusinessExempt === true;
  return [
    item(
      'substantiation',
      'Safety substantiation on file',
      signed !== null || hasReference(substantiation),
      `Record where the safety substantiation for version ${n} is kept, or have version ${n} assessed`,
      signed ? `/assessments/${signed.id}` : '/readiness',
      READINESS_SOURCES.usSubstantiation,
    ),
    labelsItem(input, 'US', READINESS_SOURCES.usLabels),
    item(
      'listing',
      'FDA product listing recorded, or small-business exemption',
      hasReference(listing) || exempt,
      listing?.smallBusinessExempt === false
        ? 'Not exempt as a small business: record the product listing number'
        : 'Record the product listing number, or that the business is exempt as a small business',
      '/readiness',
      READINESS_SOURCES.usListing,
    ),
    identityItem(
      input,
      'US',
      'adverse-event-contact',
      'Label contact for adverse-event reports',
      'usAdverseEventContact',
      PRODUCT_IDENTITY_SOURCES.usAdverseEventContact,
    ),
  ];
}

/** The Canadian notification's due date: 10 days after the first sale. */
export function canadaNotificationDue(firstSaleOn: string): string {
  return addDays(firstSaleOn, CANADA_NOTIFICATION_DAYS);
}

function canadaNotificationDetail(record: MarketRecord | null, today: string): string {
  const first = record?.firstSaleOn ?? null;
  if (first === null)
    return `Record the Cosmetic Notification Form reference: it is due at the latest ${CANADA_NOTIFICATION_DAYS} days after the first sale in Canada`;
  const due = canadaNotificationDue(first);
  return today > due
    ? `Overdue: it was due by ${due}, ${CANADA_NOTIFICATION_DAYS} days after the first sale on ${first}`
    : `Due by ${due}: ${CANADA_NOTIFICATION_DAYS} days after the first sale on ${first}`;
}

function ca(input: MarketReadinessInput): ReadinessItem[] {
  const record = reference(input.records, 'ca-notification');
  return [
    labelsItem(input, 'CA', READINESS_SOURCES.caLabels),
    item(
      'notification',
      'Canadian notification (Cosmetic Notification Form) recorded',
      hasReference(record),
      canadaNotificationDetail(record, input.today),
      '/readiness',
      READINESS_SOURCES.caNotification,
    ),
    item(
      'name-address',
      'Name and address on the label',
      input.workshopAddressPresent,
      "Enter the workshop's postal address: it prints on every label",
      '/workshop',
      READINESS_SOURCES.caNameAddress,
    ),
  ];
}

/**
 * What each market of a product still needs before it is sold, as far as Batchproof can tell, each
 * item with its rule and where it is done. Pure: the API gathers the input.
 */
export function marketReadiness(input: MarketReadinessInput): MarketReadiness[] {
  return input.markets.map((market) => {
    const items =
      market === 'EU' || market === 'UK'
        ? euOrUk(input, market)
        : market === 'US'
          ? us(input)
          : ca(input);
    return { market, complete: items.every((i) => i.done), items };
  });
}

import {
  addDays,
  missingForMarket,
  PRODUCT_IDENTITY_SOURCES,
  type ComplianceMarket,
  type MarketReadiness,
  type MarketRecord,
  type MarketRecordKind,
  type ProductIdentity,
  type ReadinessItem,
} from '@batchproof/shared';
import { ASSESSMENT_SOURCES } from './assessment-findings';

/**
 * What the API gathers about one product for market readiness, and the rules that turn it into
 * each market's items. The rules are pure; the shared `marketReadiness` takes them over once it
 * exists, and this file then only adapts what is gathered to its input.
 */
export interface ReadinessFacts {
  formulaId: string;
  versionId: string;
  versionNumber: number;
  /** The released version's markets. */
  markets: readonly ComplianceMarket[];
  /** The released version's signed assessment, if any. */
  signedAssessment: { id: string } | null;
  /** The newest signed assessment of any version of the formula, if any. */
  lastSigned: { id: string; versionNumber: number } | null;
  /** Markets labels were printed for from the released version (runs whose PDF was made). */
  printedMarkets: readonly ComplianceMarket[];
  records: Partial<Record<MarketRecordKind, MarketRecord>>;
  identity: ProductIdentity | null;
  /** The workshop's name and address as printed on labels. */
  workshop: { name: string | null; address: string | null };
  /** The day (YYYY-MM-DD) readiness is worked out for. */
  today: string;
}

/** Where each requirement rests. */
export const READINESS_SOURCES = {
  ...ASSESSMENT_SOURCES,
  // Art. 19(1): labelling of the containers and packaging (legislation.gov.uk, eur/2009/1223).
  euLabels: 'Regulation (EC) No 1223/2009, Art. 19',
  ukLabels: 'UK Cosmetics Regulation (retained Regulation (EC) No 1223/2009), Art. 19',
  // Art. 13: notification before placing on the market (CPNP; UK: SCPN). From memory.
  euNotification: 'Regulation (EC) No 1223/2009, Art. 13 (Cosmetic Products Notification Portal)',
  ukNotification:
    'UK Cosmetics Regulation (retained Regulation (EC) No 1223/2009), Art. 13 (Submit Cosmetic Product Notification)',
  // MoCRA sections as quoted by secondary sources (C2): §608 safety substantiation, §607 listing,
  // §612 small businesses not subject to §606 or §607.
  usSubstantiation: 'FD&C Act §608, 21 U.S.C. 364d (safety substantiation)',
  usListing:
    'FD&C Act §607, 21 U.S.C. 364c (product listing); small businesses: §612, 21 U.S.C. 364h',
  usLabels: 'FD&C Act §609 and 21 CFR 701',
  // Cosmetic Regulations s. 30(1), read at laws-lois.justice.gc.ca: "at the latest 10 days after
  // the manufacturer or importer first sells a cosmetic".
  caNotification: 'Cosmetic Regulations (C.R.C., c. 869), s. 30(1)',
  caLabels: 'Cosmetic Regulations (C.R.C., c. 869), ss. 17 to 24',
  // s. 30(2)(a) names "the name and address of the manufacturer that appears on the label of the
  // cosmetic in accordance with section 20".
  caNameAddress: 'Cosmetic Regulations (C.R.C., c. 869), s. 20',
} as const;

/** Days after the first sale in Canada within which the notification is due (s. 30(1)). */
export const CA_NOTIFICATION_DAYS = 10;

const MARKET_NAME: Record<ComplianceMarket, string> = {
  EU: 'the EU',
  UK: 'the UK',
  US: 'the US',
  CA: 'Canada',
};

type Rule = (f: ReadinessFacts, market: ComplianceMarket) => ReadinessItem;

const item = (
  key: string,
  label: string,
  done: boolean,
  missing: string,
  link: string | null,
  source: string,
): ReadinessItem => ({ key, label, done, detail: done ? null : missing, link, source });

const assessmentSigned: Rule = (f, market) =>
  item(
    'assessment',
    `Safety assessment signed for version ${f.versionNumber}`,
    f.signedAssessment !== null,
    f.lastSigned
      ? `Version ${f.versionNumber} has no signed safety assessment; version ${f.lastSigned.versionNumber} was assessed`
      : `Version ${f.versionNumber} has no signed safety assessment: share it with a safety assessor`,
    f.signedAssessment ? `/assessments/${f.signedAssessment.id}` : `/formulas/${f.formulaId}`,
    READINESS_SOURCES[market as 'EU' | 'UK'],
  );

const labelsPrinted: Rule = (f, market) =>
  item(
    'labels',
    `Labels printed from version ${f.versionNumber}`,
    f.printedMarkets.includes(market),
    `No labels for ${MARKET_NAME[market]} printed from version ${f.versionNumber} yet`,
    '/labels',
    {
      EU: READINESS_SOURCES.euLabels,
      UK: READINESS_SOURCES.ukLabels,
      US: READINESS_SOURCES.usLabels,
      CA: READINESS_SOURCES.caLabels,
    }[market],
  );

const reference = (f: ReadinessFacts, kind: MarketRecordKind) => f.records[kind]?.reference ?? null;

const notification =
  (kind: 'eu-notification' | 'uk-notification', portal: string, source: string): Rule =>
  (f) =>
    item(
      'notification',
      `Notification reference recorded (${portal})`,
      reference(f, kind) !== null,
      `Notify the product on ${portal} and record its reference here`,
      '/readiness',
      source,
    );

const identityItem =
  (key: string, label: string, field: string, source: string): Rule =>
  (f, market) => {
    const gaps = f.identity
      ? missingForMarket(f.identity, market).filter((g) => g.field.startsWith(field))
      : null;
    return item(
      key,
      label,
      gaps !== null && gaps.length === 0,
      gaps === null
        ? 'Enter the product identity of this formula'
        : gaps.map((g) => g.item).join('; '),
      `/formulas/${f.formulaId}/identity`,
      source,
    );
  };

const usSubstantiation: Rule = (f) =>
  item(
    'substantiation',
    'Safety substantiation on file',
    f.signedAssessment !== null || reference(f, 'us-substantiation') !== null,
    `Keep a record that substantiates the product's safety: a signed safety assessment of version ${f.versionNumber}, or record where the substantiation is filed`,
    f.signedAssessment ? `/assessments/${f.signedAssessment.id}` : '/readiness',
    READINESS_SOURCES.usSubstantiation,
  );

const usListing: Rule = (f) => {
  const listing = f.records['us-listing'];
  const exempt = listing?.smallBusinessExempt === true;
  return item(
    'listing',
    exempt ? 'Product listing: exempt as a small business' : 'Product listing reference recorded',
    exempt || (listing?.reference ?? null) !== null,
    'List the product with FDA and record the listing number, or record that the business is exempt as a small business',
    '/readiness',
    READINESS_SOURCES.usListing,
  );
};

const caNotification: Rule = (f) => {
  const record = f.records['ca-notification'];
  const done = (record?.reference ?? null) !== null;
  let missing =
    'Send the Cosmetic Notification Form within 10 days of the first sale in Canada and record its reference';
  if (!done && record?.firstSaleOn) {
    const due = addDays(record.firstSaleOn, CA_NOTIFICATION_DAYS);
    missing =
      due < f.today
        ? `Overdue: was due by ${due}, 10 days after the first sale on ${record.firstSaleOn}`
        : `Due by ${due}: 10 days after the first sale on ${record.firstSaleOn}`;
  }
  return item(
    'notification',
    'Cosmetic Notification Form reference recorded',
    done,
    missing,
    '/readiness',
    READINESS_SOURCES.caNotification,
  );
};

const caNameAddress: Rule = (f) =>
  item(
    'name-address',
    'Name and address on the label',
    !!f.workshop.name && !!f.workshop.address,
    "Enter the workshop's name and address as printed on labels",
    '/workshop',
    READINESS_SOURCES.caNameAddress,
  );

const RULES: Record<ComplianceMarket, readonly Rule[]> = {
  EU: [
    assessmentSigned,
    labelsPrinted,
    notification('eu-notification', 'the EU notification portal', READINESS_SOURCES.euNotification),
    identityItem(
      'responsible-person',
      'EU responsible person named',
      'euResponsiblePerson',
      PRODUCT_IDENTITY_SOURCES.euResponsiblePerson,
    ),
  ],
  UK: [
    assessmentSigned,
    labelsPrinted,
    notification(
      'uk-notification',
      'the UK notification service',
      READINESS_SOURCES.ukNotification,
    ),
    identityItem(
      'responsible-person',
      'UK responsible person named',
      'ukResponsiblePerson',
      PRODUCT_IDENTITY_SOURCES.ukResponsiblePerson,
    ),
  ],
  US: [
    usSubstantiation,
    labelsPrinted,
    usListing,
    identityItem(
      'adverse-event-contact',
      'Label contact for adverse-event reports',
      'usAdverseEventContact',
      PRODUCT_IDENTITY_SOURCES.usAdverseEventContact,
    ),
  ],
  CA: [labelsPrinted, caNotification, caNameAddress],
};

/** Each market of the released version with what is in place and what is missing. */
export function readinessOf(f: ReadinessFacts): MarketReadiness[] {
  return f.markets.map((market) => {
    const items = RULES[market].map((rule) => rule(f, market));
    return { market, complete: items.every((i) => i.done), items };
  });
}

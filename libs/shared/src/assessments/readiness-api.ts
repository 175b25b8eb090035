import * as z from 'zod';
import { complianceMarketSchema, type ComplianceMarket } from '../reference-data/reference-row';
import { optionalIsoDate, optionalText } from '../records/record-fields';

/**
 * Market readiness (`GET /api/readiness`, `PUT /api/readiness/:formulaId/records/:kind`): per
 * product and market, what must be in place before it is sold, as far as Batchproof can tell, and
 * what is missing with a link to where it is done. The maker records the references; Batchproof
 * never submits anything to an authority.
 */

/** References the maker records from the authorities' own portals and forms. */
export const MARKET_RECORD_KINDS = [
  'eu-notification',
  'uk-notification',
  'us-listing',
  'us-substantiation',
  'ca-notification',
] as const;
export const marketRecordKindSchema = z.enum(MARKET_RECORD_KINDS, {
  error: 'Choose one of the notification or listing kinds',
});
export type MarketRecordKind = z.infer<typeof marketRecordKindSchema>;

/** Which market each kind belongs to. */
export const MARKET_RECORD_MARKET: Record<MarketRecordKind, ComplianceMarket> = {
  'eu-notification': 'EU',
  'uk-notification': 'UK',
  'us-listing': 'US',
  'us-substantiation': 'US',
  'ca-notification': 'CA',
};

/** `PUT /api/readiness/:formulaId/records/:kind`: what the maker records. */
export const marketRecordInputSchema = z.object({
  /** The reference the portal or form gave (notification number, listing number, file name). */
  reference: optionalText('Reference', 200),
  /** When it was submitted or recorded. */
  recordedOn: optionalIsoDate('Date recorded'),
  /** Canada: the first day the product was sold there (starts the 10-day clock). */
  firstSaleOn: optionalIsoDate('First sale in Canada'),
  /**
   * US listing: the owner's answer to "is this business exempt from listing as a small business
   * (FD&C Act §612)?" Null when not answered.
   */
  smallBusinessExempt: z.boolean({ error: 'Answer yes or no' }).nullable().default(null),
  notes: optionalText('Notes', 2000),
});
export type MarketRecordInput = z.input<typeof marketRecordInputSchema>;
export type MarketRecordParsed = z.output<typeof marketRecordInputSchema>;

export const marketRecordSchema = z.object({
  kind: marketRecordKindSchema,
  reference: z.string().nullable(),
  recordedOn: z.string().nullable(),
  firstSaleOn: z.string().nullable(),
  smallBusinessExempt: z.boolean().nullable(),
  notes: z.string().nullable(),
  updatedAt: z.string(),
});
export type MarketRecord = z.infer<typeof marketRecordSchema>;

/** One requirement of one market for one product. */
export const readinessItemSchema = z.object({
  key: z.string(),
  /** Plain words: "Safety assessment signed for version 3". */
  label: z.string(),
  done: z.boolean(),
  /** What is missing or due, when not done (e.g. "Due by 2026-12-11: 10 days after first sale"). */
  detail: z.string().nullable(),
  /** Where it is done, as an app path (e.g. `/assessments/…`), when there is a place for it. */
  link: z.string().nullable(),
  /** The rule it rests on. */
  source: z.string(),
});
export type ReadinessItem = z.infer<typeof readinessItemSchema>;

export const marketReadinessSchema = z.object({
  market: complianceMarketSchema,
  complete: z.boolean(),
  items: z.array(readinessItemSchema),
});
export type MarketReadiness = z.infer<typeof marketReadinessSchema>;

export const productReadinessSchema = z.object({
  formulaId: z.string(),
  formulaName: z.string(),
  productType: z.string(),
  /** The released version the readiness is about; null when none is released. */
  versionId: z.string().nullable(),
  versionNumber: z.number().int().nullable(),
  markets: z.array(marketReadinessSchema),
  records: z.array(marketRecordSchema),
});
export type ProductReadiness = z.infer<typeof productReadinessSchema>;

export const readinessListSchema = z.object({ items: z.array(productReadinessSchema) });
export type ReadinessList = z.infer<typeof readinessListSchema>;

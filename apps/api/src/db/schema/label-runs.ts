import {
  date,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from 'drizzle-orm/pg-core';
import type {
  ComplianceMarket,
  LabelContent,
  LabelFieldKey,
  LabelLayout,
  LabelPanel,
  LabelStock,
  LotBarcode,
  MissingLabelElementRecord,
  ProductIdentity,
} from '@batchproof/shared';
import { bytea, id, timestamps, workshopKey, workshopReference } from './columns';
import { batches } from './batches';
import { formulas, formulaVersions } from './formulas';
import { members } from './users';
import { workshops } from './workshops';

/**
 * A formula's product identity: what its labels carry beyond the engine's output (name, code,
 * durability, contacts, French text), checked with the shared `productIdentitySchema`. One per
 * formula; every version's labels use it.
 */
export const productIdentities = pgTable(
  'product_identities',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    formulaId: uuid().notNull(),
    identity: jsonb().$type<ProductIdentity>().notNull(),
    updatedBy: uuid(),
    ...timestamps,
  },
  (t) => [
    uniqueIndex('product_identities_formula_key').on(t.workshopId, t.formulaId),
    workshopKey('product_identities', t),
    workshopReference(
      'product_identities_formula_fk',
      { workshopId: t.workshopId, column: t.formulaId },
      formulas,
      'cascade',
    ),
    workshopReference(
      'product_identities_updated_by_fk',
      { workshopId: t.workshopId, column: t.updatedBy },
      members,
      'set null',
    ),
  ],
);

export const labelRunStatusEnum = pgEnum('label_run_status', ['rendering', 'ready', 'failed']);

/**
 * One print run of a released formula version: what was asked for, and a snapshot of what was
 * printed (the stock's geometry and every market's label content), so the PDF and the public
 * ingredients page show exactly what went on the labels even after the stock or the identity
 * changes. The public page is found by `public_token` (unique index: one lookup).
 */
export const labelRuns = pgTable(
  'label_runs',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    formulaId: uuid().notNull(),
    versionId: uuid().notNull(),
    versionNumber: integer().notNull(),
    /** The formula's name when printed. */
    formulaName: text().notNull(),
    markets: jsonb().$type<ComplianceMarket[]>().notNull(),
    /** A built-in stock's key or the workshop's own stock's id, as chosen. */
    stockId: text().notNull(),
    stock: jsonb().$type<LabelStock>().notNull(),
    layout: text().$type<LabelLayout>().notNull(),
    barcode: text().$type<LotBarcode>().notNull(),
    placement: jsonb().$type<Partial<Record<LabelFieldKey, LabelPanel>>>().notNull(),
    startPosition: integer().notNull(),
    copies: integer().notNull(),
    labelCount: integer().notNull(),
    pageCount: integer().notNull(),
    lotCode: text(),
    expiresOn: date({ mode: 'string' }),
    /** The batch printed for (production prints from batches); null for a run of a version. */
    batchId: uuid(),
    /** Every market's label content as printed, in the order of `markets`. */
    contents: jsonb().$type<LabelContent[]>().notNull(),
    status: labelRunStatusEnum().notNull().default('rendering'),
    progressDone: integer().notNull().default(0),
    progressTotal: integer().notNull(),
    overrideReason: text(),
    overriddenMissing: jsonb().$type<MissingLabelElementRecord[]>().notNull().default([]),
    /** 32 random bytes, base64url: the public ingredients page's address. */
    publicToken: text().notNull(),
    withdrawnAt: timestamp({ withTimezone: true }),
    createdBy: uuid(),
    /** The printer's name when printed, kept after the member leaves. */
    createdByName: text().notNull(),
    ...timestamps,
  },
  (t) => [
    uniqueIndex('label_runs_public_token_key').on(t.publicToken),
    index('label_runs_workshop_formula_idx').on(t.workshopId, t.formulaId, t.createdAt.desc()),
    index('label_runs_workshop_created_idx').on(t.workshopId, t.createdAt.desc()),
    workshopKey('label_runs', t),
    // Restrict: a formula with printed labels has released versions and is archived, not deleted.
    workshopReference(
      'label_runs_formula_fk',
      { workshopId: t.workshopId, column: t.formulaId },
      formulas,
      'restrict',
    ),
    workshopReference(
      'label_runs_version_fk',
      { workshopId: t.workshopId, column: t.versionId },
      formulaVersions,
      'restrict',
    ),
    index('label_runs_batch_idx').on(t.workshopId, t.batchId),
    workshopReference(
      'label_runs_batch_fk',
      { workshopId: t.workshopId, column: t.batchId },
      batches,
      'restrict',
    ),
    workshopReference(
      'label_runs_created_by_fk',
      { workshopId: t.workshopId, column: t.createdBy },
      members,
      'set null',
    ),
  ],
);

/** A run's finished PDF, apart from the run so lists never drag the bytes along. */
export const labelRunPdfs = pgTable(
  'label_run_pdfs',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    runId: uuid().notNull(),
    content: bytea().notNull(),
    ...timestamps,
  },
  (t) => [
    uniqueIndex('label_run_pdfs_run_key').on(t.runId),
    workshopKey('label_run_pdfs', t),
    workshopReference(
      'label_run_pdfs_run_fk',
      { workshopId: t.workshopId, column: t.runId },
      labelRuns,
      'cascade',
    ),
  ],
);

/** A print run as stored. */
export type LabelRunRow = typeof labelRuns.$inferSelect;

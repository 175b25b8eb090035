import { sql } from 'drizzle-orm';
import {
  index,
  integer,
  jsonb,
  numeric,
  pgEnum,
  pgTable,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from 'drizzle-orm/pg-core';
import { PRODUCT_TYPES, type EvaluationResult, type ProductProfile } from '@batchproof/shared';
import { archivedAt, id, timestamps, workshopKey, workshopReference } from './columns';
import { materials } from './materials';
import { members } from './users';
import { workshops } from './workshops';

export const productTypeEnum = pgEnum('product_type', PRODUCT_TYPES);
export const versionStateEnum = pgEnum('formula_version_state', [
  'draft',
  'released',
  'superseded',
]);

/** A product's recipe; its content lives in numbered versions. */
export const formulas = pgTable(
  'formulas',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    name: text().notNull(),
    productType: productTypeEnum().notNull(),
    notes: text(),
    archivedAt: archivedAt(),
    ...timestamps,
  },
  (t) => [
    index('formulas_workshop_name_idx').on(t.workshopId, t.name),
    index('formulas_workshop_updated_idx').on(t.workshopId, t.updatedAt),
    workshopKey('formulas', t),
  ],
);

/**
 * One version of a formula. At most one draft and one released version per formula (partial
 * unique indexes), so two concurrent releases cannot both win.
 */
export const formulaVersions = pgTable(
  'formula_versions',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    formulaId: uuid().notNull(),
    number: integer().notNull(),
    state: versionStateEnum().notNull().default('draft'),
    profile: jsonb().$type<ProductProfile>().notNull(),
    notes: text(),
    /** The full engine output at the last save or release, so history shows what was checked. */
    evaluation: jsonb().$type<EvaluationResult>(),
    blockCount: integer(),
    warnCount: integer(),
    infoCount: integer(),
    evaluationProblems: jsonb().$type<string[]>().notNull().default([]),
    evaluatedAt: timestamp({ withTimezone: true }),
    releasedAt: timestamp({ withTimezone: true }),
    releasedBy: uuid(),
    overrideReason: text(),
    ...timestamps,
  },
  (t) => [
    uniqueIndex('formula_versions_number_key').on(t.formulaId, t.number),
    uniqueIndex('formula_versions_one_draft_key')
      .on(t.formulaId)
      .where(sql`${t.state} = 'draft'`),
    uniqueIndex('formula_versions_one_released_key')
      .on(t.formulaId)
      .where(sql`${t.state} = 'released'`),
    index('formula_versions_workshop_idx').on(t.workshopId),
    workshopKey('formula_versions', t),
    workshopReference(
      'formula_versions_formula_fk',
      { workshopId: t.workshopId, column: t.formulaId },
      formulas,
      'cascade',
    ),
    workshopReference(
      'formula_versions_released_by_fk',
      { workshopId: t.workshopId, column: t.releasedBy },
      members,
      'set null',
    ),
  ],
);

/** One line of a version: a weight of one material. */
export const formulaLines = pgTable(
  'formula_lines',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    versionId: uuid().notNull(),
    position: integer().notNull(),
    // Restrict: a material used in a formula cannot be deleted out from under it.
    materialId: uuid().notNull(),
    grams: numeric({ precision: 18, scale: 6, mode: 'number' }).notNull(),
    ...timestamps,
  },
  (t) => [
    uniqueIndex('formula_lines_position_key').on(t.versionId, t.position),
    index('formula_lines_material_idx').on(t.workshopId, t.materialId),
    workshopKey('formula_lines', t),
    workshopReference(
      'formula_lines_version_fk',
      { workshopId: t.workshopId, column: t.versionId },
      formulaVersions,
      'cascade',
    ),
    workshopReference(
      'formula_lines_material_fk',
      { workshopId: t.workshopId, column: t.materialId },
      materials,
      'restrict',
    ),
  ],
);

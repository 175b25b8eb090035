import { sql } from 'drizzle-orm';
import { boolean, index, jsonb, pgEnum, pgTable, text, uuid } from 'drizzle-orm/pg-core';
import {
  MATERIAL_CATEGORIES,
  type AllergenDeclaration,
  type Calibration,
  type IfraCertificate,
  type Material,
  type WeightPerVolume,
} from '@batchproof/shared';
import { archivedAt, id, timestamps, workshopKey, workshopReference } from './columns';
import { suppliers } from './suppliers';
import { workshops } from './workshops';

export const materialCategoryEnum = pgEnum('material_category', MATERIAL_CATEGORIES);

/**
 * A raw material. The certificate data the compliance engine reads (blend components, IFRA
 * maxima, allergen declaration) is stored as JSON documents: it is always read and written whole
 * with its material, and validated by the shared schema on the way in.
 */
export const materials = pgTable(
  'materials',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    supplierId: uuid(),
    tradeName: text().notNull(),
    inci: text().notNull(),
    usName: text(),
    cas: text(),
    ec: text(),
    functions: text()
      .array()
      .notNull()
      .default(sql`'{}'::text[]`),
    category: materialCategoryEnum().notNull(),
    /** Whether the material is a nanomaterial (EU and UK ingredient lists print "(nano)" after it). */
    nano: boolean().notNull().default(false),
    notes: text(),
    colourIndex: text(),
    components: jsonb().$type<Material['components']>().notNull().default([]),
    ifraCertificate: jsonb().$type<IfraCertificate>(),
    allergenDeclaration: jsonb().$type<AllergenDeclaration>(),
    weightPerVolume: jsonb().$type<WeightPerVolume>().notNull().default({}),
    calibrations: jsonb().$type<Calibration[]>().notNull().default([]),
    /**
     * The fields the list's text filter reads, lower-cased into one column: one LIKE per row in
     * place of four ILIKEs (a scan is 3 to 5 times faster), and one trigram index to serve it.
     */
    searchText: text().generatedAlwaysAs(
      sql`lower(trade_name || E'\\n' || inci || E'\\n' || coalesce(us_name, '') || E'\\n' || coalesce(cas, ''))`,
    ),
    /**
     * The INCI names of a blend's components, lower-cased, for the same filter: a match here only
     * ranks below a match in `searchText` (the material's own names). The JSON text of the list,
     * since a generated column cannot aggregate; a query naming a quote or backslash misses it.
     */
    componentSearchText: text().generatedAlwaysAs(
      sql`lower(jsonb_path_query_array(components, '$[*].inci')::text)`,
    ),
    archivedAt: archivedAt(),
    ...timestamps,
  },
  (t) => [
    index('materials_workshop_trade_name_idx').on(t.workshopId, t.tradeName, t.id),
    index('materials_workshop_inci_idx').on(t.workshopId, t.inci, t.id),
    index('materials_workshop_category_idx').on(t.workshopId, t.category, t.tradeName),
    index('materials_workshop_updated_idx').on(t.workshopId, t.updatedAt),
    index('materials_workshop_created_idx').on(t.workshopId, t.createdAt),
    index('materials_supplier_idx').on(t.supplierId),
    // Trigram indexes (pg_trgm, migration 0003) for the list's "contains" filter.
    index('materials_trade_name_trgm_idx').using('gin', sql`${t.tradeName} gin_trgm_ops`),
    index('materials_inci_trgm_idx').using('gin', sql`${t.inci} gin_trgm_ops`),
    index('materials_search_text_trgm_idx').using('gin', sql`${t.searchText} gin_trgm_ops`),
    index('materials_component_search_text_trgm_idx').using(
      'gin',
      sql`${t.componentSearchText} gin_trgm_ops`,
    ),
    workshopKey('materials', t),
    // Restrict: a supplier that materials name is archived, not deleted out from under them.
    workshopReference(
      'materials_supplier_fk',
      { workshopId: t.workshopId, column: t.supplierId },
      suppliers,
      'restrict',
    ),
  ],
);

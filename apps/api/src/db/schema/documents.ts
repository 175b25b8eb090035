import { sql } from 'drizzle-orm';
import {
  check,
  date,
  index,
  integer,
  pgEnum,
  pgTable,
  text,
  uniqueIndex,
  uuid,
} from 'drizzle-orm/pg-core';
import { DOCUMENT_KINDS } from '@batchproof/shared';
import { archivedAt, bytea, id, timestamps, workshopKey, workshopReference } from './columns';
import { lots } from './lots';
import { materials } from './materials';
import { members } from './users';
import { workshops } from './workshops';

export const documentKindEnum = pgEnum('document_kind', DOCUMENT_KINDS);

/**
 * A supplier document with its file. The bytes live in the same row as the metadata, so one
 * database backup holds everything and a failed insert leaves nothing behind.
 */
export const documents = pgTable(
  'documents',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    materialId: uuid(),
    lotId: uuid(),
    kind: documentKindEnum().notNull(),
    title: text().notNull(),
    issuedOn: date({ mode: 'string' }).notNull(),
    version: text(),
    filename: text().notNull(),
    mimeType: text().notNull(),
    sizeBytes: integer().notNull(),
    sha256: text().notNull(),
    content: bytea().notNull(),
    uploadedBy: uuid(),
    /**
     * The older document of the same material or lot this one replaced. The old one stays on
     * file as history (superseded); it cannot be deleted while this one points at it.
     */
    replacesId: uuid(),
    archivedAt: archivedAt(),
    ...timestamps,
  },
  (t) => [
    check('documents_one_owner', sql`num_nonnulls(${t.materialId}, ${t.lotId}) = 1`),
    index('documents_material_idx').on(t.workshopId, t.materialId, t.kind),
    index('documents_lot_idx').on(t.workshopId, t.lotId),
    workshopKey('documents', t),
    // Restrict: a material's documents are its compliance history; delete them first, or archive.
    workshopReference(
      'documents_material_fk',
      { workshopId: t.workshopId, column: t.materialId },
      materials,
      'restrict',
    ),
    // One replacement per document, so two concurrent replacements cannot both win.
    uniqueIndex('documents_replaces_key')
      .on(t.workshopId, t.replacesId)
      .where(sql`${t.replacesId} is not null`),
    workshopReference(
      'documents_replaces_fk',
      { workshopId: t.workshopId, column: t.replacesId },
      t,
      'restrict',
    ),
    workshopReference(
      'documents_lot_fk',
      { workshopId: t.workshopId, column: t.lotId },
      lots,
      'cascade',
    ),
    workshopReference(
      'documents_uploaded_by_fk',
      { workshopId: t.workshopId, column: t.uploadedBy },
      members,
      'set null',
    ),
  ],
);

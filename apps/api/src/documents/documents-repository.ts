import { and, desc, eq, inArray, isNull, sql, type SQL } from 'drizzle-orm';
import type { DocumentKind } from '@batchproof/shared';
import type { Database } from '../db/database';
import { documents, lots, materials } from '../db/schema';
import { unlessArchived } from '../housekeeping/archiving';

// Spelled out in full: in a single-table select Drizzle renders `${documents.id}` as a bare "id",
// which inside the subquery would mean the newer document's own id.
const outer = { id: sql.raw('"documents"."id"'), workshopId: sql.raw('"documents"."workshop_id"') };
/** The newer document that replaced this one (one at most: a unique index), or null. */
const supersededById = sql<
  string | null
>`(select newer.id from ${documents} as newer where newer.workshop_id = ${outer.workshopId} and newer.replaces_id = ${outer.id})`;
/** Whether no newer document replaced this one. */
const notSuperseded = sql`not exists (select 1 from ${documents} as newer where newer.workshop_id = ${outer.workshopId} and newer.replaces_id = ${outer.id})`;
/**
 * Whether a document is in use: not archived and not replaced by a newer one. Only these count
 * towards a material's document status and the home page. For selects from `documents` alone.
 */
export const documentInUse = () => and(isNull(documents.archivedAt), notSuperseded);

/** Metadata only: the bytes are read by {@link findDocumentContent} and nowhere else. */
const metaColumns = {
  id: documents.id,
  kind: documents.kind,
  title: documents.title,
  issuedOn: documents.issuedOn,
  version: documents.version,
  materialId: documents.materialId,
  lotId: documents.lotId,
  filename: documents.filename,
  mimeType: documents.mimeType,
  sizeBytes: documents.sizeBytes,
  sha256: documents.sha256,
  replacesId: documents.replacesId,
  supersededById,
  archivedAt: documents.archivedAt,
  createdAt: documents.createdAt,
  updatedAt: documents.updatedAt,
};
/** A document's metadata as stored. */
export type DocumentMeta = Awaited<ReturnType<typeof findDocument>> & object;

/** Everything a new document row holds, bytes included. */
export type NewDocument = Omit<typeof documents.$inferInsert, 'id' | 'createdAt' | 'updatedAt'>;

/** Inserts metadata and bytes in one statement: it succeeds whole or leaves nothing. */
export async function insertDocument(db: Database, row: NewDocument) {
  const [created] = await db.insert(documents).values(row).returning(metaColumns);
  return created!;
}

export async function listDocuments(
  db: Database,
  workshopId: string,
  owner: { materialId?: string; lotId?: string; includeArchived?: boolean },
) {
  const conditions: (SQL | undefined)[] = [
    eq(documents.workshopId, workshopId),
    unlessArchived(documents.archivedAt, owner.includeArchived ?? false),
  ];
  if (owner.materialId) conditions.push(eq(documents.materialId, owner.materialId));
  if (owner.lotId) conditions.push(eq(documents.lotId, owner.lotId));
  return db
    .select(metaColumns)
    .from(documents)
    .where(and(...conditions))
    .orderBy(desc(documents.issuedOn), desc(documents.createdAt));
}

/**
 * The material's documents in use (neither archived nor replaced by a newer one) of the given
 * kinds, newest issue first.
 */
export async function materialDocumentsOfKinds(
  db: Database,
  workshopId: string,
  materialId: string,
  kinds: DocumentKind[],
) {
  return db
    .select(metaColumns)
    .from(documents)
    .where(
      and(
        eq(documents.workshopId, workshopId),
        eq(documents.materialId, materialId),
        inArray(documents.kind, kinds),
        documentInUse(),
      ),
    )
    .orderBy(desc(documents.issuedOn), desc(documents.createdAt));
}

export async function findDocument(db: Database, workshopId: string, id: string) {
  const [row] = await db
    .select(metaColumns)
    .from(documents)
    .where(and(eq(documents.workshopId, workshopId), eq(documents.id, id)));
  return row;
}

export async function findDocumentContent(db: Database, workshopId: string, id: string) {
  const [row] = await db
    .select({
      filename: documents.filename,
      mimeType: documents.mimeType,
      sizeBytes: documents.sizeBytes,
      sha256: documents.sha256,
      content: documents.content,
    })
    .from(documents)
    .where(and(eq(documents.workshopId, workshopId), eq(documents.id, id)));
  return row;
}

export async function deleteDocument(db: Database, workshopId: string, id: string) {
  const [row] = await db
    .delete(documents)
    .where(and(eq(documents.workshopId, workshopId), eq(documents.id, id)))
    .returning({ id: documents.id });
  return row?.id;
}

/** The material's category, when it belongs to the workshop. */
export async function findMaterialCategory(db: Database, workshopId: string, id: string) {
  const [row] = await db
    .select({ category: materials.category })
    .from(materials)
    .where(and(eq(materials.workshopId, workshopId), eq(materials.id, id)));
  return row?.category;
}

/** Whether the lot belongs to the workshop. */
export async function lotExists(db: Database, workshopId: string, id: string) {
  const [row] = await db
    .select({ id: lots.id })
    .from(lots)
    .where(and(eq(lots.workshopId, workshopId), eq(lots.id, id)));
  return row !== undefined;
}

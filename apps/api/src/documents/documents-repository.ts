import { and, desc, eq, inArray, type SQL } from 'drizzle-orm';
import type { DocumentKind } from '@batchproof/shared';
import type { Database } from '../db/database';
import { documents, lots, materials } from '../db/schema';

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
  owner: { materialId?: string; lotId?: string },
) {
  const conditions: SQL[] = [eq(documents.workshopId, workshopId)];
  if (owner.materialId) conditions.push(eq(documents.materialId, owner.materialId));
  if (owner.lotId) conditions.push(eq(documents.lotId, owner.lotId));
  return db
    .select(metaColumns)
    .from(documents)
    .where(and(...conditions))
    .orderBy(desc(documents.issuedOn), desc(documents.createdAt));
}

/** The material's documents of the given kinds, newest issue first. */
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

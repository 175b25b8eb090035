import { createHash } from 'node:crypto';
import { fileTypeFromBuffer } from 'file-type';
import type { z } from 'zod';
import {
  DOCUMENT_MIME_TYPES,
  documentStatusEntries,
  expectedDocumentKinds,
  todayIso,
  type documentUploadSchema,
  type DocumentStatus,
} from '@batchproof/shared';
import type { AuthUser } from '../auth/authenticate';
import { AppError, conflict, notFound } from '../core/app-error';
import { withIsoDates } from '../core/list-paging';
import type { Database } from '../db/database';
import { deleteLogged } from '../housekeeping/deletion';
import * as repo from './documents-repository';
import { safeFilename } from './download-name';

/** The uploaded file as multer's memory storage hands it over. */
export interface UploadedFile {
  originalname: string;
  buffer: Buffer;
  size: number;
}

const fieldError = (field: string, message: string) =>
  new AppError(400, 'validation_failed', 'Some fields need attention.', { [field]: [message] });

/**
 * Stores an uploaded supplier document. The type is decided from the file's first bytes, never
 * its name or the browser's claim, so a renamed executable is refused. Metadata and bytes go in
 * one insert: a request that fails at any point leaves no row.
 */
export async function uploadDocument(
  db: Database,
  actor: AuthUser,
  input: z.output<typeof documentUploadSchema>,
  file: UploadedFile | undefined,
) {
  if (!file || file.size === 0)
    throw fieldError('file', 'Choose a PDF, PNG or JPEG file to upload');
  const detected = await fileTypeFromBuffer(file.buffer);
  if (!detected || !(DOCUMENT_MIME_TYPES as readonly string[]).includes(detected.mime)) {
    throw new AppError(
      415,
      'unsupported_media_type',
      'Upload a PDF, PNG or JPEG file. The file’s contents are not one of these, whatever its name says.',
      { file: ['Upload a PDF, PNG or JPEG file'] },
    );
  }
  if (
    input.materialId &&
    !(await repo.findMaterialCategory(db, actor.workshopId, input.materialId))
  ) {
    throw fieldError('materialId', 'Choose one of this workshop’s materials');
  }
  if (input.lotId && !(await repo.lotExists(db, actor.workshopId, input.lotId))) {
    throw fieldError('lotId', 'Choose one of this workshop’s lots');
  }
  if (input.replacesId) await checkReplaced(db, actor, input);
  const created = await repo.insertDocument(db, {
    workshopId: actor.workshopId,
    materialId: input.materialId ?? null,
    lotId: input.lotId ?? null,
    kind: input.kind,
    title: input.title,
    issuedOn: input.issuedOn,
    version: input.version,
    filename: safeFilename(file.originalname, detected.ext),
    mimeType: detected.mime,
    sizeBytes: file.size,
    sha256: createHash('sha256').update(file.buffer).digest('hex'),
    content: file.buffer,
    uploadedBy: actor.id,
    replacesId: input.replacesId ?? null,
  });
  return withIsoDates(created);
}

/**
 * The document a new one replaces must be one of the same material or lot that nothing has
 * replaced yet: the history is a single line, newest last. (Two replacements racing meet the
 * unique index on `replaces_id`, which answers 409.)
 */
async function checkReplaced(
  db: Database,
  actor: AuthUser,
  input: z.output<typeof documentUploadSchema>,
) {
  const old = await repo.findDocument(db, actor.workshopId, input.replacesId!);
  const sameOwner =
    old &&
    (old.materialId ?? undefined) === input.materialId &&
    (old.lotId ?? undefined) === input.lotId;
  if (!old || !sameOwner) {
    throw fieldError('replacesId', 'Choose a document of the same material or lot to replace');
  }
  if (old.supersededById) {
    throw conflict('A newer document already replaced that one; replace the newer one instead.', {
      replacesId: ['A newer document already replaced this one'],
    });
  }
}

/**
 * The documents of one material or one lot of the caller's workshop, superseded ones included as
 * history, archived ones when asked for; 404 for any other.
 */
export async function listDocuments(
  db: Database,
  actor: AuthUser,
  owner: { materialId?: string; lotId?: string; includeArchived?: boolean },
) {
  if (
    owner.materialId &&
    !(await repo.findMaterialCategory(db, actor.workshopId, owner.materialId))
  ) {
    throw notFound('That material');
  }
  if (owner.lotId && !(await repo.lotExists(db, actor.workshopId, owner.lotId))) {
    throw notFound('That lot');
  }
  const rows = await repo.listDocuments(db, actor.workshopId, owner);
  return { items: rows.map(withIsoDates) };
}

export async function getDocument(db: Database, actor: AuthUser, id: string) {
  const row = await repo.findDocument(db, actor.workshopId, id);
  if (!row) throw notFound('That document');
  return withIsoDates(row);
}

/** The stored file of a document of the caller's workshop. */
export async function getDocumentContent(db: Database, actor: AuthUser, id: string) {
  const row = await repo.findDocumentContent(db, actor.workshopId, id);
  if (!row) throw notFound('That document');
  return row;
}

/**
 * Deletes a document no newer document replaced (a superseded one is the history of the one
 * that replaced it; archive it instead), and logs the deletion. Deleting the newest of a line
 * makes the one it replaced current again.
 */
export async function deleteDocument(db: Database, actor: AuthUser, id: string) {
  await deleteLogged(db, actor, {
    subjectType: 'document',
    label: 'That document',
    id,
    find: (tx) => repo.findDocument(tx, actor.workshopId, id),
    check: (_tx, doc) => {
      if (!doc.supersededById) return;
      throw conflict(
        'This document cannot be deleted: a newer document replaced it and keeps it as its ' +
          'history. Archive it instead, or delete the newer one first.',
      );
    },
    remove: (tx) => repo.deleteDocument(tx, actor.workshopId, id),
    detail: (doc) => ({ title: doc.title, kind: doc.kind, filename: doc.filename }),
  });
}

/**
 * Which documents a material should have on file (a safety data sheet always; an IFRA
 * certificate and allergen declaration for fragrances and essential oils) and whether each is
 * missing, issued more than a year before `now`, or dated after it.
 */
export async function documentStatus(
  db: Database,
  actor: AuthUser,
  materialId: string,
  now: Date,
): Promise<DocumentStatus> {
  const category = await repo.findMaterialCategory(db, actor.workshopId, materialId);
  if (!category) throw notFound('That material');
  const kinds = expectedDocumentKinds(category);
  const docs = await repo.materialDocumentsOfKinds(db, actor.workshopId, materialId, kinds);
  const today = todayIso(now);
  const entries = documentStatusEntries(category, docs.map(withIsoDates), today);
  return {
    materialId,
    asOf: today,
    entries,
    complete: entries.every((e) => e.state === 'current'),
  };
}

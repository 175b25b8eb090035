import { Router } from 'express';
import multer from 'multer';
import {
  DOCUMENT_MAX_BYTES,
  documentListQuerySchema,
  documentUploadSchema,
  ROLE_SETS,
} from '@batchproof/shared';
import type { Authenticator } from '../auth/authenticate';
import { idempotentCreate } from '../core/idempotency';
import { multipart } from '../core/multipart';
import { recordId } from '../core/record-id';
import { parse } from '../core/validate';
import type { Database } from '../db/database';
import { documents } from '../db/schema';
import { archiveRoutes } from '../housekeeping/archiving';
import * as domain from './documents-domain';
import { attachmentDisposition, safeFilename } from './download-name';

// Memory storage: the file goes straight into PostgreSQL, so nothing is left on disk when a
// request fails. The size limit makes multer stop reading and raise LIMIT_FILE_SIZE (413).
// Browsers send the file name as raw UTF-8; multer would read it as latin1 (é.pdf -> Ã©.pdf).
const upload = multer({
  storage: multer.memoryStorage(),
  defParamCharset: 'utf8',
  limits: { fileSize: DOCUMENT_MAX_BYTES, files: 1, fields: 20, fieldSize: 10_000 },
});

/** `/api/documents`: supplier documents on materials and lots. */
export function documentsRouter(deps: { db: Database; authn: Authenticator }) {
  const { db, authn } = deps;
  const router = Router();
  const read = authn.allow(ROLE_SETS.members);
  const write = authn.allow(ROLE_SETS.writers);

  router.get('/', ...read, async (req, res) => {
    const owner = parse(documentListQuerySchema, req.query);
    res.json(await domain.listDocuments(db, req.user!, owner));
  });
  router.post(
    '/',
    ...write,
    multipart(upload.single('file')),
    idempotentCreate(db, (req, tx) =>
      domain.uploadDocument(tx, req.user!, parse(documentUploadSchema, req.body), req.file),
    ),
  );
  router.get('/:id', ...read, async (req, res) => {
    res.json(await domain.getDocument(db, req.user!, recordId(req.params.id, 'That document')));
  });
  router.get('/:id/content', ...read, async (req, res) => {
    const id = recordId(req.params.id, 'That document');
    const file = await domain.getDocumentContent(db, req.user!, id);
    // The type is the one sniffed on upload. Not res.attachment(): it would set the type again
    // from the file name's extension, so `x.html` holding a PDF would go out as text/html.
    res.set({
      'Content-Type': file.mimeType,
      'Content-Length': String(file.sizeBytes),
      'Content-Disposition': attachmentDisposition(safeFilename(file.filename, 'bin')),
      // Stop the browser from second-guessing the type.
      'X-Content-Type-Options': 'nosniff',
      ETag: `"${file.sha256}"`,
    });
    res.end(file.content);
  });
  router.delete('/:id', ...write, async (req, res) => {
    await domain.deleteDocument(db, req.user!, recordId(req.params.id, 'That document'));
    res.status(204).end();
  });
  router.use(
    archiveRoutes(db, write, {
      table: documents,
      subjectType: 'document',
      label: 'That document',
      read: domain.getDocument,
    }),
  );
  return router;
}

import { createHash, randomUUID } from 'node:crypto';
import type { Readable } from 'node:stream';
import type { UserRow } from '../../../../schema';
import type { FileStore } from '../../adapters/file-store';
import type { Database } from '../../db/client';
import { AppError, forbidden, notFound } from '../../lib/app-error';
import { recordAudit } from '../audit/audit-repository';
import { hasRole } from '../users/roles';
import { usersRepository } from '../users/users-repository';
import { looksLikePdf } from './pdf-check';
import { sourcesRepository, type DocumentRow } from './sources-repository';

/** The largest document accepted (the multipart limit enforces it while reading). */
export const MAX_DOCUMENT_BYTES = 20 * 1024 * 1024;

export interface UploadedFile {
  buffer: Buffer;
  originalname: string;
}

/** Editors and admins read every document; anyone else only what they uploaded themselves. */
const readsAll = (actor: UserRow) => hasRole(actor.role, 'editor');

export function createSourceDocumentsService(db: Database, files: FileStore) {
  async function sourceMustExist(sourceId: number) {
    if (!(await sourcesRepository.findById(db, sourceId))) throw notFound(`Source ${sourceId}`);
  }

  return {
    /**
     * Stores a PDF and records it. The bytes go to the file store first under a fresh key; the row
     * and its audit entry follow in one transaction, and the object is removed if that fails.
     */
    async upload(actor: UserRow, sourceId: number, file: UploadedFile): Promise<DocumentRow> {
      await sourceMustExist(sourceId);
      if (!looksLikePdf(file.buffer)) {
        throw new AppError(
          415,
          'not_pdf',
          'Only PDF documents can be attached; this file is not a PDF',
        );
      }
      const sha256 = createHash('sha256').update(file.buffer).digest('hex');
      const key = `sources/${sourceId}/${randomUUID()}.pdf`;
      await files.put(key, file.buffer, 'application/pdf');
      try {
        const id = await db.transaction(async (tx) => {
          await usersRepository.assertActorRoleLocked(tx, actor.id, 'curator');
          const row = await sourcesRepository.insertDocument(tx, {
            sourceId,
            key,
            sha256,
            size: file.buffer.length,
            fileName: displayName(file.originalname),
            uploadedBy: actor.id,
          });
          await recordAudit(tx, {
            actorId: actor.id,
            action: 'source.document_attached',
            entityType: 'source',
            entityId: sourceId,
            after: { documentId: row.id, fileName: row.fileName, size: row.size, sha256 },
          });
          return row.id;
        });
        return (await sourcesRepository.findDocument(db, sourceId, id))!;
      } catch (err) {
        await files.delete(key).catch(() => undefined);
        throw err;
      }
    },

    async list(actor: UserRow, sourceId: number): Promise<DocumentRow[]> {
      await sourceMustExist(sourceId);
      if (readsAll(actor)) return sourcesRepository.listDocuments(db, sourceId);
      const own = await sourcesRepository.listDocuments(db, sourceId, actor.id);
      if (own.length === 0)
        throw forbidden('Only editors, admins and the uploader may see documents');
      return own;
    },

    async download(
      actor: UserRow,
      sourceId: number,
      docId: number,
    ): Promise<{ doc: DocumentRow; body: Readable }> {
      const doc = await sourcesRepository.findDocument(db, sourceId, docId);
      if (!doc) throw notFound(`Document ${docId} of source ${sourceId}`);
      if (!readsAll(actor) && doc.uploadedBy !== actor.id) {
        throw forbidden('Only editors, admins and the uploader may download this document');
      }
      return { doc, body: await files.get(doc.key) };
    },
  };
}

export type SourceDocumentsService = ReturnType<typeof createSourceDocumentsService>;

/** A file name fit to show and to offer on download: no path, no control characters. */
function displayName(original: string): string {
  const base = original.split(/[\\/]/).pop() ?? '';
  const clean = [...base]
    .filter((c) => c >= ' ' && c !== '\u007f')
    .join('')
    .trim()
    .slice(0, 200);
  return clean || 'document.pdf';
}

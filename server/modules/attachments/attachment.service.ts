import { createHash, randomUUID } from 'node:crypto';
import type { Readable } from 'node:stream';
import type { EntityManager } from '@mikro-orm/postgresql';
import { roleAtLeast } from '@/lib/schemas/groups';
import { attachmentExtensions, type Attachment as AttachmentDto, type AttachmentKind, type AttachmentState } from '@/lib/schemas/exchange';
import { AppError, notFound } from '@/server/http/errors';
import { recordAudit } from '@/server/modules/audit/audit.service';
import { User } from '@/server/modules/auth/user.entity';
import { getComplex, recordEntryChange } from '@/server/modules/library/complex.service';
import { Attachment } from './attachment.entity';
import { binaryKindOf, binaryKindWords, decodeText } from './file-sniff';
import type { ObjectStorage } from './object-storage';

/**
 * Files on a library entry. Who: its author (contributor) and curators attach; curators delete.
 * A file is added by a revision of the entry (an accepted entry is re-opened for review, as by any
 * edit) and goes through review with it: the author and curators see every file with its state,
 * restricted readers (viewers, contributors on entries of others) list and download only accepted
 * files (see migration 20270137). What: the type is decided by the content (magic bytes, or valid
 * UTF-8 text) AND must agree with the file name's extension.
 */

/** The files this reader may see: accepted ones for readers of the published view, all for the others. */
const visibleStates = (view: 'working' | 'published'): AttachmentState[] => (view === 'published' ? ['accepted'] : ['pending', 'accepted', 'declined']);

export const contentTypes: Readonly<Record<AttachmentKind, string>> = {
  pdf: 'application/pdf',
  png: 'image/png',
  jpeg: 'image/jpeg',
  zip: 'application/zip',
  cif: 'chemical/x-cif',
  'jcamp-dx': 'chemical/x-jcamp-dx',
  csv: 'text/csv; charset=utf-8',
  text: 'text/plain; charset=utf-8',
};

const allExtensions = Object.values(attachmentExtensions).flat();

/** The name people see: no folders, no control characters, no quotes; never used as a storage key. */
export function sanitiseFileName(raw: string): string {
  const base = raw.split(/[\\/]/).pop() ?? '';
  const cleaned = base
    .normalize('NFC')
    .replace(/[\u0000-\u001f\u007f"*:<>?|;]/g, '_')
    .replace(/^[.\s]+/, '')
    .trim()
    .slice(0, 200);
  return cleaned || 'attachment';
}

const extensionOf = (fileName: string) => {
  const dot = fileName.lastIndexOf('.');
  return dot > 0 ? fileName.slice(dot + 1).toLowerCase() : '';
};

/** The attachment kind, or a 415 saying why the file is refused. */
export function attachmentKindOf(bytes: Buffer, fileName: string): AttachmentKind {
  const extension = extensionOf(fileName);
  if (!allExtensions.includes(extension)) {
    throw new AppError(
      'UNSUPPORTED_MEDIA',
      `Files ending in "${extension ? `.${extension}` : '(no extension)'}" are not accepted. Attach PDF, PNG, JPEG, ZIP, CIF, JCAMP-DX (.jdx, .dx), CSV or plain text files.`,
    );
  }
  const binary = binaryKindOf(bytes);
  let kind: AttachmentKind;
  if (binary === 'pdf' || binary === 'png' || binary === 'jpeg' || binary === 'zip') kind = binary;
  else if (binary) throw new AppError('UNSUPPORTED_MEDIA', `This file is ${binaryKindWords[binary]}, which is not accepted as an attachment.`);
  else {
    const text = decodeText(bytes);
    if (!text.ok || text.encoding !== 'utf-8') {
      throw new AppError('UNSUPPORTED_MEDIA', `The content of "${fileName}" is neither a PDF, PNG, JPEG or ZIP file nor UTF-8 text. ${text.ok ? '' : text.reason}`.trim());
    }
    // JCAMP-DX files open with the ##TITLE= label (IUPAC JCAMP-DX, McDonald & Wilks, Appl. Spectrosc. 1988, 42, 151).
    const jcamp = /^\s*##TITLE=/.test(text.text);
    if (attachmentExtensions['jcamp-dx'].includes(extension)) {
      if (!jcamp) throw new AppError('UNSUPPORTED_MEDIA', `"${fileName}" is named like a JCAMP-DX file but does not start with ##TITLE=.`);
      return 'jcamp-dx';
    }
    if (attachmentExtensions.cif.includes(extension)) return 'cif';
    if (attachmentExtensions.csv.includes(extension)) return 'csv';
    if (attachmentExtensions.text.includes(extension)) return jcamp ? 'jcamp-dx' : 'text';
    throw new AppError('UNSUPPORTED_MEDIA', `"${fileName}" is named like a .${extension} file but its content is plain text.`);
  }
  if (!attachmentExtensions[kind].includes(extension)) {
    throw new AppError(
      'UNSUPPORTED_MEDIA',
      `The content of "${fileName}" is ${binaryKindWords[kind as 'pdf']}, which does not match its extension ".${extension}". Rename it (.${attachmentExtensions[kind][0]}) or attach the right file.`,
    );
  }
  return kind;
}

type AttachmentRow = { id: string; complex: { id: string }; fileName: string; kind: AttachmentKind; contentType: string; sizeBytes: number; sha256: string; description?: string | null; uploadedById?: string | null; createdAt: Date; state: AttachmentState };

function toDto(row: AttachmentRow, people: Map<string, string>): AttachmentDto {
  return {
    id: row.id,
    complexId: row.complex.id,
    fileName: row.fileName,
    kind: row.kind,
    contentType: row.contentType,
    sizeBytes: Number(row.sizeBytes),
    sha256: row.sha256.trim(),
    description: row.description ?? null,
    uploadedBy: row.uploadedById ? { id: row.uploadedById, displayName: people.get(row.uploadedById) ?? 'former member' } : null,
    createdAt: row.createdAt.toISOString(),
    downloadPath: `/api/complexes/${row.complex.id}/attachments/${row.id}`,
    state: row.state,
  };
}

async function names(em: EntityManager, ids: (string | null | undefined)[]) {
  const wanted = [...new Set(ids.filter((id): id is string => !!id))];
  if (wanted.length === 0) return new Map<string, string>();
  const users = await em.find(User, { id: { $in: wanted } }, { fields: ['id', 'displayName'] });
  return new Map(users.map((u) => [u.id, u.displayName]));
}

export async function listAttachments(em: EntityManager, userId: string, complexId: string): Promise<AttachmentDto[]> {
  const entry = await getComplex(em, { userId }, complexId);
  const rows = await em.find(Attachment, { complex: complexId, state: { $in: visibleStates(entry.view) } }, { orderBy: { createdAt: 'asc', id: 'asc' } });
  const people = await names(em, rows.map((r) => r.uploadedById));
  return rows.map((row) => toDto(row, people));
}

export async function addAttachment(
  em: EntityManager,
  storage: ObjectStorage,
  userId: string,
  complexId: string,
  input: { fileName: string; description?: string },
  bytes: Buffer,
): Promise<AttachmentDto> {
  const entry = await getComplex(em, { userId }, complexId);
  const author = entry.myRole === 'contributor' && entry.createdBy?.id === userId;
  if (!roleAtLeast(entry.myRole, 'curator') && !author) {
    throw new AppError('FORBIDDEN', entry.myRole === 'viewer' ? 'Viewers cannot attach files.' : 'Contributors attach files to the entries they created; a curator can attach to any entry.');
  }
  if (entry.status === 'retired') throw new AppError('CONFLICT', 'This entry is retired; its files are kept as they are.');
  if (entry.status === 'in-review' || entry.status === 'declined') {
    throw new AppError('CONFLICT', entry.status === 'in-review'
      ? 'This entry is waiting for review: attach the file after the decision (a returned entry takes files).'
      : 'This entry was declined; declined entries stay as they are.');
  }
  if (bytes.length === 0) throw new AppError('VALIDATION_FAILED', 'The file is empty.', { file: 'empty' });
  const fileName = sanitiseFileName(input.fileName);
  const kind = attachmentKindOf(bytes, fileName);
  const id = randomUUID();
  // The key is ours alone: the person's file name never reaches the store (no ../ tricks).
  const objectKey = `attachments/${entry.groupId}/${complexId}/${id}`;
  const sha256 = createHash('sha256').update(bytes).digest('hex');
  await storage.put(objectKey, bytes, contentTypes[kind]);
  const now = new Date();
  try {
    // One revision of the entry adds the file (an accepted entry is re-opened for review).
    await recordEntryChange(em, { userId }, complexId, `Attached ${fileName}`.slice(0, 500), async (tem, newVersion) => {
      await tem.insert(Attachment, {
        id,
        complex: complexId,
        groupId: entry.groupId,
        objectKey,
        fileName,
        kind,
        contentType: contentTypes[kind],
        sizeBytes: bytes.length,
        sha256,
        description: input.description ?? null,
        uploadedById: userId,
        createdAt: now,
        state: 'pending',
        addedInVersion: newVersion,
        acceptedInVersion: null,
      });
      recordAudit(tem, {
        actorId: userId,
        groupId: entry.groupId,
        action: 'library.attachment.added',
        subjectType: 'complex',
        subjectId: complexId,
        details: { attachmentId: id, fileName, kind, sizeBytes: bytes.length, sha256 },
      });
      await tem.flush();
    });
  } catch (error) {
    await storage.remove(objectKey).catch(() => {});
    throw error;
  }
  const row = await em.findOneOrFail(Attachment, { id });
  return toDto(row, await names(em, [userId]));
}

export async function openAttachment(
  em: EntityManager,
  storage: ObjectStorage,
  userId: string,
  complexId: string,
  attachmentId: string,
): Promise<{ attachment: AttachmentDto; body: Readable }> {
  const entry = await getComplex(em, { userId }, complexId);
  const row = await em.findOne(Attachment, { id: attachmentId, complex: complexId, state: { $in: visibleStates(entry.view) } });
  if (!row) throw notFound('That attachment');
  return { attachment: toDto(row, new Map()), body: await storage.get(row.objectKey) };
}

export async function deleteAttachment(em: EntityManager, storage: ObjectStorage, userId: string, complexId: string, attachmentId: string): Promise<void> {
  const entry = await getComplex(em, { userId }, complexId);
  const row = await em.findOne(Attachment, { id: attachmentId, complex: complexId });
  if (!row) throw notFound('That attachment');
  if (!roleAtLeast(entry.myRole, 'curator')) throw new AppError('FORBIDDEN', 'Only curators (or admins) delete attachments.');
  await em.transactional(async (tem) => {
    await tem.nativeDelete(Attachment, { id: attachmentId });
    recordAudit(tem, {
      actorId: userId,
      groupId: entry.groupId,
      action: 'library.attachment.deleted',
      subjectType: 'complex',
      subjectId: complexId,
      details: { attachmentId, fileName: row.fileName, sha256: row.sha256 },
    });
    await tem.flush();
  });
  // After the commit: a failed delete leaves an orphan object, never a row without its file.
  await storage.remove(row.objectKey).catch((error: Error) => console.error(`[attachments] orphan ${row.objectKey}: ${error.message}`));
}

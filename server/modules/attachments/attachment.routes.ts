import { Router, type Request, type Response } from 'express';
import { ATTACHMENT_MAX_BYTES, attachmentUploadQuerySchema } from '@/lib/schemas/exchange';
import { requestEm } from '@/server/db/request-context';
import { getAuth, isUuid, requireAuth } from '@/server/http/auth-middleware';
import { AppError } from '@/server/http/errors';
import { parseWith } from '@/server/http/validate';
import { addAttachment, deleteAttachment, listAttachments, openAttachment } from './attachment.service';
import type { ObjectStorage } from './object-storage';
import { readRawBody } from './raw-body';

function pathId(req: Request, param: string, what: string): string {
  const value = req.params[param];
  if (!isUuid(value)) throw new AppError('NOT_FOUND', `${what} was not found.`);
  return value;
}

/** RFC 6266: an ASCII fallback plus the UTF-8 name (RFC 8187) for everything else. */
export function contentDisposition(fileName: string): string {
  const ascii = fileName.replace(/[^\x20-\x7e]/g, '_').replace(/["\\]/g, '_');
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(fileName).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`)}`;
}

/** Files on a library entry: /api/complexes/:id/attachments[/:attachmentId]. */
export function attachmentRoutes(storage: ObjectStorage): Router {
  const router = Router();
  const userId = (res: Response) => getAuth(res).user.id;

  router.get('/complexes/:id/attachments', requireAuth, async (req, res) => {
    const id = pathId(req, 'id', 'That library entry');
    res.json({ attachments: await listAttachments(requestEm(), userId(res), id) });
  });

  router.post('/complexes/:id/attachments', requireAuth, async (req, res) => {
    const id = pathId(req, 'id', 'That library entry');
    const query = parseWith(attachmentUploadQuerySchema, req.query, 'query');
    const bytes = await readRawBody(req, res, ATTACHMENT_MAX_BYTES, 'file');
    res.status(201).json(await addAttachment(requestEm(), storage, userId(res), id, query, bytes));
  });

  router.get('/complexes/:id/attachments/:attachmentId', requireAuth, async (req, res) => {
    const id = pathId(req, 'id', 'That library entry');
    const attachmentId = pathId(req, 'attachmentId', 'That attachment');
    const { attachment, body } = await openAttachment(requestEm(), storage, userId(res), id, attachmentId);
    res.status(200);
    res.setHeader('Content-Type', attachment.contentType);
    res.setHeader('Content-Length', String(attachment.sizeBytes));
    res.setHeader('Content-Disposition', contentDisposition(attachment.fileName));
    res.setHeader('Cache-Control', 'private, no-store');
    res.setHeader('X-Content-SHA256', attachment.sha256);
    // A file never runs as a page of ours, whatever it holds.
    res.setHeader('Content-Security-Policy', "default-src 'none'; sandbox");
    await new Promise<void>((resolve, reject) => {
      body.on('error', reject);
      res.on('finish', () => resolve());
      res.on('close', () => resolve());
      body.pipe(res);
    });
  });

  router.delete('/complexes/:id/attachments/:attachmentId', requireAuth, async (req, res) => {
    const id = pathId(req, 'id', 'That library entry');
    const attachmentId = pathId(req, 'attachmentId', 'That attachment');
    await deleteAttachment(requestEm(), storage, userId(res), id, attachmentId);
    res.status(204).end();
  });

  return router;
}

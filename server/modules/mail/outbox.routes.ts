import { Router } from 'express';
import type { Orm } from '@/server/db/orm';
import { extractLinks, parseMail } from './mime';
import { DevOutboxMessage } from './outbox-message.entity';

/**
 * GET /api/dev/outbox[?to=address]: what the local mail sink received, newest first, so a person
 * (or a test) can follow the links. Only mounted outside production.
 */
export function devOutboxRoutes(orm: Orm): Router {
  const router = Router();
  router.get('/dev/outbox', async (req, res) => {
    const to = typeof req.query.to === 'string' ? req.query.to.trim().toLowerCase() : null;
    const rows = await orm.em.fork().find(DevOutboxMessage, {}, { orderBy: { receivedAt: 'desc' }, limit: 200 });
    const messages = rows
      .filter((row) => !to || row.recipients.includes(to))
      .map((row) => {
        const mail = parseMail(row.raw);
        return {
          id: row.id,
          receivedAt: row.receivedAt.toISOString(),
          from: mail.from,
          to: row.recipients,
          subject: mail.subject,
          text: mail.text,
          html: mail.html,
          links: extractLinks(mail.text),
        };
      });
    res.setHeader('Cache-Control', 'no-store');
    res.json({ messages });
  });
  return router;
}

import { Router } from 'express';
import { requestEm } from '@/server/db/request-context';
import { isLoopbackHost } from '@/server/http/host-allow-list';
import { extractLinks, parseMail } from '@/server/modules/mail/mime';
import { DevOutboxMessage } from '@/server/modules/mail/outbox-message.entity';

const escapeHtml = (text: string) =>
  text.replace(/[&<>"']/g, (ch) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[ch] ?? ch);

function outboxPage(messages: { receivedAt: string; to: string[]; subject: string; text: string; links: string[] }[]): string {
  const items = messages
    .map(
      (m) => `<article><h2>${escapeHtml(m.subject)}</h2><p class="meta">to ${escapeHtml(m.to.join(', '))} · ${escapeHtml(m.receivedAt)}</p>` +
        `<ul>${m.links.map((link) => `<li><a href="${escapeHtml(link)}">${escapeHtml(link)}</a></li>`).join('')}</ul>` +
        `<pre>${escapeHtml(m.text)}</pre></article>`,
    )
    .join('');
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>Sphereline — local outbox</title>` +
    `<style>body{font-family:sans-serif;max-width:760px;margin:2rem auto;padding:0 1rem;color:#16302C;background:#F4F1E8}` +
    `article{background:#fff;border:1px solid #D8D1C1;border-radius:12px;padding:1rem;margin:1rem 0}.meta{color:#66736F;font-size:.85rem}` +
    `pre{white-space:pre-wrap;font-size:.85rem}a{color:#1F6B61}</style></head><body><h1>Local outbox (development only)</h1>` +
    `<p>Mail the local sink received, newest first. Nothing here left this machine.</p>${items || '<p>No messages yet.</p>'}</body></html>`;
}

/**
 * GET /api/dev/outbox[?to=address]: what the local mail sink received, newest first, so a person
 * (or a test) can follow the links. Only mounted outside production, and it answers only requests
 * addressed to a loopback host (127.0.0.1, localhost): the links in it take over accounts.
 */
export function devOutboxRoutes(): Router {
  const router = Router();
  router.get('/dev/outbox', async (req, res, next) => {
    if (!isLoopbackHost(req)) return next();
    const to = typeof req.query.to === 'string' ? req.query.to.trim().toLowerCase() : null;
    const rows = await requestEm().find(DevOutboxMessage, {}, { orderBy: { receivedAt: 'desc' }, limit: 200 });
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
    // A person opening the address in a browser gets a readable page with clickable links.
    if (req.accepts(['json', 'html']) === 'html') {
      res.type('html').send(outboxPage(messages));
      return;
    }
    res.json({ messages });
  });
  return router;
}

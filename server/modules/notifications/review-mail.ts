import type { Orm } from '@/server/db/orm';
import { User } from '@/server/modules/auth/user.entity';
import { GroupMembership } from '@/server/modules/groups/membership.entity';
import { ResearchGroup } from '@/server/modules/groups/group.entity';
import type { LibraryEvent } from '@/server/modules/library/library-events';
import type { Mailer, OutgoingMail } from '@/server/modules/mail/mailer';
import { optedOut } from './mail-preferences.service';

/**
 * E-mail on review events: curators (and admins) of the group hear of a new submission; the
 * submitter hears of the decision. Each person can turn either off (PATCH /api/auth/me/preferences).
 * Sent after the change committed, in the background: a mail failure is logged, never undoes it.
 */

const escapeHtml = (value: string) =>
  value.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] ?? c);

function message(to: string, subject: string, lines: string[], link: { label: string; url: string }): OutgoingMail {
  const footer = 'You can turn these messages off under Account → E-mail. Sphereline — lability and electron-transfer routes for coordination chemists.';
  const text = [...lines.flatMap((l) => [l, '']), `${link.label}:`, link.url, '', '-- ', footer].join('\n');
  const html = [
    '<!doctype html><html><body style="font-family: system-ui, sans-serif; line-height: 1.5; color: #1d2430">',
    ...lines.map((l) => `<p>${escapeHtml(l)}</p>`),
    `<p><a href="${escapeHtml(link.url)}">${escapeHtml(link.label)}</a></p>`,
    `<hr><p style="font-size: 12px; color: #5a6472">${escapeHtml(footer)}</p>`,
    '</body></html>',
  ].join('\n');
  return { to, subject, text, html };
}

const decisionWords = { accept: 'accepted', return: 'returned for revision', decline: 'declined' } as const;

export interface ReviewMail {
  handle(event: LibraryEvent): void;
  /** Resolves when every mail started so far has been sent (or has failed and been logged). */
  settle(): Promise<void>;
}

export function createReviewMail(orm: Orm, mailer: Mailer, appUrl: string): ReviewMail {
  const pending = new Set<Promise<void>>();

  async function deliver(event: LibraryEvent) {
    // Runs after the change committed, possibly after the response: its own manager, not the request's.
    const em = orm.em.fork();
    const group = await em.findOne(ResearchGroup, { id: event.groupId });
    const actor = await em.findOne(User, { id: event.actorId });
    const groupName = group?.name ?? 'your group';
    const entry = `${event.name} (${event.formula})`;
    const url = `${appUrl}/library/${event.complexId}`;
    if (event.type === 'in-review') {
      const curators = await em.find(GroupMembership, { groupId: event.groupId, role: { $in: ['curator', 'admin'] } });
      const ids = curators.map((m) => m.userId).filter((id) => id !== event.actorId);
      const off = await optedOut(em, ids, 'reviewSubmissions');
      const people = await em.find(User, { id: { $in: ids.filter((id) => !off.has(id)) } });
      for (const person of people) {
        await mailer.send(
          message(person.email, `Sphereline: ${entry} waits for review`, [
            `Hello ${person.displayName},`,
            `${actor?.displayName ?? 'A member'} submitted ${entry} in ${groupName} for review.`,
          ], { label: 'Review it', url: `${appUrl}/review` }),
        );
      }
      return;
    }
    if (!event.submitterId || event.submitterId === event.actorId) return;
    if ((await optedOut(em, [event.submitterId], 'reviewDecisions')).size > 0) return;
    const submitter = await em.findOne(User, { id: event.submitterId });
    if (!submitter) return;
    await mailer.send(
      message(submitter.email, `Sphereline: ${entry} was ${decisionWords[event.decision]}`, [
        `Hello ${submitter.displayName},`,
        `${actor?.displayName ?? 'A curator'} ${decisionWords[event.decision]} your submission ${entry} in ${groupName}.`,
        ...(event.comment ? [`Comment: ${event.comment}`] : []),
      ], { label: 'Open the entry', url }),
    );
  }

  return {
    handle(event) {
      const job = deliver(event)
        .catch((error: Error) => console.error(`[review-mail] ${event.type} ${event.complexId}: ${error.message}`))
        .finally(() => pending.delete(job));
      pending.add(job);
    },
    async settle() {
      while (pending.size > 0) await Promise.all([...pending]);
    },
  };
}

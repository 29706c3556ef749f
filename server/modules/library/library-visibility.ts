import type { EntityManager } from '@mikro-orm/postgresql';
import { roleAtLeast } from '@/lib/schemas/groups';
import type { Citation as CitationDto, CitationInput } from '@/lib/schemas/library';
import { Citation } from './citation.entity';
import { citationFields } from './citation.service';
import { toCitationDto } from './complex.mapper';
import type { MembershipInfo } from './library-access';
import { ComplexReview } from './review.entity';

/**
 * What a restricted reader (a viewer, or a contributor for entries they did not create) may see
 * beyond the entries themselves: which revisions of an entry, and which of the group's citations.
 * Full readers (the author, curators and admins) see the working copy and everything in it.
 */

/**
 * The revisions a restricted reader sees: the accepted states only, i.e. the revisions an accept
 * decision recorded. Drafts before the first acceptance, returned or declined edits (and the
 * restore that follows a declined edit, whose message carries the decline) stay with the author
 * and the curators.
 */
export async function acceptedRevisionNumbers(em: EntityManager, complexId: string): Promise<number[]> {
  const reviews = await em.find(ComplexReview, { complex: complexId, decision: 'accept' }, { fields: ['revisionNumber'] });
  return reviews.map((r) => r.revisionNumber);
}

/**
 * The ids of the group's citations this member may see: every one for curators and admins; for
 * others, the citations cited by the accepted snapshot of a published entry, by the working copy
 * of an entry they created (contributors), or entered by themselves.
 */
function visibleCitationIdsSql(membership: MembershipInfo, userId: string): { sql: string; params: unknown[] } {
  if (roleAtLeast(membership.role, 'curator')) {
    return { sql: 'select id from citation where group_id = ?', params: [membership.groupId] };
  }
  const parts = [
    `select (m->'citation'->>'id')::uuid as id
       from complex x cross join lateral jsonb_array_elements(x.accepted_snapshot->'measurements') m
      where x.group_id = ? and x.is_published and jsonb_typeof(m->'citation') = 'object'`,
    'select id from citation where group_id = ? and created_by_id = ?',
  ];
  const params: unknown[] = [membership.groupId, membership.groupId, userId];
  if (membership.role === 'contributor') {
    parts.push(`select ms.citation_id from measurement ms join complex x on x.id = ms.complex_id
      where x.group_id = ? and x.created_by_id = ? and ms.citation_id is not null`);
    params.push(membership.groupId, userId);
  }
  return { sql: parts.join(' union '), params };
}

/** GET /api/citations: the group's citations this member may see, newest year first. */
export async function listVisibleCitations(em: EntityManager, membership: MembershipInfo, userId: string): Promise<CitationDto[]> {
  const visible = visibleCitationIdsSql(membership, userId);
  const ids = await em.execute<{ id: string }[]>(`select distinct v.id from (${visible.sql}) v where v.id is not null`, visible.params);
  if (ids.length === 0) return [];
  const rows = await em.find(
    Citation,
    { groupId: membership.groupId, id: { $in: ids.map((r) => r.id) } },
    { orderBy: { year: 'desc', authors: 'asc', id: 'asc' }, limit: 2000 },
  );
  return rows.map(toCitationDto);
}

export async function citationVisibleTo(em: EntityManager, membership: MembershipInfo, userId: string, citationId: string): Promise<boolean> {
  const visible = visibleCitationIdsSql(membership, userId);
  const [row] = await em.execute<{ found: boolean }[]>(`select exists (select 1 from (${visible.sql}) v where v.id = ?::uuid) as found`, [
    ...visible.params,
    citationId,
  ]);
  return row?.found === true;
}

/**
 * POST /api/citations answers with the group's record for a DOI it already holds. When only
 * entries this member may not see cite that record, the answer keeps the record's id (so the
 * member can cite it; citations are one per DOI and group) but shows the member's own fields,
 * never the stored ones: nothing of another member's draft comes back.
 */
export function ownFieldsView(stored: CitationDto, input: CitationInput): CitationDto {
  return toCitationDto({ id: stored.id, groupId: stored.groupId, doi: stored.doi, ...citationFields(input) });
}

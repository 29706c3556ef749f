import { randomUUID } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import type { Citation as CitationDto, CitationInput } from '@/lib/schemas/library';
import { AppError } from '@/server/http/errors';
import { Citation } from './citation.entity';
import { toCitationDto } from './complex.mapper';

/**
 * Citations are de-duplicated by DOI per group (decision: a group's library is private, so its
 * citation records are too — a typo in one lab's record never shows up in another's; the
 * partial unique index citation_group_doi_unique enforces it, race-free with ON CONFLICT).
 * Without a DOI, an identical authors/journal/year/volume/pages record is reused.
 */
/** The bibliographic fields of a citation as stored, from what a person typed. */
export function citationFields(input: CitationInput) {
  return {
    authors: input.authors,
    title: input.title ?? null,
    journal: input.journal,
    year: input.year ?? null,
    volume: input.volume ?? null,
    pages: input.pages ?? null,
    kind: input.kind ?? 'article',
    publisher: input.publisher ?? null,
    place: input.place ?? null,
    url: input.url ?? null,
  };
}

export async function findOrCreateCitation(
  em: EntityManager,
  groupId: string,
  input: CitationInput,
  actorId: string | null,
): Promise<{ citation: CitationDto; created: boolean }> {
  const doi = input.doi ?? null;
  const values = citationFields(input);
  if (doi) {
    const id = randomUUID();
    const inserted = await em.execute<{ id: string }[]>(
      `insert into citation (id, group_id, doi, authors, title, journal, year, volume, pages, kind, publisher, place, url, created_by_id, created_at)
       values (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, now())
       on conflict (group_id, lower(doi)) where doi is not null do nothing returning id`,
      [id, groupId, doi, values.authors, values.title, values.journal, values.year, values.volume, values.pages, values.kind, values.publisher, values.place, values.url, actorId],
    );
    const existing = await em.execute<Record<string, unknown>[]>(
      'select * from citation where group_id = ? and lower(doi) = lower(?)',
      [groupId, doi],
    );
    const row = existing[0];
    if (!row) throw new Error('citation vanished after upsert');
    return { citation: fromRow(row), created: inserted.length > 0 };
  }
  const same = await em.execute<Record<string, unknown>[]>(
    `select * from citation where group_id = ? and doi is null and authors = ? and journal = ?
       and year is not distinct from ? and volume is not distinct from ? and pages is not distinct from ?
       and kind = ? and title is not distinct from ? and publisher is not distinct from ? and url is not distinct from ? limit 1`,
    [groupId, values.authors, values.journal, values.year, values.volume, values.pages, values.kind, values.title, values.publisher, values.url],
  );
  if (same[0]) return { citation: fromRow(same[0]), created: false };
  const id = randomUUID();
  await em.insert(Citation, { id, groupId, doi: null, ...values, createdById: actorId, createdAt: new Date() });
  return { citation: toCitationDto({ id, groupId, doi: null, ...values }), created: true };
}

function fromRow(row: Record<string, unknown>): CitationDto {
  return toCitationDto({
    id: String(row.id),
    groupId: String(row.group_id),
    doi: (row.doi as string | null) ?? null,
    authors: String(row.authors),
    title: (row.title as string | null) ?? null,
    journal: String(row.journal),
    year: (row.year as number | null) ?? null,
    volume: (row.volume as string | null) ?? null,
    pages: (row.pages as string | null) ?? null,
    kind: (row.kind as string | null) ?? null,
    publisher: (row.publisher as string | null) ?? null,
    place: (row.place as string | null) ?? null,
    url: (row.url as string | null) ?? null,
  });
}

export async function citationOfGroup(em: EntityManager, groupId: string, citationId: string, field = 'citationId'): Promise<CitationDto> {
  const citation = await em.findOne(Citation, { id: citationId, groupId });
  if (!citation) {
    throw new AppError('VALIDATION_FAILED', 'That citation is not in this group’s library.', { [field]: 'not a citation of this group' });
  }
  return toCitationDto(citation);
}

import type { EntityManager } from '@mikro-orm/postgresql';
import { roleAtLeast } from '@/lib/schemas/groups';
import type {
  ComplexListItem,
  ComplexListResponse,
  ComplexSearchQuery,
  ComplexSnapshot,
  ComplexStatus,
  MeasurementKind,
  ReviewQueueResponse,
} from '@/lib/schemas/library';
import { AppError } from '@/server/http/errors';
import { personRef } from './complex.mapper';
import { searchTokens } from './derive';
import { membershipsOf, type MembershipInfo } from './library-access';

/**
 * Server-side search over the groups the person belongs to.
 * Text: every query token is compared with the words of `search_text` by pg_trgm word similarity
 * (`token <% search_text`, GIN-indexed); an entry matches when any token does, and ranks by the
 * mean word similarity of all tokens — so "Co amm" puts cobalt ammines (both tokens match) first.
 * Filters combine with AND. Order: rank desc then id (with text), name then id (without).
 * Visibility is part of the SQL (see library-access.ts): viewers get approved snapshots only.
 */

interface Row {
  id: string;
  group_id: string;
  formula: string;
  name: string;
  status: ComplexStatus;
  effective_status: ComplexStatus;
  full_view: boolean;
  metal: string;
  oxidation_state: number;
  d_electrons: number;
  spin_state: 'high' | 'low' | null;
  verdict: ComplexListItem['verdict'];
  ligand_ids: string[];
  measurement_kinds: string[];
  has_citation: boolean;
  version: number;
  measurement_count: string | number;
  approved_snapshot: ComplexSnapshot | null;
  has_approved: boolean;
  created_by_id: string | null;
  created_by_name: string | null;
  submitted_by_id?: string | null;
  submitted_by_name?: string | null;
  submitted_at?: Date | string | null;
  /** Raw rows: MikroORM's pg driver returns timestamps as strings. */
  updated_at: Date | string;
  rank: number | null;
  total: string | number;
}

const csv = (ids: readonly string[]) => ids.join(',');

/** SQL for "this reader sees the working copy" and "sees this entry at all", with its bindings. */
function visibility(memberships: readonly MembershipInfo[], userId: string) {
  const curatorGroups = memberships.filter((m) => roleAtLeast(m.role, 'curator')).map((m) => m.groupId);
  const contributorGroups = memberships.filter((m) => m.role === 'contributor').map((m) => m.groupId);
  const full = `(c.group_id = any(string_to_array(?, ',')::uuid[]) or (c.group_id = any(string_to_array(?, ',')::uuid[]) and c.created_by_id = ?))`;
  const fullParams: unknown[] = [csv(curatorGroups), csv(contributorGroups), userId];
  const visible = `(${full} or (c.approved_snapshot is not null and c.status <> 'retired'))`;
  return { full, fullParams, visible, visibleParams: fullParams };
}

export async function searchComplexes(em: EntityManager, userId: string, query: ComplexSearchQuery): Promise<ComplexListResponse> {
  const all = await membershipsOf(em, userId);
  let memberships = [...all.values()];
  if (query.groupId) {
    const one = all.get(query.groupId);
    if (!one) throw new AppError('NOT_FOUND', 'That group was not found.');
    memberships = [one];
  }
  if (memberships.length === 0) return { items: [], total: 0, page: query.page, pageSize: query.pageSize };

  const vis = visibility(memberships, userId);
  const effectiveStatus = `(case when ${vis.full} then c.status else 'approved' end)`;
  const where: string[] = [`c.group_id = any(string_to_array(?, ',')::uuid[])`, vis.visible];
  const params: unknown[] = [csv(memberships.map((m) => m.groupId)), ...vis.visibleParams];

  const tokens = searchTokens(query.q ?? '');
  let rankSql = 'null::real';
  const rankParams: unknown[] = [];
  if (tokens.length > 0) {
    where.push(`(${tokens.map(() => '? <% c.search_text').join(' or ')})`);
    params.push(...tokens);
    rankSql = `((${tokens.map(() => 'word_similarity(?, c.search_text)').join(' + ')}) / ${tokens.length})::real`;
    rankParams.push(...tokens);
  }
  if (query.metal) {
    where.push('c.metal = ?');
    params.push(query.metal);
  }
  if (query.oxidationState !== undefined) {
    where.push('c.oxidation_state = ?');
    params.push(query.oxidationState);
  }
  if (query.dCount !== undefined) {
    where.push('c.d_electrons = ?');
    params.push(query.dCount);
  }
  if (query.verdict) {
    where.push('c.verdict = ?');
    params.push(query.verdict);
  }
  if (query.ligand) {
    where.push('c.ligand_ids @> array[?]::text[]');
    params.push(query.ligand);
  }
  if (query.measurementKind) {
    where.push('c.measurement_kinds @> array[?]::text[]');
    params.push(query.measurementKind);
  }
  if (query.hasCitation !== undefined) {
    where.push('c.has_citation = ?');
    params.push(query.hasCitation);
  }
  if (query.status) {
    where.push(`${effectiveStatus} = ?`);
    params.push(...vis.fullParams, query.status);
  }

  const order = tokens.length > 0 ? 'rank desc, id asc' : 'sort_name asc, id asc';
  const outerOrder = tokens.length > 0 ? 'p.rank desc, p.id asc' : 'p.sort_name asc, p.id asc';
  const offset = (query.page - 1) * query.pageSize;
  // Rank, visibility and order key once per match (materialised CTE); counting and the page come
  // from it; the heavier columns (snapshot, measurement count, author) only for the page's rows.
  const sql = `
    with hits as materialized (
      select c.id, ${rankSql} as rank, ${vis.full} as full_view, lower(c.name) as sort_name
        from complex c
       where ${where.join(' and ')}
    ), page as (
      select * from hits order by ${order} limit ? offset ?
    )
    select c.id, c.group_id, c.formula, c.name, c.status, c.metal, c.oxidation_state, c.d_electrons, c.spin_state,
           c.verdict, c.ligand_ids, c.measurement_kinds, c.has_citation, c.version, c.updated_at, c.created_by_id,
           p.full_view,
           case when p.full_view then null else c.approved_snapshot end as approved_snapshot,
           (c.approved_snapshot is not null) as has_approved,
           (select count(*) from measurement m where m.complex_id = c.id) as measurement_count,
           u.display_name as created_by_name,
           p.rank,
           (select count(*) from hits) as total
      from page p
      join complex c on c.id = p.id
      left join app_user u on u.id = c.created_by_id
     order by ${outerOrder}`;
  const rows = await em.execute<Row[]>(sql, [...rankParams, ...vis.fullParams, ...params, query.pageSize, offset]);
  let total = rows[0] ? Number(rows[0].total) : 0;
  if (rows.length === 0 && query.page > 1) {
    const counted = await em.execute<{ n: string }[]>(`select count(*) as n from complex c where ${where.join(' and ')}`, params);
    total = Number(counted[0]?.n ?? 0);
  }
  return { items: rows.map(toListItem), total, page: query.page, pageSize: query.pageSize };
}

function toListItem(row: Row): ComplexListItem {
  const people = new Map<string, string>();
  if (row.created_by_id && row.created_by_name) people.set(row.created_by_id, row.created_by_name);
  const published = !row.full_view && row.approved_snapshot ? row.approved_snapshot : null;
  const pending = row.has_approved && row.status !== 'approved' && row.status !== 'retired';
  const base = {
    id: row.id,
    groupId: row.group_id,
    version: row.version,
    rank: row.rank === null ? null : Number(row.rank),
    createdBy: personRef(people, row.created_by_id),
    updatedAt: new Date(row.updated_at).toISOString(),
  };
  if (published) {
    return {
      ...base,
      formula: published.formula,
      name: published.name,
      status: 'approved',
      metal: published.metal,
      oxidationState: published.oxidationState,
      dElectrons: published.dElectrons,
      spinState: published.spinState,
      verdict: published.verdict,
      ligandIds: published.ligandIds,
      measurementCount: published.measurements.length,
      measurementKinds: [...new Set(published.measurements.map((m) => m.kind))].sort() as MeasurementKind[],
      hasCitation: published.measurements.some((m) => m.citation !== null),
      hasPendingRevision: false,
    };
  }
  return {
    ...base,
    formula: row.formula,
    name: row.name,
    status: row.status,
    metal: row.metal,
    oxidationState: row.oxidation_state,
    dElectrons: row.d_electrons,
    spinState: row.spin_state,
    verdict: row.verdict,
    ligandIds: row.ligand_ids,
    measurementCount: Number(row.measurement_count),
    measurementKinds: row.measurement_kinds as MeasurementKind[],
    hasCitation: row.has_citation,
    hasPendingRevision: pending,
  };
}

/** Submitted entries of every group where the person is a curator or admin, oldest submission first. */
export async function reviewQueue(em: EntityManager, userId: string): Promise<ReviewQueueResponse> {
  const memberships = [...(await membershipsOf(em, userId)).values()].filter((m) => roleAtLeast(m.role, 'curator'));
  if (memberships.length === 0) {
    throw new AppError('FORBIDDEN', 'The review queue is for curators and admins of a group.');
  }
  const names = new Map(memberships.map((m) => [m.groupId, m.groupName]));
  const rows = await em.execute<(Row & { approved_version: number | null })[]>(
    `select c.*, true as full_view, (c.approved_snapshot is not null) as has_approved, null::real as rank, 0 as total,
            (select count(*) from measurement m where m.complex_id = c.id) as measurement_count,
            u.display_name as created_by_name, s.display_name as submitted_by_name
       from complex c
       left join app_user u on u.id = c.created_by_id
       left join app_user s on s.id = c.submitted_by_id
      where c.group_id = any(string_to_array(?, ',')::uuid[]) and c.status = 'submitted'
      order by c.submitted_at asc nulls last, c.id asc
      limit 500`,
    [csv(memberships.map((m) => m.groupId))],
  );
  const items = rows.map((row) => {
    const people = new Map<string, string>();
    if (row.submitted_by_id && row.submitted_by_name) people.set(row.submitted_by_id, row.submitted_by_name);
    return {
      ...toListItem(row),
      groupName: names.get(row.group_id) ?? '',
      submittedBy: personRef(people, row.submitted_by_id),
      submittedAt: row.submitted_at ? new Date(row.submitted_at).toISOString() : null,
      isEditOfApproved: row.approved_snapshot != null,
    };
  });
  return { items, total: items.length };
}

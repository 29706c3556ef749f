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
import atomicWeightData from '@/data/atomic-weights.json';
import { isElementSymbol } from '@/lib/chem/elements';
import { AppError } from '@/server/http/errors';
import { personRef } from './complex.mapper';
import { searchTokens } from './derive';
import { membershipsOf, type MembershipInfo } from './library-access';

/**
 * Server-side search over the groups the person belongs to (issue 8: 100 000 entries).
 *
 * Text: every query token must match (AND), each in the cheapest way that is still right:
 * - a metal's symbol as written ("Co", case-sensitive, so "CO" stays carbonyl) or an element name
 *   ("cobalt") is an equality on the indexed `metal` column;
 * - a token of 3+ characters is a substring of `search_text` (`like '%amm%'`);
 * - a shorter token ("en", "6") must start a word of `search_text`.
 * When that finds nothing and a token is 3+ characters, the search runs once more with pg_trgm word
 * similarity for those tokens (`tok <% search_text`), so a typo ("chromium amine") still finds
 * the entry. Rank (0–1) is the mean over tokens: 1 for a metal or a whole word, 0.9 for the start
 * of a word, 0.7 inside a word (word similarity in the typo pass) — cheap string tests, because
 * every match is ranked and counted (word similarity costs ~35 µs a row: seconds at 100 000).
 * Filters combine with AND. Order: rank desc then id (with text), name then id (without).
 * Visibility is part of the SQL (see library-access.ts): viewers get approved snapshots only.
 *
 * Speed: the WHERE and the ranked columns all live in `complex_search_cover` (migration
 * 20261230), so matching, ranking and counting are an index-only scan; only the page's rows are
 * read from the table.
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

/** A piece of SQL with its bindings, in order. */
interface Fragment {
  sql: string;
  params: unknown[];
}

const frag = (sql: string, ...params: unknown[]): Fragment => ({ sql, params });

function joinFragments(parts: readonly Fragment[], separator: string): Fragment {
  return { sql: parts.map((p) => p.sql).join(separator), params: parts.flatMap((p) => p.params) };
}

const csv = (ids: readonly string[]) => ids.join(',');
const inGroups = (ids: readonly string[]) => frag(`c.group_id = any(string_to_array(?, ',')::uuid[])`, csv(ids));

/**
 * "This reader sees the working copy" and "sees this entry at all", written per role so that a
 * reader with one role (the usual case) gets a plain condition the covering index answers:
 * curators and admins see every entry of their groups, contributors their own plus published
 * ones, viewers published ones only (`is_published`: approved snapshot, not retired).
 */
function visibility(memberships: readonly MembershipInfo[], userId: string) {
  const curatorGroups = memberships.filter((m) => roleAtLeast(m.role, 'curator')).map((m) => m.groupId);
  const contributorGroups = memberships.filter((m) => m.role === 'contributor').map((m) => m.groupId);
  const viewerGroups = memberships
    .filter((m) => !roleAtLeast(m.role, 'curator') && m.role !== 'contributor')
    .map((m) => m.groupId);
  const fullParts: Fragment[] = [];
  const visibleParts: Fragment[] = [];
  if (curatorGroups.length > 0) {
    fullParts.push(inGroups(curatorGroups));
    visibleParts.push(inGroups(curatorGroups));
  }
  if (contributorGroups.length > 0) {
    const groups = inGroups(contributorGroups);
    fullParts.push(frag(`(${groups.sql} and c.created_by_id = ?)`, ...groups.params, userId));
    visibleParts.push(frag(`(${groups.sql} and (c.created_by_id = ? or c.is_published))`, ...groups.params, userId));
  }
  if (viewerGroups.length > 0) {
    const groups = inGroups(viewerGroups);
    visibleParts.push(frag(`(${groups.sql} and c.is_published)`, ...groups.params));
  }
  const or = (parts: Fragment[]) => (parts.length === 0 ? frag('false') : parts.length === 1 ? parts[0]! : (() => {
    const joined = joinFragments(parts, ' or ');
    return frag(`(${joined.sql})`, ...joined.params);
  })());
  return { full: or(fullParts), visible: or(visibleParts) };
}

/** Elements that are never the central metal: their symbols stay text tokens. */
const NON_METALS = new Set(['H', 'He', 'B', 'C', 'N', 'O', 'F', 'Ne', 'Si', 'P', 'S', 'Cl', 'Ar', 'As', 'Se', 'Br', 'Kr', 'Te', 'I', 'Xe', 'At', 'Rn']);

/** The metal a query word names: its symbol as written ("Co", not "CO" or "co") or its name in any case. */
function metalNamedBy(word: string): string | undefined {
  const bySymbol = isElementSymbol(word) && !NON_METALS.has(word) ? word : undefined;
  if (bySymbol) return bySymbol;
  return metalByName.get(word.toLowerCase());
}

const metalByName: ReadonlyMap<string, string> = new Map(
  atomicWeightData.elements.filter((e) => !NON_METALS.has(e.symbol)).map((e) => [e.name.toLowerCase(), e.symbol]),
);

export type SearchTerm = { kind: 'metal'; symbol: string } | { kind: 'substring'; text: string } | { kind: 'word-start'; text: string };

/** The query as search terms: "Co amm" → metal Co + substring "amm"; at most 8 terms. */
export function searchTerms(query: string): SearchTerm[] {
  const words = query
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .replace(/[^A-Za-z0-9]+/g, ' ')
    .trim()
    .split(' ')
    .filter((word) => word.length > 0);
  const seen = new Set<string>();
  const terms: SearchTerm[] = [];
  for (const word of words) {
    const metal = metalNamedBy(word);
    const [token] = searchTokens(word);
    if (!metal && !token) continue;
    const term: SearchTerm = metal
      ? { kind: 'metal', symbol: metal }
      : token!.length >= 3
        ? { kind: 'substring', text: token! }
        : { kind: 'word-start', text: token! };
    const key = term.kind === 'metal' ? `m:${term.symbol}` : `t:${term.text}`;
    if (seen.has(key)) continue;
    seen.add(key);
    terms.push(term);
  }
  return terms.slice(0, 8);
}

/** WHERE condition and 0–1 score of one term; `fuzzy` widens substring terms to word similarity. */
function termSql(term: SearchTerm, fuzzy: boolean): { where: Fragment; score: Fragment } {
  if (term.kind === 'metal') return { where: frag('c.metal = ?', term.symbol), score: frag('1.0::float8') };
  const t = term.text;
  // Tokens are [a-z0-9]+ (normaliseSearchText), so they need no escaping inside LIKE patterns.
  const wholeWord = frag(`(c.search_text = ? or c.search_text like ? or c.search_text like ? or c.search_text like ?)`, t, `${t} %`, `% ${t} %`, `% ${t}`);
  const wordStart = frag(`(c.search_text like ? or c.search_text like ?)`, `${t}%`, `% ${t}%`);
  if (term.kind === 'word-start') {
    return { where: wordStart, score: frag(`(case when ${wholeWord.sql} then 1.0 else 0.9 end)::float8`, ...wholeWord.params) };
  }
  if (fuzzy) {
    return {
      where: frag(`(c.search_text like ? or ? <% c.search_text)`, `%${t}%`, t),
      score: frag(`(case when c.search_text like ? then 0.7 else 0 end + 0.3 * word_similarity(?, c.search_text))::float8`, `%${t}%`, t),
    };
  }
  return {
    where: frag('c.search_text like ?', `%${t}%`),
    score: frag(
      `(case when ${wholeWord.sql} then 1.0 when ${wordStart.sql} then 0.9 else 0.7 end)::float8`,
      ...wholeWord.params,
      ...wordStart.params,
    ),
  };
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

  const terms = searchTerms(query.q ?? '');
  const strict = await runSearch(em, userId, memberships, query, terms, false);
  // Nothing matched exactly: let substring terms match by word similarity (typos), once.
  if (strict.total === 0 && terms.some((term) => term.kind === 'substring')) {
    return runSearch(em, userId, memberships, query, terms, true);
  }
  return strict;
}

async function runSearch(
  em: EntityManager,
  userId: string,
  memberships: readonly MembershipInfo[],
  query: ComplexSearchQuery,
  terms: readonly SearchTerm[],
  fuzzy: boolean,
): Promise<ComplexListResponse> {
  const vis = visibility(memberships, userId);
  const effectiveStatus = frag(`(case when ${vis.full.sql} then c.status else 'approved' end)`, ...vis.full.params);
  const where: Fragment[] = [inGroups(memberships.map((m) => m.groupId)), vis.visible];

  let rank = frag('null::real');
  if (terms.length > 0) {
    const parts = terms.map((term) => termSql(term, fuzzy));
    where.push(...parts.map((p) => p.where));
    const sum = joinFragments(parts.map((p) => p.score), ' + ');
    rank = frag(`((${sum.sql}) / ${terms.length})::real`, ...sum.params);
  }
  if (query.metal) where.push(frag('c.metal = ?', query.metal));
  if (query.oxidationState !== undefined) where.push(frag('c.oxidation_state = ?', query.oxidationState));
  if (query.dCount !== undefined) where.push(frag('c.d_electrons = ?', query.dCount));
  if (query.verdict) where.push(frag('c.verdict = ?', query.verdict));
  if (query.ligand) where.push(frag('c.ligand_ids @> array[?]::text[]', query.ligand));
  if (query.measurementKind) where.push(frag('c.measurement_kinds @> array[?]::text[]', query.measurementKind));
  if (query.hasCitation !== undefined) where.push(frag('c.has_citation = ?', query.hasCitation));
  if (query.status) where.push(frag(`${effectiveStatus.sql} = ?`, ...effectiveStatus.params, query.status));
  const condition = joinFragments(where, ' and ');

  // With text the order is by rank: the name's lower case is only worth computing without text.
  const sortKey = terms.length > 0 ? 'null::text' : 'lower(c.name)';
  const order = terms.length > 0 ? 'rank desc, id asc' : 'sort_name asc, id asc';
  const outerOrder = terms.length > 0 ? 'p.rank desc, p.id asc' : 'p.sort_name asc, p.id asc';
  const offset = (query.page - 1) * query.pageSize;
  // Rank, visibility and order key once per match (materialised CTE, read from the covering
  // index); counting and the page come from it; the heavier columns (snapshot, measurement
  // count, author) only for the page's rows.
  const sql = `
    with hits as materialized (
      select c.id, ${rank.sql} as rank, ${vis.full.sql} as full_view, ${sortKey} as sort_name
        from complex c
       where ${condition.sql}
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
  const rows = await em.execute<Row[]>(sql, [...rank.params, ...vis.full.params, ...condition.params, query.pageSize, offset]);
  let total = rows[0] ? Number(rows[0].total) : 0;
  if (rows.length === 0 && query.page > 1) {
    const counted = await em.execute<{ n: string }[]>(`select count(*) as n from complex c where ${condition.sql}`, condition.params);
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

import type { EntityManager } from '@mikro-orm/postgresql';
import { roleAtLeast } from '@/lib/schemas/groups';
import type {
  ComplexListItem,
  ComplexListResponse,
  ComplexSearchQuery,
  ComplexSnapshot,
  ComplexStatus,
  LibrarySort,
  MeasurementKind,
  ReviewQueueResponse,
  SortDirection,
} from '@/lib/schemas/library';
import { complexStatuses } from '@/lib/schemas/library';
import { ASSUMED_MEASUREMENT_TEMPERATURE_K, pickDecidingMeasurement } from '@/lib/chem/library-decision';
import atomicWeightData from '@/data/atomic-weights.json';
import { isElementSymbol } from '@/lib/chem/elements';
import { AppError } from '@/server/http/errors';
import { personRef } from './complex.mapper';
import { searchTokens } from './derive';
import { membershipsOf, type MembershipInfo } from './library-access';

/**
 * Server-side search over the groups the person belongs to (100 000 entries).
 *
 * Text: every query token must match (AND), each in the cheapest way that is still right:
 * - a metal's symbol as written ("Co", case-sensitive, so "CO" stays carbonyl) or an element name
 *   ("cobalt") is an equality on the indexed `metal` column;
 * - a token of 3+ characters is a substring of `search_text` (`like '%amm%'`);
 * - a shorter token ("en", "6") must start a word of `search_text`.
 * When that finds nothing and a token is 3+ characters, the search runs once more with pg_trgm word
 * similarity for those tokens (`tok <% search_text`), so a typo ("chromium amine") still finds
 * the entry. Rank (0–1) is the mean over tokens: 1 for a metal or a whole word, 0.9 for the start
 * of a word, 0.7 inside a word (word similarity in the typo pass) — cheap string tests.
 * Filters combine with AND. Order: rank desc then id (with text), name then id (without).
 * Visibility is part of the SQL (searchSource): restricted readers search, filter and see the
 * accepted snapshot (the `published_*` columns), authors and curators the working copy.
 *
 * Totals are exact up to SEARCH_COUNT_CAP (1 000) matches, or up to the end of the page asked
 * for if that is deeper; past it the reply says `totalIsLowerBound` (the list reads "1,000+").
 * So no search has to visit every match, and the page is read in an order an index delivers:
 * - without text, one walk of `complex_search_by_name` (group, lower(name), id), index-only,
 *   stopping after countLimit + 1 matches, gives the count and the page;
 * - with text, the strict rank takes few values (one per mix of tiers, rankLevels). Level by
 *   level, highest first, a probe of ≤ countLimit + 1 rows counts the level (and returns its
 *   smallest ids when it is small: a rare or empty level is found by index, e.g. the whole-word
 *   tier by `complex_search_words_gin`); a larger level is walked in id order on
 *   `complex_search_by_id` and stops when the page is full. Two or more text words make more,
 *   mostly small, levels: a capped count comes first, and few matches are simply all ranked.
 * - the typo pass and 3+ text words rank every match and sort (the `single-pass` strategy,
 *   which tests and the bench also use as the reference for the same results).
 * Only the page's rows (≤ 100) are then read from the table (pageOf). Indexes: migrations
 * 20261230 (`complex_search_cover`, `is_published`) and 20261231; their published twins 20270136.
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
  accepted_snapshot: ComplexSnapshot | null;
  has_approved: boolean;
  created_by_id: string | null;
  created_by_name: string | null;
  submitted_by_id?: string | null;
  submitted_by_name?: string | null;
  submitted_at?: Date | string | null;
  /** Raw rows: MikroORM's pg driver returns timestamps as strings. */
  updated_at: Date | string;
  rank: number | null;
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
// One group (the usual case) as an equality, so that b-trees led by group_id can deliver their order.
const inGroups = (ids: readonly string[]) =>
  ids.length === 1 ? frag('c.group_id = ?::uuid', ids[0]) : frag(`c.group_id = any(string_to_array(?, ',')::uuid[])`, csv(ids));

/** The columns a search reads, under the same names in both copies (see `searchSource`). */
const WORKING_COLUMNS = `c.id, c.group_id, c.name, c.status, c.metal, c.oxidation_state, c.d_electrons, c.verdict,
  c.ligand_ids, c.measurement_kinds, c.has_citation, c.search_text, true as full_view`;
const PUBLISHED_COLUMNS = `c.id, c.group_id, c.published_name as name, 'accepted'::varchar(20) as status, c.published_metal as metal,
  c.published_oxidation_state as oxidation_state, c.published_d_electrons as d_electrons, c.published_verdict as verdict,
  c.published_ligand_ids as ligand_ids, c.published_measurement_kinds as measurement_kinds, c.published_has_citation as has_citation,
  c.published_search_text as search_text, false as full_view`;

/**
 * Columns only a chosen order reads (`sort`), in the copy the reader sees: the formula, the number
 * of measurements and the time of the last change. Kept out of the other searches.
 */
const WORKING_SORT_COLUMNS = `c.formula, (select count(*) from measurement m where m.complex_id = c.id) as measurement_count, c.updated_at`;
const PUBLISHED_SORT_COLUMNS = `c.accepted_snapshot->>'formula' as formula,
  coalesce(jsonb_array_length(c.accepted_snapshot->'measurements'), 0)::bigint as measurement_count, c.updated_at`;

/** The ORDER BY keys of each chosen order (before the final id), over the source's columns. */
const SORT_KEYS: Record<LibrarySort, readonly string[]> = {
  formula: ['c.formula'],
  name: ['lower(c.name)'],
  metal: ['c.metal', 'c.oxidation_state'],
  dCount: ['c.d_electrons'],
  verdict: [`array_position(array['labile','intermediate','inert']::text[], c.verdict::text)`],
  measurements: ['c.measurement_count'],
  status: [`array_position(array[${complexStatuses.map((status) => `'${status}'`).join(',')}]::text[], c.status::text)`],
  updated: ['c.updated_at'],
};

/** "order by k1 asc, k2 asc, c.id asc": every key, then the id, in one direction. */
export function sortOrderSql(sort: LibrarySort, dir: SortDirection): string {
  const direction = dir === 'desc' ? 'desc' : 'asc';
  return [...SORT_KEYS[sort], 'c.id'].map((key) => `${key} ${direction}`).join(', ');
}

/**
 * What this reader searches: the rows they see, each with the copy they see. Curators and admins
 * see the working copy of every entry of their groups, contributors the working copy of their own
 * entries, and everyone (contributors for the entries of others, viewers for all) the accepted
 * snapshot of published entries (`is_published`: accepted snapshot, not retired), through its
 * `published_*` columns (migration 20270136). So a word that exists only in a pending edit finds
 * nothing for them, and the accepted name does. Both parts read under the same column names, so
 * the text terms, filters and orders below are written once; a reader with one role (the usual
 * case) gets one part, a plain condition its indexes answer; a contributor gets a UNION ALL that
 * PostgreSQL plans as an append of the two index scans (merged in order when a page is read in
 * name order).
 */
export function searchSource(memberships: readonly MembershipInfo[], userId: string, options: { sortColumns?: boolean } = {}): Fragment {
  const curatorGroups = memberships.filter((m) => roleAtLeast(m.role, 'curator')).map((m) => m.groupId);
  const contributorGroups = memberships.filter((m) => m.role === 'contributor').map((m) => m.groupId);
  const viewerGroups = memberships
    .filter((m) => !roleAtLeast(m.role, 'curator') && m.role !== 'contributor')
    .map((m) => m.groupId);
  const workingParts: Fragment[] = [];
  const publishedParts: Fragment[] = [];
  if (curatorGroups.length > 0) workingParts.push(inGroups(curatorGroups));
  if (contributorGroups.length > 0) {
    const groups = inGroups(contributorGroups);
    workingParts.push(frag(`(${groups.sql} and c.created_by_id = ?::uuid)`, ...groups.params, userId));
    publishedParts.push(frag(`(${groups.sql} and c.is_published and c.created_by_id is distinct from ?::uuid)`, ...groups.params, userId));
  }
  if (viewerGroups.length > 0) {
    const groups = inGroups(viewerGroups);
    publishedParts.push(frag(`(${groups.sql} and c.is_published)`, ...groups.params));
  }
  const or = (parts: Fragment[]) => {
    const joined = joinFragments(parts, ' or ');
    return parts.length === 1 ? joined : frag(`(${joined.sql})`, ...joined.params);
  };
  const selects: Fragment[] = [];
  if (workingParts.length > 0) {
    const where = or(workingParts);
    const extra = options.sortColumns ? `, ${WORKING_SORT_COLUMNS}` : '';
    selects.push(frag(`select ${WORKING_COLUMNS}${extra} from complex c where ${where.sql}`, ...where.params));
  }
  if (publishedParts.length > 0) {
    const where = or(publishedParts);
    const extra = options.sortColumns ? `, ${PUBLISHED_SORT_COLUMNS}` : '';
    selects.push(frag(`select ${PUBLISHED_COLUMNS}${extra} from complex c where ${where.sql}`, ...where.params));
  }
  if (selects.length === 0) return frag('(select null::uuid as id where false)');
  const union = joinFragments(selects, ' union all ');
  return frag(`(${union.sql})`, ...union.params);
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

/** Totals are exact up to this many matches (or the end of the page asked for, if deeper); above it the reply says `totalIsLowerBound`. */
export const SEARCH_COUNT_CAP = 1000;

/**
 * How the page is found. `auto` (the service): index-ordered plans when there are many matches;
 * `single-pass`: every match ranked, then sorted — the reference plan (tests compare the two) and
 * the bench's plain unindexed baseline. Both give the same entries, order, ranks and totals.
 */
export type SearchStrategy = 'auto' | 'single-pass';

export async function searchComplexes(
  em: EntityManager,
  userId: string,
  query: ComplexSearchQuery,
  options: { strategy?: SearchStrategy; memberships?: readonly MembershipInfo[] } = {},
): Promise<ComplexListResponse> {
  // The session lookup already read the person's groups; other callers (bench, CLI) ask here.
  const all = options.memberships
    ? new Map(options.memberships.map((m) => [m.groupId, m]))
    : await membershipsOf(em, userId);
  let memberships = [...all.values()];
  if (query.groupId) {
    const one = all.get(query.groupId);
    if (!one) throw new AppError('NOT_FOUND', 'That group was not found.');
    memberships = [one];
  }
  if (memberships.length === 0) return { items: [], total: 0, totalIsLowerBound: false, page: query.page, pageSize: query.pageSize };

  const terms = searchTerms(query.q ?? '');
  const strategy = options.strategy ?? 'auto';
  const strict = await runSearch(em, userId, memberships, query, terms, false, strategy);
  // Nothing matched exactly: let substring terms match by word similarity (typos), once.
  if (strict.total === 0 && terms.some((term) => term.kind === 'substring')) {
    return runSearch(em, userId, memberships, query, terms, true, strategy);
  }
  return strict;
}

/** One term's share of the rank, as a condition that holds exactly when the term scores `score`. */
interface Tier {
  score: number;
  where: Fragment;
}

/** A rank value with the condition that selects exactly the matches that have it. */
interface RankLevel {
  rank: number;
  where: Fragment;
}

/** Above this many tier combinations (three or more text words) the single pass is used. */
const MAX_RANK_COMBINATIONS = 9;
/** Up to this many rank levels (one text word) the level probes also count; beyond, a count comes first. */
const FEW_RANK_LEVELS = 3;

/**
 * The conditions behind termSql's strict score tiers, split apart; together with the other
 * filters each one selects exactly the matches where the term scores `score`. "t is a whole
 * word" is written as `t = any word of search_text` — the same test as termSql's four LIKEs for
 * a token without spaces — because the words GIN index (migration 20261231) answers it and its
 * statistics estimate it, so a rare or empty top tier costs an index probe, not a long walk.
 */
function tiersOf(term: SearchTerm): Tier[] {
  if (term.kind === 'metal') return [{ score: 1.0, where: frag('c.metal = ?', term.symbol) }];
  const t = term.text;
  const wholeWord = frag(`string_to_array(c.search_text, ' ') @> array[?]::text[]`, t);
  const wordStart = frag(`(c.search_text like ? or c.search_text like ?)`, `${t}%`, `% ${t}%`);
  const tiers: Tier[] = [
    { score: 1.0, where: wholeWord },
    { score: 0.9, where: frag(`(${wordStart.sql} and not ${wholeWord.sql})`, ...wordStart.params, ...wholeWord.params) },
  ];
  if (term.kind === 'substring') {
    tiers.push({ score: 0.7, where: frag(`(c.search_text like ? and not ${wordStart.sql})`, `%${t}%`, ...wordStart.params) });
  }
  return tiers;
}

/**
 * The rank values a strict text search can produce, highest first, each with its condition. The
 * rank is computed here as PostgreSQL computes termSql's expression (float8 sum in term order,
 * divided by the term count, rounded to real), so that combinations with equal ranks share a level.
 */
function rankLevels(terms: readonly SearchTerm[]): RankLevel[] | null {
  let combinations: { scores: number[]; where: Fragment[] }[] = [{ scores: [], where: [] }];
  for (const term of terms) {
    const tiers = tiersOf(term);
    if (combinations.length * tiers.length > MAX_RANK_COMBINATIONS) return null;
    combinations = combinations.flatMap((c) =>
      tiers.map((tier) => ({ scores: [...c.scores, tier.score], where: [...c.where, tier.where] })),
    );
  }
  const byRank = new Map<number, Fragment[]>();
  for (const c of combinations) {
    const rank = Math.fround(c.scores.reduce((sum, score) => sum + score) / terms.length);
    const all = joinFragments(c.where, ' and ');
    byRank.set(rank, [...(byRank.get(rank) ?? []), frag(`(${all.sql})`, ...all.params)]);
  }
  return [...byRank.entries()]
    .sort((a, b) => b[0] - a[0])
    .map(([rank, parts]) => {
      const either = joinFragments(parts, ' or ');
      return { rank, where: frag(`(${either.sql})`, ...either.params) };
    });
}

async function runSearch(
  em: EntityManager,
  userId: string,
  memberships: readonly MembershipInfo[],
  query: ComplexSearchQuery,
  terms: readonly SearchTerm[],
  fuzzy: boolean,
  strategy: SearchStrategy,
): Promise<ComplexListResponse> {
  // Scope, visibility and which copy each row is searched by live in the source; here the filters,
  // and the text terms separately, because a rank level's condition (rankLevels) stands in for them.
  const source = searchSource(memberships, userId, { sortColumns: query.sort !== undefined });
  const from = (alias = 'c') => `${source.sql} ${alias}`;
  const filters: Fragment[] = [frag('true')];
  if (query.metal) filters.push(frag('c.metal = ?', query.metal));
  if (query.oxidationState !== undefined) filters.push(frag('c.oxidation_state = ?', query.oxidationState));
  if (query.dCount !== undefined) filters.push(frag('c.d_electrons = ?', query.dCount));
  if (query.verdict) filters.push(frag('c.verdict = ?', query.verdict));
  if (query.ligand) filters.push(frag('c.ligand_ids @> array[?]::text[]', query.ligand));
  if (query.measurementKind) filters.push(frag('c.measurement_kinds @> array[?]::text[]', query.measurementKind));
  if (query.hasCitation !== undefined) filters.push(frag('c.has_citation = ?', query.hasCitation));
  if (query.status) filters.push(frag('c.status = ?', query.status));
  if (query.ids) filters.push(frag(`c.id = any(string_to_array(?, ',')::uuid[])`, csv(query.ids)));
  const filterCondition = joinFragments(filters, ' and ');

  let rank = frag('null::real');
  const textWhere: Fragment[] = [];
  if (terms.length > 0) {
    const parts = terms.map((term) => termSql(term, fuzzy));
    textWhere.push(...parts.map((p) => p.where));
    const sum = joinFragments(parts.map((p) => p.score), ' + ');
    rank = frag(`((${sum.sql}) / ${terms.length})::real`, ...sum.params);
  }
  const condition = joinFragments([...filters, ...textWhere], ' and ');

  const offset = (query.page - 1) * query.pageSize;
  // Totals are counted up to the cap (or the end of this page), not to the last match.
  const countLimit = Math.max(SEARCH_COUNT_CAP, offset + query.pageSize);
  const answer = (matches: number, ids: readonly string[]) =>
    pageOf(em, ids, source, rank).then((items) => ({
      items,
      total: Math.min(matches, countLimit),
      totalIsLowerBound: matches > countLimit,
      page: query.page,
      pageSize: query.pageSize,
    }));

  const countUpTo = async (limit: number) => {
    // `limit` stops the scan: at most `limit` matches are visited.
    const [row] = await em.execute<{ n: string | number }[]>(
      `select count(*) as n from (select 1 from ${from()} where ${condition.sql} limit ?) x`,
      [...source.params, ...condition.params, limit],
    );
    return Number(row?.n ?? 0);
  };

  if (query.sort) {
    // A chosen column order (both strategies): count up to the limit, then sort the matches by
    // the column (a top-N sort) and read the page; the id settles ties.
    const matches = await countUpTo(countLimit + 1);
    if (matches <= offset) return answer(matches, []);
    const rows = await em.execute<{ id: string }[]>(
      `select c.id from ${from()} where ${condition.sql}
        order by ${sortOrderSql(query.sort, query.dir ?? 'asc')} limit ? offset ?`,
      [...source.params, ...condition.params, query.pageSize, offset],
    );
    return answer(matches, rows.map((r) => r.id));
  }

  if (terms.length === 0) {
    // Name then id, the order complex_search_by_name holds: one walk that stops after countLimit + 1
    // matches gives both the count and the page (its first rows).
    const [walk] = await em.execute<{ n: string | number; ids: string[] | null }[]>(
      `with walk as materialized (
         select c.id, row_number() over (order by lower(c.name) asc, c.id asc) as n
           from ${from()} where ${condition.sql}
          order by lower(c.name) asc, c.id asc limit ?)
       select (select count(*) from walk) as n,
              array(select w.id::text from walk w where w.n > ? order by w.n limit ?) as ids`,
      [...source.params, ...condition.params, countLimit + 1, offset, query.pageSize],
    );
    return answer(Number(walk?.n ?? 0), walk?.ids ?? []);
  }

  const levels = !fuzzy && strategy === 'auto' ? rankLevels(terms) : null;
  // One text word (three levels at most): the level probes below count as they go. More words
  // make more levels, most of them small: count first, and rank every match when there are few.
  let counted: number | null = null;
  if (levels && levels.length > FEW_RANK_LEVELS) counted = await countUpTo(countLimit + 1);
  if (levels && (counted === null || counted > countLimit)) {
    // Rank level by rank level, highest first (levels partition the matches). Each level is
    // probed for up to countLimit + 1 rows in any order: a limit above the planner's estimate
    // makes it take its cheapest whole plan (an index for a rare or empty level) or an
    // early-stopping walk (a common one); a small limit would tempt it to walk the whole group in
    // id order for a level with (nearly) no rows. A level that ends within the probe is complete
    // and its smallest ids come back at once; only a larger one is then walked in id order from
    // complex_search_by_id, up to the end of the page. Without a count beforehand, the probes'
    // sizes add up to the total: the loop stops once the page is full and the sum is past the
    // count limit (or every level is counted).
    const wanted = offset + query.pageSize;
    const found: string[] = [];
    let matches = 0;
    for (const level of levels) {
      if (found.length >= wanted && (counted !== null || matches > countLimit)) break;
      const needed = Math.max(0, wanted - found.length);
      const levelCondition = frag(`${filterCondition.sql} and ${level.where.sql}`, ...filterCondition.params, ...level.where.params);
      const [probe] = await em.execute<{ n: string | number; ids: string[] | null }[]>(
        `select count(*) as n, (array_agg(x.id::text order by x.id))[1:?] as ids
           from (select c.id from ${from()} where ${levelCondition.sql} limit ?) x`,
        [needed, ...source.params, ...levelCondition.params, countLimit + 1],
      );
      const size = Number(probe?.n ?? 0);
      matches += size;
      if (needed === 0) continue;
      if (size <= countLimit) {
        found.push(...(probe?.ids ?? []));
      } else {
        const rows = await em.execute<{ id: string }[]>(
          `select c.id from ${from()} where ${levelCondition.sql} order by c.id asc limit ?`,
          [...source.params, ...levelCondition.params, needed],
        );
        found.push(...rows.map((r) => r.id));
      }
    }
    return answer(counted ?? matches, found.slice(offset, wanted));
  }

  // Few matches of several words, the fuzzy pass, many words, or the reference strategy: count
  // up to the limit, then rank every match and sort.
  const matches = counted ?? (await countUpTo(countLimit + 1));
  if (matches <= offset) return answer(matches, []);
  const rows = await em.execute<{ id: string }[]>(
    `select h.id from (select c.id, ${rank.sql} as rank from ${from()} where ${condition.sql}) h
      order by h.rank desc, h.id asc limit ? offset ?`,
    [...rank.params, ...source.params, ...condition.params, query.pageSize, offset],
  );
  return answer(matches, rows.map((r) => r.id));
}

/**
 * The list items for the page's ids, in that order: snapshot, measurement count, author and rank
 * for these rows only. The source says which copy the reader sees and ranks each row by.
 */
async function pageOf(em: EntityManager, ids: readonly string[], source: Fragment, rank: Fragment): Promise<ComplexListItem[]> {
  if (ids.length === 0) return [];
  const sql = `
    select c.id, c.group_id, c.formula, c.name, c.status, c.metal, c.oxidation_state, c.d_electrons, c.spin_state,
           c.verdict, c.ligand_ids, c.measurement_kinds, c.has_citation, c.version, c.updated_at, c.created_by_id,
           v.full_view,
           case when v.full_view then null else c.accepted_snapshot end as accepted_snapshot,
           (c.accepted_snapshot is not null) as has_approved,
           (select count(*) from measurement m where m.complex_id = c.id) as measurement_count,
           u.display_name as created_by_name,
           v.rank
      from unnest(string_to_array(?, ',')::uuid[]) with ordinality as p(id, ord)
      join complex c on c.id = p.id
      join lateral (select c.full_view, ${rank.sql} as rank from ${source.sql} c where c.id = p.id) v on true
      left join app_user u on u.id = c.created_by_id
     order by p.ord`;
  const rows = await em.execute<Row[]>(sql, [csv(ids), ...rank.params, ...source.params]);
  const workingIds = rows.filter((row) => row.full_view || !row.accepted_snapshot).map((row) => row.id);
  const working = new Map<string, RateMeasurement[]>();
  if (workingIds.length > 0) {
    const measured = await em.execute<(RateMeasurement & { complex_id: string })[]>(
      `select m.complex_id, m.kind, m.value, m.unit, m.temperature_k as "temperatureK"
         from measurement m
        where m.complex_id = any(string_to_array(?, ',')::uuid[])
          and m.kind in ('water-exchange', 'ligand-exchange', 'substitution', 'half-life')
        order by m.complex_id, m.created_at, m.id`,
      [csv(workingIds)],
    );
    for (const m of measured) working.set(m.complex_id, [...(working.get(m.complex_id) ?? []), m]);
  }
  return rows.map((row) => {
    const measurements = row.full_view || !row.accepted_snapshot ? working.get(row.id) ?? [] : row.accepted_snapshot.measurements;
    return { ...toListItem(row), headlineRate: headlineRate(row.id, measurements) };
  });
}

type RateMeasurement = { kind: string; value: number; unit: string; temperatureK: number | null };

/** The measurement that would decide the entry's verdict at 25 °C (lib/chem/library-decision.ts), as a first-order k. */
function headlineRate(entryId: string, measurements: readonly RateMeasurement[]): ComplexListItem['headlineRate'] {
  const picked = pickDecidingMeasurement(
    [{ entryId, entryName: '', entryFormula: '', measurements: measurements.map((m) => ({ ...m, value: Number(m.value), citation: null })) }],
    ASSUMED_MEASUREMENT_TEMPERATURE_K,
  );
  return picked ? { kind: picked.kind, kPerSecond: picked.kPerSecond, temperatureK: picked.temperatureK } : null;
}

function toListItem(row: Row): ComplexListItem {
  const people = new Map<string, string>();
  if (row.created_by_id && row.created_by_name) people.set(row.created_by_id, row.created_by_name);
  const published = !row.full_view && row.accepted_snapshot ? row.accepted_snapshot : null;
  const pending = row.has_approved && row.status !== 'accepted' && row.status !== 'retired';
  const base = {
    id: row.id,
    groupId: row.group_id,
    version: row.version,
    rank: row.rank === null ? null : Number(row.rank),
    createdBy: personRef(people, row.created_by_id),
    updatedAt: new Date(row.updated_at).toISOString(),
    headlineRate: null,
  };
  if (published) {
    return {
      ...base,
      formula: published.formula,
      name: published.name,
      status: 'accepted',
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
  const rows = await em.execute<(Row & { accepted_version: number | null })[]>(
    `select c.*, true as full_view, (c.accepted_snapshot is not null) as has_approved, null::real as rank,
            (select count(*) from measurement m where m.complex_id = c.id) as measurement_count,
            u.display_name as created_by_name, s.display_name as submitted_by_name
       from complex c
       left join app_user u on u.id = c.created_by_id
       left join app_user s on s.id = c.submitted_by_id
      where c.group_id = any(string_to_array(?, ',')::uuid[]) and c.status = 'in-review'
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
      isEditOfApproved: row.accepted_snapshot != null,
    };
  });
  return { items, total: items.length };
}

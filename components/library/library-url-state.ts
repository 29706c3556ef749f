import type { ComplexFilters } from '@/lib/api/library';
import { complexSearchQuerySchema, librarySortKeys, type LibrarySort, type SortDirection } from '@/lib/schemas/library';

/**
 * The library's search, filters, order and loaded pages as they live in the address
 * (`/library?q=co&metal=Co&sort=updated&dir=desc&pages=2`), so that Back and a shared link bring
 * the same list back. Read leniently: a value the list query would refuse is dropped, not an error.
 */
export interface LibraryUrlState {
  filters: ComplexFilters;
  sort?: LibrarySort;
  dir?: SortDirection;
  /** How many pages of the list are loaded ("Load more" adds one). */
  pages: number;
}

/** Restoring a link loads at most this many pages (a long list is read further with "Load more"). */
export const MAX_RESTORED_PAGES = 10;

const FILTER_KEYS = ['q', 'metal', 'oxidationState', 'dCount', 'verdict', 'ligand', 'measurementKind', 'status', 'hasCitation', 'groupId'] as const;
/** Every parameter the library reads from the address, in the order it writes them. */
export const LIBRARY_URL_KEYS = [...FILTER_KEYS, 'sort', 'dir', 'pages'] as const;

type RawParams = Record<string, string | string[] | undefined>;

const first = (value: string | string[] | undefined) => (Array.isArray(value) ? value[0] : value);

export function readLibraryUrl(params: RawParams): LibraryUrlState {
  const filters: Record<string, unknown> = {};
  const shape = complexSearchQuerySchema.shape;
  for (const key of FILTER_KEYS) {
    const raw = first(params[key]);
    if (raw === undefined || raw === '') continue;
    const parsed = shape[key].safeParse(raw);
    if (parsed.success && parsed.data !== undefined) filters[key] = parsed.data;
  }
  const sortRaw = first(params.sort);
  const sort = (librarySortKeys as readonly string[]).includes(sortRaw ?? '') ? (sortRaw as LibrarySort) : undefined;
  const dirRaw = first(params.dir);
  const dir = sort && (dirRaw === 'asc' || dirRaw === 'desc') ? dirRaw : undefined;
  const pagesNumber = Number(first(params.pages));
  const pages = Number.isInteger(pagesNumber) && pagesNumber >= 1 ? Math.min(pagesNumber, MAX_RESTORED_PAGES) : 1;
  return { filters: filters as ComplexFilters, sort, dir, pages };
}

/** Every key of LIBRARY_URL_KEYS, with undefined for the ones to leave out of the address. */
export function libraryUrlParams(state: LibraryUrlState): Record<(typeof LIBRARY_URL_KEYS)[number], string | undefined> {
  const out = Object.fromEntries(LIBRARY_URL_KEYS.map((key) => [key, undefined])) as Record<(typeof LIBRARY_URL_KEYS)[number], string | undefined>;
  for (const key of FILTER_KEYS) {
    const value = state.filters[key];
    if (value === undefined || value === null) continue;
    const text = String(value).trim();
    if (text !== '') out[key] = text;
  }
  if (state.sort) {
    out.sort = state.sort;
    out.dir = state.dir ?? 'asc';
  }
  if (state.pages > 1) out.pages = String(state.pages);
  return out;
}

/** Same search, filters and order (the loaded pages aside)? */
export function sameQuery(a: LibraryUrlState, b: LibraryUrlState): boolean {
  const pick = (s: LibraryUrlState) => JSON.stringify({ ...libraryUrlParams(s), pages: undefined });
  return pick(a) === pick(b);
}

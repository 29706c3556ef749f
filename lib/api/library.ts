import {
  keepPreviousData,
  useInfiniteQuery,
  useMutation,
  useQuery,
  useQueryClient,
  type QueryClient,
} from '@tanstack/react-query';
import type { z } from 'zod';
import { useMemo } from 'react';
import {
  complexDetailSchema,
  complexListResponseSchema,
  ligandsResponseSchema,
  measuredResponseSchema,
  reviewQueueResponseSchema,
  reviewResponseSchema,
  revisionDiffSchema,
  revisionsResponseSchema,
  staleVersionErrorSchema,
  type ComplexDetail,
  type ComplexListResponse,
  type ComplexSearchQuery,
  type CreateComplexInput,
  type ReviewInput,
  type ReviewResponse,
  type TransitionInput,
  type SaveComplexInput,
  duplicatesResponseSchema,
  libraryPreferencesSchema,
  type LibraryColumn,
  type LibraryPreferences,
} from '@/lib/schemas/library';
import { complexFacetsSchema } from '@/lib/schemas/library-facets';
import { ApiError, apiErrorFrom, apiRequest, requestHeaders, writeKeys } from './api-client';

/**
 * The curated library: typed calls for /api/complexes, /api/review-queue and /api/ligands,
 * their query keys, and the hooks the screens use. Every change invalidates the lists, the entry, its
 * history and the review queue; a 409 on a stale version arrives as StaleVersionError with the entry
 * as it is now (never a silent overwrite).
 */

/** Search filters as the screens hold them (page is handled by the infinite query). */
export type ComplexFilters = Omit<Partial<ComplexSearchQuery>, 'page' | 'pageSize'>;

export const LIBRARY_PAGE_SIZE = 20;

export const complexKeys = {
  all: ['complexes'] as const,
  lists: () => [...complexKeys.all, 'list'] as const,
  list: (filters: ComplexFilters) => [...complexKeys.lists(), normaliseFilters(filters)] as const,
  details: () => [...complexKeys.all, 'detail'] as const,
  detail: (id: string) => [...complexKeys.details(), id] as const,
  revisions: (id: string) => [...complexKeys.detail(id), 'revisions'] as const,
  diff: (id: string, from: number, to: number) => [...complexKeys.revisions(id), 'diff', from, to] as const,
};

/** The person's library preferences (the table's columns), kept on the server so they follow the person. */
export const libraryPreferenceKeys = {
  all: ['library-preferences'] as const,
};

export const reviewQueueKeys = {
  all: ['review-queue'] as const,
};

export const ligandKeys = {
  all: ['ligands'] as const,
  list: (groupId: string | null) => [...ligandKeys.all, groupId ?? 'reference'] as const,
};

/** Drops empty filters so `{ q: '' }` and `{}` share one cache entry. */
export function normaliseFilters(filters: ComplexFilters): ComplexFilters {
  const out: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(filters)) {
    if (value === undefined || value === null) continue;
    if (typeof value === 'string' && value.trim() === '') continue;
    out[key] = typeof value === 'string' ? value.trim() : value;
  }
  return out as ComplexFilters;
}

export function searchParams(filters: ComplexFilters, page: number, pageSize = LIBRARY_PAGE_SIZE): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(normaliseFilters(filters))) params.set(key, String(value));
  params.set('page', String(page));
  params.set('pageSize', String(pageSize));
  return params.toString();
}

// ---- errors ---------------------------------------------------------------------------------------

/** 409 because someone saved the entry after it was loaded: carries the entry as it is now. */
export class StaleVersionError extends ApiError {
  constructor(
    message: string,
    readonly current: ComplexDetail,
  ) {
    super(409, 'CONFLICT', message);
    this.name = 'StaleVersionError';
  }
}

/** No retries on 4xx (the request itself is wrong); two more tries on network and 5xx failures. */
export function retryUnlessClientError(failureCount: number, error: unknown): boolean {
  return !(error instanceof ApiError && error.status >= 400 && error.status < 500) && failureCount < 2;
}

/**
 * Like apiRequest, but a stale-version 409 keeps its `current` entry (apiRequest's generic error
 * shape drops extra members of the error body).
 */
async function versionedRequest<T>(path: string, schema: z.ZodType<T>, init: { method: string; body?: unknown; idempotencyKey?: string }): Promise<T> {
  let response: Response;
  try {
    response = await fetch(`/api${path}`, {
      method: init.method,
      headers: requestHeaders(init),
      body: init.body === undefined ? undefined : JSON.stringify(init.body),
      credentials: 'same-origin',
    });
  } catch {
    throw new ApiError(0, 'NETWORK', 'The server could not be reached. Check your connection.');
  }
  const payload: unknown = await response.json().catch(() => null);
  if (!response.ok) {
    if (response.status === 409) {
      const stale = staleVersionErrorSchema.safeParse(payload);
      if (stale.success) throw new StaleVersionError(stale.data.error.message, stale.data.error.current);
    }
    throw apiErrorFrom(response.status, payload);
  }
  return schema.parse(payload);
}

// ---- plain API functions ------------------------------------------------------------------------

const entryPath = (id: string) => `/complexes/${encodeURIComponent(id)}`;

export function fetchComplexes(filters: ComplexFilters, page: number, signal?: AbortSignal): Promise<ComplexListResponse> {
  return apiRequest(`/complexes?${searchParams(filters, page)}`, complexListResponseSchema, { signal });
}

export function fetchComplex(id: string, signal?: AbortSignal): Promise<ComplexDetail> {
  return apiRequest(entryPath(id), complexDetailSchema, { signal });
}

export function createComplex(input: CreateComplexInput, idempotencyKey?: string): Promise<ComplexDetail> {
  return apiRequest('/complexes', complexDetailSchema, { method: 'POST', body: input, idempotencyKey });
}

/** Saves the whole entry (one request, one revision); a stale version throws StaleVersionError. */
export function saveComplex(id: string, input: SaveComplexInput, idempotencyKey?: string): Promise<ComplexDetail> {
  return versionedRequest(entryPath(id), complexDetailSchema, { method: 'PUT', body: input, idempotencyKey });
}

export function submitComplex(id: string, input: TransitionInput = {}): Promise<ComplexDetail> {
  return versionedRequest(`${entryPath(id)}/submit`, complexDetailSchema, { method: 'POST', body: input });
}

export function reviewComplex(id: string, input: ReviewInput): Promise<ReviewResponse> {
  return versionedRequest(`${entryPath(id)}/reviews`, reviewResponseSchema, { method: 'POST', body: input });
}

export function retireComplex(id: string, input: TransitionInput = {}): Promise<ComplexDetail> {
  return versionedRequest(`${entryPath(id)}/retire`, complexDetailSchema, { method: 'POST', body: input });
}

export async function fetchRevisions(id: string, signal?: AbortSignal) {
  const { revisions } = await apiRequest(`${entryPath(id)}/revisions`, revisionsResponseSchema, { signal });
  return revisions;
}

export function fetchRevisionDiff(id: string, from: number, to: number, signal?: AbortSignal) {
  return apiRequest(`${entryPath(id)}/revisions/diff?from=${from}&to=${to}`, revisionDiffSchema, { signal });
}

export function fetchReviewQueue(signal?: AbortSignal) {
  return apiRequest('/review-queue', reviewQueueResponseSchema, { signal });
}

export async function fetchLigands(groupId: string | null, signal?: AbortSignal) {
  const query = groupId ? `?groupId=${encodeURIComponent(groupId)}` : '';
  const { ligands } = await apiRequest(`/ligands${query}`, ligandsResponseSchema, { signal });
  return ligands;
}

export function fetchLibraryPreferences(signal?: AbortSignal): Promise<LibraryPreferences> {
  return apiRequest('/auth/me/preferences', libraryPreferencesSchema, { signal });
}

/** Saves the shown columns (null: every column). */
export function saveLibraryColumns(libraryColumns: LibraryColumn[] | null): Promise<LibraryPreferences> {
  return apiRequest('/auth/me/preferences', libraryPreferencesSchema, { method: 'PATCH', body: { libraryColumns } });
}

// ---- cache rules ----------------------------------------------------------------------------------

/** After any change of an entry: store the fresh copy, refetch lists, history and the queue. */
export async function entryChanged(client: QueryClient, entry: ComplexDetail): Promise<void> {
  client.setQueryData(complexKeys.detail(entry.id), entry);
  await Promise.all([
    client.invalidateQueries({ queryKey: complexKeys.lists() }),
    client.invalidateQueries({ queryKey: complexKeys.revisions(entry.id) }),
    client.invalidateQueries({ queryKey: reviewQueueKeys.all }),
  ]);
}

/** A 409 brought the entry as it is now: the cache should show that too. */
function rememberCurrent(client: QueryClient, error: unknown) {
  if (error instanceof StaleVersionError) void entryChanged(client, error.current);
}

// ---- hooks ------------------------------------------------------------------------------------------

/**
 * Pages of the search, appended as the person scrolls or presses "Load more". While new filters
 * load, the previous result stays on screen (placeholderData), and a failed refresh keeps it too.
 */
export function useComplexesQuery(filters: ComplexFilters, enabled = true) {
  return useInfiniteQuery({
    queryKey: complexKeys.list(filters),
    queryFn: ({ pageParam, signal }) => fetchComplexes(filters, pageParam, signal),
    initialPageParam: 1,
    getNextPageParam: (last) => (last.totalIsLowerBound || last.page * last.pageSize < last.total ? last.page + 1 : undefined),
    placeholderData: keepPreviousData,
    retry: retryUnlessClientError,
    enabled,
  });
}

export function useLibraryPreferencesQuery(enabled = true) {
  return useQuery({
    queryKey: libraryPreferenceKeys.all,
    queryFn: ({ signal }) => fetchLibraryPreferences(signal),
    enabled,
    retry: retryUnlessClientError,
    staleTime: 5 * 60_000,
  });
}

/** Shows the new choice at once; the server's answer (or, on failure, the previous choice) follows. */
export function useSaveLibraryColumnsMutation() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: saveLibraryColumns,
    onMutate: async (libraryColumns) => {
      await client.cancelQueries({ queryKey: libraryPreferenceKeys.all });
      const previous = client.getQueryData<LibraryPreferences>(libraryPreferenceKeys.all);
      client.setQueryData<LibraryPreferences>(libraryPreferenceKeys.all, { ...previous, libraryColumns });
      return { previous };
    },
    onError: (_error, _columns, context) => {
      if (context?.previous) client.setQueryData(libraryPreferenceKeys.all, context.previous);
    },
    onSuccess: (saved) => client.setQueryData(libraryPreferenceKeys.all, saved),
  });
}

export function useComplexQuery(id: string | null | undefined) {
  return useQuery({
    queryKey: complexKeys.detail(id ?? ''),
    queryFn: ({ signal }) => fetchComplex(id ?? '', signal),
    enabled: !!id,
    retry: retryUnlessClientError,
  });
}

export function useRevisionsQuery(id: string | null | undefined) {
  return useQuery({
    queryKey: complexKeys.revisions(id ?? ''),
    queryFn: ({ signal }) => fetchRevisions(id ?? '', signal),
    enabled: !!id,
    retry: retryUnlessClientError,
  });
}

export function useRevisionDiffQuery(id: string, from: number | null, to: number | null) {
  return useQuery({
    queryKey: complexKeys.diff(id, from ?? 0, to ?? 0),
    queryFn: ({ signal }) => fetchRevisionDiff(id, from ?? 0, to ?? 0, signal),
    enabled: from !== null && to !== null && from !== to,
    retry: retryUnlessClientError,
    // A diff between two stored revisions never changes.
    staleTime: Infinity,
  });
}

export function useReviewQueueQuery(enabled = true) {
  return useQuery({
    queryKey: reviewQueueKeys.all,
    queryFn: ({ signal }) => fetchReviewQueue(signal),
    enabled,
    retry: retryUnlessClientError,
  });
}

export function useLigandsQuery(groupId: string | null, enabled = true) {
  return useQuery({
    queryKey: ligandKeys.list(groupId),
    queryFn: ({ signal }) => fetchLigands(groupId, signal),
    enabled,
    retry: retryUnlessClientError,
    staleTime: 5 * 60_000,
  });
}

export function useCreateComplexMutation() {
  const client = useQueryClient();
  const keys = useMemo(() => writeKeys(), []);
  return useMutation<ComplexDetail, Error, CreateComplexInput>({
    mutationFn: (input) => createComplex(input, keys.keyFor(input)),
    onSuccess: (entry) => {
      keys.done();
      return entryChanged(client, entry);
    },
  });
}

/** The one place a stale save (409) is handled: the cache takes the entry as it is now. */
export function useSaveComplexMutation(id: string) {
  const client = useQueryClient();
  const keys = useMemo(() => writeKeys(), []);
  return useMutation<ComplexDetail, Error, SaveComplexInput>({
    mutationFn: (input) => saveComplex(id, input, keys.keyFor(input)),
    onSuccess: (entry) => {
      keys.done();
      return entryChanged(client, entry);
    },
    onError: (error) => rememberCurrent(client, error),
  });
}

export function useSubmitComplexMutation(id: string) {
  const client = useQueryClient();
  return useMutation<ComplexDetail, Error, TransitionInput>({
    mutationFn: (input) => submitComplex(id, input),
    onSuccess: (entry) => entryChanged(client, entry),
    onError: (error) => rememberCurrent(client, error),
  });
}

export function useReviewComplexMutation(id: string) {
  const client = useQueryClient();
  return useMutation<ReviewResponse, Error, ReviewInput>({
    mutationFn: (input) => reviewComplex(id, input),
    onSuccess: ({ complex }) => entryChanged(client, complex),
    onError: (error) => rememberCurrent(client, error),
  });
}

export function useRetireComplexMutation(id: string) {
  const client = useQueryClient();
  return useMutation<ComplexDetail, Error, TransitionInput>({
    mutationFn: (input) => retireComplex(id, input),
    onSuccess: (entry) => entryChanged(client, entry),
    onError: (error) => rememberCurrent(client, error),
  });
}

/** Measured meets predicted: accepted measurements of the same complex in one of my groups. */
export const measuredKeys = {
  forFormula: (groupId: string, formula: string) => ['measured', groupId, formula] as const,
};

export function fetchLibraryMeasured(groupId: string, formula: string, signal?: AbortSignal) {
  const query = new URLSearchParams({ formula }).toString();
  return apiRequest(`/groups/${encodeURIComponent(groupId)}/measured?${query}`, measuredResponseSchema, { signal });
}

/** Entries of the same species already in the group (none asked while the formula cannot be read). */
export function useDuplicatesQuery(groupId: string | null, formula: string | null, exceptId: string | null) {
  return useQuery({
    queryKey: [...complexKeys.lists(), 'duplicates', groupId ?? '', formula ?? '', exceptId ?? ''] as const,
    queryFn: ({ signal }) => {
      const params = new URLSearchParams({ formula: formula ?? '' });
      if (groupId) params.set('groupId', groupId);
      if (exceptId) params.set('exceptId', exceptId);
      return apiRequest(`/complexes/duplicates?${params.toString()}`, duplicatesResponseSchema, { signal });
    },
    enabled: !!formula,
    staleTime: 30_000,
    retry: retryUnlessClientError,
  });
}

export function useLibraryMeasuredQuery(groupId: string | null, formula: string | null) {
  return useQuery({
    queryKey: measuredKeys.forFormula(groupId ?? '', formula ?? ''),
    queryFn: ({ signal }) => fetchLibraryMeasured(groupId ?? '', formula ?? '', signal),
    enabled: !!groupId && !!formula,
    staleTime: 60_000,
  });
}

/**
 * Filter options from the server: what the person may see holds these metals, oxidation states …
 * Kept under the list keys, so every change that refreshes the lists refreshes the options too.
 */
export const complexFacetKeys = {
  of: (groupId: string | undefined) => [...complexKeys.lists(), 'facets', groupId ?? 'all'] as const,
};

export function fetchComplexFacets(groupId: string | undefined, signal?: AbortSignal) {
  const query = groupId ? `?groupId=${encodeURIComponent(groupId)}` : '';
  return apiRequest(`/complexes/facets${query}`, complexFacetsSchema, { signal });
}

export function useComplexFacetsQuery(groupId: string | undefined) {
  return useQuery({
    queryKey: complexFacetKeys.of(groupId),
    queryFn: ({ signal }) => fetchComplexFacets(groupId, signal),
    retry: retryUnlessClientError,
    staleTime: 30_000,
  });
}

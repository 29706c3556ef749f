import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import {
  attachmentListSchema,
  attachmentSchema,
  doiLookupResponseSchema,
  importFileErrorSchema,
  importJobSchema,
  mailPreferencesSchema,
  type Attachment,
  type CsvMapping,
  type DuplicateChoice,
  type DoiLookupResponse,
  type ImportIssue,
  type ImportJob,
  type MailPreferences,
  type UpdateMailPreferencesInput,
} from '@/lib/schemas/exchange';
import { ApiError, apiErrorFrom, apiRequest } from './api-client';
import { normaliseFilters, retryUnlessClientError, type ComplexFilters } from './library';

/**
 * Library exchange: CSV import jobs, export links, DOI look-up, attachments and e-mail
 * preferences. Files go up as the raw request body (never JSON, never a multipart form), so uploads
 * use fetch directly; every answer is parsed with the shared schemas.
 */

const API_BASE = '/api';

/** A file the person chose: what to show (name, size) and the bytes to send. */
export interface PickedFile {
  name: string;
  sizeBytes: number;
  /** The browser's guess at the type ('' when it has none). */
  contentType: string;
  body: Blob;
}

/** A 4xx for a file that could not be read at all; `issues` points at rows and cells when given. */
export class FileRefusedError extends ApiError {
  constructor(
    status: number,
    code: ApiError['code'],
    message: string,
    fields: Record<string, string>,
    readonly issues: ImportIssue[],
  ) {
    super(status, code, message, fields);
    this.name = 'FileRefusedError';
  }
}

async function sendRaw<T>(
  path: string,
  schema: z.ZodType<T>,
  init: { method: string; body?: Blob | string; contentType?: string; signal?: AbortSignal },
): Promise<T> {
  let response: Response;
  try {
    response = await fetch(`${API_BASE}${path}`, {
      method: init.method,
      headers: init.contentType ? { 'Content-Type': init.contentType } : undefined,
      body: init.body,
      credentials: 'same-origin',
      signal: init.signal,
    });
  } catch (cause) {
    if (cause instanceof Error && cause.name === 'AbortError') throw cause;
    throw new ApiError(0, 'NETWORK', 'The server could not be reached. Check your connection.');
  }
  const payload: unknown = response.status === 204 ? null : await response.json().catch(() => null);
  if (!response.ok) {
    const refused = importFileErrorSchema.safeParse(payload);
    if (refused.success) {
      const { code, message, fields, issues } = refused.data.error;
      throw new FileRefusedError(response.status, code, message, fields ?? {}, issues ?? []);
    }
    throw apiErrorFrom(response.status, payload);
  }
  return schema.parse(payload);
}

// ---- import -----------------------------------------------------------------------------------------

export interface StartImportInput {
  file: PickedFile;
  groupId?: string;
  dryRun: boolean;
  mapping?: CsvMapping;
  /** For every duplicate row, and per row (by the row number the dry run reported). */
  duplicates?: DuplicateChoice;
  duplicateChoices?: Record<string, DuplicateChoice>;
}

export function importPath({ file, groupId, dryRun, mapping, duplicates, duplicateChoices }: Omit<StartImportInput, 'file'> & { file: Pick<PickedFile, 'name'> }): string {
  const params = new URLSearchParams();
  if (groupId) params.set('groupId', groupId);
  params.set('dryRun', dryRun ? 'true' : 'false');
  params.set('fileName', file.name.slice(0, 200));
  if (mapping && Object.keys(mapping).length > 0) params.set('mapping', JSON.stringify(mapping));
  if (duplicates) params.set('duplicates', duplicates);
  if (duplicateChoices && Object.keys(duplicateChoices).length > 0) params.set('duplicateChoices', JSON.stringify(duplicateChoices));
  return `/imports?${params.toString()}`;
}

/** POST /api/imports: 202 with the queued job (poll it with fetchImportJob). */
export function startImport(input: StartImportInput): Promise<ImportJob> {
  return sendRaw(importPath(input), importJobSchema, { method: 'POST', body: input.file.body, contentType: 'text/csv' });
}

export function fetchImportJob(id: string, signal?: AbortSignal): Promise<ImportJob> {
  return apiRequest(`/imports/${encodeURIComponent(id)}`, importJobSchema, { signal });
}

export const isImportFinished = (job: Pick<ImportJob, 'state'>) => job.state === 'succeeded' || job.state === 'failed';

// ---- export -----------------------------------------------------------------------------------------

export const exportFormats = {
  csv: { path: '/exports/library.csv', label: 'CSV (entries and measurements)' },
  bib: { path: '/exports/citations.bib', label: 'BibTeX (citations)' },
  ris: { path: '/exports/citations.ris', label: 'RIS (citations)' },
} as const;
export type ExportFormat = keyof typeof exportFormats;

/** Same-origin link to an export with the library's active search filters (no paging). */
export function exportUrl(format: ExportFormat, filters: ComplexFilters): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(normaliseFilters(filters))) params.set(key, String(value));
  const query = params.toString();
  return `${API_BASE}${exportFormats[format].path}${query ? `?${query}` : ''}`;
}

// ---- DOI look-up ------------------------------------------------------------------------------------

export function lookupDoi(doi: string, signal?: AbortSignal): Promise<DoiLookupResponse> {
  return apiRequest(`/citations/lookup?doi=${encodeURIComponent(doi.trim())}`, doiLookupResponseSchema, { signal });
}

// ---- attachments ------------------------------------------------------------------------------------

const attachmentsPath = (complexId: string) => `/complexes/${encodeURIComponent(complexId)}/attachments`;

export async function fetchAttachments(complexId: string, signal?: AbortSignal): Promise<Attachment[]> {
  const { attachments } = await apiRequest(attachmentsPath(complexId), attachmentListSchema, { signal });
  return attachments;
}

export function uploadAttachment(complexId: string, file: PickedFile, description?: string): Promise<Attachment> {
  const params = new URLSearchParams({ fileName: file.name });
  if (description?.trim()) params.set('description', description.trim());
  return sendRaw(`${attachmentsPath(complexId)}?${params.toString()}`, attachmentSchema, {
    method: 'POST',
    body: file.body,
    // The server reads the kind from the bytes and the extension; the type only has to be "not JSON".
    contentType: file.contentType && file.contentType !== 'application/json' ? file.contentType : 'application/octet-stream',
  });
}

export async function deleteAttachment(complexId: string, attachmentId: string): Promise<void> {
  await sendRaw(`${attachmentsPath(complexId)}/${encodeURIComponent(attachmentId)}`, z.unknown(), { method: 'DELETE' });
}

/** downloadPath is an API path ("/api/…"); the session cookie travels with a same-origin link. */
export function attachmentDownloadUrl(attachment: Pick<Attachment, 'downloadPath'>): string {
  return attachment.downloadPath;
}

// ---- e-mail preferences -----------------------------------------------------------------------------

export function fetchMailPreferences(signal?: AbortSignal): Promise<MailPreferences> {
  return apiRequest('/auth/me/preferences', mailPreferencesSchema, { signal });
}

export function updateMailPreferences(input: UpdateMailPreferencesInput): Promise<MailPreferences> {
  return apiRequest('/auth/me/preferences', mailPreferencesSchema, { method: 'PATCH', body: input });
}

// ---- query keys and hooks -----------------------------------------------------------------------------

export const exchangeKeys = {
  imports: ['imports'] as const,
  importJob: (id: string) => [...exchangeKeys.imports, id] as const,
  attachments: (complexId: string) => ['complexes', 'detail', complexId, 'attachments'] as const,
  // Outside the 'auth' prefix so a change of person resets it with everything else (identityChanged).
  mailPreferences: ['mail-preferences'] as const,
};

/** Poll interval while an import job runs. */
export const IMPORT_POLL_MS = 600;

export function useStartImportMutation() {
  const client = useQueryClient();
  return useMutation<ImportJob, Error, StartImportInput>({
    mutationFn: startImport,
    onSuccess: (job) => client.setQueryData(exchangeKeys.importJob(job.id), job),
  });
}

/** The job, polled until it has succeeded or failed. */
export function useImportJobQuery(id: string | null) {
  const client = useQueryClient();
  return useQuery({
    queryKey: exchangeKeys.importJob(id ?? ''),
    queryFn: async ({ signal }) => {
      const job = await fetchImportJob(id ?? '', signal);
      // A finished real import changed the library and the review queue.
      if (job.state === 'succeeded' && !job.dryRun) {
        void client.invalidateQueries({ queryKey: ['complexes'] });
        void client.invalidateQueries({ queryKey: ['review-queue'] });
      }
      return job;
    },
    enabled: !!id,
    retry: retryUnlessClientError,
    refetchInterval: (query) => (query.state.data && isImportFinished(query.state.data) ? false : IMPORT_POLL_MS),
  });
}

/** A look-up is an action (the person presses "Fill from DOI"), not data on screen: a mutation. */
export function useDoiLookupMutation() {
  return useMutation<DoiLookupResponse, Error, string>({ mutationFn: (doi) => lookupDoi(doi) });
}

export function useAttachmentsQuery(complexId: string) {
  return useQuery<Attachment[], Error>({
    queryKey: exchangeKeys.attachments(complexId),
    queryFn: ({ signal }) => fetchAttachments(complexId, signal),
    retry: retryUnlessClientError,
  });
}

export function useUploadAttachmentMutation(complexId: string) {
  const client = useQueryClient();
  return useMutation<Attachment, Error, { file: PickedFile; description?: string }>({
    mutationFn: ({ file, description }) => uploadAttachment(complexId, file, description),
    onSuccess: () => client.invalidateQueries({ queryKey: exchangeKeys.attachments(complexId) }),
  });
}

export function useDeleteAttachmentMutation(complexId: string) {
  const client = useQueryClient();
  return useMutation<void, Error, string>({
    mutationFn: (attachmentId) => deleteAttachment(complexId, attachmentId),
    onSettled: () => client.invalidateQueries({ queryKey: exchangeKeys.attachments(complexId) }),
  });
}

export function useMailPreferencesQuery(enabled = true) {
  return useQuery<MailPreferences, Error>({
    queryKey: exchangeKeys.mailPreferences,
    queryFn: ({ signal }) => fetchMailPreferences(signal),
    enabled,
    retry: retryUnlessClientError,
  });
}

/** Switches answer at once (optimistic); a refusal puts the old value back. */
export function useUpdateMailPreferencesMutation() {
  const client = useQueryClient();
  return useMutation<MailPreferences, Error, UpdateMailPreferencesInput, { before: MailPreferences | undefined }>({
    mutationFn: updateMailPreferences,
    onMutate: async (input) => {
      await client.cancelQueries({ queryKey: exchangeKeys.mailPreferences });
      const before = client.getQueryData<MailPreferences>(exchangeKeys.mailPreferences);
      if (before) client.setQueryData<MailPreferences>(exchangeKeys.mailPreferences, { ...before, ...input });
      return { before };
    },
    onError: (_error, _input, context) => {
      if (context?.before) client.setQueryData(exchangeKeys.mailPreferences, context.before);
    },
    onSuccess: (saved) => client.setQueryData(exchangeKeys.mailPreferences, saved),
  });
}

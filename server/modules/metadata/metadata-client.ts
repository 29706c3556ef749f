import type { DoiLookupResponse } from '@/lib/schemas/exchange';
import { AppError } from '@/server/http/errors';
import { joinAuthors } from '@/server/modules/exchange/citation-formats';

/**
 * Fills a citation from its DOI through a bibliographic metadata service with the REST shape of
 * the DOI registration agencies: GET {baseUrl}/works/{doi} → { message: { title: [..], author:
 * [{given, family}], 'container-title': [..], issued: { 'date-parts': [[year]] }, volume, page } }.
 * A deadline keeps a slow service from holding the form; every failure is a typed error the form
 * can show, and the citation can still be typed by hand.
 */

export const METADATA_TIMEOUT_MS = 4000;

export interface MetadataClient {
  lookup(doi: string): Promise<DoiLookupResponse>;
}

interface WorkMessage {
  title?: unknown;
  author?: unknown;
  'container-title'?: unknown;
  'short-container-title'?: unknown;
  issued?: { 'date-parts'?: unknown };
  volume?: unknown;
  page?: unknown;
  DOI?: unknown;
}

const firstText = (value: unknown): string | null => {
  const first = Array.isArray(value) ? value[0] : value;
  return typeof first === 'string' && first.trim() ? first.trim().replace(/\s+/g, ' ') : null;
};

export function workToCitation(doi: string, message: WorkMessage): DoiLookupResponse {
  const authors = Array.isArray(message.author)
    ? joinAuthors(
        message.author
          .filter((a): a is Record<string, unknown> => typeof a === 'object' && a !== null)
          .map((a) => ({
            given: typeof a.given === 'string' ? a.given : undefined,
            family: typeof a.family === 'string' ? a.family : undefined,
            literal: typeof a.name === 'string' ? a.name : undefined,
          })),
      )
    : '';
  const parts = message.issued?.['date-parts'];
  const year = Array.isArray(parts) && Array.isArray(parts[0]) && typeof parts[0][0] === 'number' ? parts[0][0] : null;
  const text = (v: unknown) => (typeof v === 'string' && v.trim() ? v.trim() : typeof v === 'number' ? String(v) : null);
  return {
    doi,
    authors: authors.slice(0, 1000),
    title: firstText(message.title)?.slice(0, 500) ?? null,
    journal: (firstText(message['container-title']) ?? firstText(message['short-container-title']) ?? '').slice(0, 200),
    year: year !== null && year >= 1800 && year <= 2100 ? year : null,
    volume: text(message.volume)?.slice(0, 40) ?? null,
    pages: text(message.page)?.slice(0, 40) ?? null,
  };
}

export function createMetadataClient(baseUrl: string | null, timeoutMs = METADATA_TIMEOUT_MS): MetadataClient {
  return {
    async lookup(doi) {
      if (!baseUrl) throw new AppError('UNAVAILABLE', 'DOI look-up is not configured on this server (METADATA_URL); type the citation by hand.');
      const url = `${baseUrl.replace(/\/+$/, '')}/works/${encodeURIComponent(doi)}`;
      let response: globalThis.Response;
      try {
        response = await fetch(url, { headers: { Accept: 'application/json' }, signal: AbortSignal.timeout(timeoutMs) });
      } catch (error) {
        const timedOut = (error as Error).name === 'TimeoutError' || (error as Error).name === 'AbortError';
        throw new AppError(
          'UNAVAILABLE',
          timedOut
            ? `The bibliographic metadata service did not answer within ${timeoutMs / 1000} s. Try again, or type the citation by hand.`
            : 'The bibliographic metadata service cannot be reached right now. Try again, or type the citation by hand.',
        );
      }
      if (response.status === 404) {
        throw new AppError('NOT_FOUND', `No record was found for DOI ${doi}. Check it, or type the citation by hand.`);
      }
      if (!response.ok) {
        throw new AppError('UNAVAILABLE', `The bibliographic metadata service answered with an error (HTTP ${response.status}). Try again, or type the citation by hand.`);
      }
      let body: unknown;
      try {
        body = await response.json();
      } catch {
        throw new AppError('UNAVAILABLE', 'The bibliographic metadata service sent an answer that is not JSON. Type the citation by hand.');
      }
      const message = (body as { message?: unknown } | null)?.message;
      if (!message || typeof message !== 'object') {
        throw new AppError('UNAVAILABLE', 'The bibliographic metadata service sent an answer without a record. Type the citation by hand.');
      }
      return workToCitation(doi, message as WorkMessage);
    },
  };
}

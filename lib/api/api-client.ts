import type { z } from 'zod';
import { apiErrorBodySchema } from '@/lib/schemas/errors';
import { ApiError } from './api-error';

export { ApiError };

/** Same-origin API base: the server serves both the app and /api. */
const API_BASE = '/api';

export async function apiRequest<T>(
  path: string,
  schema: z.ZodType<T>,
  init: { method?: string; body?: unknown; signal?: AbortSignal; idempotencyKey?: string } = {},
): Promise<T> {
  let response: Response;
  try {
    response = await fetch(`${API_BASE}${path}`, {
      method: init.method ?? 'GET',
      headers: requestHeaders(init),
      body: init.body === undefined ? undefined : JSON.stringify(init.body),
      credentials: 'same-origin',
      signal: init.signal,
    });
  } catch (cause) {
    if (cause instanceof Error && cause.name === 'AbortError') throw cause;
    throw new ApiError(0, 'NETWORK', 'The server could not be reached. Check your connection.');
  }
  const payload: unknown = await response.json().catch(() => null);
  if (!response.ok) {
    throw apiErrorFrom(response.status, payload);
  }
  return schema.parse(payload);
}

/** JSON content type when there is a body; the write's Idempotency-Key when it has one. */
export function requestHeaders(init: { body?: unknown; idempotencyKey?: string }): Record<string, string> | undefined {
  const headers: Record<string, string> = {};
  if (init.body !== undefined) headers['Content-Type'] = 'application/json';
  if (init.idempotencyKey) headers['Idempotency-Key'] = init.idempotencyKey;
  return Object.keys(headers).length ? headers : undefined;
}

/**
 * One key per intended write: the same body sent again (a retry after a lost reply or a 503) keeps
 * its key, so the server answers with the first result instead of writing twice; a new body gets
 * a new key. `done()` after success, so that saving the same values again is a new write.
 */
export function writeKeys() {
  let last: { body: string; key: string } | null = null;
  return {
    keyFor(body: unknown): string {
      const text = JSON.stringify(body);
      if (last?.body !== text) last = { body: text, key: randomKey() };
      return last.key;
    },
    done() {
      last = null;
    },
  };
}

function randomKey(): string {
  const bytes = new Uint8Array(16);
  globalThis.crypto.getRandomValues(bytes);
  return Array.from(bytes, (b) => b.toString(16).padStart(2, '0')).join('');
}

/** The ApiError for a refused answer: its error body when it has the one shape, else a generic one. */
export function apiErrorFrom(status: number, payload: unknown): ApiError {
  const parsed = apiErrorBodySchema.safeParse(payload);
  if (!parsed.success) return new ApiError(status, 'INTERNAL', `The server answered ${status}.`);
  const { code, message, fields } = parsed.data.error;
  return new ApiError(status, code, message, fields ?? {});
}

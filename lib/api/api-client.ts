import type { z } from 'zod';
import { apiErrorBodySchema } from '@/lib/schemas/errors';
import { ApiError } from './api-error';

export { ApiError };

/** Same-origin API base: the server serves both the app and /api. */
const API_BASE = '/api';

export async function apiRequest<T>(
  path: string,
  schema: z.ZodType<T>,
  init: { method?: string; body?: unknown; signal?: AbortSignal } = {},
): Promise<T> {
  let response: Response;
  try {
    response = await fetch(`${API_BASE}${path}`, {
      method: init.method ?? 'GET',
      headers: init.body === undefined ? undefined : { 'Content-Type': 'application/json' },
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

/** The ApiError for a refused answer: its error body when it has the one shape, else a generic one. */
export function apiErrorFrom(status: number, payload: unknown): ApiError {
  const parsed = apiErrorBodySchema.safeParse(payload);
  if (!parsed.success) return new ApiError(status, 'INTERNAL', `The server answered ${status}.`);
  const { code, message, fields } = parsed.data.error;
  return new ApiError(status, code, message, fields ?? {});
}

import type { ApiErrorCode } from '@/lib/schemas/errors';

/**
 * An error answered by the API, classified by its code (never by message text). Its own module, free of
 * zod, so the root layout's query client can recognise it without pulling the schema library into the
 * first screen's JavaScript.
 */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: ApiErrorCode | 'NETWORK',
    message: string,
    readonly fields: Record<string, string> = {},
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

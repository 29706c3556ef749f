import { apiErrorStatus, type ApiErrorCode } from '@/lib/schemas/errors';

/** A typed failure a service or route throws; the error handler turns it into the one error shape. */
export class AppError extends Error {
  readonly status: number;
  constructor(
    readonly code: ApiErrorCode,
    message: string,
    readonly fields?: Record<string, string>,
    readonly extra?: Record<string, unknown>,
  ) {
    super(message);
    this.name = 'AppError';
    this.status = apiErrorStatus[code];
  }
}

export const notFound = (what: string) => new AppError('NOT_FOUND', `${what} was not found.`);

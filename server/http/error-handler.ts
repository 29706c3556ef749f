import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { ApiErrorBody } from '@/lib/schemas/errors';
import { AppError } from './errors';
import { isDatabaseUnavailable } from './database-errors';
import { isKeyClash } from './idempotency';

/** Unknown routes under /api get the error shape, never the app's HTML. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new AppError('NOT_FOUND', `No API route ${req.method} ${req.path}.`));
};

function toAppError(error: unknown): AppError {
  if (error instanceof AppError) return error;
  const bodyParserType = (error as { type?: unknown } | null)?.type;
  if (bodyParserType === 'entity.parse.failed') {
    return new AppError('VALIDATION_FAILED', 'The request body is not valid JSON.', { body: 'malformed JSON' });
  }
  if (bodyParserType === 'entity.too.large') {
    return new AppError('PAYLOAD_TOO_LARGE', 'The request body is larger than this endpoint accepts.');
  }
  if (bodyParserType === 'encoding.unsupported' || bodyParserType === 'charset.unsupported') {
    return new AppError('UNSUPPORTED_MEDIA', 'The request body uses an unsupported encoding or charset.');
  }
  const status = (error as { status?: unknown; statusCode?: unknown } | null)?.status;
  if (typeof status === 'number' && status >= 400 && status < 500) {
    return new AppError('VALIDATION_FAILED', 'The request could not be read.');
  }
  if (isKeyClash(error)) {
    return new AppError('CONFLICT', 'Another request with the same Idempotency-Key is being saved; send it again in a moment to get its result.');
  }
  if (isDatabaseUnavailable(error)) {
    return new AppError('UNAVAILABLE', 'The database is not reachable right now. Try again in a moment.');
  }
  return new AppError('INTERNAL', 'Something went wrong on the server. It has been logged.');
}

export const errorHandler: ErrorRequestHandler = (error, req, res, _next) => {
  const appError = toAppError(error);
  if (appError.code === 'INTERNAL') {
    console.error(`[error] ${req.method} ${req.originalUrl}`, error);
  }
  if (res.headersSent) {
    res.end();
    return;
  }
  const body: ApiErrorBody & { error: Record<string, unknown> } = {
    error: {
      code: appError.code,
      message: appError.message,
      ...(appError.fields ? { fields: appError.fields } : {}),
      ...(appError.extra ?? {}),
    },
  };
  if (appError.code === 'UNAVAILABLE') res.setHeader('Retry-After', '5');
  const retryAfter = Number(appError.extra?.retryAfterSeconds);
  if (appError.code === 'RATE_LIMITED' && Number.isFinite(retryAfter) && !res.getHeader('Retry-After')) {
    res.setHeader('Retry-After', String(Math.max(1, Math.ceil(retryAfter))));
  }
  res.status(appError.status).json(body);
};

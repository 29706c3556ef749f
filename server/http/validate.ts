import type { Request } from 'express';
import type { z } from 'zod';
import { AppError } from './errors';

/** Parses a request part with a shared schema; failures become VALIDATION_FAILED with per-field messages. */
export function parseWith<T>(schema: z.ZodType<T>, input: unknown, where = 'body'): T {
  const result = schema.safeParse(input);
  if (result.success) return result.data;
  const fields: Record<string, string> = {};
  for (const issue of result.error.issues) {
    const key = issue.path.length > 0 ? issue.path.join('.') : where;
    fields[key] ??= issue.message;
  }
  const first = Object.entries(fields)[0];
  const summary = first ? `${first[0]}: ${first[1]}` : 'invalid input';
  throw new AppError('VALIDATION_FAILED', `The request ${where} is not valid (${summary}).`, fields);
}

/**
 * The JSON body of a route whose body may be left out (submit, retire): none → `{}`. A body in
 * another type (text/plain, a form) was not parsed, and reading it as "no body" would drop what
 * was sent without a word: 415 instead.
 */
export function optionalJsonBody(req: Request): unknown {
  if (req.body !== undefined) return req.body;
  const length = req.headers['content-length'];
  const hasBody = req.headers['transfer-encoding'] !== undefined || (length !== undefined && length !== '0');
  if (hasBody) {
    throw new AppError('UNSUPPORTED_MEDIA', `Send the request body as JSON (Content-Type application/json), not ${req.headers['content-type'] ?? 'an untyped body'}.`);
  }
  return {};
}

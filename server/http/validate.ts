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

import type { RequestHandler } from 'express';
import { AppError } from './errors';

/**
 * PostgreSQL cannot store U+0000 in text or jsonb, and jsonb refuses unpaired UTF-16 surrogates
 * ("\uD800" alone): such input used to reach the database and come back as a 500. Refuse it up
 * front with a 400 that names the field and the character position (1-based), for every JSON
 * body and query string under /api.
 */
const unstorable = /\u0000|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

function findUnstorable(value: unknown, path: string, depth = 0): { path: string; position: number; what: string } | null {
  if (typeof value === 'string') {
    const match = unstorable.exec(value);
    if (!match) return null;
    return { path, position: match.index + 1, what: match[0] === '\u0000' ? 'a NUL character (U+0000)' : 'a broken character (an unpaired UTF-16 surrogate)' };
  }
  // The JSON parser allows deep nesting; a schema refuses such bodies anyway, so stop looking deep down.
  if (depth > 64 || value === null || typeof value !== 'object') return null;
  for (const [key, child] of Object.entries(value)) {
    const keyProblem = findUnstorable(key, path, depth + 1);
    if (keyProblem) return { ...keyProblem, path: `${path}.${key.replace(unstorable, '?')}` };
    const found = findUnstorable(child, path ? `${path}.${key}` : key, depth + 1);
    if (found) return found;
  }
  return null;
}

export const rejectUnstorableText: RequestHandler = (req, _res, next) => {
  const problem = findUnstorable(req.body, '') ?? findUnstorable(req.query, '');
  if (!problem) return next();
  const field = problem.path || 'body';
  const message = `${field} contains ${problem.what} at character ${problem.position}; remove it and send again.`;
  next(new AppError('VALIDATION_FAILED', `The request is not valid (${message})`, { [field]: message }, { position: problem.position }));
};

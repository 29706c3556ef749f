import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from '@/lib/api/api-client';

/** The one sentence for a failed sign-in, whatever the reason (unknown address or wrong password). */
export const SIGN_IN_REFUSED =
  'We could not sign you in with that e-mail address and password. Check both and try again.';

/** A sentence for anything that went wrong, classified by code (never by the server's wording). */
export function describeError(error: unknown): string {
  if (error instanceof ApiError) {
    switch (error.code) {
      case 'NETWORK':
        return 'Sphereline’s server could not be reached. Check your connection and try again.';
      case 'INTERNAL':
        return 'Something went wrong on our side. Try again in a moment.';
      case 'UNAVAILABLE':
        return 'The service is briefly unavailable. Try again in a few seconds.';
      case 'UNAUTHENTICATED':
        return 'Your sign-in has ended. Sign in again to continue.';
      default:
        // RATE_LIMITED carries the wait time, CONFLICT/FORBIDDEN/NOT_FOUND say what rule applied.
        return error.message;
    }
  }
  return 'Something unexpected went wrong. Try again.';
}

/**
 * Puts the server's field problems on the matching fields and returns what is left for the form-level
 * box (null when every problem found its field).
 */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fieldNames: readonly Path<T>[],
  describe: (error: unknown) => string = describeError,
): string | null {
  if (!(error instanceof ApiError)) return describe(error);
  let placedAll = true;
  let placedAny = false;
  for (const [field, message] of Object.entries(error.fields)) {
    const name = fieldNames.find((candidate) => candidate === field);
    if (name) {
      // Field messages from the server are short reasons; the full sentence is error.message.
      setError(name, { type: 'server', message: fieldMessage(error, message) }, { shouldFocus: !placedAny });
      placedAny = true;
    } else {
      placedAll = false;
    }
  }
  return placedAny && placedAll ? null : describe(error);
}

/**
 * Field problems are either whole sentences (from the shared zod rules) or short reasons beside a full
 * sentence in the message ("already a member"): show a sentence either way.
 */
function fieldMessage(error: ApiError, reason: string): string {
  if (/^[A-Z].*[.!?]$/s.test(reason.trim())) return reason.trim();
  return Object.keys(error.fields).length === 1 && error.message ? error.message : capitalise(reason);
}

function capitalise(text: string): string {
  const trimmed = text.trim();
  if (!trimmed) return trimmed;
  const sentence = trimmed.charAt(0).toUpperCase() + trimmed.slice(1);
  return /[.!?]$/.test(sentence) ? sentence : `${sentence}.`;
}

/** Only same-site paths are followed after sign-in (no open redirect to another site). */
export function safeNextPath(next: string | string[] | undefined, fallback = '/account'): string {
  const value = Array.isArray(next) ? next[0] : next;
  if (!value || !value.startsWith('/') || value.startsWith('//') || value.startsWith('/\\')) return fallback;
  return value;
}

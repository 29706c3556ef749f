import { describeError } from '@/components/account/form-errors';
import { ApiError } from '@/lib/api/api-client';
import type { AttachmentKind } from '@/lib/schemas/exchange';

/** How exchange values read on screen: sizes in binary units, short fingerprints, refusals in words. */

export function fileSizeText(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(bytes < 10 * 1024 ? 1 : 0)} KB`;
  return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
}

/** The first 12 hex digits of a SHA-256: enough to tell two files apart by eye. */
export function shortSha(sha256: string): string {
  return sha256.slice(0, 12);
}

export const attachmentKindLabel: Record<AttachmentKind, string> = {
  pdf: 'PDF',
  png: 'PNG image',
  jpeg: 'JPEG image',
  zip: 'ZIP archive',
  cif: 'Crystal structure (CIF)',
  'jcamp-dx': 'Spectrum (JCAMP-DX)',
  csv: 'Table (CSV)',
  text: 'Text data',
};

/** A refused CSV file: why, and that nothing reached the library. */
export function importRefusalText(error: unknown): string {
  if (!(error instanceof ApiError)) return describeError(error);
  switch (error.code) {
    case 'UNSUPPORTED_MEDIA':
      return `This file cannot be read as CSV text: ${error.message} Nothing was written. Save it from your spreadsheet as “CSV UTF-8” and choose it again.`;
    case 'PAYLOAD_TOO_LARGE':
      return `The file is too large: ${error.message} Nothing was written. Split it into files of at most 5 MB.`;
    case 'VALIDATION_FAILED':
      return `The file cannot be imported as it is: ${error.message} Nothing was written.`;
    default:
      return describeError(error);
  }
}

/** A refused attachment: 415 (content and name disagree) and 413 (too large) in plain words. */
export function uploadRefusalText(error: unknown): string {
  if (!(error instanceof ApiError)) return describeError(error);
  switch (error.code) {
    case 'UNSUPPORTED_MEDIA':
      return `This file was not attached: ${error.message} Sphereline accepts PDF, PNG, JPEG, ZIP (also Office files), CIF, JCAMP-DX, CSV and plain-text data, with a matching file extension.`;
    case 'PAYLOAD_TOO_LARGE':
      return `This file was not attached: ${error.message} Files of up to 20 MB can be attached.`;
    default:
      return describeError(error);
  }
}

import { sha256 } from '@oslojs/crypto/sha2';
import { encodeBase32LowerCaseNoPadding, encodeHexLowerCase } from '@oslojs/encoding';

/** A secret for an e-mailed link: 160 random bits, base32 (32 characters, URL-safe). */
export function generateLinkToken(): string {
  const bytes = new Uint8Array(20);
  crypto.getRandomValues(bytes);
  return encodeBase32LowerCaseNoPadding(bytes);
}

/** SHA-256 (hex) of a secret: tokens and session ids are stored only in this form. */
export function hashSecret(secret: string): string {
  return encodeHexLowerCase(sha256(new TextEncoder().encode(secret)));
}

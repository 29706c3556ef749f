import { hash, verify } from '@node-rs/argon2';
import commonPasswordList from 'fxa-common-password-list';
import commonPasswords from '@/data/common-passwords.json';

/**
 * Argon2id with the OWASP Password Storage Cheat Sheet's first recommended setting
 * (m = 19 MiB, t = 2, p = 1); @node-rs/argon2 uses Argon2id by default.
 */
const argon2Options = { memoryCost: 19456, timeCost: 2, parallelism: 1, outputLen: 32 };

export function hashPassword(password: string): Promise<string> {
  return hash(password, argon2Options);
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}

let dummyHash: Promise<string> | null = null;

/**
 * For an unknown address, sign-in still verifies a password against a hash of the same cost,
 * so the answer takes about as long as for a known address (no enumeration by timing).
 */
export async function verifyAgainstDummy(password: string): Promise<false> {
  dummyHash ??= hashPassword('sphereline-no-such-account-placeholder');
  await verifyPassword(await dummyHash, password);
  return false;
}

const commonSet = new Set(commonPasswords.passwords.map((p) => p.toLowerCase()));

/** Why a new password is refused, or null. Length is checked by the shared schema. */
export function weakPasswordReason(password: string, context: { email?: string } = {}): string | null {
  const lower = password.toLowerCase();
  // Our short list, then the registry's list of about 10 000 passwords seen in breaches (Mozilla's
  // Firefox Accounts list: works offline; includes the digit runs such as 123456789012).
  if (commonSet.has(lower) || commonPasswordList.test(password) || commonPasswordList.test(lower)) {
    return 'This password is on a list of commonly used passwords: choose another.';
  }
  if (/^(.)\1*$/.test(password)) return 'A password of one repeated character is too easy to guess.';
  const localPart = context.email?.split('@')[0]?.toLowerCase();
  if (localPart && localPart.length >= 4 && lower.includes(localPart)) {
    return 'The password should not contain your e-mail address.';
  }
  if (lower.includes('sphereline')) return 'The password should not contain the name of this site.';
  return null;
}

import { formatDate, formatDateTime } from '@/lib/chem/number-format';
import type { Role } from '@/lib/schemas/groups';

/**
 * What each role may do, as a verb phrase that follows "can" or "you" (the server enforces the rules;
 * this only explains them). Each role can also do everything the roles below it can.
 */
export const roleDescriptions: Record<Role, string> = {
  viewer: 'read the accepted entries of the library',
  contributor: 'draft entries and submit them for review',
  curator: 'review contributions and keep the ligand catalogue',
  admin: 'manage members, roles and invitations',
};

/** "a viewer", "an admin". */
export function withArticle(role: Role): string {
  return `${role === 'admin' ? 'an' : 'a'} ${role}`;
}

export const roleLabels: Record<Role, string> = {
  viewer: 'Viewer',
  contributor: 'Contributor',
  curator: 'Curator',
  admin: 'Admin',
};

/** The product's one date style, following the reader's locale ("12 Dec 2026" in en-GB); no time. */
export function formatDay(iso: string): string {
  return formatDate(iso);
}

/** The same style with the time, for sessions, where the time matters ("12 Dec 2026, 14:05" in en-GB). */
export function formatMoment(iso: string): string {
  return formatDateTime(iso);
}

/** A readable guess at the device from its user-agent string ("Firefox on Linux"); never more than a hint. */
export function describeDevice(userAgent: string | null): string {
  if (!userAgent) return 'Unknown device';
  const browser = /Edg\//.test(userAgent)
    ? 'Edge'
    : /Firefox\//.test(userAgent)
      ? 'Firefox'
      : /Chrom(e|ium)\//.test(userAgent)
        ? 'Chromium-based browser'
        : /Safari\//.test(userAgent)
          ? 'Safari'
          : /curl|node|undici|okhttp/i.test(userAgent)
            ? 'Script or command-line client'
            : 'Browser';
  const system = /Android/.test(userAgent)
    ? 'Android'
    : /iPhone|iPad|iOS/.test(userAgent)
      ? 'iOS'
      : /Mac OS X|Macintosh/.test(userAgent)
        ? 'macOS'
        : /Windows/.test(userAgent)
          ? 'Windows'
          : /Linux|X11/.test(userAgent)
            ? 'Linux'
            : null;
  return system ? `${browser} on ${system}` : browser;
}

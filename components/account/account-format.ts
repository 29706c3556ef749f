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

/** "12 Dec 2026" — day, short month and year; no time, which the reader rarely needs here. */
export function formatDay(iso: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  return date.toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });
}

/** "12 Dec 2026, 14:05" for sessions, where the time matters. */
export function formatMoment(iso: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  return date.toLocaleString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' });
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

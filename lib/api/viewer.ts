import { useQuery } from '@tanstack/react-query';

/**
 * What the app shell and the landing view need to know about the visitor (which tabs to offer, what
 * to suggest next), without the schema library: both are part of the first screen's JavaScript (see
 * DEVELOPERS.md, "Speed"). The key sits outside the `auth` keys on purpose: a sign-in or sign-out
 * resets it with the rest of the person's data.
 */
export const viewerKeys = { roles: () => ['viewer', 'roles'] as const };

const ROLES = ['viewer', 'contributor', 'curator', 'admin'] as const;
export type GroupRole = (typeof ROLES)[number];

export interface Viewer {
  signedIn: boolean;
  /** Roles over all their groups; [] when signed out, in no group, or when the answer is not understood. */
  roles: GroupRole[];
}

const NOBODY: Viewer = { signedIn: false, roles: [] };

/** Who is looking, from GET /api/auth/session (200 for a visitor too, so no failed request is logged). */
export async function fetchViewer(signal?: AbortSignal): Promise<Viewer> {
  const response = await fetch('/api/auth/session', { credentials: 'same-origin', signal });
  if (!response.ok) return NOBODY;
  const body: unknown = await response.json().catch(() => null);
  const me = (body as { me?: { memberships?: unknown } | null } | null)?.me;
  if (!me || typeof me !== 'object') return NOBODY;
  const memberships = Array.isArray(me.memberships) ? me.memberships : [];
  const roles = memberships
    .map((membership: unknown) => (membership as { role?: unknown } | null)?.role)
    .filter((role): role is GroupRole => typeof role === 'string' && (ROLES as readonly string[]).includes(role));
  return { signedIn: true, roles };
}

/** The visitor as far as it is known: `undefined` while the first answer is on its way. */
export function useViewer(): Viewer | undefined {
  const viewer = useQuery({
    queryKey: viewerKeys.roles(),
    queryFn: ({ signal }) => fetchViewer(signal),
    staleTime: 60_000,
    retry: false,
  });
  return viewer.isError ? NOBODY : viewer.data;
}

/** True when the visitor curates or runs at least one group (the Review tab is theirs). */
export function useCanReview(): boolean {
  return canReview(useViewer());
}

export function canReview(viewer: Viewer | undefined): boolean {
  return (viewer?.roles ?? []).some((role) => role === 'curator' || role === 'admin');
}

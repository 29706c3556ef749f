import { useQuery } from '@tanstack/react-query';

/**
 * What the app shell needs to know about the visitor (which tabs to offer), without the schema library:
 * the shell is part of the first screen's JavaScript (see DEVELOPERS.md, "Speed"). The key sits outside
 * the `auth` keys on purpose: a sign-in or sign-out resets it with the rest of the person's data.
 */
export const viewerKeys = { roles: () => ['viewer', 'roles'] as const };

const ROLES = ['viewer', 'contributor', 'curator', 'admin'] as const;
type GroupRole = (typeof ROLES)[number];

/** The visitor's roles over all their groups; [] when signed out or when the answer is not understood. */
export async function fetchViewerRoles(signal?: AbortSignal): Promise<GroupRole[]> {
  const response = await fetch('/api/auth/session', { credentials: 'same-origin', signal });
  if (!response.ok) return [];
  const body: unknown = await response.json().catch(() => null);
  const memberships = (body as { me?: { memberships?: unknown } } | null)?.me?.memberships;
  if (!Array.isArray(memberships)) return [];
  return memberships
    .map((membership: unknown) => (membership as { role?: unknown } | null)?.role)
    .filter((role): role is GroupRole => typeof role === 'string' && (ROLES as readonly string[]).includes(role));
}

/** True when the visitor curates or runs at least one group (the Review tab is theirs). */
export function useCanReview(): boolean {
  const roles = useQuery({
    queryKey: viewerKeys.roles(),
    queryFn: ({ signal }) => fetchViewerRoles(signal),
    staleTime: 60_000,
    retry: false,
  });
  return (roles.data ?? []).some((role) => role === 'curator' || role === 'admin');
}

import { useMeQuery } from '@/lib/api/auth';
import { roleAtLeast, type Role } from '@/lib/schemas/groups';
import type { MembershipSummary } from '@/lib/schemas/auth';

export type LibraryAccess =
  | { state: 'loading' }
  | { state: 'error'; error: unknown; retry: () => void }
  | { state: 'signed-out' }
  | { state: 'no-group'; displayName: string }
  | {
      state: 'member';
      displayName: string;
      memberships: MembershipSummary[];
      /** May add entries in at least one group. */
      canContribute: boolean;
      /** Reviews in at least one group. */
      isCurator: boolean;
    };

/** Who is looking at the library, from GET /api/auth/me: decides which actions and tabs make sense. */
export function useLibraryAccess(): LibraryAccess {
  const me = useMeQuery();
  if (me.data === undefined) {
    if (me.isError) return { state: 'error', error: me.error, retry: () => void me.refetch() };
    return { state: 'loading' };
  }
  if (me.data === null) return { state: 'signed-out' };
  const { memberships, user } = me.data;
  if (memberships.length === 0) return { state: 'no-group', displayName: user.displayName };
  const some = (role: Role) => memberships.some((m) => roleAtLeast(m.role, role));
  return {
    state: 'member',
    displayName: user.displayName,
    memberships,
    canContribute: some('contributor'),
    isCurator: some('curator'),
  };
}

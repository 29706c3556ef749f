import { useCallback, useState } from 'react';
import type { MembershipSummary } from '@/lib/schemas/auth';

/**
 * Which of a person's groups Check asks for measurements: the one they chose last (kept in the
 * browser per person, so a shared computer does not mix people), else their last-joined group.
 * A stored choice that is no longer one of their groups is ignored.
 */
const STORAGE_PREFIX = 'sphereline.check-group.';

function storage(): Storage | null {
  try {
    return typeof globalThis.localStorage === 'undefined' ? null : globalThis.localStorage;
  } catch {
    // Storage can be switched off (private mode, policies): the choice then lasts for the page only.
    return null;
  }
}

export function readChosenGroup(userId: string): string | null {
  return storage()?.getItem(STORAGE_PREFIX + userId) ?? null;
}

export function writeChosenGroup(userId: string, groupId: string): void {
  try {
    storage()?.setItem(STORAGE_PREFIX + userId, groupId);
  } catch {
    // Full or refused storage: the choice still holds for this page.
  }
}

/** The group in effect: the stored choice if it is still one of theirs, else the last membership. */
export function effectiveGroup(memberships: readonly MembershipSummary[], chosen: string | null): MembershipSummary | null {
  return memberships.find((m) => m.groupId === chosen) ?? memberships[memberships.length - 1] ?? null;
}

export function useChosenGroup(userId: string | null, memberships: readonly MembershipSummary[]) {
  // A choice made on this page, for this person; otherwise the stored one (read as the card renders).
  const [picked, setPicked] = useState<{ userId: string; groupId: string } | null>(null);
  const chosen = userId === null ? null : picked?.userId === userId ? picked.groupId : readChosenGroup(userId);
  const choose = useCallback(
    (groupId: string) => {
      if (!userId) return;
      setPicked({ userId, groupId });
      writeChosenGroup(userId, groupId);
    },
    [userId],
  );
  return { group: effectiveGroup(memberships, chosen), choose };
}

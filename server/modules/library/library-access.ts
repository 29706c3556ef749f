import type { EntityManager } from '@mikro-orm/postgresql';
import { roleAtLeast, type Role } from '@/lib/schemas/groups';
import type { ComplexPermissions, ComplexStatus } from '@/lib/schemas/library';
import { AppError } from '@/server/http/errors';
import { ResearchGroup } from '@/server/modules/groups/group.entity';
import { GroupMembership } from '@/server/modules/groups/membership.entity';

/**
 * Who may see and do what with a library entry. Pure rules (table-tested) plus the membership
 * look-ups they need. Non-members get 404 everywhere (the accounts module's choice): an entry of a
 * group you are not in looks exactly like an entry that does not exist.
 */

export interface Reader {
  userId: string;
  role: Role;
}

/** The few columns the rules look at. */
export interface EntryFacts {
  status: ComplexStatus;
  createdById: string | null;
  submittedById?: string | null;
  hasAccepted: boolean;
}

export type EntryView = 'working' | 'published';

/**
 * viewer: the accepted snapshot of entries that have one and are not retired;
 * contributor: the same, plus the working copy of entries they created;
 * curator/admin: the working copy of everything (the accepted snapshot beside it).
 */
export function viewFor(reader: Reader, entry: EntryFacts): EntryView | null {
  if (roleAtLeast(reader.role, 'curator')) return 'working';
  if (reader.role === 'contributor' && entry.createdById === reader.userId) return 'working';
  if (entry.hasAccepted && entry.status !== 'retired') return 'published';
  return null;
}

const editableStatuses: readonly ComplexStatus[] = ['draft', 'returned', 'accepted'];
const submittableStatuses: readonly ComplexStatus[] = ['draft', 'returned'];

/** Curators edit any entry; contributors their own. */
function isEditor(reader: Reader, entry: EntryFacts): boolean {
  return roleAtLeast(reader.role, 'curator') || (reader.role === 'contributor' && entry.createdById === reader.userId);
}

/**
 * What the reader may do. `wroteContent`: the reader submitted the revision in review or wrote any
 * of its changes; they may accept it only when the group has no other curator (four eyes).
 */
export function permissionsFor(reader: Reader, entry: EntryFacts, curatorCount = 2, wroteContent = entry.submittedById === reader.userId): ComplexPermissions {
  const reviewer = roleAtLeast(reader.role, 'curator');
  const ownSubmission = wroteContent;
  return {
    canEdit: isEditor(reader, entry) && editableStatuses.includes(entry.status),
    canSubmit: isEditor(reader, entry) && submittableStatuses.includes(entry.status),
    canReview: reviewer && entry.status === 'in-review' && (!ownSubmission || curatorCount <= 1),
    canRetire: reviewer && entry.status !== 'retired',
  };
}

export type Action = 'edit' | 'submit' | 'review' | 'retire';

/** The reason an action is refused, or null when it is allowed: 403 for the role, 409 for the status. */
export function refusal(reader: Reader, entry: EntryFacts, action: Action): AppError | null {
  const { status } = entry;
  switch (action) {
    case 'edit':
    case 'submit': {
      if (!isEditor(reader, entry)) {
        return new AppError(
          'FORBIDDEN',
          reader.role === 'viewer'
            ? 'Viewers can read the library but not change it; ask an admin for the contributor role.'
            : 'Contributors can change only the entries they created; a curator can change any entry.',
        );
      }
      const allowed = action === 'edit' ? editableStatuses : submittableStatuses;
      if (!allowed.includes(status)) {
        const why: Record<ComplexStatus, string> = {
          draft: '',
          returned: '',
          accepted: 'It is accepted already: edit it first, then submit the new revision.',
          'in-review': 'It is waiting for review: a curator must decide first (accept, return for revision or decline).',
          declined: 'It was declined; declined entries stay as they are: create a new entry instead.',
          retired: 'It is retired; retired entries are kept for the record and cannot change.',
        };
        return new AppError('CONFLICT', `This entry cannot be ${action === 'edit' ? 'edited' : 'submitted'} now (status "${status}"). ${why[status]}`.trim());
      }
      return null;
    }
    case 'review':
      if (!roleAtLeast(reader.role, 'curator')) return new AppError('FORBIDDEN', 'Only curators (or admins) review entries.');
      if (status !== 'in-review') {
        return new AppError('CONFLICT', `Only submitted entries can be reviewed; this one is "${status}".`);
      }
      return null;
    case 'retire':
      if (!roleAtLeast(reader.role, 'curator')) return new AppError('FORBIDDEN', 'Only curators (or admins) retire entries.');
      if (status === 'retired') return new AppError('CONFLICT', 'This entry is retired already.');
      return null;
  }
}

export interface MembershipInfo {
  groupId: string;
  groupName: string;
  role: Role;
}

export async function membershipsOf(em: EntityManager, userId: string): Promise<Map<string, MembershipInfo>> {
  const memberships = await em.find(GroupMembership, { userId });
  const groups = memberships.length
    ? await em.find(ResearchGroup, { id: { $in: memberships.map((m) => m.groupId) } })
    : [];
  const names = new Map(groups.map((g) => [g.id, g.name]));
  return new Map(
    memberships.map((m) => [m.groupId, { groupId: m.groupId, groupName: names.get(m.groupId) ?? '', role: m.role }]),
  );
}

export async function membershipIn(em: EntityManager, userId: string, groupId: string): Promise<MembershipInfo | null> {
  const membership = await em.findOne(GroupMembership, { userId, groupId });
  if (!membership) return null;
  const group = await em.findOne(ResearchGroup, { id: groupId });
  return group ? { groupId, groupName: group.name, role: membership.role } : null;
}

/** The group a create/list request means: the one given (if a member), else the person's only group. */
export async function resolveGroup(em: EntityManager, userId: string, groupId: string | undefined): Promise<MembershipInfo> {
  if (groupId) {
    const membership = await membershipIn(em, userId, groupId);
    if (!membership) throw new AppError('NOT_FOUND', 'That group was not found.');
    return membership;
  }
  const all = [...(await membershipsOf(em, userId)).values()];
  if (all.length === 1 && all[0]) return all[0];
  if (all.length === 0) throw new AppError('NOT_FOUND', 'You are not a member of any group yet: create one or accept an invitation.');
  throw new AppError('VALIDATION_FAILED', 'You belong to several groups: say which one with groupId.', {
    groupId: 'required when you belong to more than one group',
  });
}

/** Members who may review in a group (curators and admins). */
export async function reviewerCount(em: EntityManager, groupId: string): Promise<number> {
  return em.count(GroupMembership, { groupId, role: { $in: ['curator', 'admin'] } });
}

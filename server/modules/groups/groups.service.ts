import { randomUUID } from 'node:crypto';
import { LockMode, type EntityManager, type InferEntity } from '@mikro-orm/core';
import type {
  AcceptInvitationResponse,
  GroupDetail,
  GroupSummary,
  Invitation,
  InvitationPreview,
  Role,
} from '@/lib/schemas/groups';
import { AppError } from '@/server/http/errors';
import { rateLimited } from '@/server/modules/auth/auth.service';
import { countAttempt, throttledFor, type ThrottleRule } from '@/server/modules/auth/throttle';
import { recordAudit } from '@/server/modules/audit/audit.service';
import type { AccountsContext } from '@/server/modules/auth/auth-context';
import { generateLinkToken, hashSecret } from '@/server/modules/auth/tokens';
import { User } from '@/server/modules/auth/user.entity';
import { invitationMail } from '@/server/modules/mail/templates';
import { ResearchGroup } from './group.entity';
import { GroupInvitation } from './invitation.entity';
import { GroupMembership } from './membership.entity';

const lastAdmin = () =>
  new AppError('CONFLICT', 'A group must keep at least one admin: make someone else an admin first.');

export async function listMyGroups(em: EntityManager, userId: string): Promise<GroupSummary[]> {
  const memberships = await em.find(GroupMembership, { userId });
  if (memberships.length === 0) return [];
  const groupIds = memberships.map((m) => m.groupId);
  const groups = await em.find(ResearchGroup, { id: { $in: groupIds } }, { orderBy: { name: 'asc' } });
  const counts = (await em.getConnection().execute(
    `select "group_id", count(*) as n from "group_membership" where "group_id" in (${groupIds.map(() => '?').join(', ')}) group by "group_id"`,
    groupIds,
  )) as { group_id: string; n: string }[];
  const countOf = new Map(counts.map((row) => [row.group_id, Number(row.n)]));
  const roleOf = new Map(memberships.map((m) => [m.groupId, m.role]));
  return groups.map((group) => ({
    id: group.id,
    name: group.name,
    role: roleOf.get(group.id) ?? 'viewer',
    memberCount: countOf.get(group.id) ?? 0,
    createdAt: group.createdAt.toISOString(),
  }));
}

export async function createGroup(em: EntityManager, userId: string, name: string): Promise<GroupSummary> {
  const group = em.create(ResearchGroup, { id: randomUUID(), name });
  em.create(GroupMembership, { groupId: group.id, userId, role: 'admin' });
  recordAudit(em, { actorId: userId, groupId: group.id, action: 'group.created', subjectType: 'group', subjectId: group.id, details: { name } });
  await em.flush();
  return { id: group.id, name: group.name, role: 'admin', memberCount: 1, createdAt: group.createdAt.toISOString() };
}

export async function getGroupDetail(em: EntityManager, groupId: string, myRole: Role): Promise<GroupDetail> {
  const group = await em.findOneOrFail(ResearchGroup, { id: groupId });
  const memberships = await em.find(GroupMembership, { groupId }, { orderBy: { createdAt: 'asc' } });
  const users = await em.find(User, { id: { $in: memberships.map((m) => m.userId) } });
  const userOf = new Map(users.map((u) => [u.id, u]));
  return {
    id: group.id,
    name: group.name,
    createdAt: group.createdAt.toISOString(),
    myRole,
    members: memberships.flatMap((m) => {
      const user = userOf.get(m.userId);
      return user
        ? [{ userId: user.id, email: user.email, displayName: user.displayName, role: m.role, joinedAt: m.createdAt.toISOString() }]
        : [];
    }),
  };
}

// ---- invitations -------------------------------------------------------------------------------

function toInvitationDto(invitation: InferEntity<typeof GroupInvitation>, inviters: Map<string, string>): Invitation {
  const inviterName = invitation.invitedById ? inviters.get(invitation.invitedById) : undefined;
  return {
    id: invitation.id,
    email: invitation.email,
    role: invitation.role,
    createdAt: invitation.createdAt.toISOString(),
    expiresAt: invitation.expiresAt.toISOString(),
    invitedBy: invitation.invitedById && inviterName ? { id: invitation.invitedById, displayName: inviterName } : null,
    status: invitation.expiresAt.getTime() > Date.now() ? 'pending' : 'expired',
  };
}

/** Invites an address; a newer invitation to the same address replaces a pending one. */
export async function createInvitation(
  ctx: AccountsContext,
  em: EntityManager,
  input: { groupId: string; groupName: string; inviterId: string; email: string; role: Role },
): Promise<Invitation> {
  const existingUser = await em.findOne(User, { email: input.email });
  if (existingUser && (await em.findOne(GroupMembership, { groupId: input.groupId, userId: existingUser.id }))) {
    throw new AppError('CONFLICT', `${input.email} is already a member of this group.`, { email: 'already a member' });
  }
  // Limits on invitations, so the app cannot be used to send mail in bulk to one address or many.
  const hour = 3600;
  const limits: ThrottleRule[] = [
    { key: `invite:inviter:${input.inviterId}`, limit: ctx.settings.invitationsPerInviterPerHour, windowSeconds: hour },
    { key: `invite:group:${input.groupId}`, limit: ctx.settings.invitationsPerGroupPerHour, windowSeconds: hour },
    { key: `invite:recipient:${input.email.toLowerCase()}`, limit: ctx.settings.invitationsPerRecipientPerDay, windowSeconds: 24 * hour },
  ];
  const retry = await throttledFor(em, limits);
  if (retry) throw rateLimited(retry);
  await countAttempt(em, limits);
  await em.nativeDelete(GroupInvitation, { groupId: input.groupId, email: input.email, acceptedAt: null });
  const token = generateLinkToken();
  const invitation = em.create(GroupInvitation, {
    id: randomUUID(),
    groupId: input.groupId,
    email: input.email,
    role: input.role,
    tokenHash: hashSecret(token),
    invitedById: input.inviterId,
    expiresAt: new Date(Date.now() + ctx.settings.invitationDays * 86_400_000),
  });
  recordAudit(em, {
    actorId: input.inviterId, groupId: input.groupId, action: 'invitation.created', subjectType: 'invitation',
    subjectId: invitation.id, details: { email: input.email, role: input.role },
  });
  await em.flush();
  const inviter = await em.findOneOrFail(User, { id: input.inviterId });
  await ctx.mailer.send(
    invitationMail(input.email, {
      groupName: input.groupName,
      role: input.role,
      inviterName: inviter.displayName,
      url: `${ctx.appUrl}/invitations/accept?token=${encodeURIComponent(token)}`,
      days: ctx.settings.invitationDays,
    }),
  );
  return toInvitationDto(invitation, new Map([[inviter.id, inviter.displayName]]));
}

/** Invitations not yet accepted (expired ones too, marked, so an admin can see and resend). */
export async function listInvitations(em: EntityManager, groupId: string): Promise<Invitation[]> {
  const invitations = await em.find(GroupInvitation, { groupId, acceptedAt: null }, { orderBy: { createdAt: 'desc' } });
  const inviterIds = invitations.flatMap((i) => (i.invitedById ? [i.invitedById] : []));
  const inviters = inviterIds.length ? await em.find(User, { id: { $in: inviterIds } }) : [];
  const names = new Map(inviters.map((u) => [u.id, u.displayName]));
  return invitations.map((i) => toInvitationDto(i, names));
}

export async function revokeInvitation(em: EntityManager, groupId: string, invitationId: string, actorId: string) {
  const invitation = await em.findOne(GroupInvitation, { id: invitationId, groupId, acceptedAt: null });
  if (!invitation) throw new AppError('NOT_FOUND', 'That invitation was not found.');
  em.remove(invitation);
  recordAudit(em, {
    actorId, groupId, action: 'invitation.revoked', subjectType: 'invitation', subjectId: invitationId,
    details: { email: invitation.email, role: invitation.role },
  });
  await em.flush();
}

async function findUsableInvitation(em: EntityManager, token: string) {
  return em.findOne(GroupInvitation, { tokenHash: hashSecret(token), acceptedAt: null, expiresAt: { $gt: new Date() } });
}

export async function previewInvitation(em: EntityManager, token: string): Promise<InvitationPreview> {
  const invitation = await findUsableInvitation(em, token);
  const group = invitation ? await em.findOne(ResearchGroup, { id: invitation.groupId }) : null;
  if (!invitation || !group) throw new AppError('NOT_FOUND', 'This invitation is not valid: it was used, withdrawn or has expired.');
  return { groupName: group.name, role: invitation.role, email: invitation.email, expiresAt: invitation.expiresAt.toISOString() };
}

/** Accepting needs the invited address: the person must be signed in with it. Single use. */
export async function acceptInvitation(
  em: EntityManager,
  user: { id: string; email: string },
  token: string,
): Promise<AcceptInvitationResponse> {
  return em.transactional(async (tx) => {
    const invitation = await tx.findOne(
      GroupInvitation,
      { tokenHash: hashSecret(token), acceptedAt: null, expiresAt: { $gt: new Date() } },
      { lockMode: LockMode.PESSIMISTIC_WRITE },
    );
    if (!invitation) {
      throw new AppError('VALIDATION_FAILED', 'This invitation is not valid: it was used, withdrawn or has expired.', {
        token: 'invalid, used or expired',
      });
    }
    if (invitation.email !== user.email.toLowerCase()) {
      throw new AppError('FORBIDDEN', `This invitation was sent to another address. Sign in as ${invitation.email} to accept it.`);
    }
    const group = await tx.findOneOrFail(ResearchGroup, { id: invitation.groupId });
    if (await tx.findOne(GroupMembership, { groupId: group.id, userId: user.id })) {
      throw new AppError('CONFLICT', 'You are already a member of this group.');
    }
    invitation.acceptedAt = new Date();
    invitation.acceptedById = user.id;
    tx.create(GroupMembership, { groupId: group.id, userId: user.id, role: invitation.role });
    recordAudit(tx, {
      actorId: user.id, groupId: group.id, action: 'member.joined', subjectType: 'user', subjectId: user.id,
      details: { role: invitation.role, invitationId: invitation.id },
    });
    return { groupId: group.id, groupName: group.name, role: invitation.role };
  });
}

// ---- members -----------------------------------------------------------------------------------

/**
 * Role changes and removals lock the group row first, so two admins demoting each other at the
 * same moment cannot leave the group without an admin.
 */
async function withGroupLocked<T>(em: EntityManager, groupId: string, work: (tx: EntityManager) => Promise<T>) {
  return em.transactional(async (tx) => {
    await tx.findOneOrFail(ResearchGroup, { id: groupId }, { lockMode: LockMode.PESSIMISTIC_WRITE });
    return work(tx);
  });
}

async function adminCount(tx: EntityManager, groupId: string) {
  return tx.count(GroupMembership, { groupId, role: 'admin' });
}

export async function changeRole(em: EntityManager, groupId: string, actorId: string, targetUserId: string, role: Role) {
  await withGroupLocked(em, groupId, async (tx) => {
    const membership = await tx.findOne(GroupMembership, { groupId, userId: targetUserId });
    if (!membership) throw new AppError('NOT_FOUND', 'That person is not a member of this group.');
    if (membership.role === role) return;
    if (membership.role === 'admin' && (await adminCount(tx, groupId)) <= 1) throw lastAdmin();
    recordAudit(tx, {
      actorId, groupId, action: 'member.role-changed', subjectType: 'user', subjectId: targetUserId,
      details: { from: membership.role, to: role },
    });
    membership.role = role;
  });
}

export async function removeMember(em: EntityManager, groupId: string, actorId: string, targetUserId: string) {
  await withGroupLocked(em, groupId, async (tx) => {
    const membership = await tx.findOne(GroupMembership, { groupId, userId: targetUserId });
    if (!membership) throw new AppError('NOT_FOUND', 'That person is not a member of this group.');
    if (membership.role === 'admin' && (await adminCount(tx, groupId)) <= 1) throw lastAdmin();
    recordAudit(tx, {
      actorId, groupId, action: actorId === targetUserId ? 'member.left' : 'member.removed', subjectType: 'user',
      subjectId: targetUserId, details: { role: membership.role },
    });
    tx.remove(membership);
  });
}

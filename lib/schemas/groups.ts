import { z } from 'zod';

/** Roles in a group, lowest first: each role can do everything the ones before it can. */
export const roles = ['viewer', 'contributor', 'curator', 'admin'] as const;
export const roleSchema = z.enum(roles, { error: `Choose a role: ${roles.join(', ')}.` });
export type Role = z.infer<typeof roleSchema>;

export const roleRank: Record<Role, number> = { viewer: 0, contributor: 1, curator: 2, admin: 3 };

export function roleAtLeast(role: Role, minimum: Role): boolean {
  return roleRank[role] >= roleRank[minimum];
}

const groupNameSchema = z
  .string({ error: 'Enter a group name.' })
  .trim()
  .min(2, 'A group name has at least 2 characters.')
  .max(120, 'A group name has at most 120 characters.');

export const createGroupInputSchema = z.object({ name: groupNameSchema });
export type CreateGroupInput = z.infer<typeof createGroupInputSchema>;

export const groupSummarySchema = z.object({
  id: z.string(),
  name: z.string(),
  role: roleSchema,
  memberCount: z.number().int(),
  createdAt: z.iso.datetime(),
});
export type GroupSummary = z.infer<typeof groupSummarySchema>;

export const groupsResponseSchema = z.object({ groups: z.array(groupSummarySchema) });
export type GroupsResponse = z.infer<typeof groupsResponseSchema>;

export const memberSchema = z.object({
  userId: z.string(),
  email: z.string(),
  displayName: z.string(),
  role: roleSchema,
  joinedAt: z.iso.datetime(),
});
export type Member = z.infer<typeof memberSchema>;

export const groupDetailSchema = z.object({
  id: z.string(),
  name: z.string(),
  createdAt: z.iso.datetime(),
  myRole: roleSchema,
  members: z.array(memberSchema),
});
export type GroupDetail = z.infer<typeof groupDetailSchema>;

export const createInvitationInputSchema = z.object({
  email: z
    .string({ error: 'Enter an e-mail address.' })
    .trim()
    .toLowerCase()
    .pipe(z.email('Enter a valid e-mail address, like name@example.org.').max(254)),
  role: roleSchema,
});
export type CreateInvitationInput = z.infer<typeof createInvitationInputSchema>;

export const invitationSchema = z.object({
  id: z.string(),
  email: z.string(),
  role: roleSchema,
  createdAt: z.iso.datetime(),
  expiresAt: z.iso.datetime(),
  invitedBy: z.object({ id: z.string(), displayName: z.string() }).nullable(),
  status: z.enum(['pending', 'expired']),
});
export type Invitation = z.infer<typeof invitationSchema>;

export const invitationsResponseSchema = z.object({ invitations: z.array(invitationSchema) });
export type InvitationsResponse = z.infer<typeof invitationsResponseSchema>;

/** GET /api/invitations/:token: enough to decide whether to accept, nothing more. */
export const invitationPreviewSchema = z.object({
  groupName: z.string(),
  role: roleSchema,
  email: z.string(),
  expiresAt: z.iso.datetime(),
});
export type InvitationPreview = z.infer<typeof invitationPreviewSchema>;

export const acceptInvitationInputSchema = z.object({
  token: z.string({ error: 'The invitation token is missing.' }).trim().min(16, 'The invitation token is too short.').max(128),
});
export type AcceptInvitationInput = z.infer<typeof acceptInvitationInputSchema>;

export const acceptInvitationResponseSchema = z.object({
  groupId: z.string(),
  groupName: z.string(),
  role: roleSchema,
});
export type AcceptInvitationResponse = z.infer<typeof acceptInvitationResponseSchema>;

export const updateMemberInputSchema = z.object({ role: roleSchema });
export type UpdateMemberInput = z.infer<typeof updateMemberInputSchema>;

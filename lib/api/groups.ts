import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import {
  acceptInvitationResponseSchema,
  groupDetailSchema,
  groupsResponseSchema,
  groupSummarySchema,
  invitationPreviewSchema,
  invitationSchema,
  invitationsResponseSchema,
  type AcceptInvitationInput,
  type AcceptInvitationResponse,
  type CreateGroupInput,
  type CreateInvitationInput,
  type GroupDetail,
  type GroupSummary,
  type Invitation,
  type InvitationPreview,
  type Role,
} from '@/lib/schemas/groups';
import { apiRequest } from './api-client';
import { authKeys } from './auth';

/** Query keys for groups, their members and invitations. */
export const groupKeys = {
  all: ['groups'] as const,
  list: () => [...groupKeys.all, 'list'] as const,
  detail: (groupId: string) => [...groupKeys.all, 'detail', groupId] as const,
  invitations: (groupId: string) => [...groupKeys.all, 'detail', groupId, 'invitations'] as const,
};

export const invitationKeys = {
  preview: (token: string) => ['invitation-preview', token] as const,
};

const noContentSchema = z.unknown();
const path = (groupId: string) => `/groups/${encodeURIComponent(groupId)}`;

// ---- plain API functions ------------------------------------------------------------------------

export async function fetchGroups(signal?: AbortSignal): Promise<GroupSummary[]> {
  const { groups } = await apiRequest('/groups', groupsResponseSchema, { signal });
  return groups;
}

export const createGroup = (input: CreateGroupInput) =>
  apiRequest('/groups', groupSummarySchema, { method: 'POST', body: input });

export const fetchGroup = (groupId: string, signal?: AbortSignal): Promise<GroupDetail> =>
  apiRequest(path(groupId), groupDetailSchema, { signal });

export async function fetchInvitations(groupId: string, signal?: AbortSignal): Promise<Invitation[]> {
  const { invitations } = await apiRequest(`${path(groupId)}/invitations`, invitationsResponseSchema, { signal });
  return invitations;
}

export const createInvitation = (groupId: string, input: CreateInvitationInput) =>
  apiRequest(`${path(groupId)}/invitations`, invitationSchema, { method: 'POST', body: input });

export async function revokeInvitation(groupId: string, invitationId: string): Promise<void> {
  await apiRequest(`${path(groupId)}/invitations/${encodeURIComponent(invitationId)}`, noContentSchema, { method: 'DELETE' });
}

export const changeMemberRole = (groupId: string, userId: string, role: Role) =>
  apiRequest(`${path(groupId)}/members/${encodeURIComponent(userId)}`, groupDetailSchema, { method: 'PATCH', body: { role } });

export async function removeMember(groupId: string, userId: string): Promise<void> {
  await apiRequest(`${path(groupId)}/members/${encodeURIComponent(userId)}`, noContentSchema, { method: 'DELETE' });
}

export const fetchInvitationPreview = (token: string, signal?: AbortSignal): Promise<InvitationPreview> =>
  apiRequest(`/invitations/${encodeURIComponent(token)}`, invitationPreviewSchema, { signal });

export const acceptInvitation = (input: AcceptInvitationInput) =>
  apiRequest('/invitations/accept', acceptInvitationResponseSchema, { method: 'POST', body: input });

// ---- hooks ------------------------------------------------------------------------------------------

export function useGroupsQuery(enabled = true) {
  return useQuery({ queryKey: groupKeys.list(), queryFn: ({ signal }) => fetchGroups(signal), enabled });
}

export function useGroupQuery(groupId: string) {
  return useQuery({
    queryKey: groupKeys.detail(groupId),
    queryFn: ({ signal }) => fetchGroup(groupId, signal),
    enabled: groupId.length > 0,
  });
}

/** Admins only: callers pass `enabled` once they know the role, so others never ask (and get 403). */
export function useInvitationsQuery(groupId: string, enabled: boolean) {
  return useQuery({
    queryKey: groupKeys.invitations(groupId),
    queryFn: ({ signal }) => fetchInvitations(groupId, signal),
    enabled: enabled && groupId.length > 0,
  });
}

export function useInvitationPreviewQuery(token: string) {
  return useQuery({
    queryKey: invitationKeys.preview(token),
    queryFn: ({ signal }) => fetchInvitationPreview(token, signal),
    enabled: token.length > 0,
  });
}

/** Membership changes show up in /auth/me (memberships) as well as in the group lists. */
function useMembershipChanged() {
  const client = useQueryClient();
  return () =>
    Promise.all([
      client.invalidateQueries({ queryKey: groupKeys.all }),
      client.invalidateQueries({ queryKey: authKeys.me() }),
    ]);
}

export function useCreateGroupMutation() {
  const membershipChanged = useMembershipChanged();
  return useMutation<GroupSummary, Error, CreateGroupInput>({
    mutationFn: createGroup,
    onSuccess: () => membershipChanged(),
  });
}

export function useCreateInvitationMutation(groupId: string) {
  const client = useQueryClient();
  return useMutation<Invitation, Error, CreateInvitationInput>({
    mutationFn: (input) => createInvitation(groupId, input),
    onSuccess: () => client.invalidateQueries({ queryKey: groupKeys.invitations(groupId) }),
  });
}

export function useRevokeInvitationMutation(groupId: string) {
  const client = useQueryClient();
  return useMutation<void, Error, string>({
    mutationFn: (invitationId) => revokeInvitation(groupId, invitationId),
    onSettled: () => client.invalidateQueries({ queryKey: groupKeys.invitations(groupId) }),
  });
}

export function useChangeRoleMutation(groupId: string) {
  const client = useQueryClient();
  const membershipChanged = useMembershipChanged();
  return useMutation<GroupDetail, Error, { userId: string; role: Role }>({
    mutationFn: ({ userId, role }) => changeMemberRole(groupId, userId, role),
    onSuccess: (detail) => {
      // The answer is the fresh member list: show it at once, then refresh the summaries.
      client.setQueryData(groupKeys.detail(groupId), detail);
      return membershipChanged();
    },
  });
}

export function useRemoveMemberMutation(groupId: string) {
  const membershipChanged = useMembershipChanged();
  return useMutation<void, Error, string>({
    mutationFn: (userId) => removeMember(groupId, userId),
    onSuccess: () => membershipChanged(),
  });
}

export function useAcceptInvitationMutation() {
  const membershipChanged = useMembershipChanged();
  return useMutation<AcceptInvitationResponse, Error, AcceptInvitationInput>({
    mutationFn: acceptInvitation,
    onSuccess: () => membershipChanged(),
  });
}

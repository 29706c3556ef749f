import { useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import {
  meResponseSchema,
  messageResponseSchema,
  sessionStateResponseSchema,
  sessionsResponseSchema,
  type MeResponse,
  type MessageResponse,
  type PasswordChangeInput,
  type PasswordResetConfirmInput,
  type PasswordResetRequestInput,
  type SessionDto,
  type SignInInput,
  type SignUpInput,
  type UpdateMeInput,
  type VerifyEmailInput,
} from '@/lib/schemas/auth';
import { devOutboxResponseSchema } from '@/lib/schemas/auth-forms';
import { apiRequest } from './api-client';

/** Query keys for the signed-in person; everything else a person sees hangs off who they are. */
export const authKeys = {
  all: ['auth'] as const,
  me: () => [...authKeys.all, 'me'] as const,
  sessions: () => [...authKeys.all, 'sessions'] as const,
  devOutbox: () => [...authKeys.all, 'dev-outbox'] as const,
};

/** 204 answers carry no body: apiRequest hands the schema `null`. */
const noContentSchema = z.unknown();

// ---- plain API functions ------------------------------------------------------------------------

/**
 * The signed-in person, or null when signed out. Asks /auth/session, which answers 200 either way, so a
 * visitor's browser logs no failed request.
 */
export async function fetchMe(signal?: AbortSignal): Promise<MeResponse | null> {
  const { me } = await apiRequest('/auth/session', sessionStateResponseSchema, { signal });
  return me;
}

export const signIn = (input: SignInInput) =>
  apiRequest('/auth/sign-in', meResponseSchema, { method: 'POST', body: input });

export const signUp = (input: SignUpInput) =>
  apiRequest('/auth/sign-up', messageResponseSchema, { method: 'POST', body: input });

export const verifyEmail = (input: VerifyEmailInput) =>
  apiRequest('/auth/verify', messageResponseSchema, { method: 'POST', body: input });

export const requestPasswordReset = (input: PasswordResetRequestInput) =>
  apiRequest('/auth/password-reset/request', messageResponseSchema, { method: 'POST', body: input });

export const confirmPasswordReset = (input: PasswordResetConfirmInput) =>
  apiRequest('/auth/password-reset/confirm', messageResponseSchema, { method: 'POST', body: input });

export const changePassword = (input: PasswordChangeInput) =>
  apiRequest('/auth/password', messageResponseSchema, { method: 'POST', body: input });

export const updateMe = (input: UpdateMeInput) =>
  apiRequest('/auth/me', meResponseSchema, { method: 'PATCH', body: input });

export async function signOut(): Promise<void> {
  await apiRequest('/auth/sign-out', noContentSchema, { method: 'POST' });
}

export async function signOutEverywhere(): Promise<void> {
  await apiRequest('/auth/sign-out-everywhere', noContentSchema, { method: 'POST' });
}

export async function fetchSessions(signal?: AbortSignal): Promise<SessionDto[]> {
  const { sessions } = await apiRequest('/auth/sessions', sessionsResponseSchema, { signal });
  return sessions;
}

export async function revokeSession(sessionId: string): Promise<void> {
  await apiRequest(`/auth/sessions/${encodeURIComponent(sessionId)}`, noContentSchema, { method: 'DELETE' });
}

/** True when the development mail sink answers (never in production, where the route does not exist). */
export async function probeDevOutbox(signal?: AbortSignal): Promise<boolean> {
  try {
    await apiRequest('/dev/outbox', devOutboxResponseSchema, { signal });
    return true;
  } catch (error) {
    if (error instanceof Error && error.name === 'AbortError') throw error;
    return false;
  }
}

// ---- cache rules ----------------------------------------------------------------------------------

/**
 * The person changed (sign-in, sign-out, reset): record who it is now and throw away everything cached
 * for the previous person (groups, sessions, group-scoped library data), refetching what is on screen.
 */
export async function identityChanged(client: QueryClient, me: MeResponse | null): Promise<void> {
  client.setQueryData(authKeys.me(), me);
  await client.resetQueries({
    predicate: (query) => query.queryKey[0] !== authKeys.all[0] || query.queryKey[1] === 'sessions',
  });
}

// ---- hooks ------------------------------------------------------------------------------------------

export function useMeQuery() {
  return useQuery({ queryKey: authKeys.me(), queryFn: ({ signal }) => fetchMe(signal) });
}

export function useSessionsQuery(enabled = true) {
  return useQuery({ queryKey: authKeys.sessions(), queryFn: ({ signal }) => fetchSessions(signal), enabled });
}

/** Whether to offer "Open the local outbox" (development servers only). */
export function useDevOutboxQuery() {
  return useQuery({
    queryKey: authKeys.devOutbox(),
    queryFn: ({ signal }) => probeDevOutbox(signal),
    retry: false,
    staleTime: Infinity,
  });
}

export function useSignInMutation() {
  const client = useQueryClient();
  return useMutation<MeResponse, Error, SignInInput>({
    mutationFn: signIn,
    onSuccess: (me) => identityChanged(client, me),
  });
}

export function useSignUpMutation() {
  return useMutation<MessageResponse, Error, SignUpInput>({ mutationFn: signUp });
}

export function useVerifyEmailMutation() {
  return useMutation<MessageResponse, Error, VerifyEmailInput>({ mutationFn: verifyEmail });
}

export function usePasswordResetRequestMutation() {
  return useMutation<MessageResponse, Error, PasswordResetRequestInput>({ mutationFn: requestPasswordReset });
}

export function usePasswordResetConfirmMutation() {
  const client = useQueryClient();
  return useMutation<MessageResponse, Error, PasswordResetConfirmInput>({
    mutationFn: confirmPasswordReset,
    // The server signs the person out everywhere after a reset.
    onSuccess: () => identityChanged(client, null),
  });
}

export function useChangePasswordMutation() {
  const client = useQueryClient();
  return useMutation<MessageResponse, Error, PasswordChangeInput>({
    mutationFn: changePassword,
    // This session stays; every other one has ended.
    onSuccess: () => client.invalidateQueries({ queryKey: authKeys.sessions() }),
  });
}

export function useUpdateMeMutation() {
  const client = useQueryClient();
  return useMutation<MeResponse, Error, UpdateMeInput>({
    mutationFn: updateMe,
    onSuccess: (me) => {
      client.setQueryData(authKeys.me(), me);
    },
  });
}

export function useSignOutMutation() {
  const client = useQueryClient();
  return useMutation<void, Error, void>({
    mutationFn: signOut,
    onSuccess: () => identityChanged(client, null),
  });
}

export function useSignOutEverywhereMutation() {
  const client = useQueryClient();
  return useMutation<void, Error, void>({
    mutationFn: signOutEverywhere,
    onSuccess: () => identityChanged(client, null),
  });
}

export function useRevokeSessionMutation() {
  const client = useQueryClient();
  return useMutation<void, Error, string>({
    mutationFn: revokeSession,
    onSettled: () => client.invalidateQueries({ queryKey: authKeys.sessions() }),
  });
}

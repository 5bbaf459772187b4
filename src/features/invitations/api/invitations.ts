import { queryOptions, useMutation, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type {
  AcceptInvitationInput,
  CreateInvitationInput,
  InvitationPreview,
  InvitationView,
} from '@/shared/schemas/invitation';

export const invitationKeys = {
  all: ['invitations'] as const,
  list: (projectId: string) => [...invitationKeys.all, 'list', projectId] as const,
  preview: (token: string) => [...invitationKeys.all, 'preview', token] as const,
};

const projectPath = (projectId: string) => `/api/projects/${encodeURIComponent(projectId)}/invitations`;

export const invitationsQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: invitationKeys.list(projectId),
    queryFn: async () => (await api.get<{ invitations: InvitationView[] }>(projectPath(projectId))).invitations,
  });

export function useInvitations(projectId: string) {
  return useQuery(invitationsQueryOptions(projectId));
}

export function useInvite(projectId: string) {
  return useMutation({
    mutationFn: async (input: CreateInvitationInput) =>
      (await api.post<{ invitation: InvitationView }>(projectPath(projectId), input)).invitation,
  });
}

export function useRevokeInvitation() {
  return useMutation({ mutationFn: (id: string) => api.delete(`/api/invitations/${encodeURIComponent(id)}`) });
}

/** The public preview of an invitation link (no session needed). */
export const invitationPreviewQueryOptions = (token: string) =>
  queryOptions({
    queryKey: invitationKeys.preview(token),
    queryFn: async () => (await api.get<{ invitation: InvitationPreview }>(`/api/invitations/${encodeURIComponent(token)}`)).invitation,
    meta: { redirectOn401: false },
  });

export function useInvitationPreview(token: string) {
  return useQuery(invitationPreviewQueryOptions(token));
}

export function useAcceptInvitation(token: string) {
  return useMutation({
    mutationFn: (input: AcceptInvitationInput) =>
      api.post<{ projectId: string }>(`/api/invitations/${encodeURIComponent(token)}/accept`, input),
    meta: { invalidates: false },
  });
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { InvitationDto } from '@shared/schemas/invitations';
import { invitationsQueryOptions } from './get-invitations';

export const revokeInvitation = (id: string) => api<InvitationDto>(`/team/invitations/${id}/revoke`, { method: 'POST' });
export const resendInvitation = (id: string) => api<InvitationDto>(`/team/invitations/${id}/resend`, { method: 'POST' });

export function useRevokeInvitation() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: revokeInvitation, onSettled: () => qc.invalidateQueries({ queryKey: invitationsQueryOptions().queryKey }) });
}

export function useResendInvitation() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: resendInvitation, onSettled: () => qc.invalidateQueries({ queryKey: invitationsQueryOptions().queryKey }) });
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { meQueryOptions } from '@/lib/auth';
import type { AcceptInvitationInput, InviteeInvitationDto } from '@shared/schemas/invitations';
import { invitationQueryOptions } from './get-invitation';

export const acceptInvitation = ({ id, body }: { id: string; body: AcceptInvitationInput }) =>
  api<InviteeInvitationDto>(`/invitations/${encodeURIComponent(id)}/accept`, { method: 'POST', body });

export function useAcceptInvitation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: acceptInvitation,
    onSuccess: async (data) => {
      qc.setQueryData(invitationQueryOptions(data.id).queryKey, data);
      // The person is now a member or a homeowner: who they are changes everywhere.
      await qc.invalidateQueries({ queryKey: meQueryOptions().queryKey });
    },
  });
}

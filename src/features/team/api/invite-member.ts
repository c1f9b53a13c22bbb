import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { InvitationDto, MemberInvitationInput } from '@shared/schemas/invitations';
import { invitationsQueryOptions } from './get-invitations';

export const inviteMember = (body: MemberInvitationInput) => api<InvitationDto>('/team/invitations', { method: 'POST', body });

export function useInviteMember() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: inviteMember, onSettled: () => qc.invalidateQueries({ queryKey: invitationsQueryOptions().queryKey }) });
}

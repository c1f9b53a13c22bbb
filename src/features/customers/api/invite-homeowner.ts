import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { HomeownerInvitationInput, InvitationDto } from '@shared/schemas/invitations';

export const inviteHomeowner = ({ customerId, body }: { customerId: string; body: HomeownerInvitationInput }) =>
  api<InvitationDto>(`/customers/${encodeURIComponent(customerId)}/homeowner-invitation`, { method: 'POST', body });

export const useInviteHomeowner = () => useMutation({ mutationFn: inviteHomeowner });

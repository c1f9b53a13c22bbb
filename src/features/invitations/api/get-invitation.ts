import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { InviteeInvitationDto } from '@shared/schemas/invitations';

export const getInvitation = (id: string) => api<InviteeInvitationDto>(`/invitations/${encodeURIComponent(id)}`);
export const invitationQueryOptions = (id: string) =>
  queryOptions({ queryKey: ['invitations', id], queryFn: () => getInvitation(id), retry: false });
export const useInvitation = (id: string, enabled: boolean) => useQuery({ ...invitationQueryOptions(id), enabled });

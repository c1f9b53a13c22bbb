import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { InvitationDto } from '@shared/schemas/invitations';

export const getInvitations = () => api<InvitationDto[]>('/team/invitations');
export const invitationsQueryOptions = () => queryOptions({ queryKey: ['team', 'invitations'], queryFn: getInvitations });
export const useInvitations = (enabled: boolean) => useQuery({ ...invitationsQueryOptions(), enabled });

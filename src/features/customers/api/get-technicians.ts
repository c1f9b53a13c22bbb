import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { MemberDto } from '@shared/schemas/company';

export const getMembers = () => api<MemberDto[]>('/members');
/** Same key as the team screen's list, so both share one cache entry. */
export const membersQueryOptions = () => queryOptions({ queryKey: ['members'], queryFn: getMembers });

/** Active technicians, the people a site can be assigned to. */
export const useTechnicians = () =>
  useQuery({ ...membersQueryOptions(), select: (members) => members.filter((m) => m.role === 'technician' && m.active) });

import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { MemberDto } from '@shared/schemas/company';

/** `/members`: the team screen, the site form's technician choice and the due list's assignment share one entry. */
export const memberKeys = { all: ['members'] as const };

export const getMembers = () => api<MemberDto[]>('/members');
export const membersQueryOptions = () => queryOptions({ queryKey: memberKeys.all, queryFn: getMembers });
export const useMembers = () => useQuery(membersQueryOptions());

const activeTechnicians = (members: MemberDto[]) => members.filter((m) => m.role === 'technician' && m.active);
/** Active technicians, the people a site or a due item can be assigned to. */
export const useTechnicians = () => useQuery({ ...membersQueryOptions(), select: activeTechnicians });

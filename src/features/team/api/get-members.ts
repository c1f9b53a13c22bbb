import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { MemberDto } from '@shared/schemas/company';

export const getMembers = () => api<MemberDto[]>('/members');
export const membersQueryOptions = () => queryOptions({ queryKey: ['members'], queryFn: getMembers });
export const useMembers = () => useQuery(membersQueryOptions());

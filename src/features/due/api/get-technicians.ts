import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { MemberDto } from '@shared/schemas/company';

const getTechnicians = async () => (await api<MemberDto[]>('/members')).filter((m) => m.role === 'technician' && m.active);
export const techniciansQueryOptions = () => queryOptions({ queryKey: ['members', 'technicians'], queryFn: getTechnicians });
export const useTechnicians = () => useQuery(techniciansQueryOptions());

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { MemberDto } from '@shared/schemas/company';
import type { MemberRole } from '@shared/schemas/roles';
import { memberKeys } from '@/lib/resources/members';

export const changeMemberRole = ({ id, role }: { id: string; role: MemberRole }) =>
  api<MemberDto>(`/members/${id}`, { method: 'PATCH', body: { role } });
export const deactivateMember = (id: string) => api<MemberDto>(`/members/${id}/deactivate`, { method: 'POST' });

export function useChangeMemberRole() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: changeMemberRole, onSuccess: () => qc.invalidateQueries({ queryKey: memberKeys.all }) });
}

export function useDeactivateMember() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deactivateMember, onSuccess: () => qc.invalidateQueries({ queryKey: memberKeys.all }) });
}

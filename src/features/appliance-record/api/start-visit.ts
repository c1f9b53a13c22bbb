import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { VisitDto } from '@shared/schemas/visits';
import type { VisitType } from '@shared/schemas/enums';
import { applianceKeys } from '@/lib/resources/appliances';

export const startVisit = (input: { applianceId: string; type: VisitType; bookingId?: string }) => api<VisitDto>('/visits', { method: 'POST', body: input });

export function useStartVisit() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: startVisit,
    onSuccess: (visit) => {
      qc.setQueryData(['visit', visit.id], visit);
      return qc.invalidateQueries({ queryKey: applianceKeys.record(visit.applianceId) });
    },
  });
}

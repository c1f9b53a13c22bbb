import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { api } from '@/lib/api-client';
import type { amendmentInput, VisitDto } from '@shared/schemas/visits';
import { applianceKeys } from '@/lib/resources/appliances';
import { visitQueryOptions } from './get-visit';

export type AmendmentInput = z.input<typeof amendmentInput>;

export const amendVisit = ({ visitId, ...body }: AmendmentInput & { visitId: string }) =>
  api<VisitDto>(`/visits/${visitId}/amendments`, { method: 'POST', body });

export function useAmendVisit() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: amendVisit,
    onSuccess: (visit) => {
      qc.setQueryData(visitQueryOptions(visit.id).queryKey, visit);
      return qc.invalidateQueries({ queryKey: applianceKeys.record(visit.applianceId) });
    },
  });
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { VisitDto } from '@shared/schemas/visits';
import type { z } from 'zod';
import type { swapInput } from '@shared/schemas/visits';
import { applianceKeys } from '@/lib/resources/appliances';
import { visitQueryOptions } from './get-visit';

export type SwapInput = z.input<typeof swapInput>;

export const swapPart = ({ visitId, ...body }: SwapInput & { visitId: string }) => api<VisitDto>(`/visits/${visitId}/swaps`, { method: 'POST', body });

export function useSwapPart() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: swapPart,
    onSuccess: (visit) => {
      qc.setQueryData(visitQueryOptions(visit.id).queryKey, visit);
      return qc.invalidateQueries({ queryKey: applianceKeys.record(visit.applianceId) });
    },
  });
}
